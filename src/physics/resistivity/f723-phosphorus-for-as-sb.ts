/**
 * ASTM F723's phosphorus conversion applied to arsenic and antimony.
 *
 * ASTM F723-99 states that its phosphorus conversion may serve for As- and Sb-doped silicon
 * except near solid solubility [V scope, see docs/references.md]; we apply it up to 1e19 cm⁻³ and
 * warn above. (The standard's separate arsenic conversion for 1e19–6e20 cm⁻³ was not
 * retrieved and is not invented here: heavily As-doped silicon uses Masetti by default.)
 * Equations, coefficients and citation: src/physics/resistivity/astm-f723.ts.
 */
import { F723_REFERENCE_TEMPERATURE_K } from '../constants.js';
import type { Problem } from '../problems.js';
import type { Dopant, Parameter, Range } from '../types.js';
import {
  F723_CITATION,
  F723_PHOSPHORUS_EQUATIONS,
  F723_SELF_CONSISTENCY,
  f723PhosphorusDensityPerCm3,
  f723PhosphorusParameters,
  f723PhosphorusResistivityOhmCm,
} from './astm-f723.js';
import { widen, type ConversionDomain, type RegisteredConversionModel } from './conversion-model.js';

export const F723_AS_SB_DENSITY_LIMIT_PER_CM3 = 1e19;

const P_RHO = F723_SELF_CONSISTENCY.phosphorus.resistivityOhmCm;
const RHO: Range = { min: f723PhosphorusResistivityOhmCm(F723_AS_SB_DENSITY_LIMIT_PER_CM3), max: P_RHO.max };
const N: Range = { min: f723PhosphorusDensityPerCm3(P_RHO.max), max: F723_AS_SB_DENSITY_LIMIT_PER_CM3 };
const DOMAIN: ConversionDomain = { resistivityOhmCm: widen(RHO, 10), dopantDensityPerCm3: widen(N, 10) };
const ID = 'f723-phosphorus-for-as-sb';

function substitute(dopant: Dopant): readonly Problem[] {
  return Object.freeze([
    {
      code: 'substitute_model',
      model: ID,
      forDopant: dopant,
      reason: 'ASTM F723 allows its phosphorus conversion for As and Sb below solid solubility',
    } as const,
  ]);
}
const STANDING_AS = substitute('arsenic');
const STANDING_SB = substitute('antimony');

export const f723PhosphorusForArsenicAntimony: RegisteredConversionModel = {
  id: ID,
  name: 'ASTM F723 phosphorus conversion used for As and Sb',
  citation: F723_CITATION,
  aliases: ['f723-p', 'f723-phosphorus', 'f723-as-sb'],
  dopants: ['arsenic', 'antimony'],
  referenceTemperatureK: F723_REFERENCE_TEMPERATURE_K,
  validity: {
    arsenic: { resistivityOhmCm: RHO, dopantDensityPerCm3: N },
    antimony: { resistivityOhmCm: RHO, dopantDensityPerCm3: N },
  },
  domain: { arsenic: DOMAIN, antimony: DOMAIN },
  equations: F723_PHOSPHORUS_EQUATIONS,
  notes: [
    'ASTM F723 allows its phosphorus conversion for arsenic and antimony except near solid solubility; used here up to 1e19 cm⁻³.',
    'Defined at 23 °C for uncompensated silicon.',
  ],
  assumptionCodes: ['uncompensated', 'full_ionization', 'temperature_23C'],
  parameters(): readonly Parameter[] {
    return f723PhosphorusParameters();
  },
  dopantDensityFromResistivity(resistivityOhmCm: number): number {
    return resistivityOhmCm > 0 ? f723PhosphorusDensityPerCm3(resistivityOhmCm) : Number.NaN;
  },
  resistivityFromDopantDensity(dopantDensityPerCm3: number): number {
    return dopantDensityPerCm3 > 0 ? f723PhosphorusResistivityOhmCm(dopantDensityPerCm3) : Number.NaN;
  },
  standingProblems(dopant: Dopant): readonly Problem[] {
    return dopant === 'antimony' ? STANDING_SB : STANDING_AS;
  },
};
