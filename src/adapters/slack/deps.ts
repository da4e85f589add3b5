/**
 * What the Slack adapter needs from the rest of shiftprobe, injected: the command handler, the
 * stores, the clock and ids, the logger and fetch (for Slack's response URLs). Tests pass a
 * fixed clock, in-memory or temporary stores and a logger that captures lines.
 */
import type { Logger } from '@slack/bolt';
import type { HandleContext, ResultStore } from '../../commands/context.js';
import type { LotsRuntime } from '../../lots/runtime.js';
import type { Reply } from '../../reply/reply.js';
import type { ConversationMemory } from '../../store/conversations.js';
import type { EventLedger } from '../../store/event-ledger.js';

/** `handle` from src/commands/handle.ts, or any function of the same shape. */
export type Handler = (text: string, ctx: HandleContext) => Promise<Reply>;

export interface SlackDeps {
  readonly handle: Handler;
  readonly results: ResultStore;
  readonly ledger: EventLedger;
  readonly conversations: ConversationMemory;
  readonly now: () => Date;
  readonly newId: () => string;
  readonly logger: Logger;
  readonly fetch: typeof fetch;
  /** Whether the store answers (for /readyz). */
  readonly storeHealthy: () => boolean;
  /**
   * How long a slash command may compute before it is acknowledged with "working on it" and
   * answered through its response URL instead (Slack's window is 3 s; the default leaves room).
   */
  readonly ackDeadlineMs: number;
  /** Timeout for the optional channel-history call that lists recent threads. */
  readonly historyTimeoutMs: number;
  /** Lot records (record, lot, flags, clear, digest) when wired. */
  readonly lots?: LotsRuntime;
  /** Display names for replies (users.info, cached); ids when absent. */
  readonly displayName?: (userId: string) => Promise<string | undefined>;
}

export const DEFAULT_ACK_DEADLINE_MS = 2000;
export const DEFAULT_HISTORY_TIMEOUT_MS = 1200;

/** The listeners' view: the deps plus the slash command's configured name. */
export interface ListenerDeps extends SlackDeps {
  readonly slashCommand: string;
}
