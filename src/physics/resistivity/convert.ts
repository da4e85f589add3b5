/**
 * Public API: resistivity ↔ dopant density in silicon. Validates input, picks the model
 * (default or `modelId`), refuses meaningless input, and reports validity problems as data.
 */
import { ELEMENTARY_CHARGE_C } from '../constants.js';
import { checkPositive, refuse, type Outcome, type Refusal } from '../outcome.js';
import type { Problem } from '../problems.js';
import { DOPANT_TYPE, type ConversionResult, type Dopant, type Range } from '../types.js';
import type { RegisteredConversionModel } from './conversion-model.js';
import { ANTIMONY_DEFAULT_SWITCH_PER_CM3, CONVERSION_MODELS, defaultModelFor, findConversionModel } from './registry.js';

// Module-local copies of imported bindings: the conversion is the hot path of every reading,
// and the TypeScript runner reaches imported bindings through accessors.
const Q = ELEMENTARY_CHARGE_C;
const TYPE_OF = DOPANT_TYPE;
const findModel = findConversionModel;
const defaultFor = defaultModelFor;

/** An input within this factor of a validity limit (inside it) gets a 'near_boundary' note. */
export const NEAR_BOUNDARY_FACTOR = 1.1;

type Quantity = 'resistivityOhmCm' | 'dopantDensityPerCm3';

const NO_PROBLEMS: readonly Problem[] = Object.freeze([]);

/** Resolve an explicit model id (following a model's delegation for the dopant). */
function resolveExplicit(modelId: string, dopant: Dopant): RegisteredConversionModel | undefined {
  const found = findModel(modelId);
  if (!found) return undefined;
  if (found.dopants.includes(dopant)) return found;
  const delegateId = found.delegates?.[dopant];
  const delegate = delegateId === undefined ? undefined : findModel(delegateId);
  return delegate && delegate.dopants.includes(dopant) ? delegate : undefined;
}

/** Why resolveExplicit found nothing. */
function unresolved(modelId: string, dopant: Dopant): Refusal {
  const found = findModel(modelId);
  if (!found) return { code: 'unknown_model', model: modelId, known: CONVERSION_MODELS.map((m) => m.id) };
  return { code: 'model_dopant', model: found.id, dopant, supported: [...found.dopants] };
}

/** Problems for an input against a validity range. */
export function validityProblems(
  quantity: Quantity,
  input: number,
  range: Range | undefined,
  model: string,
): readonly Problem[] {
  if (!range) return NO_PROBLEMS;
  if (input < range.min || input > range.max) {
    return [{ code: 'outside_validity', quantity, input, min: range.min, max: range.max, model }];
  }
  if (input < range.min * NEAR_BOUNDARY_FACTOR) return [{ code: 'near_boundary', quantity, input, boundary: range.min, model }];
  if (input > range.max / NEAR_BOUNDARY_FACTOR) return [{ code: 'near_boundary', quantity, input, boundary: range.max, model }];
  return NO_PROBLEMS;
}

function domainRefusal(quantity: Quantity, input: number, range: Range | undefined, model: string): Refusal | undefined {
  if (!range) return undefined;
  if (input < range.min || input > range.max) {
    return { code: 'outside_domain', quantity, input, min: range.min, max: range.max, model };
  }
  return undefined;
}

function result(
  model: RegisteredConversionModel,
  dopant: Dopant,
  resistivityOhmCm: number,
  dopantDensityPerCm3: number,
  problems: readonly Problem[],
): ConversionResult {
  const standing = model.standingProblems(dopant);
  return {
    resistivityOhmCm,
    dopantDensityPerCm3,
    mobilityCm2PerVs: 1 / (Q * dopantDensityPerCm3 * resistivityOhmCm),
    carrierType: TYPE_OF[dopant],
    dopant,
    model,
    problems: standing.length === 0 ? problems : problems.length === 0 ? standing : [...standing, ...problems],
    // Shared, read-only: every result of a model carries the same assumptions.
    assumptionCodes: model.assumptionCodes,
  };
}

