/**
 * Effective densities of states of the conduction and valence bands, Nc and Nv.
 *
 * Si: M. A. Green, "Intrinsic concentration, effective densities of states, and effective mass
 *   in silicon", J. Appl. Phys. 67, 2944 (1990), doi:10.1063/1.345414:
 *   Nc(300 K) = 2.86e19 cm⁻³ ∝ T^1.58, Nv(300 K) = 3.10e19 cm⁻³ ∝ T^1.85 (fits over ~200–500 K).
 * Ge, GaAs: S. M. Sze, Physics of Semiconductor Devices, 2nd ed. (Wiley, 1981), Appendix G, as
 *   tabulated in S. O. Kasap, Principles of Electronic Materials and Devices: Ge 1.04e19 / 6.0e18,
 *   GaAs 4.7e17 / 7.0e18 cm⁻³ at 300 K, scaled with the parabolic-band T^1.5 law (the law itself
 *   is textbook; its use far from 300 K ignores the temperature dependence of effective masses).
 */
import type { Material, Parameter, Range } from './types.js';

export interface DensityOfStates {
  readonly conductionAt300KPerCm3: number;
  readonly conductionExponent: number;
  readonly valenceAt300KPerCm3: number;
  readonly valenceExponent: number;
  readonly source: string;
  /** Temperatures over which the scaling was fitted or is trusted. */
  readonly validityTemperatureK: Range;
}

/** Melting points, K (Si 1414 °C, Ge 938 °C, GaAs 1238 °C; handbook values, from memory). */
export const MELTING_POINT_K: Readonly<Record<Material, number>> = { Si: 1687, Ge: 1211, GaAs: 1511 };

export const DENSITY_OF_STATES: Readonly<Record<Material, DensityOfStates>> = {
  Si: {
    conductionAt300KPerCm3: 2.86e19,
    conductionExponent: 1.58,
    valenceAt300KPerCm3: 3.1e19,
    valenceExponent: 1.85,
    source: 'M. A. Green, J. Appl. Phys. 67, 2944 (1990)',
    validityTemperatureK: { min: 200, max: 500 },
  },
  Ge: {
    conductionAt300KPerCm3: 1.04e19,
    conductionExponent: 1.5,
    valenceAt300KPerCm3: 6.0e18,
    valenceExponent: 1.5,
    source: 'S. M. Sze, Physics of Semiconductor Devices, 2nd ed. (1981), App. G; T^1.5 scaling',
    validityTemperatureK: { min: 200, max: 400 },
  },
  GaAs: {
    conductionAt300KPerCm3: 4.7e17,
    conductionExponent: 1.5,
    valenceAt300KPerCm3: 7.0e18,
    valenceExponent: 1.5,
    source: 'S. M. Sze, Physics of Semiconductor Devices, 2nd ed. (1981), App. G; T^1.5 scaling',
    validityTemperatureK: { min: 200, max: 400 },
  },
};

export function conductionBandDensityPerCm3(material: Material, temperatureK: number): number {
  const d = DENSITY_OF_STATES[material];
  return d.conductionAt300KPerCm3 * Math.pow(temperatureK / 300, d.conductionExponent);
}

export function valenceBandDensityPerCm3(material: Material, temperatureK: number): number {
  const d = DENSITY_OF_STATES[material];
  return d.valenceAt300KPerCm3 * Math.pow(temperatureK / 300, d.valenceExponent);
}

export function densityOfStatesParameters(material: Material): readonly Parameter[] {
  const d = DENSITY_OF_STATES[material];
  return [
    { name: 'Nc(300 K)', value: d.conductionAt300KPerCm3, unit: 'cm⁻³', source: d.source },
    { name: 'Nc exponent', value: d.conductionExponent, source: d.source },
    { name: 'Nv(300 K)', value: d.valenceAt300KPerCm3, unit: 'cm⁻³', source: d.source },
    { name: 'Nv exponent', value: d.valenceExponent, source: d.source },
  ];
}
