/**
 * The lot domain's entry points: record, lot, flags, clear and the summary. Takes typed
 * requests (zod-checked here), returns data or a LotError; never builds sentences, never throws
 * for bad input. Clock, time zone, ids, storage, specs and physics are all injected.
 */
import { z } from 'zod';
import { buildDigest, type Digest } from './digest.js';
import type { LotError } from './errors.js';
import { FLAG_CODES } from './flags.js';
import { normalizeLotId, type LotIdRule } from './ids.js';
import { lotView, type LotView } from './lot-view.js';
import { mayWrite, type LotAction, type Permissions } from './permissions.js';
import type { LotPhysics } from './physics.js';
import { planClear, planRecord } from './plan.js';
import { RecordRequest, type Actor, type MapSite, type StoredReading } from './readings.js';
import type { ClearOutcome, FlagWithProduct, LotRepository, RecordOutcome } from './repository.js';
import type { Product, SpecCatalog } from './spec/schema.js';
import { localDate, recentSlots, startOfLocalDay, type Clock } from './time.js';

export interface LotServiceDeps {
  readonly repo: LotRepository;
  /** The current specs (a function, so a reloaded spec file takes effect). */
  readonly specs: () => SpecCatalog;
  readonly physics: LotPhysics;
  /** The fab's probe head spacing (PROBE_SPACING_MM), cm. */
  readonly probeSpacingCm?: number;
  readonly now: Clock;
  readonly timeZone: string;
  readonly permissions: Permissions;
  readonly lotIds: LotIdRule;
  /** Id for a write that arrives without a chat event id (console, CLI). */
  readonly newEventId: () => string;
  /** The summary's channel and local time, for the preview window. */
  readonly digest: { readonly channel: string; readonly at: string };
  /** RECORD_CONFIRM_FACTOR: a reading this far outside its window is confirmed before storing. */
  readonly confirmFactor?: number;
}

export type Result<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: LotError };

export interface Caller {
  readonly actor: Actor;
  /** The chat event that caused this request: the same id again writes nothing new. */
  readonly eventId?: string;
}

export interface RecordResult {
  readonly outcome: RecordOutcome;
  /** True when this event was already recorded (a redelivery): nothing new was written. */
  readonly duplicate: boolean;
  readonly catalog: SpecCatalog;
}

export const FLAG_PERIODS = ['open', 'today', '24h', '7d'] as const;
export type FlagPeriod = (typeof FLAG_PERIODS)[number];

export interface FlagsResult {
  readonly period: FlagPeriod;
  readonly since?: string;
  readonly flags: readonly FlagWithProduct[];
  /** Open flags raised before the period (shown as a count). */
  readonly olderOpenCount: number;
  readonly now: string;
}

export const FlagSelector = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('id'), flagId: z.number().int().positive() }),
  z.object({
    kind: z.literal('code'),
    code: z.enum(FLAG_CODES),
    wafer: z.number().int().positive().optional(),
    site: z.number().int().positive().optional(),
  }),
  z.object({ kind: z.literal('all') }),
]);
export type FlagSelector = z.infer<typeof FlagSelector>;

export const ClearRequest = z
  .object({
    lotId: z.string().min(1).max(64),
    selector: FlagSelector,
    reason: z.string().trim().min(3, 'say why the flag is cleared (at least a few words)').max(500),
  })
  .strict();
export type ClearRequest = z.infer<typeof ClearRequest>;

const SEVEN_DAYS_MS = 7 * 24 * 3600_000;

export class LotService {
  constructor(private readonly deps: LotServiceDeps) {}

  get timeZone(): string {
    return this.deps.timeZone;
  }

  get catalog(): SpecCatalog {
    return this.deps.specs();
  }

  /** A reading more than this factor outside its product window asks for confirmation (0: never). */
  get confirmFactor(): number {
    return this.deps.confirmFactor ?? 3;
  }

  get lotIdRule(): LotIdRule {
    return this.deps.lotIds;
  }

  mayWrite(action: LotAction, actor: Actor): boolean {
    return mayWrite(this.deps.permissions, action, actor);
  }

  async record(input: unknown, caller: Caller): Promise<Result<RecordResult>> {
    if (!this.mayWrite('record', caller.actor)) return this.notPermitted('record', caller.actor);
    const parsed = RecordRequest.safeParse(input);
    if (!parsed.success) return invalid(parsed.error);
    const request = parsed.data;
    const lotId = normalizeLotId(request.lotId, this.deps.lotIds);
    if (!lotId) return this.badLotId(request.lotId);
    const catalog = this.deps.specs();
    const result = await this.deps.repo.commitRecord(
      {
        lotId,
        eventId: caller.eventId ?? this.deps.newEventId(),
        actor: caller.actor,
        at: this.deps.now().toISOString(),
        ...(request.corrects !== undefined ? { corrects: request.corrects } : {}),
      },
      (state) => planRecord({ lotId, request: { ...request, lotId }, catalog, physics: this.deps.physics, ...(this.deps.probeSpacingCm !== undefined ? { probeSpacingCm: this.deps.probeSpacingCm } : {}) }, state),
    );
    if (!result.ok) return result;
    return { ok: true, value: { outcome: result.outcome, duplicate: result.duplicate, catalog } };
  }

