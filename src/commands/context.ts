/**
 * What a command needs from the world, injected so tests use a fixed clock, fixed ids,
 * in-memory stores and no network.
 */
import type { LotService } from '../lots/service.js';
import type { ReplyOk } from '../reply/reply.js';

export type Surface = 'console' | 'cli' | 'slack' | 'teams' | 'http';

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

/** Side effects a command reports while it runs (see handle.ts: a failure is worded from these). */
export interface EffectLog {
  /** About to store `what` ("reading for LOT-A17 w3"); `check` says how to look ("lot LOT-A17 shows it"). */
  willStore(what: string, check?: string): void;
  /** `what` is stored and committed ("reading #41 for LOT-A17 w3"). */
  didStore(what: string): void;
}

/** Where a surface's failures are logged, with their cause (a Bolt logger fits). */
export interface FailureLog {
  error(...args: unknown[]): void;
}

/** A question the last reply asked: typing one of the answers runs its command. */
export interface PendingChoice {
  readonly answer: string;
  readonly command: string;
}

/** A file that came with the message (a measurement CSV): its name and text. */
export interface Attachment {
  readonly name: string;
  readonly text: string;
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
  readonly session: { lastResultId?: string; pendingChoices?: readonly PendingChoice[] | undefined };
  /** The surface's log for failures; stderr when absent. */
  readonly log?: FailureLog;
  /** Set by `handle` for the duration of one request. */
  readonly effects?: EffectLog;
  /** The fab's four-point probe head (PROBE_SPACING_MM): pin spacing in cm, for readings that give none. */
  readonly probeSpacingCm?: number;
  /** A file sent with the message (`map`, `record … map`); absent when none was. */
  readonly attachment?: Attachment;
  /** Lot records (record, lot, flags, clear, digest); absent where no lot store is wired. */
  readonly lots?: LotService;
}

/** Result ids: 'r-' and six hex digits from the given random source. */
export function resultIdFrom(random: () => number): () => string {
  return () =>
    'r-' +
    Math.floor(random() * 0x1000000)
      .toString(16)
      .padStart(6, '0');
}
