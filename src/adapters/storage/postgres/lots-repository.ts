/**
 * The lot repository on PostgreSQL. Each write is one transaction that first takes a
 * transaction-scoped advisory lock on the lot (pg_advisory_xact_lock), so writers of one lot —
 * on any instance — run one after another: the event id is checked, the lot's state read, the
 * plan run and its rows inserted, then COMMIT. No check ever runs against a stale lot and no
 * update is lost; writers of different lots do not wait for each other. The same event again
 * (a redelivery, or another instance) finds its row in lot_events and gets the first outcome.
 */
import type pg from 'pg';
import type { StoredFlag } from '../../../lots/flags.js';
import type { MapSite, StoredReading } from '../../../lots/readings.js';
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
  ReadingPoint,
  RecordOutcome,
  RecordPlan,
  RecordWrite,
  WriteResult,
} from '../../../lots/repository.js';
import { digestFromRow, FLAG_SELECT, flagFromRow, readingFromRow, type DigestRow, type FlagRow, type ReadingRow } from '../shared/lot-rows.js';

type Q = Pick<pg.PoolClient, 'query'>;

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

const READING_SELECT = `
SELECT r.*, s.id AS superseded_by
FROM lot_readings r LEFT JOIN lot_readings s ON s.supersedes = r.id`;

/** Serialization failures and deadlocks are retried (they roll back completely). */
const RETRYABLE = new Set(['40001', '40P01']);

export class PgLotRepository implements LotRepository {
  constructor(private readonly pool: pg.Pool) {}

  /** Run `work` in one transaction holding the lot's advisory lock. */
  private async inLotTransaction<T>(lotId: string, work: (q: Q) => Promise<T>): Promise<T> {
    for (let attempt = 0; ; attempt++) {
      const client = await this.pool.connect();
      try {
        await client.query('BEGIN');
        await client.query("SELECT pg_advisory_xact_lock(hashtextextended('shiftprobe:lot:' || $1, 0))", [lotId]);
        const result = await work(client);
        await client.query('COMMIT');
        return result;
      } catch (e) {
        await client.query('ROLLBACK').catch(() => undefined);
        const code = (e as { code?: string }).code;
        if (code && RETRYABLE.has(code) && attempt < 4) continue;
        throw e;
      } finally {
        client.release();
      }
    }
  }

  // ---------- writes ----------

