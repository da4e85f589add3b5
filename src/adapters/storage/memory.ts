/**
 * In-process stores: one process only, nothing survives a restart. For tests and tools; a
 * running shiftprobe uses the SQLite or PostgreSQL backend.
 */
import { ResultIdTakenError, type ResultStore } from '../../commands/context.js';
import type { ReplyOk } from '../../reply/reply.js';
import {
  DEFAULT_LEASE_MS,
  DEFAULT_RETENTION_MS,
  type ConversationMemory,
  type EventLedger,
  type KnownThread,
  type LedgerOptions,
} from '../../app/ports.js';

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

/** One process only (tests, the console). For several instances use a database backend. */
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

export class MemoryConversationMemory implements ConversationMemory {
  private readonly last = new Map<string, string>();
  private readonly threads = new Map<string, KnownThread>();
  async lastResult(key: string): Promise<string | undefined> {
    return this.last.get(key);
  }
  async setLastResult(key: string, resultId: string): Promise<void> {
    this.last.set(key, resultId);
  }
  async rememberThread(thread: KnownThread): Promise<void> {
    this.threads.set(`${thread.channelId}:${thread.threadTs}`, thread);
  }
  async recentThreads(channelId: string, limit: number): Promise<KnownThread[]> {
    return [...this.threads.values()]
      .filter((t) => t.channelId === channelId)
      .sort((a, b) => b.lastAt.getTime() - a.lastAt.getTime())
      .slice(0, limit);
  }
}
