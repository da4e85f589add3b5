/**
 * The daily summary of flagged lots: fired by croner at DIGEST_AT in DIGEST_TZ, built once, kept
 * in the result store (so `why` and the share buttons find it) and handed to each surface's
 * notifier (Slack posts it to DIGEST_CHANNEL, the console prints it), exactly once per
 * destination per local date, however many instances fire.
 *
 * Once per date: before posting, the instance inserts the claim row (destination, local date) —
 * a primary key, so of two instances firing in the same minute only one gets it. A failed post
 * marks the row 'failed' and is retried (a failed row may be claimed again); a row left
 * 'claimed' by an instance that died before posting may be taken over after the lease.
 *
 * Missed summaries: at start, if the most recent slot has no posted summary (the bot was down),
 * it is posted once, marked late, covering everything since the last posted summary. The very
 * first start on a destination has missed nothing and waits for the next slot.
 */
import { Cron } from 'croner';
import type { ResultStore } from '../commands/context.js';
import { digestReply } from '../commands/lots/digest.js';
import type { Digest } from '../lots/digest.js';
import type { LotRepository } from '../lots/repository.js';
import type { LotService } from '../lots/service.js';
import { dailyPattern, localDate, recentSlots, type Clock } from '../lots/time.js';
import type { ReplyOk } from '../reply/reply.js';

export type Publish = (digest: Digest, channel: string) => Promise<void>;

export interface SchedulerDeps {
  readonly service: LotService;
  readonly repo: LotRepository;
  readonly channel: string;
  /** Local clock time 'HH:MM'. */
  readonly at: string;
  readonly timeZone: string;
  readonly now: Clock;
  readonly publish: Publish;
  /** Names this process in claim rows (host:pid or similar). */
  readonly instanceId: string;
  /** A summary posted this long after its slot is marked late. Default 10 min. */
  readonly lateAfterMs?: number;
  /** A claim not completed within this is considered abandoned. Default 15 min. */
  readonly leaseMs?: number;
  /** Retry a failed post after `retryDelayMs` (default true; one-off runs in tests pass false). */
  readonly retries?: boolean;
  /** Attempts per date before giving up until the next start. Default 3. */
  readonly maxAttempts?: number;
  /** Wait between attempts. Default 5 min. */
  readonly retryDelayMs?: number;
  /** Where failures are reported (never only logged: the summary is retried). */
  readonly onError?: (error: unknown, context: string) => void;
  /** Builds the summary (default: the service); the daily job passes one that builds it once for every destination. */
  readonly build?: (args: { channel: string; windowStart: Date; late: boolean; dueAt: Date; now: Date }) => Promise<Digest>;
}

export type RunResult =
  | { readonly status: 'posted'; readonly localDate: string; readonly late: boolean; readonly digest: Digest }
  | { readonly status: 'taken'; readonly localDate: string }
  | { readonly status: 'failed'; readonly localDate: string; readonly error: string };

/** One destination's summaries: claim, build, publish, record; retries a failed post. */
export class DigestScheduler {
  private retryTimer: NodeJS.Timeout | undefined;
  private stopped = false;
  private readonly lateAfterMs: number;
  private readonly leaseMs: number;
  private readonly maxAttempts: number;
  private readonly retryDelayMs: number;

  constructor(private readonly deps: SchedulerDeps) {
    this.lateAfterMs = deps.lateAfterMs ?? 10 * 60_000;
    this.leaseMs = deps.leaseMs ?? 15 * 60_000;
    this.maxAttempts = deps.maxAttempts ?? 3;
    this.retryDelayMs = deps.retryDelayMs ?? 5 * 60_000;
  }

  get channel(): string {
    return this.deps.channel;
  }

  /** No more retries. */
  stop(): void {
    this.stopped = true;
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.retryTimer = undefined;
  }

  /**
   * At start: if the most recent slot's summary was never posted (or failed, or was abandoned),
   * post it now — late if the slot is past by more than `lateAfterMs`.
   */
  async catchUp(): Promise<RunResult | undefined> {
    const now = this.deps.now();
    const slot = recentSlots(now, this.deps.at, this.deps.timeZone).current;
    const date = localDate(slot, this.deps.timeZone);
    const run = await this.deps.repo.getDigestRun(this.deps.channel, date);
    if (run?.status === 'posted') return undefined;
    if (run?.status === 'failed' && run.attempts >= this.maxAttempts) return undefined;
    // A first start ever (no summary posted to this channel before) has missed nothing.
    if (!run && !(await this.deps.repo.lastPostedDigest(this.deps.channel))) return undefined;
    return this.runSlot(slot, now);
  }

  /** Called when the job fires: the slot due now. */
  async runDue(): Promise<RunResult> {
    const now = this.deps.now();
    const slot = recentSlots(now, this.deps.at, this.deps.timeZone).current;
    return this.runSlot(slot, now);
  }

