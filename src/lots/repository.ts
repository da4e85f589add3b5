/**
 * The storage boundary of the lot domain (a port). The domain talks only to this interface; the
 * backends in src/adapters/storage (SQLite, PostgreSQL) implement it.
 *
 * Writes take a *plan* function: the repository opens one write transaction, loads the lot's
 * state, calls the plan (pure, synchronous) and writes what it returns — all or nothing. Two
 * instances on one database therefore never check a reading against a stale lot. Each write is
 * keyed by the chat event that caused it: the same event again returns the first outcome and
 * writes nothing.
 */
import type { FlagFinding, StoredFlag } from './flags.js';
import type { LotError } from './errors.js';
import type { ReadingDraft } from './evaluation-types.js';
import type { Actor, MapSite, StoredReading } from './readings.js';

export interface LotRecord {
  readonly lotId: string;
  readonly productId?: string;
  readonly firstSeenAt: string;
  readonly productSetAt?: string;
  readonly productSetBy?: string;
}

/** The part of a current reading the checks need (read without its stored evaluation). */
export interface ReadingPoint {
  readonly id: number;
  readonly quantity: StoredReading['quantity'];
  readonly wafer?: number;
  readonly site?: number;
  readonly resistivityOhmCm?: number;
}

/** What a record plan sees, read inside the write transaction. */
export interface LotState {
  readonly lot?: LotRecord;
  /** Current (not corrected) readings of the lot, ascending id. */
  readonly currentReadings: readonly ReadingPoint[];
  readonly openFlags: readonly StoredFlag[];
  /** The reading named by `corrects`, wherever it is (the plan checks it belongs to the lot). */
  readonly corrected?: StoredReading;
}

export interface RecordPlan {
  /** Set the lot's product (first time, or a change). */
  readonly productId?: string;
  readonly readings: readonly ReadingDraft[];
  /** The index in `readings` of the reading that supersedes `write.corrects`. */
  readonly supersedingIndex?: number;
  /** Flags to raise; `readingIndex` names the reading that raised each. */
  readonly raise: readonly { readonly finding: FlagFinding; readonly readingIndex?: number }[];
  /** Open flags the same condition already holds (nothing new is raised for them). */
  readonly alreadyOpen: readonly number[];
  /**
   * Open flags the system closes: the reading that raised them is corrected, or the lot now
   * names a product that has a spec (for a no-spec flag).
   */
  readonly close: readonly { readonly flagId: number; readonly because: 'reading_corrected' | 'product_set' }[];
  /** The sites of a map reading (the reading at `readingIndex`), stored append-only beside it. */
  readonly mapSites?: { readonly readingIndex: number; readonly sites: readonly MapSite[] };
}

export type PlanResult<P> = { readonly ok: true; readonly plan: P } | { readonly ok: false; readonly error: LotError };

export interface WriteMeta {
  readonly eventId: string;
  readonly actor: Actor;
  /** ISO time of the write, from the injected clock. */
  readonly at: string;
}

export interface RecordWrite extends WriteMeta {
  readonly lotId: string;
  readonly corrects?: number;
}

export interface RecordOutcome {
  readonly eventId: string;
  readonly lotId: string;
  readonly recordedAt: string;
  readonly productId?: string;
  /** Set when this record changed the lot's product. */
  readonly productChange?: { readonly from?: string; readonly to: string };
  readonly readings: readonly StoredReading[];
  readonly raised: readonly StoredFlag[];
  readonly alreadyOpen: readonly StoredFlag[];
  readonly closed: readonly StoredFlag[];
  readonly supersedes?: number;
}

export interface ClearState {
  readonly lot?: LotRecord;
  readonly openFlags: readonly StoredFlag[];
  /** The flag named by id, wherever it is (the plan checks lot and state). */
  readonly named?: StoredFlag;
}

export interface ClearPlan {
  readonly flagIds: readonly number[];
  readonly reason: string;
}

export interface ClearWrite extends WriteMeta {
  readonly lotId: string;
  readonly flagId?: number;
}

export interface ClearOutcome {
  readonly eventId: string;
  readonly lotId: string;
  readonly cleared: readonly StoredFlag[];
}

export type WriteResult<O> =
  | { readonly ok: true; readonly outcome: O; readonly duplicate: boolean }
  | { readonly ok: false; readonly error: LotError };

export interface LotHistory {
  readonly lot: LotRecord;
  /** Every reading of the lot, ascending id, with `supersededBy` filled. */
  readonly readings: readonly StoredReading[];
  /** Every flag of the lot, ascending id, with its clearance if any. */
  readonly flags: readonly StoredFlag[];
}

export interface FlagQuery {
  /** Flags raised at or after this ISO time. */
  readonly raisedSince?: string;
  /** Flags raised before this ISO time. */
  readonly raisedBefore?: string;
  readonly openOnly?: boolean;
  readonly limit?: number;
}

/** A flag with the lot's current product (for grouping). */
export interface FlagWithProduct extends StoredFlag {
  readonly lotProductId?: string;
}

export type DigestStatus = 'claimed' | 'posted' | 'failed';

export interface DigestRun {
  readonly channel: string;
  readonly localDate: string;
  readonly slotAt: string;
  readonly claimedAt: string;
  readonly claimedBy: string;
  readonly late: boolean;
  readonly status: DigestStatus;
  readonly attempts: number;
  readonly windowStart?: string;
  readonly windowEnd?: string;
  readonly postedAt?: string;
  readonly error?: string;
}

export interface DigestClaim {
  readonly channel: string;
  readonly localDate: string;
  readonly slotAt: string;
  readonly now: string;
  readonly instanceId: string;
  readonly late: boolean;
  /** A claim left 'claimed' longer than this (a crashed instance) may be taken over. */
  readonly leaseMs: number;
}

export interface LotRepository {
  commitRecord(write: RecordWrite, plan: (state: LotState) => PlanResult<RecordPlan>): Promise<WriteResult<RecordOutcome>>;
  commitClear(write: ClearWrite, plan: (state: ClearState) => PlanResult<ClearPlan>): Promise<WriteResult<ClearOutcome>>;
  getLot(lotId: string): Promise<LotHistory | undefined>;
  /** Known lot ids that start with a prefix (for "did you mean"). */
  findLotIds(prefix: string, limit: number): Promise<string[]>;
  /** Lots whose current product is `productId`, by lot id (for a product's trend chart). */
  lotIdsOfProduct(productId: string, limit: number): Promise<string[]>;
  listFlags(query: FlagQuery): Promise<FlagWithProduct[]>;
  /** The sites of a map reading, in file order (empty for any other reading). */
  mapSites(readingId: number): Promise<MapSite[]>;
  countReadings(): Promise<number>;
  countLots(): Promise<number>;

  /** Insert the claim row for (channel, local date); true when this caller now owns it. */
  claimDigest(claim: DigestClaim): Promise<boolean>;
  completeDigest(channel: string, localDate: string, result: { postedAt: string; windowStart: string; windowEnd: string }): Promise<void>;
  failDigest(channel: string, localDate: string, error: string): Promise<void>;
  getDigestRun(channel: string, localDate: string): Promise<DigestRun | undefined>;
  lastPostedDigest(channel: string): Promise<DigestRun | undefined>;

  close(): Promise<void>;
}

