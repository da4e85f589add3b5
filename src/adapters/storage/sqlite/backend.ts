/**
 * The embedded backend: one SQLite file (DATABASE_PATH) through better-sqlite3, with every
 * store's migrations applied here, in one place.
 *
 * Two connections to the one file:
 * - lot records on a synchronous=FULL connection: a reading is on disk before its reply is sent;
 * - the chat state (kept results, the event ledger, conversation memory) on a second connection
 *   with synchronous=NORMAL. Every chat answer writes there before it is sent, and with FULL each
 *   commit waits for an fsync (bench/slack.bench.ts: the slash-command p50 went from ~1.2 ms to
 *   ~4 ms). In WAL mode NORMAL loses nothing when the process crashes; only an OS crash or power
 *   cut can drop the last commits, and then the worst case is benign: a card's buttons answer
 *   "I no longer have that result", or an event redelivered after the outage is answered again.
 * ':memory:' (tests) shares one connection, since a second would open another, empty database.
 *
 * Before anything is written, the file is checked (src/adapters/storage/sqlite/preflight.ts): a
 * folder, a text file, a damaged database or another application's database stops start-up with
 * a message naming DATABASE_PATH, and the file is left as it was.
 */
import type { StorageBackend } from '../../../app/ports.js';
import { conversationMigrations, SqliteConversationMemory } from './conversations.js';
import { migrate, openDatabase, type Db, type Migration } from './db.js';
import { eventLedgerMigrations, SqliteEventLedger } from './event-ledger.js';
import { LOT_MIGRATIONS } from './lots-migrations.js';
import { SqliteLotRepository } from './lots-repository.js';
import { resultStoreMigrations, SqliteResultStore } from './results.js';

/** Every store's migrations, in the order they apply. */
export const SQLITE_MIGRATIONS: readonly Migration[] = [...resultStoreMigrations, ...eventLedgerMigrations, ...LOT_MIGRATIONS, ...conversationMigrations];

export interface SqliteBackend extends StorageBackend {
  readonly kind: 'sqlite';
  readonly lots: SqliteLotRepository;
  /** The FULL connection (lot records); tools and tests only. */
  readonly db: Db;
  /** The chat state's connection (NORMAL; the same as `db` in memory); tests only. */
  readonly chatDb: Db;
}

export function openSqliteBackend(path: string, options: { now?: () => Date } = {}): SqliteBackend {
  const now = options.now ?? (() => new Date());
  const db = openDatabase(path, SQLITE_MIGRATIONS);
  const own = path !== ':memory:';
  let chat: Db = db;
  if (own) {
    try {
      chat = openDatabase(path, []);
      chat.pragma('synchronous = NORMAL');
    } catch (e) {
      db.close();
      throw e;
    }
  } else {
    migrate(db, SQLITE_MIGRATIONS);
  }
  const ping = chat.prepare('SELECT 1');
  return {
    kind: 'sqlite',
    location: path,
    db,
    chatDb: chat,
    results: new SqliteResultStore(chat),
    ledger: new SqliteEventLedger(chat, { now }),
    conversations: new SqliteConversationMemory(chat, now),
    lots: new SqliteLotRepository(db),
    async healthy() {
      try {
        return ping.get() !== undefined;
      } catch {
        return false;
      }
    },
    async close() {
      if (own && chat.open) chat.close();
      if (db.open) db.close();
    },
  };
}
