/**
 * The one rule of what a reply is good for after it is sent, read by every layer above: the
 * command handler keeps results, renderers offer `why`, chat surfaces draw share and explain
 * buttons. A property of the reply's command, so it lives beside the reply type.
 *
 *              kept   shared   explained (`why`)
 *   results     yes     yes       yes
 *   why         yes*    yes       no     (*kept by the application layer when shown, so its card's buttons work)
 *   help/models no      no        no
 */
import type { Reply, ReplyOk } from './reply.js';

/** Commands whose replies are reference text, not results. */
const REFERENCE = new Set(['help', 'models']);

/** A result: kept, shared and explained (`why <id>`). */
export function isResult(reply: Reply): reply is ReplyOk {
  return reply.ok && !REFERENCE.has(reply.command) && reply.command !== 'why';
}

/** May be posted into a channel or thread (results and `why` answers). */
export function isShareable(reply: Reply): reply is ReplyOk {
  return reply.ok && !REFERENCE.has(reply.command);
}

/** Has a derivation to show (`why <id>`): results only. */
export function isExplainable(reply: Reply): reply is ReplyOk {
  return isResult(reply);
}
