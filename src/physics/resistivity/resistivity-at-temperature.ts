/**
 * Resistivity of uniformly doped, uncompensated silicon at a temperature, from a
 * temperature-dependent mobility model and n_i(T):
 *
 *   n·p = n_i(T)²,  n − p = N (donor) or p − n = N (acceptor)   (full ionization)
 *   majority = N/2 + √(N²/4 + n_i²),  minority = n_i²/majority
 *   ρ(N, T) = 1/(q·(n·μn + p·μp)),  μ from the model at (N, n, p, T)
 *
 * Full ionization is assumed on purpose: near room temperature shallow dopants in Si are
 * ionized to within a few per cent up to ~1e17 cm⁻³, and above the Mott transition (~4e18,
 * from memory) they are fully ionized (metallic impurity band); the simple ionization model
 * in src/physics/carriers would wrongly freeze heavily doped substrates out (it overstates
 * freeze-out above ~1e18). Between, the true fraction is uncertain by model; the temperature
 * coefficient it would add is not used. Including n_i keeps high-resistivity material honest
 * at elevated temperature.
 *
 * Kernels: return numbers, never throw.
 */
import { ELEMENTARY_CHARGE_C } from '../constants.js';
import type { MobilityModel } from '../mobility/mobility-model.js';
import { mobilityPair } from '../mobility/temperature-model.js';
import { DOPANT_TYPE, type Dopant } from '../types.js';

export interface ResistivityAtTemperature {
  readonly resistivityOhmCm: number;
  readonly electronDensityPerCm3: number;
  readonly holeDensityPerCm3: number;
  readonly electronMobilityCm2PerVs: number;
  readonly holeMobilityCm2PerVs: number;
}

/** Kernel: ρ(N, T) with full ionization and n_i. */
export function resistivityAtTemperature(
  model: MobilityModel,
  dopantDensityPerCm3: number,
  dopant: Dopant,
  temperatureK: number,
  intrinsicDensityPerCm3: number,
): ResistivityAtTemperature {
  const N = dopantDensityPerCm3;
  const ni = intrinsicDensityPerCm3;
  const half = 0.5 * N;
  // majority = N/2 + √(N²/4 + n_i²); minority by mass action, written to avoid cancellation.
  const majority = half + Math.sqrt(half * half + ni * ni);
  const minority = (ni * ni) / majority;
  const donor = DOPANT_TYPE[dopant] === 'n';
  const n = donor ? majority : minority;
  const p = donor ? minority : majority;
  const mu = mobilityPair(model, {
    donorDensityPerCm3: donor ? N : 0,
    acceptorDensityPerCm3: donor ? 0 : N,
    electronDensityPerCm3: n,
    holeDensityPerCm3: p,
    temperatureK,
    ...(donor ? { donor: dopant } : {}),
  });
  return {
    resistivityOhmCm: 1 / (ELEMENTARY_CHARGE_C * (n * mu.electronCm2PerVs + p * mu.holeCm2PerVs)),
    electronDensityPerCm3: n,
    holeDensityPerCm3: p,
    electronMobilityCm2PerVs: mu.electronCm2PerVs,
    holeMobilityCm2PerVs: mu.holeCm2PerVs,
  };
}
