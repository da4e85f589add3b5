/**
 * The global error handler: whatever escaped a listener, the person who asked still gets an
 * answer — through the response URL of a command or button, the dialog's saved response URL,
 * or a private message where the mention or DM was — and the error is logged (redacted).
 */
import type { App, webApi } from '@slack/bolt';
import { renderSlackMessage } from '../../render/slack-blocks.js';
import { errorReply } from '../../reply/build.js';
import type { SlackDeps } from './deps.js';
import { postEphemeral, postMessage, toResponseUrl } from './outbound.js';
import { INTERNAL_FAILURE } from './slack-errors.js';
import { decodePickerState } from './views/thread-picker.js';

interface AnyBody {
  readonly response_url?: string;
  readonly user?: { id?: string } | string;
  readonly user_id?: string;
  readonly view?: { private_metadata?: string };
  readonly event?: { channel?: string; user?: string; ts?: string; thread_ts?: string; channel_type?: string; type?: string };
}

export function installErrorHandler(app: App, deps: SlackDeps, client: webApi.WebClient): void {
  const message = renderSlackMessage(errorReply('internal', INTERNAL_FAILURE), { helpHint: false });
  // With extendedErrorHandler: true, Bolt passes { error, logger, context, body }.
  const handler = async (args: { error: Error; body?: unknown }): Promise<void> => {
    const { error } = args;
    const body = (args.body ?? {}) as AnyBody;
    deps.logger.error('unhandled error while answering Slack:', error);
    try {
      const responseUrl = body.response_url ?? decodePickerState(body.view?.private_metadata)?.responseUrl;
      if (responseUrl) {
        await toResponseUrl(deps.fetch, responseUrl, message, 'add');
        return;
      }
      const e = body.event;
      if (e?.channel && e.user) {
        if (e.channel_type === 'im') await postMessage(client, { channel: e.channel, ...(e.thread_ts ? { threadTs: e.thread_ts } : {}) }, message);
        else await postEphemeral(client, { channel: e.channel, user: e.user, threadTs: e.thread_ts ?? e.ts ?? '' }, message);
      }
    } catch (tellError) {
      deps.logger.error('could not tell the person about the error either:', tellError);
    }
  };
  app.error(handler as unknown as Parameters<App['error']>[0]);
}
