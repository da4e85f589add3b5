/**
 * Exactly-once handling of chat events. Slack delivers at least once: HTTP retries (with
 * X-Slack-Retry-Num), Socket Mode redeliveries after a reconnect, and several instances behind
 * one app. Before a reply or a side effect, an adapter claims the event's key; only the first
 * claim wins, and a duplicate does nothing.
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
  /** How long keys are remembered (Slack stops retrying within minutes). */
  readonly retentionMs?: number;
}

export const DEFAULT_LEASE_MS = 30_000;
export const DEFAULT_RETENTION_MS = 24 * 60 * 60 * 1000;

/** One process only (tests, the console). For several instances use the SQLite ledger. */
export class MemoryEventLedger implements EventLedger {
  private readonly entries = new Map<string, { done: boolean; at: number }>();
  private readonly leaseMs: number;
  private readonly retentionMs: number;
  constructor(private readonly options: LedgerOptions) {
    this.leaseMs = options.leaseMs ?? DEFAULT_LEASE_MS;
    this.retentionMs = options.retentionMs ?? DEFAULT_RETENTION_MS;
  }
  async claim(key: string): Promise<boolean> {
    const now = this.options.now().getTime();
    for (const [k, e] of this.entries) {
      if (e.at >= now - this.retentionMs) break; // insertion order ≈ time order
      this.entries.delete(k);
    }
    const entry = this.entries.get(key);
    if (entry && (entry.done || entry.at >= now - this.leaseMs)) return false;
    this.entries.delete(key);
    this.entries.set(key, { done: false, at: now });
    return true;
  }
  async complete(key: string): Promise<void> {
    const entry = this.entries.get(key);
    if (entry) entry.done = true;
  }
  async release(key: string): Promise<void> {
    if (this.entries.get(key)?.done === false) this.entries.delete(key);
  }
}
