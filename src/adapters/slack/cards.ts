/**
 * Which card goes where: the renderer draws it, this decides the buttons. Results can be shared
 * and explained; `why` answers can be shared; help and model lists are neither.
 */
import { renderSlackMessage, type CardAction, type SlackMessage } from '../../render/slack-blocks.js';
import type { Reply } from '../../reply/reply.js';

/**
 * private: the ephemeral answer to a slash command · thread: the answer to a mention ·
 * dm: the answer in a direct message · shared: a copy posted by a button · derivation: a `why`
 * shown privately by a button.
 */
export type Place = 'private' | 'thread' | 'dm' | 'shared' | 'derivation';

const NEVER_SHARED = new Set(['help', 'models']);

export function isShareable(reply: Reply): boolean {
  return reply.ok && !NEVER_SHARED.has(reply.command);
}

export function isExplainable(reply: Reply): boolean {
  return isShareable(reply) && reply.ok && reply.command !== 'why';
}

/**
 * `handle` keeps results but not `why` answers (they restate an earlier result); their cards can
 * still be shared, so the adapter keeps those itself.
 */
export function mustKeep(reply: Reply): reply is Extract<Reply, { ok: true }> {
  return reply.ok && reply.command === 'why' && isShareable(reply);
}

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
