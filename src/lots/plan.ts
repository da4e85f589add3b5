/**
 * From a validated `record` and the lot's state (read inside the write transaction) to the rows
 * to write: the checked readings, the flags to raise (one open flag per lot, code and scope),
 * and the flags the system closes. Pure.
 */
import type { LotError } from './errors.js';
import { evaluateRecord } from './evaluation.js';
import { isOpen, type FlagCode, type FlagFinding, type StoredFlag } from './flags.js';
import type { LotPhysics } from './physics.js';
import type { RecordRequest } from './readings.js';
import type { ClearPlan, ClearState, LotState, PlanResult, RecordPlan } from './repository.js';
import type { SpecCatalog } from './spec/schema.js';
import type { PlaceValue } from './spread.js';

export interface PlanInput {
  readonly lotId: string;
  readonly request: RecordRequest;
  readonly catalog: SpecCatalog;
  readonly physics: LotPhysics;
  /** The fab's probe head spacing (PROBE_SPACING_MM), cm, for sheet readings that give none. */
  readonly probeSpacingCm?: number;
}

export function planRecord(input: PlanInput, state: LotState): PlanResult<RecordPlan> {
  const { request, catalog } = input;
  const fail = (error: LotError): PlanResult<RecordPlan> => ({ ok: false, error });

  // The product: as named now (spelled as the spec file spells it), or the lot's.
  const named = request.productId !== undefined ? (catalog.find(request.productId)?.id ?? request.productId.toUpperCase()) : undefined;
  const productId = named ?? state.lot?.productId;
  if (productId === undefined) {
    return fail({ code: 'no_product', lotId: input.lotId, products: catalog.products.map((p) => p.id) });
  }

  // A correction names a current reading of the same lot.
  const corrects = request.corrects;
  if (corrects !== undefined) {
    const target = state.corrected;
    if (!target) return fail({ code: 'unknown_reading', readingId: corrects });
    if (target.lotId !== input.lotId) {
      return fail({ code: 'correction_other_lot', readingId: corrects, readingLot: target.lotId, lotId: input.lotId });
    }
    if (target.supersededBy !== undefined) return fail({ code: 'already_corrected', readingId: corrects, by: target.supersededBy });
  }

  const currentPoints: PlaceValue[] = [];
  for (const r of state.currentReadings) {
    if (r.id === corrects || r.wafer === undefined || r.resistivityOhmCm === undefined) continue;
    if (r.quantity !== 'resistivity' && r.quantity !== 'sheet') continue;
    currentPoints.push({ wafer: r.wafer, ...(r.site !== undefined ? { site: r.site } : {}), resistivityOhmCm: r.resistivityOhmCm, readingId: r.id });
  }

  const evaluated = evaluateRecord({ request, productId, catalog, physics: input.physics, currentPoints, ...(input.probeSpacingCm !== undefined ? { probeSpacingCm: input.probeSpacingCm } : {}) });
  if (!evaluated.ok) return evaluated;
  const { drafts, lotFindings } = evaluated.value;

  // Which new reading supersedes the corrected one: the one of the same kind.
  let supersedingIndex: number | undefined;
  if (corrects !== undefined && state.corrected) {
    const wantType = state.corrected.quantity === 'type';
    const i = drafts.findIndex((d) => (d.quantity === 'type') === wantType);
    supersedingIndex = i >= 0 ? i : 0;
  }

  const close: { flagId: number; because: 'reading_corrected' | 'product_set' }[] = [];
  if (corrects !== undefined) {
    for (const f of state.openFlags) if (f.raisedByReading === corrects) close.push({ flagId: f.id, because: 'reading_corrected' });
  }
  if (evaluated.value.product) {
    for (const f of state.openFlags) {
      if (f.code === 'no_spec' && !close.some((c) => c.flagId === f.id)) close.push({ flagId: f.id, because: 'product_set' });
    }
  }
  const closing = new Set(close.map((c) => c.flagId));
  const stillOpen = state.openFlags.filter((f) => !closing.has(f.id));

  const raise: { finding: FlagFinding; readingIndex?: number }[] = [];
  const alreadyOpen: number[] = [];
  const keyOf = (f: { code: string; scope: string }): string => `${f.code}|${f.scope}`;
  const taken = new Set<string>();
  const consider = (finding: FlagFinding, readingIndex: number | undefined): void => {
    const key = keyOf(finding);
    if (taken.has(key)) return;
    taken.add(key);
    const open = stillOpen.find((f) => keyOf(f) === key);
    if (open) alreadyOpen.push(open.id);
    else raise.push({ finding, ...(readingIndex !== undefined ? { readingIndex } : {}) });
  };
  drafts.forEach((d, i) => {
    for (const f of d.evaluation.findings) consider(f, i);
  });
  if (drafts.length === 0) for (const f of lotFindings) consider(f, undefined);

  return {
    ok: true,
    plan: {
      ...(named !== undefined ? { productId: named } : {}),
      readings: drafts,
      ...(supersedingIndex !== undefined ? { supersedingIndex } : {}),
      raise,
      alreadyOpen,
      close,
      ...(evaluated.value.mapSites ? { mapSites: evaluated.value.mapSites } : {}),
    },
  };
}

export type ClearSelector =
  | { readonly kind: 'id'; readonly flagId: number }
  | { readonly kind: 'code'; readonly code: FlagCode; readonly wafer?: number; readonly site?: number }
  | { readonly kind: 'all' };

/** Which open flags a `clear` closes, read inside the write transaction. Pure. */
export function planClear(lotId: string, sel: ClearSelector, reason: string, state: ClearState): PlanResult<ClearPlan> {
  if (!state.lot) return { ok: false, error: { code: 'unknown_lot', lotId } };
  const brief = (f: StoredFlag) => ({ id: f.id, code: f.code, scope: f.scope });
  const what = sel.kind === 'id' ? `F${sel.flagId}` : sel.kind === 'all' ? 'all' : sel.code.replace(/_/g, ' ');
  if (sel.kind === 'id') {
    const f = state.named;
    if (!f) return { ok: false, error: { code: 'no_such_flag', lotId, what, open: state.openFlags.map(brief) } };
    if (f.lotId !== lotId) return { ok: false, error: { code: 'flag_other_lot', flagId: f.id, flagLot: f.lotId, lotId } };
    if (!isOpen(f)) {
      const c = f.clearance!;
      return { ok: false, error: { code: 'flag_already_cleared', flagId: f.id, at: c.at, by: c.byUserName ?? c.byUserId } };
    }
    return { ok: true, plan: { flagIds: [f.id], reason } };
  }
  const candidates =
    sel.kind === 'all'
      ? state.openFlags
      : state.openFlags.filter(
          (f) => f.code === sel.code && (sel.wafer === undefined || f.wafer === sel.wafer) && (sel.site === undefined || f.site === sel.site),
        );
  if (candidates.length === 0) return { ok: false, error: { code: 'no_such_flag', lotId, what, open: state.openFlags.map(brief) } };
  if (candidates.length > 1 && sel.kind === 'code') {
    return { ok: false, error: { code: 'ambiguous_flag', lotId, what, candidates: candidates.map(brief) } };
  }
  return { ok: true, plan: { flagIds: candidates.map((f) => f.id), reason } };
}
