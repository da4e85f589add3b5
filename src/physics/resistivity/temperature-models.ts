/**
 * Resistivity ↔ dopant density from the temperature-dependent mobility models (Klaassen 1992,
 * Arora–Hauser–Roulston 1982; citations, parameters and validity in src/physics/mobility),
 * registered as conversions for `model klaassen` / `model arora`.
 *
 * As conversions they are evaluated at 23 °C (296.15 K), the temperature readings are taken
 * at unless one is given, so that they compare like for like with ASTM F723; ρ = 1/(q·N·μ(N))
 * with full ionization and majority carriers, as for Masetti. For a reading at another
 * temperature, temperature-correction.ts uses the same models with their temperature law.
 * Masetti 1983 and Caughey–Thomas stay 300 K models, and F723 a 23 °C model: none of those
 * has a temperature law.
 */
import { F723_REFERENCE_TEMPERATURE_K } from '../constants.js';
import { arora1982 } from '../mobility/arora-1982.js';
import { klaassen1992 } from '../mobility/klaassen-1992.js';
import type { MobilityModel } from '../mobility/mobility-model.js';
import type { Dopant } from '../types.js';
import type { RegisteredConversionModel } from './conversion-model.js';
import { conversionFromMobility } from './mobility-conversion.js';

const NOTE =
  'Temperature-dependent model, evaluated here at 23 °C; Masetti (300 K) and ASTM F723 (23 °C) stay fixed-temperature models. Give `at <T>` to correct a reading taken at another temperature.';

/** The model with its temperature fixed at 23 °C, for the fixed-temperature conversion machinery. */
function at23C(model: MobilityModel): MobilityModel {
  return {
    ...model,
    referenceTemperatureK: F723_REFERENCE_TEMPERATURE_K,
    mobilityCm2PerVs: (n: number, d: Dopant, t?: number) => model.mobilityCm2PerVs(n, d, t ?? F723_REFERENCE_TEMPERATURE_K),
  };
}

/**
 * The models have no lower density limit (the lattice term takes over); for the conversion's
 * stated range we start at 1e12 cm⁻³ (~1e4 Ω·cm), where intrinsic carriers at 23 °C are still
 * under 0.1 % of the doping. Upper limits are the models' own.
 */
function conversionValidity(model: MobilityModel): Readonly<Partial<Record<Dopant, { min: number; max: number }>>> {
  const out: Partial<Record<Dopant, { min: number; max: number }>> = {};
  for (const d of model.dopants) {
    const r = model.validityDensityPerCm3[d];
    if (r) out[d] = { min: Math.max(r.min, 1e12), max: r.max };
  }
  return out;
}

function withAssumptions(m: RegisteredConversionModel): RegisteredConversionModel {
  return {
    ...m,
    assumptionCodes: m.assumptionCodes.map((c) => (c === 'temperature_300K' ? 'temperature_23C' : c)),
  };
}

export const klaassen1992Conversion: RegisteredConversionModel = withAssumptions(
  conversionFromMobility(at23C(klaassen1992), {
    id: 'klaassen-1992',
    name: 'Klaassen 1992 unified mobility, ρ = 1/(q·N·μ) at 23 °C',
    aliases: ['klaassen', 'philips', 'klaassen92'],
    validityDensityPerCm3: conversionValidity(klaassen1992),
    extraNotes: [NOTE],
  }),
);

export const arora1982Conversion: RegisteredConversionModel = withAssumptions(
  conversionFromMobility(at23C(arora1982), {
    id: 'arora-1982',
    name: 'Arora–Hauser–Roulston 1982 mobility, ρ = 1/(q·N·μ) at 23 °C',
    aliases: ['arora', 'arora82'],
    validityDensityPerCm3: conversionValidity(arora1982),
    extraNotes: [NOTE],
  }),
);
