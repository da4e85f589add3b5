/**
 * What a chat adapter remembers about conversations, so that it survives a restart and is the
 * same on every instance sharing the database:
 * - the last result per person and conversation, for a bare `why`;
 * - threads where the bot has answered, per channel: the short list offered when sharing a
 *   result into a thread (no channel-history permission needed for it).
 * It holds ids, timestamps and the bot's own reply titles, never the text people wrote.
 */
export interface KnownThread {
  readonly channelId: string;
  /** The thread's parent message timestamp (Slack `thread_ts`). */
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