function computeFromResistivity(
  model: RegisteredConversionModel,
  dopant: Dopant,
  resistivityOhmCm: number,
): Outcome<ConversionResult> {
  const refusal = domainRefusal('resistivityOhmCm', resistivityOhmCm, model.domain[dopant]?.resistivityOhmCm, model.id);
  if (refusal) return refuse(refusal);
  const n = model.dopantDensityFromResistivity(resistivityOhmCm, dopant);
  const range = model.domain[dopant]?.resistivityOhmCm;
  if (!Number.isFinite(n) || n <= 0) {
    // The kernel could not answer (e.g. the inversion found no root): say so as data.
    return refuse({
      code: 'outside_domain',
      quantity: 'resistivityOhmCm',
      input: resistivityOhmCm,
      min: range?.min ?? Number.NaN,
      max: range?.max ?? Number.NaN,
      model: model.id,
    });
  }
  const problems = validityProblems('resistivityOhmCm', resistivityOhmCm, model.validity[dopant]?.resistivityOhmCm, model.id);
  return { ok: true, value: result(model, dopant, resistivityOhmCm, n, problems) };
}

function computeFromDensity(
  model: RegisteredConversionModel,
  dopant: Dopant,
  dopantDensityPerCm3: number,
): Outcome<ConversionResult> {
  const range = model.domain[dopant]?.dopantDensityPerCm3;
  const refusal = domainRefusal('dopantDensityPerCm3', dopantDensityPerCm3, range, model.id);
  if (refusal) return refuse(refusal);
  const rho = model.resistivityFromDopantDensity(dopantDensityPerCm3, dopant);
  if (!Number.isFinite(rho) || rho <= 0) {
    return refuse({
      code: 'outside_domain',
      quantity: 'dopantDensityPerCm3',
      input: dopantDensityPerCm3,
      min: range?.min ?? Number.NaN,
      max: range?.max ?? Number.NaN,
      model: model.id,
    });
  }
  const problems = validityProblems('dopantDensityPerCm3', dopantDensityPerCm3, model.validity[dopant]?.dopantDensityPerCm3, model.id);
  return { ok: true, value: result(model, dopant, rho, dopantDensityPerCm3, problems) };
}

export function convertResistivityToDensity(req: {
  resistivityOhmCm: number;
  dopant: Dopant;
  modelId?: string;
}): Outcome<ConversionResult> {
  const rho = req.resistivityOhmCm;
  if (!(rho > 0 && rho < Number.POSITIVE_INFINITY)) return refuse(checkPositive('resistivityOhmCm', rho) as Refusal);
  if (req.modelId !== undefined) {
    const r = resolveExplicit(req.modelId, req.dopant);
    if (!r) return refuse(unresolved(req.modelId, req.dopant));
    return computeFromResistivity(r, req.dopant, req.resistivityOhmCm);
  }
  const first = defaultFor(req.dopant);
  const out = computeFromResistivity(first, req.dopant, req.resistivityOhmCm);
  if (req.dopant !== 'antimony') return out;
  // Antimony: the default depends on the density, known only after a first conversion.
  if (out.ok && out.value.dopantDensityPerCm3 > ANTIMONY_DEFAULT_SWITCH_PER_CM3) {
    const second = defaultFor(req.dopant, out.value.dopantDensityPerCm3);
    if (second !== first) return computeFromResistivity(second, req.dopant, req.resistivityOhmCm);
  }
  if (!out.ok && out.refusal.code === 'outside_domain') {
    // Below the P conversion's domain in ρ means heavily doped: try the high-density default.
    const second = defaultFor(req.dopant, Number.POSITIVE_INFINITY);
    if (second !== first) return computeFromResistivity(second, req.dopant, req.resistivityOhmCm);
  }
  return out;
}

export function convertDensityToResistivity(req: {
  dopantDensityPerCm3: number;
  dopant: Dopant;
  modelId?: string;
}): Outcome<ConversionResult> {
  const n = req.dopantDensityPerCm3;
  if (!(n > 0 && n < Number.POSITIVE_INFINITY)) return refuse(checkPositive('dopantDensityPerCm3', n) as Refusal);
  if (req.modelId !== undefined) {
    const r = resolveExplicit(req.modelId, req.dopant);
    if (!r) return refuse(unresolved(req.modelId, req.dopant));
    return computeFromDensity(r, req.dopant, req.dopantDensityPerCm3);
  }
  return computeFromDensity(defaultFor(req.dopant, req.dopantDensityPerCm3), req.dopant, req.dopantDensityPerCm3);
}
