/**
 * Checking one `record` against the lot's product spec. Pure: the physics comes through the
 * LotPhysics port, the lot's current readings are given. The result is data (checks, notes,
 * flag findings, a verdict per reading); wording lives in the commands layer.
 *
 * Checks, in order:
 * 1. resistivity (or dopant density) inside the product window at 23 °C, with the margin in %
 *    of the nearest limit (inside) or of the limit crossed (outside);
 * 2. the ρ → N conversion inside the model's validity;
 * 3. conductivity type as the product expects;
 * 4. site-to-site spread on the reading's wafer and wafer-to-wafer spread in the lot;
 * 5. the lot has a product with a spec.
 */
import type { Refusal } from '../physics/outcome.js';
import type { Problem } from '../physics/problems.js';
import type { Dopant } from '../physics/types.js';
import {
  placeScope,
  siteSpreadScope,
  WAFER_SPREAD_SCOPE,
  type FlagFinding,
} from './flags.js';
import type { LotPhysics, ModelRef } from './physics.js';
import type { PrimaryMeasurement, Quantity, RecordRequest, TypeMeasurement, Verdict } from './readings.js';
import { suggestProduct } from './suggest.js';
import type { Product, SpecCatalog, SpecWindow } from './spec/schema.js';
import { waferSummaries, waferToWaferSpread, type PlaceValue } from './spread.js';

/** 23 °C, the temperature product windows (and ASTM F723) are defined at. */
export const SPEC_TEMPERATURE_K = 296.15;
/** A reading within this of 23 °C is taken as at 23 °C. */
export const TEMPERATURE_TOLERANCE_K = 0.5;

export type Check =
  | {
      readonly check: 'window';
      readonly quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3';
      readonly value: number;
      readonly min: number;
      readonly max: number;
      readonly status: 'pass' | 'fail';
      /** Inside: distance to the nearest limit in % of it. Outside: how far past the limit, in % of it. */
      readonly marginPercent: number;
      /** Which limit the margin is measured to. */
      readonly limit: 'min' | 'max';
    }
  | { readonly check: 'validity'; readonly status: 'pass' | 'fail'; readonly model: string }
  | {
      readonly check: 'type';
      readonly expected: 'n' | 'p';
      readonly found: 'n' | 'p' | 'indeterminate';
      readonly method: string;
      readonly status: 'pass' | 'fail' | 'indeterminate';
    }
  | {
      readonly check: 'site_spread';
      readonly wafer: number;
      readonly spreadPercent: number;
      readonly limitPercent: number;
      readonly count: number;
      readonly status: 'pass' | 'fail';
    }
  | {
      readonly check: 'wafer_spread';
      readonly spreadPercent: number;
      readonly limitPercent: number;
      readonly count: number;
      readonly status: 'pass' | 'fail';
    }
  | { readonly check: 'spec'; readonly status: 'fail'; readonly productId: string };

export type LotNote =
  | { readonly code: 'temperature_uncorrected'; readonly temperatureK: number }
  | {
      readonly code: 'temperature_corrected';
      readonly temperatureK: number;
      readonly measuredOhmCm: number;
      readonly correctedOhmCm: number;
      readonly coefficientPerK: number;
      readonly model: ModelRef;
    }
  | {
      readonly code: 'near_limit';
      readonly quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3';
      readonly marginPercent: number;
      readonly limit: 'min' | 'max';
      readonly thresholdPercent: number;
    }
  | { readonly code: 'problem'; readonly problem: Problem }
  | { readonly code: 'assumption'; readonly assumption: string }
  | { readonly code: 'type_not_checked'; readonly reason: 'indeterminate' }
  | { readonly code: 'window_not_checked'; readonly reason: 'conversion_refused' };

/** Stored with each reading: what it was checked against and what was found. */
export interface ReadingEvaluation {
  readonly productId?: string;
  readonly specSource?: string;
  readonly specRevision?: string;
  readonly demoSpecs?: boolean;
  readonly dopant?: Dopant;
  readonly model?: ModelRef;
  readonly checks: readonly Check[];
  readonly notes: readonly LotNote[];
  readonly findings: readonly FlagFinding[];
  readonly verdict: Verdict;
}

