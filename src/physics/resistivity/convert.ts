/**
 * Public API: resistivity ↔ dopant density in silicon. Validates input, picks the model
 * (default or `modelId`), refuses meaningless input, and reports validity problems as data.
 */
import { ELEMENTARY_CHARGE_C } from '../constants.js';
import { checkPositive, ok, refuse, type Outcome, type Refusal } from '../outcome.js';
import type { Problem } from '../problems.js';
import { DOPANT_TYPE, type ConversionResult, type Dopant, type Range } from '../types.js';
import type { RegisteredConversionModel } from './conversion-model.js';
import {
  ANTIMONY_DEFAULT_SWITCH_PER_CM3,
  CONVERSION_MODELS,
  defaultConversionModel,
  findConversionModel,
} from './registry.js';

/** An input within this factor of a validity limit (inside it) gets a 'near_boundary' note. */
export const NEAR_BOUNDARY_FACTOR = 1.1;

type Quantity = 'resistivityOhmCm' | 'dopantDensityPerCm3';

interface Resolved {
  readonly model: RegisteredConversionModel;
}

/** Resolve an explicit model id (following a model's delegation for the dopant). */
function resolveExplicit(modelId: string, dopant: Dopant): Outcome<Resolved> {
  const found = findConversionModel(modelId);
  if (!found) {
    return refuse({ code: 'unknown_model', model: modelId, known: CONVERSION_MODELS.map((m) => m.id) });
  }
  let model = found;
  const delegateId = found.delegates?.[dopant];
  if (!found.dopants.includes(dopant) && delegateId) {
    const delegate = findConversionModel(delegateId);
    if (delegate) model = delegate;
  }
  if (!model.dopants.includes(dopant)) {
    return refuse({ code: 'model_dopant', model: found.id, dopant, supported: [...found.dopants] });
  }
  return ok({ model });
}

/** Problems for an input against a validity range. */
export function validityProblems(quantity: Quantity, input: number, range: Range | undefined, model: string): Problem[] {
  if (!range) return [];
  if (input < range.min || input > range.max) {
    return [{ code: 'outside_validity', quantity, input, min: range.min, max: range.max, model }];
  }
  if (input < range.min * NEAR_BOUNDARY_FACTOR) return [{ code: 'near_boundary', quantity, input, boundary: range.min, model }];
  if (input > range.max / NEAR_BOUNDARY_FACTOR) return [{ code: 'near_boundary', quantity, input, boundary: range.max, model }];
  return [];
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
  problems: Problem[],
): ConversionResult {
  return {
    resistivityOhmCm,
    dopantDensityPerCm3,
    mobilityCm2PerVs: 1 / (ELEMENTARY_CHARGE_C * dopantDensityPerCm3 * resistivityOhmCm),
    carrierType: DOPANT_TYPE[dopant],
    dopant,
    model,
    problems: [...model.standingProblems(dopant), ...problems],
    assumptionCodes: [...model.assumptionCodes],
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
  return ok(result(model, dopant, resistivityOhmCm, n, problems));
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
  return ok(result(model, dopant, rho, dopantDensityPerCm3, problems));
}

export function convertResistivityToDensity(req: {
  resistivityOhmCm: number;
  dopant: Dopant;
  modelId?: string;
}): Outcome<ConversionResult> {
  const bad = checkPositive('resistivityOhmCm', req.resistivityOhmCm);
  if (bad) return refuse(bad);
  if (req.modelId !== undefined) {
    const r = resolveExplicit(req.modelId, req.dopant);
    if (!r.ok) return r;
    return computeFromResistivity(r.value.model, req.dopant, req.resistivityOhmCm);
  }
  const first = defaultConversionModel(req.dopant).model;
  const out = computeFromResistivity(first, req.dopant, req.resistivityOhmCm);
  // Antimony: the default depends on the density, known only after a first conversion.
  if (out.ok && out.value.dopantDensityPerCm3 > ANTIMONY_DEFAULT_SWITCH_PER_CM3) {
    const second = defaultConversionModel(req.dopant, out.value.dopantDensityPerCm3).model;
    if (second !== first) return computeFromResistivity(second, req.dopant, req.resistivityOhmCm);
  }
  if (!out.ok && out.refusal.code === 'outside_domain' && req.dopant === 'antimony') {
    // Below the P conversion's domain in ρ means heavily doped: try the high-density default.
    const second = defaultConversionModel(req.dopant, Number.POSITIVE_INFINITY).model;
    if (second !== first) return computeFromResistivity(second, req.dopant, req.resistivityOhmCm);
  }
  return out;
}

export function convertDensityToResistivity(req: {
  dopantDensityPerCm3: number;
  dopant: Dopant;
  modelId?: string;
}): Outcome<ConversionResult> {
  const bad = checkPositive('dopantDensityPerCm3', req.dopantDensityPerCm3);
  if (bad) return refuse(bad);
  if (req.modelId !== undefined) {
    const r = resolveExplicit(req.modelId, req.dopant);
    if (!r.ok) return r;
    return computeFromDensity(r.value.model, req.dopant, req.dopantDensityPerCm3);
  }
  const { model } = defaultConversionModel(req.dopant, req.dopantDensityPerCm3);
  return computeFromDensity(model, req.dopant, req.dopantDensityPerCm3);
}
