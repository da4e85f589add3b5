/**
 * Typed conversions for fab systems (the HTTP API's /v1/convert/…): one value or up to 10 000 in
 * one call, through the core's batch path, each value with its own status. A reading taken off
 * 23 °C is first corrected to 23 °C, value by value (the same correction as `rho … at 27C`). The
 * request schemas are the ones the HTTP adapter validates with and documents (OpenAPI).
 */
import { z } from 'zod';
import { refusalMessage } from '../commands/describe.js';
import { convertDensityToResistivity, convertResistivityToDensity } from '../physics/resistivity/convert.js';
import { BATCH_OUTSIDE_VALIDITY, BATCH_REFUSED, convertDensityBatch, convertResistivityBatch } from '../physics/resistivity/batch.js';
import { findConversionModel } from '../physics/resistivity/registry.js';
import { correctResistivityToReference } from '../physics/resistivity/temperature-correction.js';
import type { Dopant } from '../physics/types.js';
import { CONFIRM_PROCEDURE, MODEL_ESTIMATE } from '../reply/cautions.js';
import { assumptionText, problemMessage } from '../reply/messages.js';

/** The most values one call converts. */
export const MAX_BATCH = 10_000;

export const DOPANTS = ['boron', 'phosphorus', 'arsenic', 'antimony'] as const;

const Reading = z.number().finite();
const OneOrMany = (what: string) =>
  z.union([Reading, z.array(Reading).min(1, { error: `give at least one ${what}` }).max(MAX_BATCH, { error: `at most ${MAX_BATCH} values in one call` })]);

const Common = {
  dopant: z.enum(DOPANTS, { error: `dopant must be one of ${DOPANTS.join(', ')}` }),
  model: z.string().min(1).max(40).optional(),
};

export const ConvertResistivityRequest = z
  .object({
    resistivityOhmCm: OneOrMany('resistivity'),
    ...Common,
    /** The temperature the readings were taken at; corrected to 23 °C first. Default 23 °C. */
    temperatureC: z.number().min(-100).max(300).optional(),
  })
  .strict();
export type ConvertResistivityRequest = z.infer<typeof ConvertResistivityRequest>;

export const ConvertDensityRequest = z
  .object({
    dopantDensityPerCm3: OneOrMany('dopant density'),
    ...Common,
  })
  .strict();
export type ConvertDensityRequest = z.infer<typeof ConvertDensityRequest>;

export const ConvertedValue = z.object({
  status: z.enum(['ok', 'outside_validity', 'refused']),
  resistivityOhmCm: z.number().nullable(),
  dopantDensityPerCm3: z.number().nullable(),
  /** For readings off 23 °C: the resistivity corrected to 23 °C (what was converted). */
  resistivityAt23COhmCm: z.number().optional(),
  model: z.string().optional(),
  message: z.string().optional(),
});

export const ConvertResponse = z.object({
  ok: z.literal(true),
  dopant: z.enum(DOPANTS),
  models: z.array(z.object({ id: z.string(), name: z.string(), citation: z.string() })),
  results: z.array(ConvertedValue),
  assumptions: z.array(z.string()),
  cautions: z.array(z.string()),
});
export type ConvertResponse = z.infer<typeof ConvertResponse>;

export const ConvertError = z.object({ ok: z.literal(false), error: z.object({ code: z.string(), message: z.string() }) });
export type ConvertOutcome = ConvertResponse | z.infer<typeof ConvertError>;

const list = (v: number | readonly number[]): number[] => (typeof v === 'number' ? [v] : [...v]);

/** The assumptions every result of these models carries, in words. */
function assumptionsOf(ids: readonly string[]): string[] {
  const codes = new Set(ids.filter((id) => id !== '').flatMap((id) => findConversionModel(id)?.assumptionCodes ?? []));
  return [...codes].filter((c) => c !== 'temperature_23C').map(assumptionText);
}

function modelsOf(ids: readonly string[]): ConvertResponse['models'] {
  return [...new Set(ids.filter((id) => id !== ''))].map((id) => {
    const m = findConversionModel(id)!;
    return { id: m.id, name: m.name, citation: m.citation };
  });
}

