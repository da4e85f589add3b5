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

/** The note the person gets when something on our side failed. */
export function failureMessage(): ReturnType<typeof renderSlackMessage> {
  return renderSlackMessage(errorReply('internal', INTERNAL_FAILURE), { helpHint: false });
}

const ANSWERED = Symbol('answered');

/** A listener has already told the person about this error; the global handler only logs it. */
export function markAnswered(error: unknown): unknown {
  if (error && typeof error === 'object') Object.defineProperty(error, ANSWERED, { value: true });
  return error;
}

/** Bolt wraps errors without a code (UnknownError, the original in `.original`). */
function isAnswered(error: unknown): boolean {
  const e = error as { [ANSWERED]?: boolean; original?: unknown } | undefined;
  return Boolean(e && typeof e === 'object' && (e[ANSWERED] || (e.original !== e && isAnswered(e.original))));
}

export function installErrorHandler(app: App, deps: SlackDeps, client: webApi.WebClient): void {
  const message = failureMessage();
  // With extendedErrorHandler: true, Bolt passes { error, logger, context, body }.
  const handler = async (args: { error: Error; body?: unknown }): Promise<void> => {
    const { error } = args;
    const body = (args.body ?? {}) as AnyBody;
    if (isAnswered(error)) {
      deps.logger.error('error while answering Slack (the person already has an answer):', error);
      return;
    }
    deps.logger.error('unhandled error while answering Slack (telling the person):', error);
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
