/**
 * The Hall relations of a single-carrier semiconductor (S. M. Sze, K. K. Ng, Physics of
 * Semiconductor Devices, 3rd ed. (2007), §1.5.3; docs/references.md): n = r_H/(q·|R_H|),
 * μ_H = |R_H|/ρ, R_H = V_H·t/(I·B); q from CODATA 2018 (exact). Arithmetic identities: checked to
 * 1e-12 (floating point only).
 */
import { describe, expect, it } from 'vitest';
import { hallAnalysis, hallCoefficientFromVoltage } from '../../../src/physics/hall/hall-effect.js';

const Q = 1.602176634e-19; // C, CODATA 2018, exact in the SI

describe('Hall effect', () => {
  it('R_H = −1300 cm³/C: n-type, n = 1/(q·1300) = 4.80e15 cm⁻³; with ρ = 1.1 Ω·cm, μ_H = 1300/1.1 cm²/V·s', () => {
    const h = hallAnalysis({ hallCoefficientCm3PerC: -1300, resistivityOhmCm: 1.1 });
    expect(h.ok && h.value.carrierType).toBe('n');
    expect(h.ok && h.value.carrierDensityPerCm3).toBeWithinRelative(1 / (Q * 1300), 1e-12);
    expect(h.ok && h.value.hallMobilityCm2PerVs).toBeWithinRelative(1300 / 1.1, 1e-12);
  });

  it('positive R_H is p-type; the scattering factor scales the density (r_H = 1.18: 18 % more carriers)', () => {
    const h = hallAnalysis({ hallCoefficientCm3PerC: 4200, scatteringFactor: 1.18 });
    expect(h.ok && h.value.carrierType).toBe('p');
    expect(h.ok && h.value.carrierDensityPerCm3).toBeWithinRelative(1.18 / (Q * 4200), 1e-12);
  });

  it('from the Hall voltage: −2.6 mV, 1 mA, 0.5 T, 500 µm → R_H = V·t/(I·B) = −2.6e-3 m³/C = −2600 cm³/C (SI: 1 m³ = 1e6 cm³)', () => {
    const r = hallCoefficientFromVoltage(-2.6e-3, 1e-3, 0.5, 0.05);
    expect(r.ok && r.value).toBeWithinRelative(((-2.6e-3 * 5e-4) / (1e-3 * 0.5)) * 1e6, 1e-12);
  });

  it('a zero Hall coefficient or voltage, a zero field and a zero resistivity are refused, never a result', () => {
    expect(hallAnalysis({ hallCoefficientCm3PerC: 0 }).ok).toBe(false);
    expect(hallAnalysis({ hallCoefficientCm3PerC: -1300, resistivityOhmCm: 0 }).ok).toBe(false);
    expect(hallCoefficientFromVoltage(0, 1e-3, 0.5, 0.05).ok).toBe(false);
    expect(hallCoefficientFromVoltage(-1e-3, 1e-3, 0, 0.05).ok).toBe(false);
  });
});
