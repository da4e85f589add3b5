import { describe, expect, it } from 'vitest';
import { misiakosTsamakisDensityPerCm3 } from '../../../src/physics/intrinsic/misiakos-tsamakis-1993.js';

describe('Misiakos–Tsamakis 1993 n_i(T) for silicon', () => {
  // Source: K. Misiakos, D. Tsamakis, J. Appl. Phys. 74, 3293 (1993), abstract:
  // n_i(300 K) = (9.7 ± 0.1)e9 cm⁻³. Tolerance: the paper's ±0.1e9 (1.03 %).
  it('gives (9.7 ± 0.1)e9 cm⁻³ at 300 K (Misiakos & Tsamakis 1993)', () => {
    const ni = misiakosTsamakisDensityPerCm3(300);
    expect(Math.abs(ni - 9.7e9)).toBeLessThanOrEqual(0.1e9);
  });
  // Source: Altermatt et al., J. Appl. Phys. 93, 1598 (2003): 9.65e9 cm⁻³ at 300 K. Issue 2 asks
  // the default to be within 1 %.
  it('is within 1 % of 9.65e9 cm⁻³ at 300 K (Altermatt et al. 2003)', () => {
    expect(misiakosTsamakisDensityPerCm3(300)).toBeWithinRelative(9.65e9, 0.01);
  });
  // Form check: the activation 6726 K corresponds to Eg/2k with Eg ≈ 1.16 eV, the
  // extrapolated 0 K gap of Si (Thurmond 1975: 1.170 eV; the fit absorbs the T-dependence).
  // Tolerance 2 % in energy: a fit exponent is not a band gap.
  it('has an activation energy 2k·6726 K close to the 0 K gap of Si (Thurmond 1975, 1.170 eV)', () => {
    const k = 8.617333262e-5; // eV/K, CODATA 2018 (k/q)
    const ratio = misiakosTsamakisDensityPerCm3(250) / misiakosTsamakisDensityPerCm3(200);
    const activationK = Math.log(ratio / Math.pow(250 / 200, 2.54)) / (1 / 200 - 1 / 250);
    expect(2 * k * activationK).toBeWithinRelative(1.17, 0.02);
  });
});
