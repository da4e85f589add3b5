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

let index: Map<string, RegisteredConversionModel> | undefined;
function lookup(): Map<string, RegisteredConversionModel> {
  // Built on first use (after every module has registered its models), ids before aliases.
  if (!index || index.size === 0) {
    index = new Map();
    for (const m of CONVERSION_MODELS) index.set(m.id, m);
    for (const m of CONVERSION_MODELS) for (const a of m.aliases) if (!index.has(a)) index.set(a, m);
  }
  return index;
}

/** Look a model up by id or alias (case-insensitive; spaces and underscores read as '-'). */
export function findConversionModel(id: string): RegisteredConversionModel | undefined {
  const map = lookup();
  return map.get(id) ?? map.get(normalise(id));
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
  const model = defaultModelFor(dopant, densityHintPerCm3);
  return { model, problems: [...model.standingProblems(dopant)] };
}

/** The default model alone (no allocation: the conversion hot path uses this). */
export function defaultModelFor(dopant: Dopant, densityHintPerCm3?: number): RegisteredConversionModel {
  switch (dopant) {
    case 'boron':
    case 'phosphorus':
      return f723;
    case 'arsenic':
      return masetti1983Conversion;
    case 'antimony':
      return densityHintPerCm3 !== undefined && densityHintPerCm3 > F723_AS_SB_DENSITY_LIMIT_PER_CM3
        ? masettiArsenicForAntimony
        : f723PhosphorusForArsenicAntimony;
  }
}

/** Threshold between the two antimony defaults, cm⁻³. */
export const ANTIMONY_DEFAULT_SWITCH_PER_CM3 = F723_AS_SB_DENSITY_LIMIT_PER_CM3;
