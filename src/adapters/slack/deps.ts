/**
 * What the Slack adapter needs from the rest of shiftprobe, injected: the application layer's
 * `ask` (src/app/application.ts), the stores the buttons use, the clock, the logger and fetch
 * (for Slack's response URLs). Tests pass a fixed clock, temporary stores and a logger that
 * captures lines.
 */
import type { Logger } from '@slack/bolt';
import type { Asked, Question } from '../../app/application.js';
import type { ConversationMemory, EventLedger } from '../../app/ports.js';
import type { ResultStore } from '../../commands/context.js';

export interface SlackDeps {
  /** One question, once: claim, handle, keep (the application layer). */
  readonly ask: (question: Question) => Promise<Asked>;
  readonly results: ResultStore;
  readonly ledger: EventLedger;
  readonly conversations: ConversationMemory;
  readonly now: () => Date;
  readonly logger: Logger;
  readonly fetch: typeof fetch;
  /** Whether the store answers (for /readyz). */
  readonly storeHealthy: () => Promise<boolean>;
  /**
   * How long a slash command may compute before it is acknowledged with "working on it" and
   * answered through its response URL instead (Slack's window is 3 s; the default leaves room).
   */
  readonly ackDeadlineMs: number;
  /** Timeout for the optional channel-history call that lists recent threads. */
  readonly historyTimeoutMs: number;
  /** The Prometheus text for /metrics (absent: no /metrics route). */
  readonly metrics?: () => Promise<{ contentType: string; body: string }>;
  /** Display names for replies (users.info, cached); ids when absent. */
  readonly displayName?: (userId: string) => Promise<string | undefined>;
}

export const DEFAULT_ACK_DEADLINE_MS = 2000;
export const DEFAULT_HISTORY_TIMEOUT_MS = 1200;

/** The listeners' view: the deps plus the slash command's configured name. */
export interface ListenerDeps extends SlackDeps {
  readonly slashCommand: string;
}