  async lot(lotIdText: string): Promise<Result<LotView>> {
    const lotId = normalizeLotId(lotIdText, this.deps.lotIds);
    if (!lotId) return this.badLotId(lotIdText);
    const history = await this.deps.repo.getLot(lotId);
    if (!history) return { ok: false, error: { code: 'unknown_lot', lotId } };
    return { ok: true, value: lotView(history, this.deps.specs()) };
  }

  /**
   * The latest current map reading of a wafer and its stored sites, with the lot's product (for
   * its dopant and model), to draw the map again.
   */
  async storedMap(lotIdText: string, wafer: number): Promise<Result<{ lotId: string; reading: StoredReading; sites: MapSite[]; product?: Product }>> {
    const lotId = normalizeLotId(lotIdText, this.deps.lotIds);
    if (!lotId) return this.badLotId(lotIdText);
    const history = await this.deps.repo.getLot(lotId);
    if (!history) return { ok: false, error: { code: 'unknown_lot', lotId } };
    const maps = history.readings.filter((r) => r.supersededBy === undefined && r.evaluation.map !== undefined);
    const reading = maps.filter((r) => r.wafer === wafer).sort((a, b) => b.id - a.id)[0];
    if (!reading) {
      return { ok: false, error: { code: 'no_map', lotId, wafer, wafersWithMaps: [...new Set(maps.map((r) => r.wafer!))].sort((a, b) => a - b) } };
    }
    const product = history.lot.productId !== undefined ? this.deps.specs().find(history.lot.productId) : undefined;
    return { ok: true, value: { lotId, reading, sites: await this.deps.repo.mapSites(reading.id), ...(product ? { product } : {}) } };
  }

  /**
   * The readings behind a trend chart: the current (not corrected) resistivity readings of one
   * lot, or of every lot of a product recorded since `sinceIso`, in time order, with the product
   * (for its window) and `history`: the product's readings the control limits come from (the
   * lot's own when it has no product). At most `limit` lots are read.
   */
  async trendReadings(
    target: { readonly lotId: string } | { readonly productId: string; readonly sinceIso: string },
    limit = 500,
  ): Promise<Result<{ product?: Product; readings: StoredReading[]; history: StoredReading[]; lotCount: number }>> {
    const usable = (r: StoredReading) => r.supersededBy === undefined && r.quantity !== 'type' && r.resistivityOhmCm !== undefined;
    const byTime = (a: StoredReading, b: StoredReading) => (a.recordedAt < b.recordedAt ? -1 : a.recordedAt > b.recordedAt ? 1 : a.id - b.id);
    const catalog = this.deps.specs();
    const productReadings = async (productId: string) => {
      const ids = await this.deps.repo.lotIdsOfProduct(productId, limit);
      const out: StoredReading[] = [];
      for (const id of ids) {
        const h = await this.deps.repo.getLot(id);
        if (h) out.push(...h.readings.filter(usable));
      }
      return { readings: out.sort(byTime), lots: ids.length };
    };
    if ('lotId' in target) {
      const lotId = normalizeLotId(target.lotId, this.deps.lotIds);
      if (!lotId) return this.badLotId(target.lotId);
      const h = await this.deps.repo.getLot(lotId);
      if (!h) return { ok: false, error: { code: 'unknown_lot', lotId } };
      const readings = h.readings.filter(usable).sort(byTime);
      const product = h.lot.productId !== undefined ? catalog.find(h.lot.productId) : undefined;
      const history = h.lot.productId !== undefined ? (await productReadings(h.lot.productId)).readings : readings;
      return { ok: true, value: { ...(product ? { product } : {}), readings, history, lotCount: 1 } };
    }
    const product = catalog.find(target.productId);
    const productId = product?.id ?? target.productId;
    const all = await productReadings(productId);
    const readings = all.readings.filter((r) => r.recordedAt >= target.sinceIso);
    return { ok: true, value: { ...(product ? { product } : {}), readings, history: all.readings, lotCount: new Set(readings.map((r) => r.lotId)).size } };
  }

