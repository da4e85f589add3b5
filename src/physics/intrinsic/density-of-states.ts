/**
 * Intrinsic carrier density from the band gap and the effective densities of states:
 *
 *   n_i = √(Nc(T)·Nv(T)) · exp(−Eg(T) / 2kT)
 *
 * The physical (nondegenerate, parabolic-band) form, in any semiconductor textbook, e.g.
 * S. M. Sze, Physics of Semiconductor Devices, 2nd ed. (Wiley, 1981), ch. 1.
 * Eg(T): Varshni form with Thurmond's parameters (src/physics/bandgap/varshni-thurmond-1975.ts).
 * Nc, Nv: Si from Green, J. Appl. Phys. 67, 2944 (1990); Ge, GaAs from Sze as tabulated by
 * Kasap (src/physics/materials.ts).
 *
 * Validity: the densities of states' range (Si 200–500 K; Ge, GaAs 200–400 K). For Si this
 * form gives about 1.07e10 cm⁻³ at 300 K, about 10 % above the measured 9.65e9 (Altermatt
 * 2003): the Green Nc, Nv and Thurmond Eg were not fitted together. Default for Ge and GaAs.
 */
import { BOLTZMANN_EV_PER_K } from '../constants.js';
import { bandgapEv, bandgapParameters } from '../bandgap/varshni-thurmond-1975.js';
import {
  conductionBandDensityPerCm3,
  DENSITY_OF_STATES,
  densityOfStatesParameters,
  valenceBandDensityPerCm3,
} from '../materials.js';
import type { Material, Parameter, Range } from '../types.js';
import type { IntrinsicModel } from './intrinsic-model.js';

export function densityOfStatesIntrinsicPerCm3(material: Material, temperatureK: number): number {
  const nc = conductionBandDensityPerCm3(material, temperatureK);
  const nv = valenceBandDensityPerCm3(material, temperatureK);
  const eg = bandgapEv(material, temperatureK);
  return Math.sqrt(nc * nv) * Math.exp(-eg / (2 * BOLTZMANN_EV_PER_K * temperatureK));
}

export const densityOfStatesModel: IntrinsicModel = {
  id: 'density-of-states',
  name: 'Density-of-states form √(Nc·Nv)·exp(−Eg/2kT)',
  citation:
    'n_i = √(Nc·Nv)·exp(−Eg/2kT) (Sze 1981); Eg: C. D. Thurmond, J. Electrochem. Soc. 122, 1133 (1975); Nc, Nv: Si M. A. Green, J. Appl. Phys. 67, 2944 (1990), Ge/GaAs Sze 1981 via Kasap',
  materials: ['Si', 'Ge', 'GaAs'],
  validityTemperatureK: DENSITY_OF_STATES.Si.validityTemperatureK,
  validityTemperatureKFor(material: Material): Range {
    return DENSITY_OF_STATES[material].validityTemperatureK;
  },
  equations: ['n_i = √(Nc(T)·Nv(T))·exp(−Eg(T)/(2kT))', 'Nc ∝ T^a, Nv ∝ T^b', 'Eg(T) = Eg0 − αT²/(T + β)'],
  notes: ['For Si this form is about 10 % above the measured n_i at 300 K; prefer the default for silicon.'],
  aliases: ['dos', 'physical', 'nc-nv'],
  parameters(material: Material): Parameter[] {
    return [...densityOfStatesParameters(material), ...bandgapParameters(material)];
  },
  intrinsicDensityPerCm3: densityOfStatesIntrinsicPerCm3,
};
