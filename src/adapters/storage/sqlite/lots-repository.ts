/**
 * The lot repository over SQLite (better-sqlite3). Each write is one `BEGIN IMMEDIATE`
 * transaction: the event id is checked, the lot's state read, the plan run and its rows
 * inserted, then COMMIT — with synchronous=FULL the reading is on disk before the caller can
 * reply. A second process on the same file waits on the write lock (busy timeout), so checks
 * never run against a stale lot.
 */
import { openDatabase, type Db } from './db.js';
import type { StoredFlag } from '../../../lots/flags.js';
import type {
  ClearOutcome,
  ClearPlan,
  ClearState,
  ClearWrite,
  DigestClaim,
  DigestRun,
  FlagQuery,
  FlagWithProduct,
  LotHistory,
  LotRecord,
  LotRepository,
  LotState,
  PlanResult,
  RecordOutcome,
  RecordPlan,
  ReadingPoint,
  RecordWrite,
  WriteResult,
} from '../../../lots/repository.js';
import type { MapSite, StoredReading } from '../../../lots/readings.js';
import { LOT_MIGRATIONS } from './lots-migrations.js';
import { digestFromRow, FLAG_SELECT, flagFromRow, readingFromRow, type DigestRow, type FlagRow, type ReadingRow } from '../shared/lot-rows.js';

/** What the event log keeps for a record: ids only, the rows are read back from their tables. */
interface RecordEventLog {
  readonly readingIds: readonly number[];
  readonly raisedIds: readonly number[];
  readonly alreadyOpenIds: readonly number[];
  readonly closedIds: readonly number[];
  readonly productId?: string;
  readonly productChange?: { readonly from?: string; readonly to: string };
  readonly supersedes?: number;
}

interface ClearEventLog {
  readonly clearedIds: readonly number[];
}

interface PointRow {
  id: number;
  quantity: string;
  wafer: number | null;
  site: number | null;
  resistivity_ohm_cm: number | null;
}

function pointFromRow(r: PointRow): ReadingPoint {
  return {
    id: r.id,
    quantity: r.quantity as ReadingPoint['quantity'],
    ...(r.wafer !== null ? { wafer: r.wafer } : {}),
    ...(r.site !== null ? { site: r.site } : {}),
    ...(r.resistivity_ohm_cm !== null ? { resistivityOhmCm: r.resistivity_ohm_cm } : {}),
  };
}

const READING_SELECT = `
SELECT r.*, s.id AS superseded_by
FROM lot_readings r LEFT JOIN lot_readings s ON s.supersedes = r.id`;

export class SqliteLotRepository implements LotRepository {
  private readonly st;