  private async runSlot(slot: Date, now: Date): Promise<RunResult> {
    const { channel, timeZone } = this.deps;
    const date = localDate(slot, timeZone);
    const late = now.getTime() - slot.getTime() > this.lateAfterMs;
    const claimed = await this.deps.repo.claimDigest({
      channel,
      localDate: date,
      slotAt: slot.toISOString(),
      now: now.toISOString(),
      instanceId: this.deps.instanceId,
      late,
      leaseMs: this.leaseMs,
    });
    if (!claimed) return { status: 'taken', localDate: date };
    try {
      // Without an earlier summary, the window is the local day before the slot (23–25 h).
      const previousSlot = recentSlots(slot, this.deps.at, timeZone).previous;
      const windowStart = await this.deps.service.defaultWindowStart(channel, now, previousSlot);
      const digest = this.deps.build
        ? await this.deps.build({ channel, windowStart, late, dueAt: slot, now })
        : await this.deps.service.digest({ channel, windowStart, late, dueAt: slot, now });
      await this.deps.publish(digest, channel);
      await this.deps.repo.completeDigest(channel, date, {
        postedAt: this.deps.now().toISOString(),
        windowStart: digest.windowStart,
        windowEnd: digest.windowEnd,
      });
      return { status: 'posted', localDate: date, late, digest };
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      await this.deps.repo.failDigest(channel, date, message);
      this.deps.onError?.(e, `daily summary for ${date}`);
      const run = await this.deps.repo.getDigestRun(channel, date);
      if (run && run.attempts < this.maxAttempts && !this.stopped && this.deps.retries !== false) {
        this.retryTimer = setTimeout(() => {
          void this.runSlot(slot, this.deps.now()).catch((err: unknown) => this.deps.onError?.(err, 'daily summary retry'));
        }, this.retryDelayMs);
        this.retryTimer.unref();
      }
      return { status: 'failed', localDate: date, error: message };
    }
  }
}

/** Where one surface sends the daily summary. */
export interface SummaryNotifier {
  /** The surface, for logs ('slack', 'console', 'teams'). */
  readonly surface: string;
  /**
   * The destination's key in the claim rows, unique across surfaces: a Slack channel id,
   * 'console', 'teams:<conversation>'.
   */
  readonly destination: string;
  /** Post or print the summary; throw when it did not go out (it is retried). */
  notify(reply: ReplyOk, digest: Digest): Promise<void>;
}

export interface DailySummaryDeps {
  readonly service: LotService;
  readonly repo: LotRepository;
  readonly results: ResultStore;
  readonly at: string;
  readonly timeZone: string;
  readonly now: Clock;
  readonly newId: () => string;
  /** The demo specs are in use (the summary says so). */
  readonly demo: boolean;
  readonly instanceId: string;
  readonly notifiers: readonly SummaryNotifier[];
  readonly onError?: (error: unknown, context: string) => void;
  /** Told the status of each destination's run (metrics). */
  readonly onRun?: (status: RunResult['status']) => void;
  readonly timing?: Pick<SchedulerDeps, 'lateAfterMs' | 'leaseMs' | 'maxAttempts' | 'retryDelayMs'>;
}

/**
 * The one daily job of a process: one cron for every destination. Each firing builds the summary
 * once per window (destinations that all had yesterday's summary share one), keeps it as a
 * result, and hands the same reply to every notifier whose claim it won.
 */
export class DailySummaryJob {
  private job: Cron | undefined;
  private readonly schedules: DigestScheduler[];
  private digests = new Map<string, Promise<Digest>>();
  private readonly replies = new WeakMap<Digest, Promise<ReplyOk>>();

  constructor(private readonly deps: DailySummaryDeps) {
    this.schedules = deps.notifiers.map(
      (n) =>
        new DigestScheduler({
          service: deps.service,
          repo: deps.repo,
          channel: n.destination,
          at: deps.at,
          timeZone: deps.timeZone,
          now: deps.now,
          instanceId: deps.instanceId,
          ...deps.timing,
          ...(deps.onError ? { onError: (e: unknown, c: string) => deps.onError?.(e, `${c} (${n.surface} ${n.destination})`) } : {}),
          build: (args) => this.buildOnce(args),
          publish: async (digest) => n.notify(await this.replyFor(digest), digest),
        }),
    );
  }

  /** Post any missed summary, then fire daily. */
  async start(): Promise<RunResult[]> {
    this.digests = new Map();
    const caught = await Promise.all(
      this.schedules.map((s) =>
        s.catchUp().catch((e: unknown) => {
          // A failed catch-up (a locked database, say) must not stop the daily job.
          this.deps.onError?.(e, `catching up the daily summary for ${s.channel}`);
          return undefined;
        }),
      ),
    );
    this.job = new Cron(dailyPattern(this.deps.at), { timezone: this.deps.timeZone, unref: true, protect: true }, () => {
      void this.runDue().catch((e: unknown) => this.deps.onError?.(e, 'daily summary'));
    });
    const done = caught.filter((r): r is RunResult => r !== undefined);
    for (const r of done) this.deps.onRun?.(r.status);
    return done;
  }

  /** Every destination's summary due now. */
  async runDue(): Promise<RunResult[]> {
    this.digests = new Map();
    const runs = await Promise.all(this.schedules.map((s) => s.runDue()));
    for (const r of runs) this.deps.onRun?.(r.status);
    return runs;
  }

  stop(): void {
    this.job?.stop();
    this.job = undefined;
    for (const s of this.schedules) s.stop();
  }

  /** When the next summary is due (undefined before start and after stop). */
  nextRun(): Date | undefined {
    return this.job?.nextRun() ?? undefined;
  }

  private buildOnce(args: { windowStart: Date; late: boolean; dueAt: Date; now: Date; channel: string }): Promise<Digest> {
    const key = `${args.windowStart.toISOString()}|${args.dueAt.toISOString()}|${args.late}`;
    let p = this.digests.get(key);
    if (!p) {
      p = this.deps.service.digest(args);
      p.catch(() => this.digests.delete(key));
      this.digests.set(key, p);
    }
    return p;
  }

  private replyFor(digest: Digest): Promise<ReplyOk> {
    let p = this.replies.get(digest);
    if (!p) {
      p = (async () => {
        const reply = digestReply({ id: this.deps.newId(), createdAt: this.deps.now().toISOString() }, digest, { demo: this.deps.demo });
        await this.deps.results.save(reply);
        return reply;
      })();
      p.catch(() => this.replies.delete(digest));
      this.replies.set(digest, p);
    }
    return p;
  }
}
