/**
 * The daily summary of flagged lots: fired by croner at DIGEST_AT in DIGEST_TZ, posted to
 * DIGEST_CHANNEL (printed in console mode), exactly once per channel per local date.
 *
 * Once per date: before posting, the instance inserts the claim row (channel, local date) —
 * a primary key, so of two instances firing in the same minute only one gets it. A failed post
 * marks the row 'failed' and is retried (a failed row may be claimed again); a row left
 * 'claimed' by an instance that died before posting may be taken over after the lease.
 *
 * Missed summaries: at start, if the most recent slot has no posted summary (the bot was down),
 * it is posted once, marked late, covering everything since the last posted summary. The very
 * first start on a channel has missed nothing and waits for the next slot.
 */
import { Cron } from 'croner';
import type { Digest } from './digest.js';
import type { LotRepository } from './repository.js';
import type { LotService } from './service.js';
import { dailyPattern, localDate, recentSlots, type Clock } from './time.js';

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
  /** Attempts per date before giving up until the next start. Default 3. */
  readonly maxAttempts?: number;
  /** Wait between attempts. Default 5 min. */
  readonly retryDelayMs?: number;
  /** Where failures are reported (never only logged: the summary is retried). */
  readonly onError?: (error: unknown, context: string) => void;
}

export type RunResult =
  | { readonly status: 'posted'; readonly localDate: string; readonly late: boolean; readonly digest: Digest }
  | { readonly status: 'taken'; readonly localDate: string }
  | { readonly status: 'failed'; readonly localDate: string; readonly error: string };

export class DigestScheduler {
  private job: Cron | undefined;
  private retryTimer: NodeJS.Timeout | undefined;
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

  /** Post a missed summary, then fire daily. */
  async start(): Promise<RunResult | undefined> {
    // A failed catch-up (a locked database, say) must not stop the daily job.
    const caught = await this.catchUp().catch((e: unknown) => {
      this.deps.onError?.(e, 'catching up the daily summary');
      return undefined;
    });
    this.job = new Cron(dailyPattern(this.deps.at), { timezone: this.deps.timeZone, unref: true, protect: true }, () => {
      void this.runDue().catch((e: unknown) => this.deps.onError?.(e, 'daily summary'));
    });
    return caught;
  }

  stop(): void {
    this.job?.stop();
    this.job = undefined;
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.retryTimer = undefined;
  }

  /** When the next summary is due (undefined before start). */
  nextRun(): Date | undefined {
    return this.job?.nextRun() ?? undefined;
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
      const digest = await this.deps.service.digest({ channel, windowStart, late, dueAt: slot, now });
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
      if (run && run.attempts < this.maxAttempts && this.job) {
        this.retryTimer = setTimeout(() => {
          void this.runSlot(slot, this.deps.now()).catch((err: unknown) => this.deps.onError?.(err, 'daily summary retry'));
        }, this.retryDelayMs);
        this.retryTimer.unref();
      }
      return { status: 'failed', localDate: date, error: message };
    }
  }
}