  constructor(private readonly db: Db) {
    const p = (sql: string) => db.prepare(sql);
    this.st = {
      event: p('SELECT kind, lot_id, at, outcome_json FROM lot_events WHERE event_id = ?'),
      insertEvent: p('INSERT INTO lot_events (event_id, kind, lot_id, at, outcome_json) VALUES (?, ?, ?, ?, ?)'),
      lot: p('SELECT lot_id, first_seen_at FROM lots WHERE lot_id = ?'),
      insertLot: p('INSERT OR IGNORE INTO lots (lot_id, first_seen_at) VALUES (?, ?)'),
      product: p('SELECT product_id, set_at, set_by FROM lot_products WHERE lot_id = ? ORDER BY id DESC LIMIT 1'),
      insertProduct: p('INSERT INTO lot_products (lot_id, product_id, set_at, set_by, event_id) VALUES (?, ?, ?, ?, ?)'),
      currentPoints: p(
        `SELECT r.id, r.quantity, r.wafer, r.site, r.resistivity_ohm_cm FROM lot_readings r
         WHERE r.lot_id = ? AND NOT EXISTS (SELECT 1 FROM lot_readings s WHERE s.supersedes = r.id)
         ORDER BY r.id`,
      ),
      readingById: p(`${READING_SELECT} WHERE r.id = ?`),
      readingsOfLot: p(`${READING_SELECT} WHERE r.lot_id = ? ORDER BY r.id`),
      insertReading: p(
        `INSERT INTO lot_readings (lot_id, wafer, site, quantity, as_entered, value, unit, thickness_cm, spacing_cm,
           type_method, resistivity_ohm_cm, dopant_density_per_cm3, carrier_type, temperature_k, verdict,
           evaluation_json, supersedes, user_id, user_name, surface, channel_id, event_id, event_seq, recorded_at, note)
         VALUES (@lot_id, @wafer, @site, @quantity, @as_entered, @value, @unit, @thickness_cm, @spacing_cm,
           @type_method, @resistivity_ohm_cm, @dopant_density_per_cm3, @carrier_type, @temperature_k, @verdict,
           @evaluation_json, @supersedes, @user_id, @user_name, @surface, @channel_id, @event_id, @event_seq, @recorded_at, @note)`,
      ),
      insertMapSite: p(
        `INSERT INTO lot_map_sites (reading_id, seq, label, x_mm, y_mm, value, resistivity_ohm_cm, included)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?)`,
      ),
      mapSites: p('SELECT label, x_mm, y_mm, value, resistivity_ohm_cm, included FROM lot_map_sites WHERE reading_id = ? ORDER BY seq'),
      openFlagsOfLot: p(`${FLAG_SELECT} WHERE f.lot_id = ? AND c.flag_id IS NULL ORDER BY f.id`),
      flagsOfLot: p(`${FLAG_SELECT} WHERE f.lot_id = ? ORDER BY f.id`),
      flagById: p(`${FLAG_SELECT} WHERE f.id = ?`),
      insertFlag: p(
        `INSERT INTO lot_flags (lot_id, code, scope, wafer, site, detail_json, product_id, raised_at, raised_by_reading,
           raised_by_user, raised_by_name, event_id)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      ),
      insertClearance: p(
        `INSERT INTO lot_flag_clearances (flag_id, kind, at, by_user, by_name, reason, corrected_by, event_id)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?)`,
      ),
      lotIdsByPrefix: p('SELECT lot_id FROM lots WHERE lot_id >= ? AND lot_id < ? ORDER BY lot_id LIMIT ?'),
      lotIdsOfProduct: p('SELECT lp.lot_id FROM lot_products lp WHERE lower(lp.product_id) = lower(?) AND lp.id = (SELECT MAX(id) FROM lot_products WHERE lot_id = lp.lot_id) ORDER BY lp.lot_id LIMIT ?'),
      countReadings: p('SELECT count(*) AS n FROM lot_readings'),
      insertClaim: p(
        `INSERT OR IGNORE INTO digest_runs (channel, local_date, slot_at, claimed_at, claimed_by, late, status, attempts)
         VALUES (?, ?, ?, ?, ?, ?, 'claimed', 1)`,
      ),
      takeOverClaim: p(
        `UPDATE digest_runs SET claimed_at = ?, claimed_by = ?, late = ?, status = 'claimed', attempts = attempts + 1, error = NULL
         WHERE channel = ? AND local_date = ?
           AND (status = 'failed' OR (status = 'claimed' AND claimed_at < ?))`,
      ),
      completeClaim: p(
        `UPDATE digest_runs SET status = 'posted', posted_at = ?, window_start = ?, window_end = ?, error = NULL
         WHERE channel = ? AND local_date = ?`,
      ),
      failClaim: p(`UPDATE digest_runs SET status = 'failed', error = ? WHERE channel = ? AND local_date = ?`),
      digestRun: p('SELECT * FROM digest_runs WHERE channel = ? AND local_date = ?'),
      lastPosted: p(
        `SELECT * FROM digest_runs WHERE channel = ? AND status = 'posted' ORDER BY window_end DESC LIMIT 1`,
      ),
    };
  }

  /** Open (and migrate) the database file; ':memory:' for tests. */
  static open(path: string): SqliteLotRepository {
    return new SqliteLotRepository(openDatabase(path, LOT_MIGRATIONS));
  }

  async mapSites(readingId: number): Promise<MapSite[]> {
    const rows = this.st.mapSites.all(readingId) as { label: string; x_mm: number; y_mm: number; value: number | null; resistivity_ohm_cm: number | null; included: number }[];
    return rows.map((r) => ({ label: r.label, xMm: r.x_mm, yMm: r.y_mm, value: r.value, resistivityOhmCm: r.resistivity_ohm_cm, included: r.included === 1 }));
  }

  async countLots(): Promise<number> {
    return (this.db.prepare('SELECT count(*) AS n FROM lots').get() as { n: number }).n;
  }

  get database(): Db {
    return this.db;
  }

  // ---------- writes ----------

  async commitRecord(write: RecordWrite, plan: (state: LotState) => PlanResult<RecordPlan>): Promise<WriteResult<RecordOutcome>> {
    return this.commitRecordSync(write, plan);
  }

  /**
   * The same write, synchronously (SQLite is synchronous underneath), so a bulk fill can run many
   * inside one outer transaction (bench/lots.bench.ts).
   */
  commitRecordSync(write: RecordWrite, plan: (state: LotState) => PlanResult<RecordPlan>): WriteResult<RecordOutcome> {
    const run = this.db.transaction((): WriteResult<RecordOutcome> => {
      const seen = this.st.event.get(write.eventId) as { kind: string; outcome_json: string } | undefined;
      if (seen) {
        return { ok: true, duplicate: true, outcome: this.rebuildRecord(write.eventId, JSON.parse(seen.outcome_json) as RecordEventLog) };
      }
      const lot = this.lotRecord(write.lotId);
      const state: LotState = {
        ...(lot ? { lot } : {}),
        currentReadings: (this.st.currentPoints.all(write.lotId) as PointRow[]).map(pointFromRow),
        openFlags: (this.st.openFlagsOfLot.all(write.lotId) as FlagRow[]).map(flagFromRow),
        ...(write.corrects !== undefined ? this.correctedReading(write.corrects) : {}),
      };
      const planned = plan(state);
      if (!planned.ok) return planned;
      const p = planned.plan;

      this.st.insertLot.run(write.lotId, write.at);
      let productChange: RecordEventLog['productChange'];
      if (p.productId !== undefined && p.productId !== lot?.productId) {
        this.st.insertProduct.run(write.lotId, p.productId, write.at, write.actor.userName ?? write.actor.userId, write.eventId);
        productChange = { ...(lot?.productId !== undefined ? { from: lot.productId } : {}), to: p.productId };
      }
      const productId = p.productId ?? lot?.productId;

      const readingIds: number[] = [];
      p.readings.forEach((d, i) => {
        const info = this.st.insertReading.run({
          lot_id: write.lotId,
          wafer: d.wafer ?? null,
          site: d.site ?? null,
          quantity: d.quantity,
          as_entered: d.asEntered,
          value: d.value,
          unit: d.unit,
          thickness_cm: d.thicknessCm ?? null,
          spacing_cm: d.spacingCm ?? null,
          type_method: d.typeMethod ?? null,
          resistivity_ohm_cm: d.resistivityOhmCm ?? null,
          dopant_density_per_cm3: d.dopantDensityPerCm3 ?? null,
          carrier_type: d.carrierType ?? null,
          temperature_k: d.temperatureK ?? null,
          verdict: d.verdict,
          evaluation_json: JSON.stringify(d.evaluation),
          supersedes: p.supersedingIndex === i ? (write.corrects ?? null) : null,
          user_id: write.actor.userId,
          user_name: write.actor.userName ?? null,
          surface: write.actor.surface,
          channel_id: write.actor.channelId,
          event_id: write.eventId,
          event_seq: i,
          recorded_at: write.at,
          note: d.note ?? null,
        });
        readingIds.push(Number(info.lastInsertRowid));
      });
      if (p.mapSites) {
        const readingId = readingIds[p.mapSites.readingIndex]!;
        p.mapSites.sites.forEach((site, seq) => {
          this.st.insertMapSite.run(readingId, seq, site.label, site.xMm, site.yMm, site.value, site.resistivityOhmCm, site.included ? 1 : 0);
        });
      }

      const closedIds: number[] = [];
      const correctedBy = p.supersedingIndex !== undefined ? readingIds[p.supersedingIndex] : undefined;
      for (const c of p.close) {
        const reason =
          c.because === 'reading_corrected'
            ? `reading ${write.corrects ?? '?'} corrected by reading ${correctedBy ?? '?'}`
            : `lot's product set to ${productId ?? '?'}, which has a spec`;
        this.st.insertClearance.run(
          c.flagId,
          'correction',
          write.at,
          write.actor.userId,
          write.actor.userName ?? null,
          reason,
          c.because === 'reading_corrected' ? (correctedBy ?? null) : null,
          write.eventId,
        );
        closedIds.push(c.flagId);
      }

      const raisedIds: number[] = [];
      for (const r of p.raise) {
        const f = r.finding;
        const info = this.st.insertFlag.run(
          write.lotId,
          f.code,
          f.scope,
          f.wafer ?? null,
          f.site ?? null,
          JSON.stringify(f.detail),
          productId ?? null,
          write.at,
          r.readingIndex !== undefined ? (readingIds[r.readingIndex] ?? null) : null,
          write.actor.userId,
          write.actor.userName ?? null,
          write.eventId,
        );
        raisedIds.push(Number(info.lastInsertRowid));
      }

      const log: RecordEventLog = {
        readingIds,
        raisedIds,
        alreadyOpenIds: [...p.alreadyOpen],
        closedIds,
        ...(productId !== undefined ? { productId } : {}),
        ...(productChange ? { productChange } : {}),
        ...(write.corrects !== undefined && p.supersedingIndex !== undefined ? { supersedes: write.corrects } : {}),
      };
      this.st.insertEvent.run(write.eventId, 'record', write.lotId, write.at, JSON.stringify(log));
      return { ok: true, duplicate: false, outcome: this.rebuildRecord(write.eventId, log, write.lotId, write.at) };
    });
    return run.immediate();
  }

  async commitClear(write: ClearWrite, plan: (state: ClearState) => PlanResult<ClearPlan>): Promise<WriteResult<ClearOutcome>> {
    const run = this.db.transaction((): WriteResult<ClearOutcome> => {
      const seen = this.st.event.get(write.eventId) as { lot_id: string; outcome_json: string } | undefined;
      if (seen) {
        const log = JSON.parse(seen.outcome_json) as ClearEventLog;
        return { ok: true, duplicate: true, outcome: { eventId: write.eventId, lotId: seen.lot_id, cleared: this.flagsById(log.clearedIds) } };
      }
      const lot = this.lotRecord(write.lotId);
      const named = write.flagId !== undefined ? (this.st.flagById.get(write.flagId) as FlagRow | undefined) : undefined;
      const state: ClearState = {
        ...(lot ? { lot } : {}),
        openFlags: (this.st.openFlagsOfLot.all(write.lotId) as FlagRow[]).map(flagFromRow),
        ...(named ? { named: flagFromRow(named) } : {}),
      };
      const planned = plan(state);
      if (!planned.ok) return planned;
      for (const id of planned.plan.flagIds) {
        this.st.insertClearance.run(id, 'person', write.at, write.actor.userId, write.actor.userName ?? null, planned.plan.reason, null, write.eventId);
      }
      const log: ClearEventLog = { clearedIds: [...planned.plan.flagIds] };
      this.st.insertEvent.run(write.eventId, 'clear', write.lotId, write.at, JSON.stringify(log));
      return { ok: true, duplicate: false, outcome: { eventId: write.eventId, lotId: write.lotId, cleared: this.flagsById(log.clearedIds) } };
    });
    return run.immediate();
  }

  // ---------- reads ----------

  async getLot(lotId: string): Promise<LotHistory | undefined> {
    const read = this.db.transaction((): LotHistory | undefined => {
      const lot = this.lotRecord(lotId);
      if (!lot) return undefined;
      return {
        lot,
        readings: (this.st.readingsOfLot.all(lotId) as ReadingRow[]).map(readingFromRow),
        flags: (this.st.flagsOfLot.all(lotId) as FlagRow[]).map(flagFromRow),
      };
    });
    return read.deferred();
  }

  async findLotIds(prefix: string, limit: number): Promise<string[]> {
    const upper = prefix.toUpperCase();
    const rows = this.st.lotIdsByPrefix.all(upper, `${upper}\uffff`, limit) as { lot_id: string }[];
    return rows.map((r) => r.lot_id);
  }

  async lotIdsOfProduct(productId: string, limit: number): Promise<string[]> {
    return (this.st.lotIdsOfProduct.all(productId, limit) as { lot_id: string }[]).map((r) => r.lot_id);
  }

  async listFlags(query: FlagQuery): Promise<FlagWithProduct[]> {
    const where: string[] = [];
    const params: (string | number)[] = [];
    if (query.raisedSince !== undefined) {
      where.push('f.raised_at >= ?');
      params.push(query.raisedSince);
    }
    if (query.raisedBefore !== undefined) {
      where.push('f.raised_at < ?');
      params.push(query.raisedBefore);
    }
    if (query.openOnly) where.push('c.flag_id IS NULL');
    const sql = `
      SELECT q.*, (SELECT lp.product_id FROM lot_products lp WHERE lp.lot_id = q.lot_id ORDER BY lp.id DESC LIMIT 1) AS lot_product_id
      FROM (${FLAG_SELECT} ${where.length ? 'WHERE ' + where.join(' AND ') : ''} ORDER BY f.raised_at DESC, f.id DESC
            ${query.limit !== undefined ? 'LIMIT ' + Math.max(0, Math.floor(query.limit)) : ''}) q`;
    const rows = this.db.prepare(sql).all(...params) as FlagRow[];
    return rows.map((r) => ({
      ...flagFromRow(r),
      ...(r.lot_product_id !== null && r.lot_product_id !== undefined ? { lotProductId: r.lot_product_id } : {}),
    }));
  }

  async countReadings(): Promise<number> {
    return (this.st.countReadings.get() as { n: number }).n;
  }

  // ---------- digest claims ----------

  async claimDigest(c: DigestClaim): Promise<boolean> {
    const run = this.db.transaction((): boolean => {
      const inserted = this.st.insertClaim.run(c.channel, c.localDate, c.slotAt, c.now, c.instanceId, c.late ? 1 : 0);
      if (inserted.changes === 1) return true;
      const staleBefore = new Date(Date.parse(c.now) - c.leaseMs).toISOString();
      const taken = this.st.takeOverClaim.run(c.now, c.instanceId, c.late ? 1 : 0, c.channel, c.localDate, staleBefore);
      return taken.changes === 1;
    });
    return run.immediate();
  }

  async completeDigest(channel: string, localDate: string, r: { postedAt: string; windowStart: string; windowEnd: string }): Promise<void> {
    this.st.completeClaim.run(r.postedAt, r.windowStart, r.windowEnd, channel, localDate);
  }

  async failDigest(channel: string, localDate: string, error: string): Promise<void> {
    this.st.failClaim.run(error.slice(0, 500), channel, localDate);
  }

  async getDigestRun(channel: string, localDate: string): Promise<DigestRun | undefined> {
    const row = this.st.digestRun.get(channel, localDate) as DigestRow | undefined;
    return row ? digestFromRow(row) : undefined;
  }

  async lastPostedDigest(channel: string): Promise<DigestRun | undefined> {
    const row = this.st.lastPosted.get(channel) as DigestRow | undefined;
    return row ? digestFromRow(row) : undefined;
  }

  async close(): Promise<void> {
    if (this.db.open) this.db.close();
  }

  // ---------- helpers ----------

  private lotRecord(lotId: string): LotRecord | undefined {
    const lot = this.st.lot.get(lotId) as { lot_id: string; first_seen_at: string } | undefined;
    if (!lot) return undefined;
    const product = this.st.product.get(lotId) as { product_id: string; set_at: string; set_by: string } | undefined;
    return {
      lotId: lot.lot_id,
      firstSeenAt: lot.first_seen_at,
      ...(product ? { productId: product.product_id, productSetAt: product.set_at, productSetBy: product.set_by } : {}),
    };
  }

  private correctedReading(id: number): { corrected?: StoredReading } {
    const row = this.st.readingById.get(id) as ReadingRow | undefined;
    return row ? { corrected: readingFromRow(row) } : {};
  }

  private flagsById(ids: readonly number[]): StoredFlag[] {
    return ids
      .map((id) => this.st.flagById.get(id) as FlagRow | undefined)
      .filter((r): r is FlagRow => r !== undefined)
      .map(flagFromRow);
  }

  private rebuildRecord(eventId: string, log: RecordEventLog, lotId?: string, at?: string): RecordOutcome {
    const readings = log.readingIds
      .map((id) => this.st.readingById.get(id) as ReadingRow | undefined)
      .filter((r): r is ReadingRow => r !== undefined)
      .map(readingFromRow);
    const ev = lotId === undefined ? (this.st.event.get(eventId) as { lot_id: string; at: string }) : undefined;
    return {
      eventId,
      lotId: lotId ?? ev?.lot_id ?? '',
      recordedAt: at ?? ev?.at ?? '',
      ...(log.productId !== undefined ? { productId: log.productId } : {}),
      ...(log.productChange ? { productChange: log.productChange } : {}),
      readings,
      raised: this.flagsById(log.raisedIds),
      alreadyOpen: this.flagsById(log.alreadyOpenIds),
      closed: this.flagsById(log.closedIds),
      ...(log.supersedes !== undefined ? { supersedes: log.supersedes } : {}),
    };
  }
}