export interface ReadingDraft {
  readonly wafer?: number;
  readonly site?: number;
  readonly quantity: Quantity;
  /** The text as entered ('8.4 ohm-cm', '45 ohm/sq thick 525um', 'hot -1.2mV'). */
  readonly asEntered: string;
  /** Canonical value: Ω·cm, Ω/□, or V / cm³/C / ±1 for type readings (0 for a stated type). */
  readonly value: number;
  readonly unit: string;
  readonly thicknessCm?: number;
  readonly spacingCm?: number;
  readonly typeMethod?: string;
  /** Resistivity used for the checks (as read, or from sheet × thickness). */
  readonly resistivityOhmCm?: number;
  readonly dopantDensityPerCm3?: number;
  readonly carrierType?: 'n' | 'p' | 'indeterminate';
  readonly temperatureK?: number;
  readonly verdict: Verdict;
  readonly evaluation: ReadingEvaluation;
  readonly note?: string;
}

export type LotError =
  | { readonly code: 'invalid_request'; readonly issues: readonly { readonly path: string; readonly message: string }[] }
  | { readonly code: 'bad_lot_id'; readonly input: string; readonly pattern: string; readonly example: string }
  | { readonly code: 'no_product'; readonly lotId: string; readonly products: readonly string[] }
  | { readonly code: 'unknown_reading'; readonly readingId: number }
  | { readonly code: 'correction_other_lot'; readonly readingId: number; readonly readingLot: string; readonly lotId: string }
  | { readonly code: 'already_corrected'; readonly readingId: number; readonly by: number }
  | { readonly code: 'measurement_refused'; readonly what: 'sheet' | 'type'; readonly refusal: Refusal }
  | { readonly code: 'not_permitted'; readonly action: 'record' | 'clear'; readonly userId: string; readonly channelId: string }
  | { readonly code: 'unknown_lot'; readonly lotId: string }
  | { readonly code: 'no_such_flag'; readonly lotId: string; readonly what: string; readonly open: readonly { id: number; code: string; scope: string }[] }
  | { readonly code: 'ambiguous_flag'; readonly lotId: string; readonly what: string; readonly candidates: readonly { id: number; code: string; scope: string }[] }
  | { readonly code: 'flag_already_cleared'; readonly flagId: number; readonly at: string; readonly by: string }
  | { readonly code: 'flag_other_lot'; readonly flagId: number; readonly flagLot: string; readonly lotId: string };

export interface EvaluationInput {
  readonly request: RecordRequest;
  /** The lot's product after this record (the one named in it, or the lot's). */
  readonly productId: string;
  readonly catalog: SpecCatalog;
  readonly physics: LotPhysics;
  /** Resistivity values of the lot's current readings (the corrected one left out), ascending id. */
  readonly currentPoints: readonly PlaceValue[];
}

export interface EvaluatedRecord {
  readonly product?: Product;
  /** Drafts in storage order: the resistivity-like reading first, then the type reading. */
  readonly drafts: readonly ReadingDraft[];
  /** Findings not tied to one reading (no spec); attached to the first draft when there is one. */
  readonly lotFindings: readonly FlagFinding[];
}

export function evaluateRecord(input: EvaluationInput): { ok: true; value: EvaluatedRecord } | { ok: false; error: LotError } {
  const { request, catalog, physics } = input;
  const product = catalog.find(input.productId);
  const specRef = product
    ? {
        productId: product.id,
        specSource: catalog.source,
        ...(catalog.revision !== undefined ? { specRevision: catalog.revision } : {}),
        ...(catalog.demo ? { demoSpecs: true } : {}),
      }
    : { productId: input.productId };

  const lotFindings: FlagFinding[] = [];
  if (!product) {
    const suggestion = suggestProduct(input.productId, catalog);
    lotFindings.push({
      code: 'no_spec',
      scope: 'lot',
      detail: { code: 'no_spec', reason: 'unknown_product', productId: input.productId, ...(suggestion ? { suggestion } : {}) },
    });
  }

  const drafts: ReadingDraft[] = [];
  let primaryRho: number | undefined;

  if (request.primary) {
    const primary = primaryDraft(request.primary, request, product, physics, input.currentPoints, specRef);
    if (!primary.ok) return primary;
    primaryRho = primary.value.resistivityOhmCm;
    drafts.push(primary.value);
  }
  if (request.typeReading) {
    const typed = typeDraft(request.typeReading, request, product, physics, primaryRho, specRef);
    if (!typed.ok) return typed;
    drafts.push(typed.value);
  }
  // A reading with no spec to check against has no verdict beyond the no-spec flag.
  const withSpecVerdict = drafts.map((d, i) =>
    !product
      ? {
          ...d,
          verdict: 'flagged' as const,
          evaluation: {
            ...d.evaluation,
            checks: [...d.evaluation.checks, { check: 'spec' as const, status: 'fail' as const, productId: input.productId }],
            findings: i === 0 ? [...lotFindings, ...d.evaluation.findings] : d.evaluation.findings,
            verdict: 'flagged' as const,
          },
        }
      : d,
  );
  return { ok: true, value: { ...(product ? { product } : {}), drafts: withSpecVerdict, lotFindings } };
}