/** Why one value was refused or is outside the validity range, in words (the single conversion knows). */
function explain(direction: 'rho' | 'density', value: number, dopant: Dopant, model: string | undefined): string | undefined {
  const r =
    direction === 'rho'
      ? convertResistivityToDensity({ resistivityOhmCm: value, dopant, ...(model ? { modelId: model } : {}) })
      : convertDensityToResistivity({ dopantDensityPerCm3: value, dopant, ...(model ? { modelId: model } : {}) });
  if (!r.ok) return refusalMessage(r.refusal);
  const words = r.value.problems.filter((p) => p.code === 'outside_validity').map(problemMessage);
  return words.length > 0 ? words.join(' ') : undefined;
}

const CAUTIONS = [MODEL_ESTIMATE, CONFIRM_PROCEDURE];

export function convertResistivities(req: ConvertResistivityRequest): ConvertOutcome {
  const read = list(req.resistivityOhmCm);
  const t = req.temperatureC;
  const corrected = new Float64Array(read.length);
  const notes: (string | undefined)[] = new Array<string | undefined>(read.length);
  const offReference = t !== undefined && Math.abs(t - 23) >= 0.05;
  for (let i = 0; i < read.length; i++) {
    const rho = read[i]!;
    if (!offReference || !(rho > 0)) {
      corrected[i] = rho;
      continue;
    }
    const c = correctResistivityToReference({ resistivityOhmCm: rho, temperatureK: t + 273.15, dopant: req.dopant });
    if (c.ok) corrected[i] = c.value.resistivityOhmCm;
    else {
      corrected[i] = Number.NaN;
      notes[i] = refusalMessage(c.refusal);
    }
  }
  const b = convertResistivityBatch(corrected, req.dopant, req.model);
  if (!b.ok) return { ok: false, error: { code: b.refusal.code, message: refusalMessage(b.refusal) } };
  const { out, status, modelIds } = b.value;
  const results = read.map((rho, i) => {
    const s = status[i] === BATCH_REFUSED ? 'refused' : status[i] === BATCH_OUTSIDE_VALIDITY ? 'outside_validity' : 'ok';
    const message = notes[i] ?? (s === 'ok' ? undefined : Number.isNaN(corrected[i]!) ? undefined : explain('rho', corrected[i]!, req.dopant, req.model));
    return {
      status: s,
      resistivityOhmCm: rho,
      dopantDensityPerCm3: s === 'refused' ? null : out[i]!,
      ...(offReference && Number.isFinite(corrected[i]!) ? { resistivityAt23COhmCm: corrected[i]! } : {}),
      ...(modelIds.length > 1 && modelIds[i] ? { model: modelIds[i]! } : {}),
      ...(message ? { message } : {}),
    } as const;
  });
  return {
    ok: true,
    dopant: req.dopant,
    models: modelsOf(modelIds),
    results,
    assumptions: [
      ...(offReference ? [`Readings taken at ${t} °C, corrected to 23 °C with a model coefficient (Klaassen mobility) before conversion: a model estimate, not the ASTM F84 table.`] : ['Readings at 23 °C.']),
      ...assumptionsOf(modelIds),
    ],
    cautions: CAUTIONS,
  };
}

export function convertDensities(req: ConvertDensityRequest): ConvertOutcome {
  const values = list(req.dopantDensityPerCm3);
  const b = convertDensityBatch(Float64Array.from(values), req.dopant, req.model);
  if (!b.ok) return { ok: false, error: { code: b.refusal.code, message: refusalMessage(b.refusal) } };
  const { out, status, modelIds } = b.value;
  return {
    ok: true,
    dopant: req.dopant,
    models: modelsOf(modelIds),
    results: values.map((n, i) => {
      const s = status[i] === BATCH_REFUSED ? 'refused' : status[i] === BATCH_OUTSIDE_VALIDITY ? 'outside_validity' : 'ok';
      const message = s === 'ok' ? undefined : explain('density', n, req.dopant, req.model);
      return {
        status: s,
        dopantDensityPerCm3: n,
        resistivityOhmCm: s === 'refused' ? null : out[i]!,
        ...(modelIds.length > 1 && modelIds[i] ? { model: modelIds[i]! } : {}),
        ...(message ? { message } : {}),
      } as const;
    }),
    assumptions: ['Resistivity at 23 °C.', ...assumptionsOf(modelIds)],
    cautions: CAUTIONS,
  };
}
