/**
 * Results kept in the embedded database, so `why <id>` and the chat buttons (whose values carry
 * only a result id) still work after a restart or on another instance sharing the file.
 *
 * A result id names one reply for good: saving the same reply again is a no-op (a retried
 * event), but saving a different reply under an id already taken throws `ResultIdTakenError`,
 * so an id collision can never make an old card's buttons show someone else's result.
 */
import { ResultIdTakenError, type ResultStore } from '../../../commands/context.js';
import type { ReplyOk } from '../../../reply/reply.js';
import type { Db, Migration } from './db.js';

export const resultStoreMigrations: readonly Migration[] = [
  {
    id: 'results-001-create',
    sql: `CREATE TABLE results (
            id         TEXT PRIMARY KEY,
            command    TEXT NOT NULL,
            created_at TEXT NOT NULL,
            reply      TEXT NOT NULL
          ) STRICT`,
  },
];



export class SqliteResultStore implements ResultStore {
  private readonly insert;
  private readonly select;

  /** `db` must have `resultStoreMigrations` applied (openDatabase(path, [...resultStoreMigrations, ...])). */
  constructor(db: Db) {
    this.insert = db.prepare(
      'INSERT INTO results (id, command, created_at, reply) VALUES (?, ?, ?, ?) ON CONFLICT(id) DO NOTHING',
    );
    this.select = db.prepare('SELECT reply FROM results WHERE id = ?').pluck();
  }

  async save(reply: ReplyOk): Promise<void> {
    const json = JSON.stringify(reply);
    const { changes } = this.insert.run(reply.id, reply.command, reply.createdAt, json);
    if (changes === 1) return;
    const existing = this.select.get(reply.id) as string | undefined;
    if (existing !== json) throw new ResultIdTakenError(reply.id);
  }

  async get(id: string): Promise<ReplyOk | undefined> {
    const json = this.select.get(id) as string | undefined;
    if (json === undefined) return undefined;
    const reply = JSON.parse(json) as ReplyOk;
    return reply.ok === true && reply.id === id ? reply : undefined;
  }
}
