/**
 * Deep freeze-out against the textbook model, written out here independently: n = Nc·exp(−(Ec −
 * E_F)/kT), N_D⁺ = N_D/(1 + 2·exp((E_F − E_D)/kT)), n = N_D⁺ (S. M. Sze, K. K. Ng, Physics of
 * Semiconductor Devices, 3rd ed. (2007), §1.5), with Nc(T) = 2.86e19·(T/300)^1.58 cm⁻³ (M. A.
 * Green, J. Appl. Phys. 67, 2944 (1990)), E_c − E_D = 45 meV for phosphorus (textbook value),
 * k from CODATA 2018 (docs/references.md). Solved by bisection, not by the core's solver.
 *
 * Tolerance 0.1 %: the core places the band edges from Nc and Nv, so an n-type freeze-out does
 * not depend on the n_i model at all; what is left is the minority holes and the solver's
 * tolerance. Before the band-edge change the core was 38 % high at 30 K.
 */
import { describe, expect, it } from 'vitest';
import { carriersAtTemperature } from '../../../src/physics/carriers/carriers.js';

const K_EV = 8.617333262e-5; // eV/K, CODATA 2018 (exact k / exact e)

function textbookIonizedFraction(T: number, nd: number, edEv = 0.045): number {
  const kT = K_EV * T;
  const nc = 2.86e19 * Math.pow(T / 300, 1.58);
  // x = E_c − E_F: n(x) falls with x, N_D⁺(x) rises with x; bisection on n − N_D⁺.
  let lo = -1;
  let hi = 2;
  for (let i = 0; i < 400; i++) {
    const x = (lo + hi) / 2;
    const f = nc * Math.exp(-x / kT) - nd / (1 + 2 * Math.exp((edEv - x) / kT));
    if (f > 0) lo = x;
    else hi = x;
  }
  const x = (lo + hi) / 2;
  return 1 / (1 + 2 * Math.exp((edEv - x) / kT));
}

describe('freeze-out follows the band edges, not the n_i fit’s extrapolation', () => {
  for (const T of [30, 40, 77]) {
    it(`1e16 cm⁻³ phosphorus at ${T} K: the ionized fraction of the textbook model, within 0.1 %`, () => {
      const r = carriersAtTemperature({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e16 }], material: 'Si', temperatureK: T });
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      expect(r.value.ionizedFraction).toBeWithinRelative(textbookIonizedFraction(T, 1e16), 0.001);
      if (T < 50) expect(r.value.assumptionCodes).toContain('freeze_out_band_edges');
    });
  }

  it('inside the fit’s range nothing changes: n·p = n_i(fit)² at 300 K', () => {
    const r = carriersAtTemperature({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e16 }], material: 'Si', temperatureK: 300 });
    expect(r.ok && r.value.assumptionCodes).not.toContain('freeze_out_band_edges');
    if (r.ok) expect(r.value.electronDensityPerCm3 * r.value.holeDensityPerCm3).toBeWithinRelative(r.value.intrinsicDensityPerCm3 ** 2, 1e-9);
  });
});
