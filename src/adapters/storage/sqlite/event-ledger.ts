/**
 * The event ledger in the embedded database: one row per event key. The claim is a single
 * INSERT … ON CONFLICT DO UPDATE … WHERE statement, atomic under SQLite's write lock, so two
 * processes sharing the file can never both win the same event.
 */
import {
  DEFAULT_LEASE_MS,
  DEFAULT_RETENTION_MS,
  type EventLedger,
  type LedgerOptions,
} from '../../../app/ports.js';
import type { Db, Migration } from './db.js';

export const eventLedgerMigrations: readonly Migration[] = [
  {
    id: 'events-001-create',
    sql: `CREATE TABLE chat_events (
            event_key  TEXT PRIMARY KEY,
            state      TEXT NOT NULL CHECK (state IN ('claimed', 'done')),
            claimed_ms INTEGER NOT NULL,
            done_ms    INTEGER
          ) STRICT;
          CREATE INDEX chat_events_claimed ON chat_events (claimed_ms)`,
  },
  {
    // One B-tree per row write instead of three (rowid table, key index, time index): a claim is
    // on the path of every answer. Pruning scans a day's keys, which is cheap.
    id: 'events-002-without-rowid',
    sql: `CREATE TABLE chat_events_v2 (
            event_key  TEXT PRIMARY KEY,
            state      TEXT NOT NULL CHECK (state IN ('claimed', 'done')),
            claimed_ms INTEGER NOT NULL,
            done_ms    INTEGER
          ) STRICT, WITHOUT ROWID;
          INSERT INTO chat_events_v2 SELECT event_key, state, claimed_ms, done_ms FROM chat_events;
          DROP TABLE chat_events;
          ALTER TABLE chat_events_v2 RENAME TO chat_events`,
  },
];

/** Prune old keys once every this many claims. */
const PRUNE_EVERY = 256;

export class SqliteEventLedger implements EventLedger {
  private readonly claimStmt;
  private readonly completeStmt;
  private readonly pruneStmt;
  private readonly releaseStmt;
  private readonly leaseMs: number;
  private readonly retentionMs: number;
  private claims = 0;

  /** `db` must have `eventLedgerMigrations` applied. */
  constructor(
    db: Db,
    private readonly options: LedgerOptions,
  ) {
    this.leaseMs = options.leaseMs ?? DEFAULT_LEASE_MS;
    this.retentionMs = options.retentionMs ?? DEFAULT_RETENTION_MS;
    this.claimStmt = db.prepare(
      `INSERT INTO chat_events (event_key, state, claimed_ms) VALUES (@key, 'claimed', @now)
       ON CONFLICT (event_key) DO UPDATE SET claimed_ms = excluded.claimed_ms
       WHERE chat_events.state = 'claimed' AND chat_events.claimed_ms < @staleBefore`,
    );
    this.completeStmt = db.prepare(
      `UPDATE chat_events SET state = 'done', done_ms = @now WHERE event_key = @key`,
    );
    this.pruneStmt = db.prepare('DELETE FROM chat_events WHERE claimed_ms < ?');
    this.releaseStmt = db.prepare(`DELETE FROM chat_events WHERE event_key = ? AND state = 'claimed'`);
  }

  async claim(key: string): Promise<boolean> {
    const now = this.options.now().getTime();
    this.claims += 1;
    if (this.claims % PRUNE_EVERY === 1) this.pruneStmt.run(now - this.retentionMs);
    const { changes } = this.claimStmt.run({ key, now, staleBefore: now - this.leaseMs });
    return changes === 1;
  }

  async complete(key: string): Promise<void> {
    this.completeStmt.run({ key, now: this.options.now().getTime() });
  }

  async release(key: string): Promise<void> {
    this.releaseStmt.run(key);
  }
}
