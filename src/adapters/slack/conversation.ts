/**
 * One question from Slack to `handle`: who asked, where, under which event key, with the
 * conversation's memory (the last result, for a bare `why`) loaded before and saved after.
 */
import { contextFor } from '../../app.js';
import type { Reply } from '../../reply/reply.js';
import { mustKeep } from './cards.js';
import type { SlackDeps } from './deps.js';
import { markAnswered } from './errors.js';

export interface Where {
  readonly teamId: string | undefined;
  readonly userId: string;
  readonly channelId: string;
  /** Exactly-once key of the Slack event that carries the question; passed on as ctx.eventId. */
  readonly eventKey: string;
}

/** Event keys: one per Slack event, the same on every retry and every instance. */
export const eventKeys = {
  command: (teamId: string | undefined, triggerId: string) => `slack:command:${teamId ?? '-'}:${triggerId}`,
  /** Keyed by the message, so an app_mention and a message event for the same message are one. */
  message: (teamId: string | undefined, channelId: string, ts: string) => `slack:message:${teamId ?? '-'}:${channelId}:${ts}`,
  action: (teamId: string | undefined, triggerId: string) => `slack:action:${teamId ?? '-'}:${triggerId}`,
  /** One post of one result into one place, however often the button is pressed. */
  share: (resultId: string, channelId: string, threadTs: string | undefined) => `slack:share:${resultId}:${channelId}:${threadTs ?? '-'}`,
};

function conversationKey(where: Where): string {
  return `slack:${where.teamId ?? '-'}:${where.channelId}:${where.userId}`;
}

export interface Asked {
  readonly reply: Reply;
  /** After the answer is out: remember the conversation's last result and complete the event. */
  settle(): Promise<void>;
}

export async function ask(deps: SlackDeps, text: string, where: Where): Promise<Asked> {
  const key = conversationKey(where);
  const before = await deps.conversations.lastResult(key);
  const session: { lastResultId?: string } = before ? { lastResultId: before } : {};
  const displayName = deps.displayName ? await deps.displayName(where.userId).catch(() => undefined) : undefined;
  const caller = { userId: where.userId, channelId: where.channelId, ...(displayName ? { displayName } : {}) };
  const ctx = { ...contextFor(deps, 'slack', caller, session, where.eventKey), log: deps.logger };
  const reply = await deps.handle(text, ctx);
  if (mustKeep(reply)) await deps.results.save(reply);
  return {
    reply,
    settle: async () => {
      try {
        if (session.lastResultId && session.lastResultId !== before) await deps.conversations.setLastResult(key, session.lastResultId);
        await deps.ledger.complete(where.eventKey);
      } catch (error) {
        // The answer is out already: log this (global handler), don't tell the person it failed.
        throw markAnswered(error);
      }
    },
  };
}
