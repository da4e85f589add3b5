/** ConversationMemory in the embedded database (see conversations.ts). */
import { THREADS_KEPT_PER_CHANNEL, type ConversationMemory, type KnownThread } from '../../../app/ports.js';
import type { Db, Migration } from './db.js';

export const conversationMigrations: readonly Migration[] = [
  {
    id: 'conversations-001-create',
    sql: `CREATE TABLE conversation_last_result (
            conversation_key TEXT PRIMARY KEY,
            result_id        TEXT NOT NULL,
            updated_ms       INTEGER NOT NULL
          ) STRICT;
          CREATE TABLE known_threads (
            channel_id TEXT NOT NULL,
            thread_ts  TEXT NOT NULL,
            title      TEXT NOT NULL,
            last_ms    INTEGER NOT NULL,
            PRIMARY KEY (channel_id, thread_ts)
          ) STRICT;
          CREATE INDEX known_threads_recent ON known_threads (channel_id, last_ms DESC)`,
  },
];


export class SqliteConversationMemory implements ConversationMemory {
  private readonly getLast;
  private readonly putLast;
  private readonly putThread;
  private readonly trimThreads;
  private readonly listThreads;

  /** `db` must have `conversationMigrations` applied. */
  constructor(
    db: Db,
    private readonly now: () => Date,
  ) {
    this.getLast = db.prepare('SELECT result_id FROM conversation_last_result WHERE conversation_key = ?').pluck();
    this.putLast = db.prepare(
      `INSERT INTO conversation_last_result (conversation_key, result_id, updated_ms) VALUES (?, ?, ?)
       ON CONFLICT (conversation_key) DO UPDATE SET result_id = excluded.result_id, updated_ms = excluded.updated_ms`,
    );
    this.putThread = db.prepare(
      `INSERT INTO known_threads (channel_id, thread_ts, title, last_ms) VALUES (@channelId, @threadTs, @title, @lastMs)
       ON CONFLICT (channel_id, thread_ts) DO UPDATE SET title = excluded.title, last_ms = excluded.last_ms`,
    );
    this.trimThreads = db.prepare(
      `DELETE FROM known_threads WHERE channel_id = @channelId AND thread_ts NOT IN
         (SELECT thread_ts FROM known_threads WHERE channel_id = @channelId ORDER BY last_ms DESC LIMIT @keep)`,
    );
    this.listThreads = db.prepare(
      'SELECT channel_id, thread_ts, title, last_ms FROM known_threads WHERE channel_id = ? ORDER BY last_ms DESC LIMIT ?',
    );
  }

  async lastResult(key: string): Promise<string | undefined> {
    return this.getLast.get(key) as string | undefined;
  }

  async setLastResult(key: string, resultId: string): Promise<void> {
    this.putLast.run(key, resultId, this.now().getTime());
  }

  async rememberThread(thread: KnownThread): Promise<void> {
    const params = { channelId: thread.channelId, threadTs: thread.threadTs, title: thread.title, lastMs: thread.lastAt.getTime() };
    this.putThread.run(params);
    this.trimThreads.run({ channelId: thread.channelId, keep: THREADS_KEPT_PER_CHANNEL });
  }

  async recentThreads(channelId: string, limit: number): Promise<KnownThread[]> {
    const rows = this.listThreads.all(channelId, limit) as { channel_id: string; thread_ts: string; title: string; last_ms: number }[];
    return rows.map((r) => ({ channelId: r.channel_id, threadTs: r.thread_ts, title: r.title, lastAt: new Date(r.last_ms) }));
  }
}
