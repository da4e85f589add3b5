/**
 * The application layer: what every surface (console, CLI, Slack, HTTP, Teams) shares, above the
 * commands and below the adapters.
 *
 * - `ask`: one question, once. Claims the event (a duplicate delivery does nothing), loads the
 *   conversation's memory, runs the command, keeps `why` answers (results are kept by `handle`)
 *   so their cards can be shared, and — once the surface has sent the answer — remembers the
 *   conversation's last result and completes the event.
 * - `contextFor`: the HandleContext of one request.
 * - `dailySummary`: the one daily job, handing the summary to each surface's notifier.
 *
 * Built on a StorageBackend (src/app/ports.ts) by the composition root (src/main.ts); nothing
 * here knows which database or which chat service is behind it.
 */
import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import type { Attachment, Caller, FailureLog, HandleContext, PendingChoice, Surface } from '../commands/context.js';
import { handle as defaultHandle } from '../commands/handle.js';
import { findCommand } from '../commands/registry.js';
import { recordCommand } from '../commands/lots/record.js';
import { RecordRequest } from '../lots/readings.js';
import { errorReply } from '../reply/build.js';
import type { LotsConfig } from '../lots/config.js';
import { startLots, type LotsOptions, type LotsRuntime } from '../lots/runtime.js';
import { isShareable, isResult } from '../reply/kinds.js';
import type { Reply } from '../reply/reply.js';
import { DailySummaryJob, type DailySummaryDeps, type SummaryNotifier } from './daily-summary.js';
import { NO_METRICS, type MetricsPort } from './metrics.js';
import type { StorageBackend } from './ports.js';

/** `handle` from src/commands/handle.ts, or any function of the same shape (tests). */
export type Handler = (text: string, ctx: HandleContext) => Promise<Reply>;

/** A problem that stops start-up (a bad spec file, a bad database), with the message to print. */
export class StartupError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'StartupError';
  }
}

/**
 * Result ids: 'r-' and 8 random hex digits, short enough to type into `why`; a clash with an
 * older result (likely only after tens of thousands) is caught by the store and re-drawn.
 */
export function randomResultId(): string {
  return `r-${randomBytes(4).toString('hex')}`;
}

/** In-process conversation state a surface may hold (the console): the pending question's answers. */
export interface Session {
  lastResultId?: string;
  pendingChoices?: readonly PendingChoice[] | undefined;
}

export interface Question {
  readonly text: string;
  readonly surface: Surface;
  readonly caller: Caller;
  /** The chat event's exactly-once key; absent on the console and the CLI. */
  readonly eventKey?: string;
  /**
   * A key that makes side effects idempotent without claiming the question (the HTTP API's
   * Idempotency-Key): a retried `record` gets the first outcome again instead of nothing.
   */
  readonly effectKey?: string;
  /**
   * Whose conversation this is, for a bare `why` across restarts and instances
   * ('slack:T1:C1:U1'); absent: only `session` remembers.
   */
  readonly conversationKey?: string;
  /** In-process session (the console keeps one for its whole run). */
  readonly session?: Session;
  /** Where this surface logs failures. */
  readonly log?: FailureLog;
  /** A file sent with the question (a measurement CSV for `map`). */
  readonly attachment?: Attachment;
}

export type Asked =
  | { readonly duplicate: true }
  | {
      readonly duplicate: false;
      readonly reply: Reply;
      /** After the answer is out: remember the conversation's last result and complete the event. */
      settle(): Promise<void>;
      /** The answer could not be sent and nothing was stored: let a redelivery try again. */
      abandon(): Promise<void>;
    };

export interface ApplicationOptions {
  readonly lots?: LotsConfig;
  readonly lotsOptions?: LotsOptions;
  readonly now?: () => Date;
  readonly newId?: () => string;
  readonly handle?: Handler;
  /** Names this process in claim rows (default host:pid). */
  readonly instanceId?: string;
  /** Where questions, summary runs and storage errors are counted (none by default). */
  readonly metrics?: MetricsPort;
}

export class Application {
  readonly now: () => Date;
  readonly newId: () => string;
  readonly instanceId: string;
  readonly metrics: MetricsPort;
  /** The fab's probe head (PROBE_SPACING_MM), cm. */
  readonly probeSpacingCm: number | undefined;
  private readonly handler: Handler;

  private constructor(
    readonly backend: StorageBackend,
    readonly lots: LotsRuntime | undefined,
    options: ApplicationOptions,
  ) {
    this.now = options.now ?? (() => new Date());
    this.newId = options.newId ?? randomResultId;
    this.handler = options.handle ?? defaultHandle;
    this.instanceId = options.instanceId ?? `${hostname()}:${process.pid}`;
    this.metrics = options.metrics ?? NO_METRICS;
    this.probeSpacingCm = options.lots?.probeSpacingCm;
  }

  /** Build the application on an open backend; a bad spec file is a StartupError. */
  static async open(backend: StorageBackend, options: ApplicationOptions = {}): Promise<Application> {
    let lots: LotsRuntime | undefined;
    if (options.lots) {
      const started = await startLots(backend.lots, options.lots, { ...(options.now ? { now: options.now } : {}), ...options.lotsOptions });
      if (!started.ok) throw new StartupError(started.message);
      lots = started.lots;
    }
    return new Application(backend, lots, options);
  }

