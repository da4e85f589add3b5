/**
 * Which card goes where: the renderer draws it, this decides the buttons from the one rule in
 * src/reply/kinds.ts (results can be shared and explained, `why` answers shared).
 */
import { renderSlackMessage, type CardAction, type SlackMessage } from '../../render/slack-blocks.js';
import { isExplainable, isShareable } from '../../reply/kinds.js';
import type { Reply } from '../../reply/reply.js';
import { errorReply } from '../../reply/build.js';

/**
 * private: the ephemeral answer to a slash command · thread: the answer to a mention ·
 * dm: the answer in a direct message · shared: a copy posted by a button · derivation: a `why`
 * shown privately by a button.
 */
export type Place = 'private' | 'thread' | 'dm' | 'shared' | 'derivation';

export function actionsFor(reply: Reply, place: Place): CardAction[] {
  if (!isShareable(reply)) return [];
  const why: CardAction[] = isExplainable(reply) ? ['why'] : [];
  switch (place) {
    case 'private':
    case 'derivation':
      return ['shareChannel', 'shareThread', ...why];
    case 'dm':
      return ['shareThread', ...why];
    case 'thread':
    case 'shared':
      return why;
  }
}

export function cardFor(
  reply: Reply,
  place: Place,
  extra: { helpHint?: string | false; sharedBy?: string; notice?: string; omit?: readonly CardAction[] } = {},
): SlackMessage {
  const actions = actionsFor(reply, place).filter((a) => !extra.omit?.includes(a));
  return renderSlackMessage(reply, {
    actions,
    ...(extra.helpHint !== undefined ? { helpHint: extra.helpHint } : {}),
    ...(extra.sharedBy ? { sharedBy: extra.sharedBy } : {}),
    ...(extra.notice ? { notice: extra.notice } : {}),
  });
}

/** A short note to the person as a small card (a result gone, a file that could not be read). */
export function noteCard(message: string): SlackMessage {
  return renderSlackMessage(errorReply('slack', message), { helpHint: false });
}
