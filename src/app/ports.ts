/**
 * What the application layer needs from storage, as ports; the backends in src/adapters/storage
 * (SQLite, PostgreSQL, memory) implement them. The lot records' port is LotRepository
 * (src/lots/repository.ts) and the result store's is ResultStore (src/commands/context.ts): each
 * is owned by the layer that uses it.
 */
import type { ResultStore } from '../commands/context.js';
import type { LotRepository } from '../lots/repository.js';

/**
 * Exactly-once handling of chat events. Chat services deliver at least once: HTTP retries,
 * redeliveries after a reconnect, several instances behind one app. Before a reply or a side
 * effect, the application claims the event's key; only the first claim wins, and a duplicate
 * does nothing.
 *
 * A claim is a lease: if its holder dies before `complete`, a later delivery may take the event
 * over once the lease has run out (Slack's own retries come about 1 and 5 minutes later), so a
 * crash does not lose the answer. A completed event is never handled again.
 */
export interface EventLedger {
  /** true: this process owns the event and should handle it; false: a duplicate, do nothing. */
  claim(key: string): Promise<boolean>;
  /** The event has been answered; it will never be claimed again. */
  complete(key: string): Promise<void>;
  /** The work failed before any side effect: forget the claim so the next attempt may do it. */
  release(key: string): Promise<void>;
}

export interface LedgerOptions {
  readonly now: () => Date;
  /** How long a claim holds before another delivery may take it over. */
  readonly leaseMs?: number;
  /** How long keys are remembered (chat services stop retrying within minutes). */
  readonly retentionMs?: number;
}

export const DEFAULT_LEASE_MS = 30_000;
export const DEFAULT_RETENTION_MS = 24 * 60 * 60 * 1000;

/**
 * What the surfaces remember about conversations, so that it survives a restart and is the same
 * on every instance sharing the database:
 * - the last result per person and conversation, for a bare `why`;
 * - threads where the bot has answered, per channel: the short list offered when sharing a
 *   result into a thread.
 * It holds ids, timestamps and the bot's own reply titles, never the text people wrote.
 */
export interface KnownThread {
  readonly channelId: string;
  /** The thread's parent message id (Slack `thread_ts`). */
  readonly threadTs: string;
  /** The bot's reply title there, e.g. 'Boron from 8.20 Ω·cm'. */
  readonly title: string;
  readonly lastAt: Date;
}

export interface ConversationMemory {
  lastResult(conversationKey: string): Promise<string | undefined>;
  setLastResult(conversationKey: string, resultId: string): Promise<void>;
  rememberThread(thread: KnownThread): Promise<void>;
  /** Most recent first. */
  recentThreads(channelId: string, limit: number): Promise<KnownThread[]>;
}

/** Threads kept per channel; older ones are dropped as new ones arrive. */
export const THREADS_KEPT_PER_CHANNEL = 50;

/**
 * One storage backend: every store the application uses, on one database. Opened (and its
 * schema migrated) by the backend's own `open…` function in src/adapters/storage; the
 * composition root picks the backend from the settings.
 */
export interface StorageBackend {
  readonly kind: 'sqlite' | 'postgres' | 'memory';
  /** Where the data is, for logs: the file path, or the URL without its password. */
  readonly location: string;
  readonly results: ResultStore;
  readonly ledger: EventLedger;
  readonly conversations: ConversationMemory;
  readonly lots: LotRepository;
  /** Whether the database answers a query now (for /readyz). */
  healthy(): Promise<boolean>;
  close(): Promise<void>;
}

/** A storage problem that stops start-up, with the message to print (names the setting, never a password). */
export class StorageError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'StorageError';
  }
}
