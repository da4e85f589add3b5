/**
 * Sending: chat.postMessage / chat.postEphemeral through the Web API client, and messages to a
 * response URL (for the private card a slash command or a button came from). Failures come back
 * as a Slack error code, never as a thrown error, so every caller decides what the person hears.
 */
import type { webApi } from '@slack/bolt';
import type { SlackMessage } from '../../render/slack-blocks.js';
import { slackErrorCode } from './slack-errors.js';

type WebClient = webApi.WebClient;

export type Sent = { readonly ok: true; readonly ts: string | undefined } | { readonly ok: false; readonly code: string };

export async function postMessage(
  client: WebClient,
  target: { channel: string; threadTs?: string },
  message: SlackMessage,
): Promise<Sent> {
  try {
    const res = await client.chat.postMessage({
      channel: target.channel,
      ...(target.threadTs ? { thread_ts: target.threadTs } : {}),
      text: message.text,
      blocks: message.blocks,
      unfurl_links: false,
      unfurl_media: false,
    });
    return { ok: true, ts: res.ts };
  } catch (error) {
    return { ok: false, code: slackErrorCode(error) };
  }
}

export async function postEphemeral(
  client: WebClient,
  target: { channel: string; user: string; threadTs?: string },
  message: SlackMessage,
): Promise<Sent> {
  try {
    const res = await client.chat.postEphemeral({
      channel: target.channel,
      user: target.user,
      ...(target.threadTs ? { thread_ts: target.threadTs } : {}),
      text: message.text,
      blocks: message.blocks,
    });
    return { ok: true, ts: res.message_ts };
  } catch (error) {
    return { ok: false, code: slackErrorCode(error) };
  }
}

/** A private message through a response URL: replacing the card it came from, or as a new one. */
export async function toResponseUrl(
  fetchFn: typeof fetch,
  responseUrl: string,
  message: SlackMessage,
  mode: 'replace' | 'add',
): Promise<Sent> {
  try {
    const res = await fetchFn(responseUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/json; charset=utf-8' },
      body: JSON.stringify({
        response_type: 'ephemeral',
        replace_original: mode === 'replace',
        text: message.text,
        blocks: message.blocks,
      }),
    });
    return res.ok ? { ok: true, ts: undefined } : { ok: false, code: `http_${res.status}` };
  } catch {
    return { ok: false, code: 'unreachable' };
  }
}

/** Resolves with the promise's value, or with `undefined` once `ms` have passed. */
/** The context property with the request's arrival time (ms since the epoch). */
export const RECEIVED_AT = 'shiftprobeReceivedAt';

/**
 * How much of the acknowledgement budget is left for a request that arrived at `receivedAt`
 * (never negative; the whole budget when the arrival time is unknown).
 */
export function ackBudgetMs(receivedAt: unknown, now: number, deadlineMs: number): number {
  if (typeof receivedAt !== 'number' || !Number.isFinite(receivedAt)) return deadlineMs;
  return Math.max(0, deadlineMs - Math.max(0, now - receivedAt));
}

export async function within<T>(promise: Promise<T>, ms: number): Promise<T | undefined> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<undefined>((resolve) => {
    timer = setTimeout(() => resolve(undefined), ms);
  });
  try {
    return await Promise.race([promise, late]);
  } finally {
    clearTimeout(timer);
  }
}
