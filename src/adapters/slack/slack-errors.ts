/**
 * Web API failures → what the person is told. Slack's error codes are from the Web API
 * reference of chat.postMessage, views.open and conversations.history. Wording lives here only.
 */
export function slackErrorCode(error: unknown): string {
  const e = error as { data?: { error?: unknown }; code?: unknown; message?: unknown } | undefined;
  if (e?.data && typeof e.data.error === 'string') return e.data.error;
  if (e?.code === 'slack_webapi_rate_limited_error') return 'ratelimited';
  if (e?.code === 'slack_webapi_request_error' || e?.code === 'slack_webapi_http_error') return 'unreachable';
  if (e instanceof Error && e.message === 'timeout') return 'timeout';
  return 'unknown';
}

export function postFailureText(code: string, where: 'channel' | 'thread'): string {
  switch (code) {
    case 'not_in_channel':
      return `I'm not a member of that channel, so I can't post there. Invite me with /invite @shiftprobe, then press the button again.`;
    case 'channel_not_found':
      return `I can't see that conversation: it is a private channel I'm not in, or a direct message between people. Add me to the channel${where === 'channel' ? ', or use “Post in a thread…” with a link to a message in a channel I’m in' : ''}.`;
    case 'thread_not_found':
    case 'message_not_found':
      return `I can't find that message. Check the link (⋯ on the message → Copy link) and try again.`;
    case 'is_archived':
      return 'That channel is archived, so nothing can be posted in it.';
    case 'restricted_action':
    case 'restricted_action_read_only_channel':
    case 'restricted_action_thread_only_channel':
    case 'restricted_action_non_threadable_channel':
    case 'cannot_reply_to_message':
      return `Slack's settings for that conversation don't let me post there (${code}).`;
    case 'ratelimited':
      return 'Slack is asking me to slow down. Please try again in a minute.';
    case 'unreachable':
    case 'timeout':
      return "I couldn't reach Slack just now. Please try again in a moment.";
    default:
      return `Slack refused the post (${code}). Please try again; if it keeps happening, tell whoever runs shiftprobe.`;
  }
}

/** Said when something on our side failed: the person always gets an answer. */
export const INTERNAL_FAILURE =
  'Something went wrong on our side while answering that. Nothing was posted or recorded twice. Please try again; if it keeps happening, tell whoever runs shiftprobe.';

export const RESULT_GONE =
  "I no longer have that result, so I can't share or explain it. Ask the question again to get a fresh card.";
