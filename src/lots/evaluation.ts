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
 * A wafer map (a measurement file) is one reading of its wafer: its mean resistivity takes the
 * checks above (against the product's uniformity mean window when it has one), and its sites
 * the non-uniformity and site-to-site limits (checks/uniformity.ts).
 */
import type { LotError } from './errors.js';
import {
  SPEC_TEMPERATURE_K,
  TEMPERATURE_TOLERANCE_K,
  type Check,
  type LotNote,
  type ReadingDraft,
  type ReadingEvaluation,
  type Verdict,
} from './evaluation-types.js';
import { placeScope, type FlagFinding } from './flags.js';
import type { LotPhysics, ModelRef } from './physics.js';
import type { MapMeasurement, MapSite, PrimaryMeasurement, RecordRequest, TypeMeasurement } from './readings.js';
import { uniformityStatistics } from '../physics/statistics/uniformity.js';
import { uniformityChecks } from './checks/uniformity.js';
import type { MapSummary } from './evaluation-types.js';
import { suggestProduct } from './suggest.js';
import type { Product, SpecCatalog, SpecWindow } from './spec/schema.js';
import type { PlaceValue } from './spread.js';
import { spreadChecks } from './checks/spread.js';
import { productWindowCheck } from './checks/window.js';
import { conversionCheck } from './checks/conversion.js';

export interface EvaluationInput {
  readonly request: RecordRequest;
  /** The lot's product after this record (the one named in it, or the lot's). */
  readonly productId: string;
  readonly catalog: SpecCatalog;
  readonly physics: LotPhysics;
  /** Resistivity values of the lot's current readings (the corrected one left out), ascending id. */
  readonly currentPoints: readonly PlaceValue[];
  /** The fab's probe head spacing, cm, when neither the reading nor the product names one. */
  readonly probeSpacingCm?: number;
}

export interface EvaluatedRecord {
  readonly product?: Product;
  /** Drafts in storage order: the resistivity-like reading first, then the type reading. */
  readonly drafts: readonly ReadingDraft[];
  /** Findings not tied to one reading (no spec); attached to the first draft when there is one. */
  readonly lotFindings: readonly FlagFinding[];
  /** The sites of a map reading, stored beside the draft at `readingIndex`. */
  readonly mapSites?: { readonly readingIndex: number; readonly sites: readonly MapSite[] };
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

  let mapSites: EvaluatedRecord['mapSites'];
  if (request.primary?.kind === 'map') {
    const map = mapDraft(request.primary, request, product, physics, input.currentPoints, specRef);
    if (!map.ok) return map;
    primaryRho = map.value.resistivityOhmCm;
    mapSites = { readingIndex: drafts.length, sites: request.primary.sites };
    drafts.push(map.value);
  } else if (request.primary) {
    const primary = primaryDraft(request.primary, request, product, physics, input.currentPoints, specRef, input.probeSpacingCm);
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
  return { ok: true, value: { ...(product ? { product } : {}), drafts: withSpecVerdict, lotFindings, ...(mapSites ? { mapSites } : {}) } };
}

/**
 * A reading off 23 °C is corrected to 23 °C with the product's dopant before any check (a model
 * estimate, said so); without a product, or if the core cannot, it is used as read.
 */
function atSpecTemperature(rho: number, t: number | undefined, product: Product | undefined, physics: LotPhysics, notes: LotNote[]): number {
  if (t === undefined || Math.abs(t - SPEC_TEMPERATURE_K) < TEMPERATURE_TOLERANCE_K) return rho;
  const corrected = product ? physics.correctTo23C(rho, t, product.dopant) : undefined;
  if (!corrected?.ok) {
    notes.push({ code: 'temperature_uncorrected', temperatureK: t });
    return rho;
  }
  notes.push({
    code: 'temperature_corrected',
    temperatureK: t,
    measuredOhmCm: rho,
    correctedOhmCm: corrected.resistivityOhmCm,
    coefficientPerK: corrected.coefficientPerK,
    model: corrected.model,
  });
  for (const p of corrected.problems) notes.push({ code: 'problem', problem: p });
  return corrected.resistivityOhmCm;
}

type DraftResult = { ok: true; value: ReadingDraft } | { ok: false; error: LotError };

function verdictOf(findings: readonly FlagFinding[], checks: readonly Check[]): Verdict {
  if (findings.length > 0) return 'flagged';
  return checks.some((c) => c.status === 'pass') ? 'pass' : 'no_verdict';
}

/** The statistics of a map's site resistivities over the sites inside the edge exclusion. */
export function mapSummary(m: MapMeasurement): MapSummary | undefined {
  const rho = Float64Array.from(m.sites, (s) => s.resistivityOhmCm ?? Number.NaN);
  const include = Uint8Array.from(m.sites, (s) => (s.included ? 1 : 0));
  const st = uniformityStatistics(rho, include);
  if (st.count === 0) return undefined;
  return {
    fileName: m.fileName,
    measured: m.measured,
    siteCount: m.sites.length,
    count: st.count,
    diameterMm: m.diameterMm,
    edgeExclusionMm: m.edgeExclusionMm,
    meanOhmCm: st.mean,
    standardDeviationOhmCm: st.standardDeviation,
    minimumOhmCm: st.minimum,
    maximumOhmCm: st.maximum,
    nonUniformityPercent: st.nonUniformityPercent,
    rangeNonUniformityPercent: st.rangeNonUniformityPercent,
  };
}

/**
 * A map reading: the mean of the sites inside the edge exclusion is the wafer's resistivity
 * (corrected to 23 °C like any reading); the value stored is the mean of what was measured.
 */
function mapDraft(
  m: MapMeasurement,
  request: RecordRequest,
  product: Product | undefined,
  physics: LotPhysics,
  currentPoints: readonly PlaceValue[],
  specRef: Partial<ReadingEvaluation>,
): DraftResult {
  const summary = mapSummary(m);
  if (!summary || request.wafer === undefined) {
    return { ok: false, error: { code: 'invalid_request', issues: [{ path: 'primary.sites', message: 'the map has no site with a resistivity inside the edge exclusion' }] } };
  }
  let measuredSum = 0;
  let measuredCount = 0;
  for (const s of m.sites) {
    if (s.included && s.value !== null && s.resistivityOhmCm !== null) {
      measuredSum += s.value;
      measuredCount++;
    }
  }
  const measured: Measured = {
    quantity: m.measured,
    asEntered: m.asEntered,
    value: measuredSum / measuredCount,
    ...(m.thicknessCm !== undefined ? { thicknessCm: m.thicknessCm } : {}),
    ...(m.spacingCm !== undefined ? { spacingCm: m.spacingCm } : {}),
    resistivityOhmCm: summary.meanOhmCm,
    notes: [],
    map: summary,
  };
  return { ok: true, value: resistivityDraft(measured, request, product, physics, currentPoints, specRef) };
}

function primaryDraft(
  m: Exclude<PrimaryMeasurement, MapMeasurement>,
  request: RecordRequest,
  product: Product | undefined,
  physics: LotPhysics,
  currentPoints: readonly PlaceValue[],
  specRef: Partial<ReadingEvaluation>,
  fabProbeSpacingCm?: number,
): DraftResult {
  if (m.kind === 'resistivity') {
    const measured: Measured = { quantity: 'resistivity', asEntered: m.asEntered, value: m.resistivityOhmCm, resistivityOhmCm: m.resistivityOhmCm, notes: [] };
    return { ok: true, value: resistivityDraft(measured, request, product, physics, currentPoints, specRef) };
  }
  const notes: LotNote[] = [];
  // The spacing typed, else the product's head, else the fab's head (PROBE_SPACING_MM).
  const productSpacing = product?.probeSpacingMm !== undefined ? product.probeSpacingMm / 10 : undefined;
  const spacing = m.spacingCm ?? productSpacing ?? fabProbeSpacingCm;
  if (m.spacingCm === undefined && spacing !== undefined) {
    notes.push({ code: 'assumption', assumption: `Probe spacing ${spacing * 10} mm from ${productSpacing !== undefined ? `the ${product!.id} spec (probeSpacingMm)` : 'the fab’s configured head (PROBE_SPACING_MM)'}.` });
  }
  const sheet = physics.resistivityFromSheet(m.sheetResistanceOhmPerSq, m.thicknessCm, spacing);
  if (!sheet.ok) return { ok: false, error: { code: 'measurement_refused', what: 'sheet', refusal: sheet.refusal } };
  for (const p of sheet.problems) notes.push({ code: 'problem', problem: p });
  for (const a of sheet.assumptionCodes) notes.push({ code: 'assumption', assumption: a });
  const measured: Measured = {
    quantity: 'sheet',
    asEntered: m.asEntered,
    value: m.sheetResistanceOhmPerSq,
    thicknessCm: m.thicknessCm,
    ...(m.spacingCm !== undefined ? { spacingCm: m.spacingCm } : {}),
    resistivityOhmCm: sheet.resistivityOhmCm,
    notes,
  };
  return { ok: true, value: resistivityDraft(measured, request, product, physics, currentPoints, specRef) };
}

/** What a resistivity-like reading measured, before the checks. */
interface Measured {
  readonly quantity: 'resistivity' | 'sheet';
  readonly asEntered: string;
  /** As measured: Ω·cm or Ω/□ (a map: the mean of its sites). */
  readonly value: number;
  readonly thicknessCm?: number;
  readonly spacingCm?: number;
  /** Resistivity at the measured temperature. */
  readonly resistivityOhmCm: number;
  /** Notes from getting the resistivity (probe head, thickness factor). */
  readonly notes: LotNote[];
  readonly map?: MapSummary;
}

/**
 * The checks every resistivity reading takes — to 23 °C, the ρ → N conversion and its validity,
 * the window (a map's mean: the uniformity mean window when the product has one), a map's
 * uniformity, the spread — and the draft that carries them.
 */
function resistivityDraft(
  x: Measured,
  request: RecordRequest,
  product: Product | undefined,
  physics: LotPhysics,
  currentPoints: readonly PlaceValue[],
  specRef: Partial<ReadingEvaluation>,
): ReadingDraft {
  const notes = [...x.notes];
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  const place = { ...(request.wafer !== undefined ? { wafer: request.wafer } : {}), ...(request.site !== undefined ? { site: request.site } : {}) };
  const rho = atSpecTemperature(x.resistivityOhmCm, request.temperatureK, product, physics, notes);
  let density: number | undefined;
  let model: ModelRef | undefined;
  if (product) {
    const where = { scope: placeScope(request.wafer, request.site), ...place };
    const conv = conversionCheck(rho, product, physics, where);
    density = conv.density;
    model = conv.model;
    const win = productWindowCheck(product, rho, density, where, x.map ? 'map_mean' : undefined);
    const uni = x.map && request.wafer !== undefined ? uniformityChecks(product, request.wafer, x.map) : { checks: [], findings: [] };
    const spread = spreadChecks(product, request, rho, currentPoints);
    checks.push(...conv.checks, ...win.checks, ...uni.checks, ...spread.checks);
    findings.push(...conv.findings, ...win.findings, ...uni.findings, ...spread.findings);
    notes.push(...conv.notes, ...win.notes);
  }
  const verdict = verdictOf(findings, checks);
  return {
    ...place,
    quantity: x.quantity,
    asEntered: x.asEntered,
    value: x.value,
    unit: x.quantity === 'sheet' ? 'Ω/□' : 'Ω·cm',
    ...(x.thicknessCm !== undefined ? { thicknessCm: x.thicknessCm } : {}),
    ...(x.spacingCm !== undefined ? { spacingCm: x.spacingCm } : {}),
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
      ...(x.map ? { map: x.map } : {}),
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