type DraftResult = { ok: true; value: ReadingDraft } | { ok: false; error: LotError };

function verdictOf(findings: readonly FlagFinding[], checks: readonly Check[]): Verdict {
  if (findings.length > 0) return 'flagged';
  return checks.some((c) => c.status === 'pass') ? 'pass' : 'no_verdict';
}

function primaryDraft(
  m: PrimaryMeasurement,
  request: RecordRequest,
  product: Product | undefined,
  physics: LotPhysics,
  currentPoints: readonly PlaceValue[],
  specRef: Partial<ReadingEvaluation>,
): DraftResult {
  const notes: LotNote[] = [];
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  let rho: number;
  if (m.kind === 'sheet') {
    const sheet = physics.resistivityFromSheet(m.sheetResistanceOhmPerSq, m.thicknessCm, m.spacingCm);
    if (!sheet.ok) return { ok: false, error: { code: 'measurement_refused', what: 'sheet', refusal: sheet.refusal } };
    rho = sheet.resistivityOhmCm;
    for (const p of sheet.problems) notes.push({ code: 'problem', problem: p });
    for (const a of sheet.assumptionCodes) notes.push({ code: 'assumption', assumption: a });
  } else {
    rho = m.resistivityOhmCm;
  }
  // A reading off 23 °C is corrected to 23 °C with the product's dopant before any check
  // (a model estimate, said so); without a product, or if the core cannot, it is used as read.
  const t = request.temperatureK;
  if (t !== undefined && Math.abs(t - SPEC_TEMPERATURE_K) >= TEMPERATURE_TOLERANCE_K) {
    const corrected = product ? physics.correctTo23C(rho, t, product.dopant) : undefined;
    if (corrected?.ok) {
      notes.push({
        code: 'temperature_corrected',
        temperatureK: t,
        measuredOhmCm: rho,
        correctedOhmCm: corrected.resistivityOhmCm,
        coefficientPerK: corrected.coefficientPerK,
        model: corrected.model,
      });
      for (const p of corrected.problems) notes.push({ code: 'problem', problem: p });
      rho = corrected.resistivityOhmCm;
    } else {
      notes.push({ code: 'temperature_uncorrected', temperatureK: t });
    }
  }
  const scope = placeScope(request.wafer, request.site);
  const place = { ...(request.wafer !== undefined ? { wafer: request.wafer } : {}), ...(request.site !== undefined ? { site: request.site } : {}) };

  let density: number | undefined;
  let model: ModelRef | undefined;
  if (product) {
    const conv = physics.densityFromResistivity(rho, product.dopant, product.model);
    if (conv.ok) {
      density = conv.dopantDensityPerCm3;
      model = conv.model;
      const outside = conv.problems.filter((p) => p.code === 'outside_validity');
      for (const p of conv.problems) if (p.code !== 'outside_validity') notes.push({ code: 'problem', problem: p });
      checks.push({ check: 'validity', status: outside.length > 0 ? 'fail' : 'pass', model: conv.model.id });
      for (const p of outside) {
        if (p.code !== 'outside_validity') continue;
        findings.push({
          code: 'outside_model_validity',
          scope,
          ...place,
          detail: { code: 'outside_model_validity', model: p.model, quantity: p.quantity, input: p.input, min: p.min, max: p.max },
        });
        break; // one flag per reading is enough; the detail names the first quantity out of range
      }
    } else {
      checks.push({ check: 'validity', status: 'fail', model: product.model ?? 'default' });
      findings.push({
        code: 'outside_model_validity',
        scope,
        ...place,
        detail: {
          code: 'outside_model_validity',
          model: product.model ?? 'default',
          quantity: 'resistivityOhmCm',
          input: rho,
          refusal: conv.refusal,
        },
      });
    }

    const windowQuantity = product.resistivityOhmCm ? 'resistivityOhmCm' : 'dopantDensityPerCm3';
    const window = (product.resistivityOhmCm ?? product.dopantDensityPerCm3) as SpecWindow;
    const value = windowQuantity === 'resistivityOhmCm' ? rho : density;
    if (value === undefined) {
      notes.push({ code: 'window_not_checked', reason: 'conversion_refused' });
    } else {
      const w = windowCheck(windowQuantity, value, window);
      checks.push(w);
      if (w.status === 'fail') {
        findings.push({
          code: 'out_of_window',
          scope,
          ...place,
          detail: {
            code: 'out_of_window',
            quantity: windowQuantity,
            value,
            min: window.min,
            max: window.max,
            side: w.limit === 'max' ? 'above' : 'below',
            marginPercent: w.marginPercent,
          },
        });
      } else if (product.nearLimitPercent !== undefined && w.marginPercent < product.nearLimitPercent) {
        notes.push({
          code: 'near_limit',
          quantity: windowQuantity,
          marginPercent: w.marginPercent,
          limit: w.limit,
          thresholdPercent: product.nearLimitPercent,
        });
      }
    }

    if (product.spread && request.wafer !== undefined) {
      const definition = product.spread.definition;
      const points: PlaceValue[] = [
        ...currentPoints,
        { wafer: request.wafer, ...(request.site !== undefined ? { site: request.site } : {}), resistivityOhmCm: rho, readingId: Number.MAX_SAFE_INTEGER },
      ];
      const wafers = waferSummaries(points, definition);
      const mine = wafers.find((w) => w.wafer === request.wafer);
      const siteLimit = product.spread.siteToSitePercent;
      if (siteLimit !== undefined && mine?.siteSpread && request.site !== undefined) {
        const s = mine.siteSpread;
        const status = s.spreadPercent > siteLimit ? 'fail' : 'pass';
        checks.push({ check: 'site_spread', wafer: request.wafer, spreadPercent: s.spreadPercent, limitPercent: siteLimit, count: s.count, status });
        if (status === 'fail') {
          findings.push({
            code: 'spread_over_limit',
            scope: siteSpreadScope(request.wafer),
            wafer: request.wafer,
            detail: {
              code: 'spread_over_limit',
              across: 'sites',
              wafer: request.wafer,
              spreadPercent: s.spreadPercent,
              limitPercent: siteLimit,
              definition,
              minOhmCm: s.minOhmCm,
              maxOhmCm: s.maxOhmCm,
              count: s.count,
            },
          });
        }
      }
      const waferLimit = product.spread.waferToWaferPercent;
      const w2w = waferToWaferSpread(wafers, definition);
      if (waferLimit !== undefined && w2w) {
        const status = w2w.spreadPercent > waferLimit ? 'fail' : 'pass';
        checks.push({ check: 'wafer_spread', spreadPercent: w2w.spreadPercent, limitPercent: waferLimit, count: w2w.count, status });
        if (status === 'fail') {
          findings.push({
            code: 'spread_over_limit',
            scope: WAFER_SPREAD_SCOPE,
            detail: {
              code: 'spread_over_limit',
              across: 'wafers',
              spreadPercent: w2w.spreadPercent,
              limitPercent: waferLimit,
              definition,
              minOhmCm: w2w.minOhmCm,
              maxOhmCm: w2w.maxOhmCm,
              count: w2w.count,
            },
          });
        }
      }
    }
  }

  const verdict = verdictOf(findings, checks);
  return {
    ok: true,
    value: {
      ...place,
      quantity: m.kind,
      asEntered: m.asEntered,
      value: m.kind === 'sheet' ? m.sheetResistanceOhmPerSq : m.resistivityOhmCm,
      unit: m.kind === 'sheet' ? 'Ω/□' : 'Ω·cm',
      ...(m.kind === 'sheet' ? { thicknessCm: m.thicknessCm } : {}),
      ...(m.kind === 'sheet' && m.spacingCm !== undefined ? { spacingCm: m.spacingCm } : {}),
      resistivityOhmCm: rho,
      ...(density !== undefined ? { dopantDensityPerCm3: density } : {}),
      ...(request.temperatureK !== undefined ? { temperatureK: request.temperatureK } : {}),
      ...(request.note !== undefined ? { note: request.note } : {}),
      verdict,
      evaluation: {
        ...specRef,
        ...(product ? { dopant: product.dopant } : {}),
        ...(model ? { model } : {}),
        checks,
        notes,
        findings,
        verdict,
      },
    },
  };
}

