/**
 * The resistivity ↔ dopant-density conversions the core knows, and the default per dopant.
 *
 * Defaults (issue 2): ASTM F723 for boron and phosphorus; Masetti 1983 for arsenic (the
 * standard's own As conversion was not retrieved); for antimony the F723 phosphorus conversion
 * below 1e19 cm⁻³, as the standard allows, and above it Masetti's arsenic form as an estimate.
 */
import type { Problem } from '../problems.js';
import type { Dopant } from '../types.js';
import { f723 } from './astm-f723.js';
import { caugheyThomas1967Conversion } from './caughey-thomas-1967.js';
import type { RegisteredConversionModel } from './conversion-model.js';
import { f723PhosphorusForArsenicAntimony, F723_AS_SB_DENSITY_LIMIT_PER_CM3 } from './f723-phosphorus-for-as-sb.js';
import { masetti1983Conversion, masettiArsenicForAntimony } from './masetti-1983.js';
import { arora1982Conversion, klaassen1992Conversion } from './temperature-models.js';

export const CONVERSION_MODELS: readonly RegisteredConversionModel[] = [
  f723,
  masetti1983Conversion,
  caugheyThomas1967Conversion,
  f723PhosphorusForArsenicAntimony,
  masettiArsenicForAntimony,
  klaassen1992Conversion,
  arora1982Conversion,
];

function normalise(s: string): string {
  return s.trim().toLowerCase().replace(/[\s_–—]+/g, '-');
}

/** Look a model up by id or alias (case-insensitive; spaces and underscores read as '-'). */
export function findConversionModel(id: string): RegisteredConversionModel | undefined {
  const key = normalise(id);
  return CONVERSION_MODELS.find((m) => m.id === key || m.aliases.includes(key));
}

/** Ids and aliases, for "did you mean" and refusals. */
export function knownConversionModelIds(): string[] {
  return CONVERSION_MODELS.map((m) => m.id);
}

/**
 * The default conversion for a dopant. For antimony the choice depends on the density: pass
 * the density (or an estimate of it) as the hint; without one the F723 phosphorus conversion
 * is chosen. `problems` are the notes every result of that choice carries.
 */
export function defaultConversionModel(
  dopant: Dopant,
  densityHintPerCm3?: number,
): { model: RegisteredConversionModel; problems: Problem[] } {
  let model: RegisteredConversionModel;
  switch (dopant) {
    case 'boron':
    case 'phosphorus':
      model = f723;
      break;
    case 'arsenic':
      model = masetti1983Conversion;
      break;
    case 'antimony':
      model =
        densityHintPerCm3 !== undefined && densityHintPerCm3 > F723_AS_SB_DENSITY_LIMIT_PER_CM3
          ? masettiArsenicForAntimony
          : f723PhosphorusForArsenicAntimony;
      break;
  }
  return { model, problems: [...model.standingProblems(dopant)] };
}

/** Threshold between the two antimony defaults, cm⁻³. */
export const ANTIMONY_DEFAULT_SWITCH_PER_CM3 = F723_AS_SB_DENSITY_LIMIT_PER_CM3;
