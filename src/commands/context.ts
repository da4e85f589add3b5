/**
 * What a command needs from the world, injected so tests use a fixed clock, fixed ids,
 * in-memory stores and no network.
 */
import type { LotService } from '../lots/service.js';
import type { ReplyOk } from '../reply/reply.js';

export type Surface = 'console' | 'cli' | 'slack' | 'teams';

/** A store refuses to save a different reply under an id already taken (the caller picks another id). */
export class ResultIdTakenError extends Error {
  constructor(readonly resultId: string) {
    super(`result id ${resultId} is already used by another result`);
    this.name = 'ResultIdTakenError';
  }
}

/** Where replies are kept so that `why <id>` and chat buttons work later (and after a restart). */
export interface ResultStore {
  /** Saving the same reply twice is a no-op; a different reply under a taken id throws ResultIdTakenError. */
  save(reply: ReplyOk): Promise<void>;
  get(id: string): Promise<ReplyOk | undefined>;
}

export interface Caller {
  /** Stable user id on the surface ('console' for the local console). */
  readonly userId: string;
  readonly displayName?: string;
  /** Channel or conversation id; 'console' for the local console. */
  readonly channelId: string;
}

export interface HandleContext {
  readonly surface: Surface;
  readonly caller: Caller;
  /** Id of the chat event that caused this request, for idempotent side effects. */
  readonly eventId?: string;
  readonly now: () => Date;
  readonly newId: () => string;
  readonly results: ResultStore;
  /** Per-conversation memory: the last result id, for a bare `why`. */
  readonly session: { lastResultId?: string };
  /** Lot records (record, lot, flags, clear, digest); absent where no lot store is wired. */
  readonly lots?: LotService;
}

export class MemoryResultStore implements ResultStore {
  private readonly byId = new Map<string, ReplyOk>();
  async save(reply: ReplyOk): Promise<void> {
    const existing = this.byId.get(reply.id);
    if (existing && JSON.stringify(existing) !== JSON.stringify(reply)) throw new ResultIdTakenError(reply.id);
    this.byId.set(reply.id, reply);
  }
  async get(id: string): Promise<ReplyOk | undefined> {
    return this.byId.get(id);
  }
}

/** Result ids: 'r-' and six hex digits from the given random source. */
export function resultIdFrom(random: () => number): () => string {
  return () =>
    'r-' +
    Math.floor(random() * 0x1000000)
      .toString(16)
      .padStart(6, '0');
}
