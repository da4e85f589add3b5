import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MASETTI_1983, masetti1983 } from '../../../src/physics/mobility/masetti-1983.js';
import { f723BoronResistivityOhmCm, f723PhosphorusResistivityOhmCm } from '../../../src/physics/resistivity/astm-f723.js';
import { ELEMENTARY_CHARGE_C } from '../../../src/physics/constants.js';

const f723Mobility = (n: number, rho: number) => 1 / (ELEMENTARY_CHARGE_C * n * rho);

describe('Masetti 1983 mobility', () => {
  // Source: Masetti, Severi, Solmi, IEEE TED ED-30, 764 (1983), Table I: at low density the
  // electron form tends to μmax (1414 for P) and the hole form to μmax (470.5 for B), because
  // the clustering term vanishes and (N/Cr)^α → 0. Tolerance 1 % at 1e12 cm⁻³ (the remaining
  // (N/Cr)^α term is 0.6 % for B and 0.4 % for P there).
  it('tends to μmax at low density: 1414 (P electrons), 470.5 (B holes) (Masetti 1983 Table I)', () => {
    expect(masetti1983.mobilityCm2PerVs(1e12, 'phosphorus')).toBeWithinRelative(1414, 0.01);
    expect(masetti1983.mobilityCm2PerVs(1e12, 'boron')).toBeWithinRelative(470.5, 0.01);
  });
  // Source: Masetti 1983, the form itself: as N → ∞ the electron mobility tends to μ0 − μ1
  // (68.5 − 56.1 = 12.4 for P). Tight tolerance 1 % at 1e24 (implementation check).
  it('tends to μ0 − μ1 at very high density (form of Masetti 1983)', () => {
    const p = MASETTI_1983.phosphorus;
    expect(masetti1983.mobilityCm2PerVs(1e24, 'phosphorus')).toBeWithinRelative(p.mu0 - p.mu1, 0.01);
  });
  // Source: ASTM F723-99 (Thurber et al.), an independent fit to overlapping data. Tolerance 5 %
  // over 1e13–1e17 cm⁻³: F723's own stated consistency (3 % B, 4.5 % P) plus rounding of the
  // parameter tables; heavy doping is checked separately below with the data's larger scatter.
  it('agrees with the mobility implied by ASTM F723 within 5 % over 1e13–1e17 cm⁻³ (B and P)', () => {
    for (let u = 13; u <= 17; u += 0.25) {
      const n = Math.pow(10, u);
      expect(masetti1983.mobilityCm2PerVs(n, 'boron')).toBeWithinRelative(f723Mobility(n, f723BoronResistivityOhmCm(n)), 0.05);
      expect(masetti1983.mobilityCm2PerVs(n, 'phosphorus')).toBeWithinRelative(
        f723Mobility(n, f723PhosphorusResistivityOhmCm(n)),
        0.05,
      );
    }
  });
  // Source: ASTM F723-99. Tolerance 15 % over 1e17–1e20 cm⁻³: at heavy doping the two fits
  // rest on different data sets whose scatter is about 10 % (from memory: Masetti et al. and
  // Thurber et al. both show this spread); 15 % still catches a wrong parameter.
  it('agrees with ASTM F723 within 15 % over 1e17–1e20 cm⁻³ (heavy doping)', () => {
    for (let u = 17; u <= 20; u += 0.25) {
      const n = Math.pow(10, u);
      expect(masetti1983.mobilityCm2PerVs(n, 'boron')).toBeWithinRelative(f723Mobility(n, f723BoronResistivityOhmCm(n)), 0.15);
      expect(masetti1983.mobilityCm2PerVs(n, 'phosphorus')).toBeWithinRelative(
        f723Mobility(n, f723PhosphorusResistivityOhmCm(n)),
        0.15,
      );
    }
  });
  it('is positive and finite for every density 1e8–1e23 cm⁻³ and every supported dopant (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 8, max: 23, noNaN: true }), fc.constantFrom(...masetti1983.dopants), (u, d) => {
        const mu = masetti1983.mobilityCm2PerVs(Math.pow(10, u), d);
        return Number.isFinite(mu) && mu > 0;
      }),
    );
  });
  it('has no antimony parameter set (kernel returns NaN, the registry never asks)', () => {
    expect(Number.isNaN(masetti1983.mobilityCm2PerVs(1e16, 'antimony'))).toBe(true);
  });
});
