/**
 * The chat state on PostgreSQL: kept results, the event ledger and conversation memory. Each
 * operation is one statement, atomic on its own; the claim is INSERT … ON CONFLICT DO UPDATE …
 * WHERE, so of several instances claiming one event key at the same instant exactly one wins.
 */
import type pg from 'pg';
import {
  DEFAULT_LEASE_MS,
  DEFAULT_RETENTION_MS,
  THREADS_KEPT_PER_CHANNEL,
  type ConversationMemory,
  type EventLedger,
  type KnownThread,
  type LedgerOptions,
} from '../../../app/ports.js';
import { ResultIdTakenError, type ResultStore } from '../../../commands/context.js';
import type { ReplyOk } from '../../../reply/reply.js';

export class PgResultStore implements ResultStore {
  constructor(private readonly pool: pg.Pool) {}

  async save(reply: ReplyOk): Promise<void> {
    const json = JSON.stringify(reply);
    const r = await this.pool.query(
      'INSERT INTO results (id, command, created_at, reply) VALUES ($1, $2, $3, $4) ON CONFLICT (id) DO NOTHING',
      [reply.id, reply.command, reply.createdAt, json],
    );
    if (r.rowCount === 1) return;
    const existing = await this.pool.query<{ reply: string }>('SELECT reply FROM results WHERE id = $1', [reply.id]);
    if (existing.rows[0]?.reply !== json) throw new ResultIdTakenError(reply.id);
  }

  async get(id: string): Promise<ReplyOk | undefined> {
    const r = await this.pool.query<{ reply: string }>('SELECT reply FROM results WHERE id = $1', [id]);
    const json = r.rows[0]?.reply;
    if (json === undefined) return undefined;
    const reply = JSON.parse(json) as ReplyOk;
    return reply.ok === true && reply.id === id ? reply : undefined;
  }
}

/** Prune old keys once every this many claims. */
const PRUNE_EVERY = 256;

export class PgEventLedger implements EventLedger {
  private readonly leaseMs: number;
  private readonly retentionMs: number;
  private claims = 0;

  constructor(
    private readonly pool: pg.Pool,
    private readonly options: LedgerOptions,
  ) {
    this.leaseMs = options.leaseMs ?? DEFAULT_LEASE_MS;
    this.retentionMs = options.retentionMs ?? DEFAULT_RETENTION_MS;
  }

  async claim(key: string): Promise<boolean> {
    const now = this.options.now().getTime();
    this.claims += 1;
    if (this.claims % PRUNE_EVERY === 1) await this.pool.query('DELETE FROM chat_events WHERE claimed_ms < $1', [now - this.retentionMs]);
    const r = await this.pool.query(
      `INSERT INTO chat_events (event_key, state, claimed_ms) VALUES ($1, 'claimed', $2)
       ON CONFLICT (event_key) DO UPDATE SET claimed_ms = excluded.claimed_ms
       WHERE chat_events.state = 'claimed' AND chat_events.claimed_ms < $3`,
      [key, now, now - this.leaseMs],
    );
    return r.rowCount === 1;
  }

  async complete(key: string): Promise<void> {
    await this.pool.query(`UPDATE chat_events SET state = 'done', done_ms = $2 WHERE event_key = $1`, [key, this.options.now().getTime()]);
  }

  async release(key: string): Promise<void> {
    await this.pool.query(`DELETE FROM chat_events WHERE event_key = $1 AND state = 'claimed'`, [key]);
  }
}

export class PgConversationMemory implements ConversationMemory {
  constructor(
    private readonly pool: pg.Pool,
    private readonly now: () => Date,
  ) {}

  async lastResult(key: string): Promise<string | undefined> {
    const r = await this.pool.query<{ result_id: string }>('SELECT result_id FROM conversation_last_result WHERE conversation_key = $1', [key]);
    return r.rows[0]?.result_id;
  }

  async setLastResult(key: string, resultId: string): Promise<void> {
    await this.pool.query(
      `INSERT INTO conversation_last_result (conversation_key, result_id, updated_ms) VALUES ($1, $2, $3)
       ON CONFLICT (conversation_key) DO UPDATE SET result_id = excluded.result_id, updated_ms = excluded.updated_ms`,
      [key, resultId, this.now().getTime()],
    );
  }

  async rememberThread(thread: KnownThread): Promise<void> {
    await this.pool.query(
      `INSERT INTO known_threads (channel_id, thread_ts, title, last_ms) VALUES ($1, $2, $3, $4)
       ON CONFLICT (channel_id, thread_ts) DO UPDATE SET title = excluded.title, last_ms = excluded.last_ms`,
      [thread.channelId, thread.threadTs, thread.title, thread.lastAt.getTime()],
    );
    await this.pool.query(
      `DELETE FROM known_threads WHERE channel_id = $1 AND thread_ts NOT IN
         (SELECT thread_ts FROM known_threads WHERE channel_id = $1 ORDER BY last_ms DESC LIMIT $2)`,
      [thread.channelId, THREADS_KEPT_PER_CHANNEL],
    );
  }

  async recentThreads(channelId: string, limit: number): Promise<KnownThread[]> {
    const r = await this.pool.query<{ channel_id: string; thread_ts: string; title: string; last_ms: string }>(
      'SELECT channel_id, thread_ts, title, last_ms FROM known_threads WHERE channel_id = $1 ORDER BY last_ms DESC LIMIT $2',
      [channelId, limit],
    );
    return r.rows.map((row) => ({ channelId: row.channel_id, threadTs: row.thread_ts, title: row.title, lastAt: new Date(Number(row.last_ms)) }));
  }
}