function typeDraft(
  m: TypeMeasurement,
  request: RecordRequest,
  product: Product | undefined,
  physics: LotPhysics,
  resistivityOhmCm: number | undefined,
  specRef: Partial<ReadingEvaluation>,
): DraftResult {
  const notes: LotNote[] = [];
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  let found: 'n' | 'p' | 'indeterminate';
  let method: string;
  let value: number;
  let unit: string;
  if (m.kind === 'stated-type') {
    found = m.carrierType;
    method = 'stated';
    value = 0;
    unit = '';
  } else {
    const t = physics.typeFromReading(m.method, m.reading, resistivityOhmCm);
    if (!t.ok) return { ok: false, error: { code: 'measurement_refused', what: 'type', refusal: t.refusal } };
    found = t.carrierType;
    method = m.method;
    value = m.reading;
    unit = m.method === 'hall' ? 'cm³/C' : m.method === 'point' ? 'polarity' : 'V';
    for (const p of t.problems) if (p.code !== 'type_mismatch') notes.push({ code: 'problem', problem: p });
  }
  const place = { ...(request.wafer !== undefined ? { wafer: request.wafer } : {}), ...(request.site !== undefined ? { site: request.site } : {}) };
  if (product) {
    if (found === 'indeterminate') {
      checks.push({ check: 'type', expected: product.type, found, method, status: 'indeterminate' });
      notes.push({ code: 'type_not_checked', reason: 'indeterminate' });
    } else {
      const status = found === product.type ? 'pass' : 'fail';
      checks.push({ check: 'type', expected: product.type, found, method, status });
      if (status === 'fail') {
        findings.push({
          code: 'type_mismatch',
          scope: placeScope(request.wafer, request.site),
          ...place,
          detail: { code: 'type_mismatch', expected: product.type, found, method },
        });
      }
    }
  }
  const verdict = verdictOf(findings, checks);
  return {
    ok: true,
    value: {
      ...place,
      quantity: 'type',
      asEntered: m.asEntered,
      value,
      unit,
      typeMethod: method,
      carrierType: found,
      ...(request.temperatureK !== undefined ? { temperatureK: request.temperatureK } : {}),
      ...(request.note !== undefined ? { note: request.note } : {}),
      verdict,
      evaluation: { ...specRef, ...(product ? { dopant: product.dopant } : {}), checks, notes, findings, verdict },
    },
  };
}

export function windowCheck(
  quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3',
  value: number,
  window: SpecWindow,
): Extract<Check, { check: 'window' }> {
  if (value > window.max) {
    return { check: 'window', quantity, value, min: window.min, max: window.max, status: 'fail', limit: 'max', marginPercent: ((value - window.max) / window.max) * 100 };
  }
  if (value < window.min) {
    return { check: 'window', quantity, value, min: window.min, max: window.max, status: 'fail', limit: 'min', marginPercent: ((window.min - value) / window.min) * 100 };
  }
  const toMin = ((value - window.min) / window.min) * 100;
  const toMax = ((window.max - value) / window.max) * 100;
  return toMin <= toMax
    ? { check: 'window', quantity, value, min: window.min, max: window.max, status: 'pass', limit: 'min', marginPercent: toMin }
    : { check: 'window', quantity, value, min: window.min, max: window.max, status: 'pass', limit: 'max', marginPercent: toMax };
}
