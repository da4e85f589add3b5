/**
 * The daily summary of flagged lots in Slack: the application's daily job (src/app) decides when,
 * builds and keeps the summary and makes sure it is once per channel per local date; this only
 * renders it as a card and posts it to DIGEST_CHANNEL. A failed post throws, so the job marks it
 * failed and tries again.
 */
import type { webApi } from '@slack/bolt';
import type { SummaryNotifier } from '../../app/daily-summary.js';
import { cardFor } from './cards.js';
import { postMessage } from './outbound.js';

export function slackSummaryNotifier(client: webApi.WebClient, channel: string): SummaryNotifier {
  return {
    surface: 'slack',
    // The bare channel id, as claim rows have always been keyed.
    destination: channel,
    async notify(reply) {
      const sent = await postMessage(client, { channel }, cardFor(reply, 'shared', { helpHint: false }));
      if (!sent.ok) throw new Error(`chat.postMessage to ${channel} failed: ${sent.code}`);
    },
  };
}
