/**
 * Parsing shared by the issue 5 commands (carriers, crossover, layer, and the `at <T>` /
 * `tc <x>%/K` options of rho and sheet): dopant lists, model ids, and the temperature
 * correction of a reading, as reply parts.
 */
import { findMobilityModel, MOBILITY_MODELS } from '../physics/mobility/registry.js';
import type { Outcome } from '../physics/outcome.js';
import type { Problem } from '../physics/problems.js';
import { findConversionModel } from '../physics/resistivity/registry.js';
import {
  correctResistivityToReference,
  type TemperatureCorrectionResult,
} from '../physics/resistivity/temperature-correction.js';
import type { Dopant } from '../physics/types.js';
import { formatNumber, formatTemperature } from '../reply/format.js';
import { assumptionText } from '../reply/messages.js';
import type { ReplyInput, ReplyValue } from '../reply/reply.js';
import { ArgError, type Args } from './args.js';
import { DOPANT_HINT } from './common.js';
import { DOPANT_WORDS } from './words.js';

/** "klaassen", "Klaassen-1992", "arora" → a mobility model id (undefined when unknown). */
export function resolveMobilityModelId(text: string | undefined): string | undefined {
  if (text === undefined) return undefined;
  const key = text.trim().toLowerCase();
  if (findMobilityModel(key)) return key;
  const conv = findConversionModel(key);
  if (conv && findMobilityModel(conv.id)) return conv.id;
  return MOBILITY_MODELS.find((m) => m.id.split('-')[0] === key)?.id ?? text;
}

export interface DopantEntry {
  readonly dopant: Dopant;
  readonly densityPerCm3: number;
  readonly densityAsTyped: string;
  readonly dopantAsTyped: string;
  readonly bareNumber: boolean;
}

/**
 * "1e16 boron and 3e15 P": densities and dopant words paired in the order typed. Read the
 * temperature (`at <T>`) before calling this, so that a bare number after `at` is not taken
 * for a density.
 */
export function readDopantList(args: Args, example: string): DopantEntry[] {
  const densities: { value: number; raw: string; bare: boolean }[] = [];
  for (;;) {
    const q = args.quantity(['density']);
    if (!q) break;
    densities.push({ value: q.value, raw: q.raw, bare: q.bareNumber });
    while (args.flag(['and', 'with', 'plus', '+'])) {
      /* separators */
    }
  }
  const dopants: { value: Dopant; raw: string }[] = [];
  args.flag(['type']);
  for (;;) {
    const d = args.word(DOPANT_WORDS);
    if (!d) break;
    dopants.push(d);
  }
  if (densities.length === 0) {
    const other = args.anyNumber();
    throw new ArgError(
      other ? 'wrong_dimension' : 'missing_value',
      other ? `"${other.raw}" is not a dopant density; give it in cm⁻³, e.g. ${example}` : `Give the dopant density and the dopant, e.g. ${example}`,
    );
  }
  if (dopants.length !== densities.length) {
    // "carriers 1e15 boron 300": a small bare number is more likely a temperature without its unit.
    const likelyTemperature = densities.find((d) => d.bare && d.value < 1e4);
    throw new ArgError(
      'missing_dopant',
      `Give one dopant for each density (${densities.length} ${densities.length === 1 ? 'density' : 'densities'}, ${dopants.length} ${dopants.length === 1 ? 'dopant' : 'dopants'}): ${DOPANT_HINT}. For example: ${example}` +
        (likelyTemperature ? `. If ${likelyTemperature.raw} is a temperature, give its unit: at ${likelyTemperature.raw}K or at ${likelyTemperature.raw}C` : ''),
    );
  }
  return densities.map((d, i) => ({
    dopant: dopants[i]!.value,
    dopantAsTyped: dopants[i]!.raw,
    densityPerCm3: d.value,
    densityAsTyped: d.raw,
    bareNumber: d.bare,
  }));
}

/** `at <T>` and `tc <x>%/K` of a reading. */
export interface ReadingTemperature {
  readonly temperatureK?: number;
  readonly temperatureAsTyped?: string;
  readonly coefficientPerK?: number;
  readonly coefficientAsTyped?: string;
}

export function readReadingTemperature(args: Args, example: string): ReadingTemperature {
  const t = args.keyed(['at'], 'temperature');
  const tc = args.keyed(['tc', 'coefficient', 'tempco'], 'temperatureCoefficient');
  if (t && t.unitAsTyped === '') {
    throw new ArgError('bad_unit', `Give the reading's temperature with its unit, e.g. at ${t.raw}C or at ${t.raw}K`);
  }
  if (tc && !t) {
    throw new ArgError('missing_value', `A coefficient needs the temperature the reading was taken at, e.g. ${example} at 27C tc 0.75%/K`);
  }
  return {
    ...(t ? { temperatureK: t.value, temperatureAsTyped: t.raw } : {}),
    ...(tc ? { coefficientPerK: tc.value, coefficientAsTyped: tc.raw } : {}),
  };
}