  /** Lot ids known to the store that start like `text` (for "did you mean"). */
  async similarLots(text: string): Promise<string[]> {
    const prefix = text.trim().toUpperCase().slice(0, Math.max(0, text.trim().length - 1));
    return prefix.length >= 3 ? this.deps.repo.findLotIds(prefix, 3) : [];
  }

  async flags(period: FlagPeriod = 'open'): Promise<FlagsResult> {
    const now = this.deps.now();
    if (period === 'open') {
      const flags = await this.deps.repo.listFlags({ openOnly: true });
      return { period, flags, olderOpenCount: 0, now: now.toISOString() };
    }
    const since =
      period === 'today'
        ? startOfLocalDay(now, this.deps.timeZone)
        : new Date(now.getTime() - (period === '24h' ? 24 : 7 * 24) * 3600_000);
    const sinceIso = since.toISOString();
    const flags = (await this.deps.repo.listFlags({ raisedSince: sinceIso })).filter((f) => f.raisedAt <= now.toISOString());
    const older = await this.deps.repo.listFlags({ raisedBefore: sinceIso, openOnly: true });
    return { period, since: sinceIso, flags, olderOpenCount: older.length, now: now.toISOString() };
  }

  async clear(input: unknown, caller: Caller): Promise<Result<{ outcome: ClearOutcome; duplicate: boolean }>> {
    if (!this.mayWrite('clear', caller.actor)) return this.notPermitted('clear', caller.actor);
    const parsed = ClearRequest.safeParse(input);
    if (!parsed.success) return invalid(parsed.error);
    const req = parsed.data;
    const lotId = normalizeLotId(req.lotId, this.deps.lotIds);
    if (!lotId) return this.badLotId(req.lotId);
    const sel = req.selector;
    const result = await this.deps.repo.commitClear(
      {
        lotId,
        eventId: caller.eventId ?? this.deps.newEventId(),
        actor: caller.actor,
        at: this.deps.now().toISOString(),
        ...(sel.kind === 'id' ? { flagId: sel.flagId } : {}),
      },
      (state) => planClear(lotId, sel, req.reason, state),
    );
    if (!result.ok) return result;
    return { ok: true, value: { outcome: result.outcome, duplicate: result.duplicate } };
  }

  /**
   * The summary for a window. `windowStart` defaults to the end of the last posted summary to
   * `channel` (at most seven days back), else the most recent summary slot.
   */
  async digest(
    options: { channel?: string; windowStart?: Date; late?: boolean; dueAt?: Date; preview?: boolean; now?: Date } = {},
  ): Promise<Digest> {
    const now = options.now ?? this.deps.now();
    const windowStart = options.windowStart ?? (await this.defaultWindowStart(options.channel ?? this.deps.digest.channel, now));
    const startIso = windowStart.toISOString();
    const [raisedInWindow, olderOpen] = await Promise.all([
      this.deps.repo.listFlags({ raisedSince: startIso }),
      this.deps.repo.listFlags({ raisedBefore: startIso, openOnly: true }),
    ]);
    return buildDigest({
      localDate: localDate(now, this.deps.timeZone),
      timeZone: this.deps.timeZone,
      windowStart,
      windowEnd: now,
      raisedInWindow,
      olderOpen,
      ...(options.late !== undefined ? { late: options.late } : {}),
      ...(options.dueAt ? { dueAt: options.dueAt } : {}),
      preview: options.preview ?? false,
    });
  }

  /**
   * Where a summary's window starts: the end of the last summary posted to `channel` (at most
   * seven days back); without one, `fallback` (the scheduler passes the previous day's slot),
   * else the most recent slot (a preview shows what the next summary holds so far).
   */
  async defaultWindowStart(channel: string, now: Date, fallback?: Date): Promise<Date> {
    const last = await this.deps.repo.lastPostedDigest(channel);
    if (last?.windowEnd) {
      const end = new Date(last.windowEnd);
      if (now.getTime() - end.getTime() <= SEVEN_DAYS_MS && end.getTime() <= now.getTime()) return end;
    }
    return fallback ?? recentSlots(now, this.deps.digest.at, this.deps.timeZone).current;
  }

  private notPermitted(action: LotAction, actor: Actor): Result<never> {
    return { ok: false, error: { code: 'not_permitted', action, userId: actor.userId, channelId: actor.channelId } };
  }

  private badLotId(input: string): Result<never> {
    return {
      ok: false,
      error: { code: 'bad_lot_id', input: input.slice(0, 64), pattern: this.deps.lotIds.source, example: this.deps.lotIds.example },
    };
  }
}

function invalid(error: z.ZodError): Result<never> {
  return {
    ok: false,
    error: {
      code: 'invalid_request',
      issues: error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message })),
    },
  };
}

