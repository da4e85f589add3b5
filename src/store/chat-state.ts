/**
 * The chat surfaces' own state — kept results (for `why` and the card buttons), the event ledger
 * (exactly-once answers) and conversation memory — on a connection of its own to the embedded
 * database, with synchronous=NORMAL instead of FULL.
 *
 * Why: every chat answer writes here before it is sent (claim the event, keep the result), and
 * with FULL each of those commits waits for an fsync (measured in bench/slack.bench.ts: the
 * slash-command p50 went from ~1.2 ms to ~4 ms). In WAL mode NORMAL loses nothing when the
 * process crashes; only an OS crash or power cut can drop the last commits, and then the worst
 * case is benign: a card's buttons answer "I no longer have that result", or an event Slack
 * redelivers after the outage is answered again. Lot readings — the records people rely on —
 * stay on the FULL connection (src/app.ts).
 */
import { migrate, openDatabase, type Db } from './db.js';
import { conversationMigrations, SqliteConversationMemory } from './conversations-sqlite.js';
import { eventLedgerMigrations, SqliteEventLedger } from './event-ledger-sqlite.js';
import { resultStoreMigrations, SqliteResultStore } from './results-sqlite.js';
import type { ResultStore } from '../commands/context.js';
import type { ConversationMemory } from './conversations.js';
import type { EventLedger } from './event-ledger.js';

export const chatStateMigrations = [...resultStoreMigrations, ...eventLedgerMigrations, ...conversationMigrations];

export interface ChatState {
  readonly db: Db;
  readonly results: ResultStore;
  readonly ledger: EventLedger;
  readonly conversations: ConversationMemory;
  /** Whether the database answers a query (for /readyz). */
  healthy(): boolean;
  close(): void;
}

/**
 * `shared`: the process's main connection. A file path gets a second connection with
 * synchronous=NORMAL; ':memory:' (tests) must share the one connection, since a second would
 * open another, empty database.
 */
export function openChatState(databasePath: string, shared: Db, now: () => Date): ChatState {
  const own = databasePath !== ':memory:';
  const db = own ? openDatabase(databasePath, chatStateMigrations) : shared;
  if (own) db.pragma('synchronous = NORMAL');
  else migrate(db, chatStateMigrations); // idempotent: applied migrations are skipped
  const ping = db.prepare('SELECT 1');
  return {
    db,
    results: new SqliteResultStore(db),
    ledger: new SqliteEventLedger(db, { now }),
    conversations: new SqliteConversationMemory(db, now),
    healthy: () => {
      try {
        return ping.get() !== undefined;
      } catch {
        return false;
      }
    },
    close: () => {
      if (own && db.open) db.close();
    },
  };
}