  get results() {
    return this.backend.results;
  }

  get conversations() {
    return this.backend.conversations;
  }

  get ledger() {
    return this.backend.ledger;
  }

  /** A storage call, counted when it fails (and the failure passed on). */
  private async storage<T>(op: () => Promise<T>): Promise<T> {
    try {
      return await op();
    } catch (e) {
      this.metrics.storageError();
      throw e;
    }
  }

  /** The HandleContext of one request. */
  contextFor(surface: Surface, caller: Caller, session: Session, eventId?: string, log?: FailureLog, attachment?: Attachment): HandleContext {
    return {
      surface,
      caller,
      now: this.now,
      newId: this.newId,
      results: this.backend.results,
      session,
      ...(eventId ? { eventId } : {}),
      ...(log ? { log } : {}),
      ...(this.lots ? { lots: this.lots.service } : {}),
      ...(this.probeSpacingCm !== undefined ? { probeSpacingCm: this.probeSpacingCm } : {}),
      ...(attachment ? { attachment } : {}),
    };
  }

  /** One question, once (see the file comment). */
  async ask(q: Question): Promise<Asked> {
    const started = performance.now();
    if (q.eventKey !== undefined && !(await this.storage(() => this.backend.ledger.claim(q.eventKey!)))) return { duplicate: true };
    const session: Session = q.session ?? {};
    const before = q.conversationKey !== undefined ? await this.backend.conversations.lastResult(q.conversationKey) : session.lastResultId;
    if (before !== undefined) session.lastResultId = before;
    const ctx = this.contextFor(q.surface, q.caller, session, q.eventKey ?? q.effectKey, q.log, q.attachment);
    const reply = await this.handler(q.text, ctx);
    // `handle` keeps results; a `why` answer is kept here so its card's buttons work too.
    if (isShareable(reply) && !isResult(reply)) await this.storage(() => this.backend.results.save(reply));
    this.metrics.answered({
      surface: q.surface,
      command: reply.ok ? reply.command : (findCommand(q.text.trim().split(/\s+/)[0] ?? '')?.verb ?? 'unrecognised'),
      outcome: reply.ok ? 'ok' : reply.error.code === 'internal' ? 'internal' : 'bad_input',
      seconds: (performance.now() - started) / 1000,
    });
    return {
      duplicate: false,
      reply,
      settle: async () => {
        if (q.conversationKey !== undefined && session.lastResultId && session.lastResultId !== before) {
          await this.storage(() => this.backend.conversations.setLastResult(q.conversationKey!, session.lastResultId!));
        }
        if (q.eventKey !== undefined) await this.storage(() => this.backend.ledger.complete(q.eventKey!));
      },
      abandon: async () => {
        if (q.eventKey !== undefined) await this.backend.ledger.release(q.eventKey);
      },
    };
  }

  /**
   * A reading recorded from typed fields (the HTTP API's /v1/readings) — the same checks, flags,
   * confirmation rule, reply and kept result as the `record` command. `confirm`: store a reading
   * far outside its window without asking.
   */
  async recordTyped(
    fields: unknown,
    q: Omit<Question, 'text' | 'eventKey' | 'conversationKey' | 'session'> & { readonly confirm?: boolean },
  ): Promise<Reply> {
    const request = RecordRequest.safeParse(fields, { reportInput: false });
    if (!request.success) {
      return errorReply('invalid_request', request.error.issues.map((i) => `${i.path.join('.') || 'body'}: ${i.message}`).join('; '));
    }
    const ctx = this.contextFor(q.surface, q.caller, {}, q.effectKey, q.log);
    try {
      const reply = await recordCommand.run(
        { record: request.data, confirmed: q.confirm === true, commandText: `record ${request.data.lotId}`, bareNumber: false, asTyped: {} },
        ctx,
      );
      if (isResult(reply)) await this.backend.results.save(reply);
      return reply;
    } catch (e) {
      (q.log ?? { error: (...a: unknown[]) => process.stderr.write(`${a.map(String).join(' ')}\n`) }).error({ err: e, surface: q.surface, user: q.caller.userId }, 'shiftprobe: a typed record failed');
      return errorReply('internal', 'Something went wrong on our side while storing that; whether it was stored is uncertain: check the lot before sending it again (or resend with the same Idempotency-Key). The cause has been logged.');
    }
  }

  /**
   * The daily summary to every notifier (none: undefined). Started by the composition root once
   * the surfaces are up.
   */
  dailySummary(
    notifiers: readonly SummaryNotifier[],
    options: { onError?: DailySummaryDeps['onError']; timing?: DailySummaryDeps['timing'] } = {},
  ): DailySummaryJob | undefined {
    if (!this.lots || notifiers.length === 0) return undefined;
    return new DailySummaryJob({
      service: this.lots.service,
      repo: this.lots.repo,
      results: this.backend.results,
      at: this.lots.config.digest.at,
      timeZone: this.lots.config.digest.timeZone,
      now: this.now,
      newId: this.newId,
      demo: this.lots.catalog.demo,
      instanceId: this.instanceId,
      notifiers,
      onRun: (status) => this.metrics.summaryRun(status),
      ...options,
    });
  }

  async close(): Promise<void> {
    await this.backend.close();
  }
}