  async commitRecord(write: RecordWrite, plan: (state: LotState) => PlanResult<RecordPlan>): Promise<WriteResult<RecordOutcome>> {
    return this.inLotTransaction(write.lotId, async (q): Promise<WriteResult<RecordOutcome>> => {
      const seen = await q.query<{ outcome_json: string; lot_id: string; at: string }>('SELECT lot_id, at, outcome_json FROM lot_events WHERE event_id = $1', [write.eventId]);
      if (seen.rows[0]) {
        const row = seen.rows[0];
        return { ok: true, duplicate: true, outcome: await this.rebuildRecord(q, write.eventId, JSON.parse(row.outcome_json) as RecordEventLog, row.lot_id, row.at) };
      }
      const lot = await this.lotRecord(q, write.lotId);
      const points = await q.query<{ id: number; quantity: string; wafer: number | null; site: number | null; resistivity_ohm_cm: number | null }>(
        `SELECT r.id, r.quantity, r.wafer, r.site, r.resistivity_ohm_cm FROM lot_readings r
         WHERE r.lot_id = $1 AND NOT EXISTS (SELECT 1 FROM lot_readings s WHERE s.supersedes = r.id)
         ORDER BY r.id`,
        [write.lotId],
      );
      const state: LotState = {
        ...(lot ? { lot } : {}),
        currentReadings: points.rows.map(
          (r): ReadingPoint => ({
            id: r.id,
            quantity: r.quantity as ReadingPoint['quantity'],
            ...(r.wafer !== null ? { wafer: r.wafer } : {}),
            ...(r.site !== null ? { site: r.site } : {}),
            ...(r.resistivity_ohm_cm !== null ? { resistivityOhmCm: r.resistivity_ohm_cm } : {}),
          }),
        ),
        openFlags: await this.openFlags(q, write.lotId),
        ...(write.corrects !== undefined ? await this.correctedReading(q, write.corrects) : {}),
      };
      const planned = plan(state);
      if (!planned.ok) return planned;
      const p = planned.plan;

      await q.query('INSERT INTO lots (lot_id, first_seen_at) VALUES ($1, $2) ON CONFLICT (lot_id) DO NOTHING', [write.lotId, write.at]);
      let productChange: RecordEventLog['productChange'];
      if (p.productId !== undefined && p.productId !== lot?.productId) {
        await q.query('INSERT INTO lot_products (lot_id, product_id, set_at, set_by, event_id) VALUES ($1, $2, $3, $4, $5)', [
          write.lotId,
          p.productId,
          write.at,
          write.actor.userName ?? write.actor.userId,
          write.eventId,
        ]);
        productChange = { ...(lot?.productId !== undefined ? { from: lot.productId } : {}), to: p.productId };
      }
      const productId = p.productId ?? lot?.productId;

      const readingIds: number[] = [];
      for (const [i, d] of p.readings.entries()) {
        const r = await q.query<{ id: number }>(
          `INSERT INTO lot_readings (lot_id, wafer, site, quantity, as_entered, value, unit, thickness_cm, spacing_cm,
             type_method, resistivity_ohm_cm, dopant_density_per_cm3, carrier_type, temperature_k, verdict,
             evaluation_json, supersedes, user_id, user_name, surface, channel_id, event_id, event_seq, recorded_at, note)
           VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14, $15, $16, $17, $18, $19, $20, $21, $22, $23, $24, $25)
           RETURNING id`,
          [
            write.lotId,
            d.wafer ?? null,
            d.site ?? null,
            d.quantity,
            d.asEntered,
            d.value,
            d.unit,
            d.thicknessCm ?? null,
            d.spacingCm ?? null,
            d.typeMethod ?? null,
            d.resistivityOhmCm ?? null,
            d.dopantDensityPerCm3 ?? null,
            d.carrierType ?? null,
            d.temperatureK ?? null,
            d.verdict,
            JSON.stringify(d.evaluation),
            p.supersedingIndex === i ? (write.corrects ?? null) : null,
            write.actor.userId,
            write.actor.userName ?? null,
            write.actor.surface,
            write.actor.channelId,
            write.eventId,
            i,
            write.at,
            d.note ?? null,
          ],
        );
        readingIds.push(r.rows[0]!.id);
      }
      if (p.mapSites) {
        // Every site in one statement: arrays unnested into rows.
        const sites = p.mapSites.sites;
        await q.query(
          `INSERT INTO lot_map_sites (reading_id, seq, label, x_mm, y_mm, value, resistivity_ohm_cm, included)
           SELECT $1, s.seq - 1, s.label, s.x, s.y, s.v, s.rho, s.inc
           FROM unnest($2::text[], $3::float8[], $4::float8[], $5::float8[], $6::float8[], $7::boolean[])
             WITH ORDINALITY AS s(label, x, y, v, rho, inc, seq)`,
          [
            readingIds[p.mapSites.readingIndex],
            sites.map((x) => x.label),
            sites.map((x) => x.xMm),
            sites.map((x) => x.yMm),
            sites.map((x) => x.value),
            sites.map((x) => x.resistivityOhmCm),
            sites.map((x) => x.included),
          ],
        );
      }

      const closedIds: number[] = [];
      const correctedBy = p.supersedingIndex !== undefined ? readingIds[p.supersedingIndex] : undefined;
      for (const c of p.close) {
        const reason =
          c.because === 'reading_corrected'
            ? `reading ${write.corrects ?? '?'} corrected by reading ${correctedBy ?? '?'}`
            : `lot's product set to ${productId ?? '?'}, which has a spec`;
        await this.insertClearance(q, c.flagId, 'correction', write, reason, c.because === 'reading_corrected' ? (correctedBy ?? null) : null);
        closedIds.push(c.flagId);
      }

      const raisedIds: number[] = [];
      for (const r of p.raise) {
        const f = r.finding;
        const inserted = await q.query<{ id: number }>(
          `INSERT INTO lot_flags (lot_id, code, scope, wafer, site, detail_json, product_id, raised_at, raised_by_reading,
             raised_by_user, raised_by_name, event_id)
           VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12) RETURNING id`,
          [
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
          ],
        );
        raisedIds.push(inserted.rows[0]!.id);
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
      await q.query('INSERT INTO lot_events (event_id, kind, lot_id, at, outcome_json) VALUES ($1, $2, $3, $4, $5)', [
        write.eventId,
        'record',
        write.lotId,
        write.at,
        JSON.stringify(log),
      ]);
      return { ok: true, duplicate: false, outcome: await this.rebuildRecord(q, write.eventId, log, write.lotId, write.at) };
    });
  }

  async commitClear(write: ClearWrite, plan: (state: ClearState) => PlanResult<ClearPlan>): Promise<WriteResult<ClearOutcome>> {
    return this.inLotTransaction(write.lotId, async (q): Promise<WriteResult<ClearOutcome>> => {
      const seen = await q.query<{ lot_id: string; outcome_json: string }>('SELECT lot_id, outcome_json FROM lot_events WHERE event_id = $1', [write.eventId]);
      if (seen.rows[0]) {
        const log = JSON.parse(seen.rows[0].outcome_json) as ClearEventLog;
        return { ok: true, duplicate: true, outcome: { eventId: write.eventId, lotId: seen.rows[0].lot_id, cleared: await this.flagsById(q, log.clearedIds) } };
      }
      const lot = await this.lotRecord(q, write.lotId);
      const named = write.flagId !== undefined ? (await this.flagsById(q, [write.flagId]))[0] : undefined;
      const state: ClearState = {
        ...(lot ? { lot } : {}),
        openFlags: await this.openFlags(q, write.lotId),
        ...(named ? { named } : {}),
      };
      const planned = plan(state);
      if (!planned.ok) return planned;
      for (const id of planned.plan.flagIds) await this.insertClearance(q, id, 'person', write, planned.plan.reason, null);
      const log: ClearEventLog = { clearedIds: [...planned.plan.flagIds] };
      await q.query('INSERT INTO lot_events (event_id, kind, lot_id, at, outcome_json) VALUES ($1, $2, $3, $4, $5)', [
        write.eventId,
        'clear',
        write.lotId,
        write.at,
        JSON.stringify(log),
      ]);
      return { ok: true, duplicate: false, outcome: { eventId: write.eventId, lotId: write.lotId, cleared: await this.flagsById(q, log.clearedIds) } };
    });
  }

  // ---------- reads ----------

  async getLot(lotId: string): Promise<LotHistory | undefined> {
    // One snapshot for the three reads.
    const client = await this.pool.connect();
    try {
      await client.query('BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY');
      const lot = await this.lotRecord(client, lotId);
      if (!lot) return undefined;
      const readings = await client.query<ReadingRow>(`${READING_SELECT} WHERE r.lot_id = $1 ORDER BY r.id`, [lotId]);
      const flags = await client.query<FlagRow>(`${FLAG_SELECT} WHERE f.lot_id = $1 ORDER BY f.id`, [lotId]);
      return { lot, readings: readings.rows.map(readingFromRow), flags: flags.rows.map(flagFromRow) };
    } finally {
      await client.query('COMMIT').catch(() => undefined);
      client.release();
    }
  }

  async findLotIds(prefix: string, limit: number): Promise<string[]> {
    const r = await this.pool.query<{ lot_id: string }>('SELECT lot_id FROM lots WHERE starts_with(lot_id, $1) ORDER BY lot_id LIMIT $2', [prefix.toUpperCase(), limit]);
    return r.rows.map((row) => row.lot_id);
  }

  async lotIdsOfProduct(productId: string, limit: number): Promise<string[]> {
    const r = await this.pool.query<{ lot_id: string }>('SELECT lp.lot_id FROM lot_products lp WHERE lower(lp.product_id) = lower($1) AND lp.id = (SELECT MAX(id) FROM lot_products WHERE lot_id = lp.lot_id) ORDER BY lp.lot_id LIMIT $2', [productId, limit]);
    return r.rows.map((row) => row.lot_id);
  }

  async mapSites(readingId: number): Promise<MapSite[]> {
    const r = await this.pool.query<{ label: string; x_mm: number; y_mm: number; value: number | null; resistivity_ohm_cm: number | null; included: boolean }>(
      'SELECT label, x_mm, y_mm, value, resistivity_ohm_cm, included FROM lot_map_sites WHERE reading_id = $1 ORDER BY seq',
      [readingId],
    );
    return r.rows.map((x) => ({ label: x.label, xMm: x.x_mm, yMm: x.y_mm, value: x.value, resistivityOhmCm: x.resistivity_ohm_cm, included: x.included }));
  }

  async listFlags(query: FlagQuery): Promise<FlagWithProduct[]> {
    const where: string[] = [];
    const params: (string | number)[] = [];
    if (query.raisedSince !== undefined) {
      params.push(query.raisedSince);
      where.push(`f.raised_at >= $${params.length}`);
    }
    if (query.raisedBefore !== undefined) {
      params.push(query.raisedBefore);
      where.push(`f.raised_at < $${params.length}`);
    }
    if (query.openOnly) where.push('c.flag_id IS NULL');
    const sql = `
      SELECT q.*, (SELECT lp.product_id FROM lot_products lp WHERE lp.lot_id = q.lot_id ORDER BY lp.id DESC LIMIT 1) AS lot_product_id
      FROM (${FLAG_SELECT} ${where.length ? 'WHERE ' + where.join(' AND ') : ''} ORDER BY f.raised_at DESC, f.id DESC
            ${query.limit !== undefined ? 'LIMIT ' + Math.max(0, Math.floor(query.limit)) : ''}) q
      ORDER BY q.raised_at DESC, q.id DESC`;
    const rows = (await this.pool.query<FlagRow>(sql, params)).rows;
    return rows.map((r) => ({
      ...flagFromRow(r),
      ...(r.lot_product_id !== null && r.lot_product_id !== undefined ? { lotProductId: r.lot_product_id } : {}),
    }));
  }

  async countReadings(): Promise<number> {
    return (await this.pool.query<{ n: number }>('SELECT count(*)::integer AS n FROM lot_readings')).rows[0]!.n;
  }

  async countLots(): Promise<number> {
    return (await this.pool.query<{ n: number }>('SELECT count(*)::integer AS n FROM lots')).rows[0]!.n;
  }

  // ---------- digest claims ----------

  async claimDigest(c: DigestClaim): Promise<boolean> {
    const inserted = await this.pool.query(
      `INSERT INTO digest_runs (channel, local_date, slot_at, claimed_at, claimed_by, late, status, attempts)
       VALUES ($1, $2, $3, $4, $5, $6, 'claimed', 1) ON CONFLICT (channel, local_date) DO NOTHING`,
      [c.channel, c.localDate, c.slotAt, c.now, c.instanceId, c.late ? 1 : 0],
    );
    if (inserted.rowCount === 1) return true;
    const staleBefore = new Date(Date.parse(c.now) - c.leaseMs).toISOString();
    // Read committed: of two instances taking over at once, the second re-checks the row after
    // the first's commit and finds it 'claimed' and fresh.
    const taken = await this.pool.query(
      `UPDATE digest_runs SET claimed_at = $1, claimed_by = $2, late = $3, status = 'claimed', attempts = attempts + 1, error = NULL
       WHERE channel = $4 AND local_date = $5 AND (status = 'failed' OR (status = 'claimed' AND claimed_at < $6))`,
      [c.now, c.instanceId, c.late ? 1 : 0, c.channel, c.localDate, staleBefore],
    );
    return taken.rowCount === 1;
  }

  async completeDigest(channel: string, localDate: string, r: { postedAt: string; windowStart: string; windowEnd: string }): Promise<void> {
    await this.pool.query(
      `UPDATE digest_runs SET status = 'posted', posted_at = $1, window_start = $2, window_end = $3, error = NULL WHERE channel = $4 AND local_date = $5`,
      [r.postedAt, r.windowStart, r.windowEnd, channel, localDate],
    );
  }

  async failDigest(channel: string, localDate: string, error: string): Promise<void> {
    await this.pool.query(`UPDATE digest_runs SET status = 'failed', error = $1 WHERE channel = $2 AND local_date = $3`, [error.slice(0, 500), channel, localDate]);
  }

  async getDigestRun(channel: string, localDate: string): Promise<DigestRun | undefined> {
    const row = (await this.pool.query<DigestRow>('SELECT * FROM digest_runs WHERE channel = $1 AND local_date = $2', [channel, localDate])).rows[0];
    return row ? digestFromRow(row) : undefined;
  }

  async lastPostedDigest(channel: string): Promise<DigestRun | undefined> {
    const row = (
      await this.pool.query<DigestRow>(`SELECT * FROM digest_runs WHERE channel = $1 AND status = 'posted' ORDER BY window_end DESC LIMIT 1`, [channel])
    ).rows[0];
    return row ? digestFromRow(row) : undefined;
  }

  /** The pool belongs to the backend, which closes it. */
  async close(): Promise<void> {}

  // ---------- helpers ----------

  private async lotRecord(q: Q, lotId: string): Promise<LotRecord | undefined> {
    const lot = (await q.query<{ lot_id: string; first_seen_at: string }>('SELECT lot_id, first_seen_at FROM lots WHERE lot_id = $1', [lotId])).rows[0];
    if (!lot) return undefined;
    const product = (
      await q.query<{ product_id: string; set_at: string; set_by: string }>(
        'SELECT product_id, set_at, set_by FROM lot_products WHERE lot_id = $1 ORDER BY id DESC LIMIT 1',
        [lotId],
      )
    ).rows[0];
    return {
      lotId: lot.lot_id,
      firstSeenAt: lot.first_seen_at,
      ...(product ? { productId: product.product_id, productSetAt: product.set_at, productSetBy: product.set_by } : {}),
    };
  }

  private async openFlags(q: Q, lotId: string): Promise<StoredFlag[]> {
    return (await q.query<FlagRow>(`${FLAG_SELECT} WHERE f.lot_id = $1 AND c.flag_id IS NULL ORDER BY f.id`, [lotId])).rows.map(flagFromRow);
  }

  private async correctedReading(q: Q, id: number): Promise<{ corrected?: StoredReading }> {
    const row = (await q.query<ReadingRow>(`${READING_SELECT} WHERE r.id = $1`, [id])).rows[0];
    return row ? { corrected: readingFromRow(row) } : {};
  }

  private async flagsById(q: Q, ids: readonly number[]): Promise<StoredFlag[]> {
    if (ids.length === 0) return [];
    const rows = (await q.query<FlagRow>(`${FLAG_SELECT} WHERE f.id = ANY($1::integer[])`, [ids])).rows.map(flagFromRow);
    const byId = new Map(rows.map((f) => [f.id, f]));
    return ids.map((id) => byId.get(id)).filter((f): f is StoredFlag => f !== undefined);
  }

  private async insertClearance(q: Q, flagId: number, kind: 'person' | 'correction', write: ClearWrite | RecordWrite, reason: string, correctedBy: number | null): Promise<void> {
    await q.query(
      `INSERT INTO lot_flag_clearances (flag_id, kind, at, by_user, by_name, reason, corrected_by, event_id) VALUES ($1, $2, $3, $4, $5, $6, $7, $8)`,
      [flagId, kind, write.at, write.actor.userId, write.actor.userName ?? null, reason, correctedBy, write.eventId],
    );
  }

  private async rebuildRecord(q: Q, eventId: string, log: RecordEventLog, lotId: string, at: string): Promise<RecordOutcome> {
    const readings =
      log.readingIds.length === 0
        ? []
        : (await q.query<ReadingRow>(`${READING_SELECT} WHERE r.id = ANY($1::integer[]) ORDER BY r.id`, [log.readingIds])).rows.map(readingFromRow);
    return {
      eventId,
      lotId,
      recordedAt: at,
      ...(log.productId !== undefined ? { productId: log.productId } : {}),
      ...(log.productChange ? { productChange: log.productChange } : {}),
      readings,
      raised: await this.flagsById(q, log.raisedIds),
      alreadyOpen: await this.flagsById(q, log.alreadyOpenIds),
      closed: await this.flagsById(q, log.closedIds),
      ...(log.supersedes !== undefined ? { supersedes: log.supersedes } : {}),
    };
  }
}
