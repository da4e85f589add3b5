/**
 * One question from Slack to the application layer: who asked, where, under which event key
 * and conversation (the application claims the event and loads and saves the memory).
 */
import type { Attachment } from '../../commands/context.js';
import type { Reply } from '../../reply/reply.js';
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

/**
 * Ask the application once; null when the event was handled already (a retry, a
 * redelivery, or another instance has it).
 */
export async function ask(deps: SlackDeps, text: string, where: Where, attachment?: Attachment): Promise<Asked | null> {
  const displayName = deps.displayName ? await deps.displayName(where.userId).catch(() => undefined) : undefined;
  const caller = { userId: where.userId, channelId: where.channelId, ...(displayName ? { displayName } : {}) };
  const asked = await deps.ask({
    text,
    surface: 'slack',
    caller,
    eventKey: where.eventKey,
    conversationKey: conversationKey(where),
    log: deps.logger,
    ...(attachment ? { attachment } : {}),
  });
  if (asked.duplicate) return null;
  return {
    reply: asked.reply,
    settle: async () => {
      try {
        await asked.settle();
      } catch (error) {
        // The answer is out already: log this (global handler), don't tell the person it failed.
        throw markAnswered(error);
      }
    },
  };
}
