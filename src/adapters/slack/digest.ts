/**
 * The daily summary of flagged lots, posted to DIGEST_CHANNEL: the lot scheduler (src/lots)
 * decides when and makes sure it is once per channel per local date; this only renders the
 * summary as a card and posts it. A failed post throws, so the scheduler marks it failed and
 * tries again.
 */
import type { webApi } from '@slack/bolt';
import { digestReply } from '../../commands/lots/digest.js';
import type { Digest } from '../../lots/digest.js';
import type { ResultStore } from '../../commands/context.js';
import { cardFor } from './cards.js';
import { postMessage } from './outbound.js';

export function slackDigestPublisher(
  client: webApi.WebClient,
  deps: { readonly now: () => Date; readonly newId: () => string; readonly results: ResultStore; readonly demo: boolean },
): (digest: Digest, channel: string) => Promise<void> {
  return async (digest, channel) => {
    const reply = digestReply({ id: deps.newId(), createdAt: deps.now().toISOString() }, digest, { demo: deps.demo });
    await deps.results.save(reply);
    const sent = await postMessage(client, { channel }, cardFor(reply, 'shared', { helpHint: false }));
    if (!sent.ok) throw new Error(`chat.postMessage to ${channel} failed: ${sent.code}`);
  };
}
