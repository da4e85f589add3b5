/**
 * The short list of threads offered by "Post in a thread…": threads in the channel's recent
 * history (conversations.history, which needs channels:history / groups:history — not in the
 * default manifest, see docs/slack.md), then threads where shiftprobe itself has answered
 * (remembered locally, no permission needed). Without history access the list holds only the
 * latter, and a pasted message link always works.
 */
import type { webApi } from '@slack/bolt';
import type { ConversationMemory } from '../../app/ports.js';
import { commandTextFromSlack } from './incoming-text.js';
import { within } from './outbound.js';
import { slackErrorCode } from './slack-errors.js';
import type { ThreadChoice } from './views/thread-picker.js';

export const THREADS_OFFERED = 10;

export interface ThreadList {
  readonly choices: ThreadChoice[];
  /** Whether the channel history could be read (else only remembered threads are listed). */
  readonly fromHistory: boolean;
}

function ago(then: Date, now: Date): string {
  const minutes = Math.max(0, Math.round((now.getTime() - then.getTime()) / 60_000));
  if (minutes < 60) return `${minutes} min ago`;
  const hours = Math.round(minutes / 60);
  if (hours < 48) return `${hours} h ago`;
  return `${Math.round(hours / 24)} d ago`;
}

export async function listThreads(
  client: webApi.WebClient,
  channelId: string,
  memory: ConversationMemory,
  options: { now: () => Date; timeoutMs: number; log: (message: string) => void },
): Promise<ThreadList> {
  const now = options.now();
  const choices: ThreadChoice[] = [];
  let fromHistory = false;
  try {
    const history = await within(client.conversations.history({ channel: channelId, limit: 100 }), options.timeoutMs);
    if (history === undefined) throw new Error('timeout');
    fromHistory = true;
    for (const m of history.messages ?? []) {
      if (!m.ts || !(m.reply_count && m.reply_count > 0)) continue;
      const said = commandTextFromSlack(m.text).slice(0, 48) || '(no text)';
      const when = ago(new Date(Number(m.ts) * 1000), now);
      choices.push({ channelId, threadTs: m.ts, label: `${said} · ${m.reply_count} repl${m.reply_count === 1 ? 'y' : 'ies'} · ${when}` });
      if (choices.length >= THREADS_OFFERED) break;
    }
  } catch (error) {
    // Expected without channels:history (missing_scope) or outside the bot's channels.
    options.log(`thread list from history unavailable in ${channelId}: ${slackErrorCode(error)}`);
  }
  const known = await memory.recentThreads(channelId, THREADS_OFFERED);
  for (const t of known) {
    if (choices.length >= THREADS_OFFERED) break;
    if (choices.some((c) => c.threadTs === t.threadTs)) continue;
    choices.push({ channelId, threadTs: t.threadTs, label: `shiftprobe: ${t.title} · ${ago(t.lastAt, now)}` });
  }
  return { choices, fromHistory };
}
