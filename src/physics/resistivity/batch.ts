/**
 * Batch conversions: many readings of one dopant at once (wafer maps, arrays sent to the HTTP
 * API), Float64Array in and out. The model is resolved once and its kernel called in a loop with
 * the same checks as the single conversion (convert.ts): a value outside the model's hard domain
 * is refused (NaN, status 'refused'), one outside its validity range is converted and marked
 * 'outside_validity'. Antimony without a named model switches model with the density, so it goes
 * value by value through the single conversion.
 */
import { refuse, type Outcome, type Refusal } from '../outcome.js';
import type { Dopant } from '../types.js';
import type { RegisteredConversionModel } from './conversion-model.js';
import { convertDensityToResistivity, convertResistivityToDensity } from './convert.js';
import { CONVERSION_MODELS, defaultModelFor, findConversionModel } from './registry.js';

/** Per value: 0 converted, 1 converted but outside the model's validity range, 2 refused (NaN). */
export const BATCH_OK = 0;
export const BATCH_OUTSIDE_VALIDITY = 1;
export const BATCH_REFUSED = 2;

export interface BatchConversion {
  /** The converted values, NaN where refused. */
  readonly out: Float64Array;
  /** BATCH_OK, BATCH_OUTSIDE_VALIDITY or BATCH_REFUSED per value. */
  readonly status: Uint8Array;
  /** The model of each value (one entry per value only for antimony by default; else one for all). */
  readonly modelIds: readonly string[];
}

type Direction = 'fromResistivity' | 'fromDensity';

function resolve(dopant: Dopant, modelId: string | undefined): RegisteredConversionModel | Refusal {
  if (modelId === undefined) return defaultModelFor(dopant);
  const found = findConversionModel(modelId);
  if (!found) return { code: 'unknown_model', model: modelId, known: CONVERSION_MODELS.map((m) => m.id) };
  if (found.dopants.includes(dopant)) return found;
  const delegateId = found.delegates?.[dopant];
  const delegate = delegateId === undefined ? undefined : findConversionModel(delegateId);
  if (delegate && delegate.dopants.includes(dopant)) return delegate;
  return { code: 'model_dopant', model: found.id, dopant, supported: [...found.dopants] };
}

function batch(direction: Direction, values: Float64Array, dopant: Dopant, modelId: string | undefined): Outcome<BatchConversion> {
  const n = values.length;
  const out = new Float64Array(n);
  const status = new Uint8Array(n);
  if (dopant === 'antimony' && modelId === undefined) {
    const ids: string[] = new Array<string>(n);
    for (let i = 0; i < n; i++) {
      const v = values[i]!;
      const r = direction === 'fromResistivity' ? convertResistivityToDensity({ resistivityOhmCm: v, dopant }) : convertDensityToResistivity({ dopantDensityPerCm3: v, dopant });
      if (!r.ok) {
        out[i] = Number.NaN;
        status[i] = BATCH_REFUSED;
        ids[i] = '';
        continue;
      }
      out[i] = direction === 'fromResistivity' ? r.value.dopantDensityPerCm3 : r.value.resistivityOhmCm;
      status[i] = r.value.problems.some((p) => p.code === 'outside_validity') ? BATCH_OUTSIDE_VALIDITY : BATCH_OK;
      ids[i] = r.value.model.id;
    }
    return { ok: true, value: { out, status, modelIds: ids } };
  }
  const model = resolve(dopant, modelId);
  if (!('dopantDensityFromResistivity' in model)) return refuse(model);
  const key = direction === 'fromResistivity' ? 'resistivityOhmCm' : 'dopantDensityPerCm3';
  const domain = model.domain[dopant]?.[key];
  const validity = model.validity[dopant]?.[key];
  const dMin = domain?.min ?? 0;
  const dMax = domain?.max ?? Number.POSITIVE_INFINITY;
  const vMin = validity?.min ?? 0;
  const vMax = validity?.max ?? Number.POSITIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const v = values[i]!;
    if (!(v > 0 && v < Number.POSITIVE_INFINITY) || v < dMin || v > dMax) {
      out[i] = Number.NaN;
      status[i] = BATCH_REFUSED;
      continue;
    }
    const r = direction === 'fromResistivity' ? model.dopantDensityFromResistivity(v, dopant) : model.resistivityFromDopantDensity(v, dopant);
    if (!(r > 0 && r < Number.POSITIVE_INFINITY)) {
      out[i] = Number.NaN;
      status[i] = BATCH_REFUSED;
      continue;
    }
    out[i] = r;
    status[i] = v < vMin || v > vMax ? BATCH_OUTSIDE_VALIDITY : BATCH_OK;
  }
  return { ok: true, value: { out, status, modelIds: [model.id] } };
}

/** Resistivities (Ω·cm) → dopant densities (cm⁻³), one dopant, one model. */
export function convertResistivityBatch(resistivityOhmCm: Float64Array, dopant: Dopant, modelId?: string): Outcome<BatchConversion> {
  return batch('fromResistivity', resistivityOhmCm, dopant, modelId);
}

/** Dopant densities (cm⁻³) → resistivities (Ω·cm), one dopant, one model. */
export function convertDensityBatch(dopantDensityPerCm3: Float64Array, dopant: Dopant, modelId?: string): Outcome<BatchConversion> {
  return batch('fromDensity', dopantDensityPerCm3, dopant, modelId);
}