/** Everything a reply needs from a temperature correction. */
export interface CorrectionParts {
  readonly result: TemperatureCorrectionResult;
  readonly values: ReplyValue[];
  readonly inputs: Record<string, ReplyInput>;
  readonly assumptions: string[];
  readonly problems: Problem[];
  readonly steps: string[];
  readonly equations: string[];
  readonly sources: string[];
}

/** Correct a resistivity reading to 23 °C (model coefficient, or the person's `tc`). */
export function correctReading(
  resistivityOhmCm: number,
  dopant: Dopant,
  t: ReadingTemperature & { temperatureK: number },
  modelId?: string,
): Outcome<CorrectionParts> {
  const mobilityModelId = modelId !== undefined ? resolveMobilityModelId(modelId) : undefined;
  const usable = mobilityModelId !== undefined && findMobilityModel(mobilityModelId);
  const fixedTemperature = usable && usable.validityTemperatureK.max === usable.validityTemperatureK.min;
  const outcome = correctResistivityToReference({
    resistivityOhmCm,
    temperatureK: t.temperatureK,
    dopant,
    ...(t.coefficientPerK !== undefined ? { coefficientPerK: t.coefficientPerK } : {}),
    // A conversion model without a temperature law (F723, Masetti) leaves the coefficient to the default.
    ...(usable && !fixedTemperature ? { mobilityModelId: usable.id } : {}),
  });
  if (!outcome.ok) return outcome;
  const r = outcome.value;
  const pct = (x: number) => x * 100;
  const values: ReplyValue[] = [
    { key: 'resistivityAtTemperatureOhmCm', value: r.measuredResistivityOhmCm, unit: 'Ω·cm', label: `Resistivity as read at ${formatTemperature(r.measuredTemperatureK)}` },
    { key: 'temperatureCoefficientPerK', value: pct(r.temperatureCoefficientPerK), unit: '%/K', label: r.coefficientSource === 'model' ? 'Temperature coefficient (1/ρ)·dρ/dT at the reading (model)' : 'Temperature coefficient (yours)' },
    { key: 'temperatureCorrectionFactor', value: r.correctionFactor, unit: '', label: 'ρ(23 °C) / ρ(reading)', sigFigs: 4 },
    { key: 'temperatureK', value: r.measuredTemperatureK, unit: 'K', label: 'Reading temperature', sigFigs: 5 },
  ];
  const inputs: Record<string, ReplyInput> = {
    temperature: { value: r.measuredTemperatureK, unit: 'K', label: 'Reading temperature', asTyped: t.temperatureAsTyped ?? '' },
  };
  if (t.coefficientPerK !== undefined) {
    inputs['coefficient'] = { value: pct(t.coefficientPerK), unit: '%/K', label: 'Temperature coefficient', asTyped: t.coefficientAsTyped ?? '' };
  }
  const dT = r.measuredTemperatureK - r.referenceTemperatureK;
  const steps =
    r.coefficientSource === 'model'
      ? [
          `Doping that reproduces ${formatNumber(r.measuredResistivityOhmCm, { sigFigs: 6 })} Ω·cm at ${formatNumber(r.measuredTemperatureK, { sigFigs: 6 })} K with ${r.mobilityModel?.name}: N = ${formatNumber(r.dopantDensityPerCm3 ?? Number.NaN, { sigFigs: 6 })} cm⁻³`,
          `ρ(N, 23 °C) = ${formatNumber(r.resistivityOhmCm, { sigFigs: 6 })} Ω·cm (factor ${formatNumber(r.correctionFactor, { sigFigs: 6 })})`,
          `α = d ln ρ/dT at the reading = ${formatNumber(pct(r.temperatureCoefficientPerK), { sigFigs: 4 })} %/K; mean over ΔT = ${formatNumber(dT, { sigFigs: 4 })} K: ${formatNumber(pct(r.meanCoefficientPerK), { sigFigs: 4 })} %/K`,
        ]
      : [`ρ(23 °C) = ρ/(1 + α·ΔT) = ${formatNumber(r.measuredResistivityOhmCm, { sigFigs: 6 })} / (1 + ${formatNumber(r.temperatureCoefficientPerK, { sigFigs: 4 })} × ${formatNumber(dT, { sigFigs: 4 })}) = ${formatNumber(r.resistivityOhmCm, { sigFigs: 6 })} Ω·cm`];
  const equations =
    r.coefficientSource === 'model'
      ? ['ρ(N, T) = 1/(q·(n·μn + p·μp)), n·p = n_i(T)², full ionization', 'ρ(N, T_reading) = ρ_reading → N; ρ(23 °C) = ρ(N, 296.15 K)', 'α = d ln ρ/dT']
      : ['ρ(23 °C) = ρ(T)/(1 + α·(T − 296.15 K))'];
  return {
    ok: true,
    value: {
      result: r,
      values,
      inputs,
      assumptions: [
        `Reading taken at ${formatTemperature(r.measuredTemperatureK)}; corrected to 23 °C before conversion.`,
        ...r.assumptionCodes.filter((c) => c !== 'uncompensated').map(assumptionText),
      ],
      problems: [...r.problems],
      steps,
      equations,
      sources: r.mobilityModel ? [r.mobilityModel.citation, ...(r.intrinsicModel ? [r.intrinsicModel.citation] : [])] : [],
    },
  };
}
