/**
 * Requests as Slack sends them over HTTP, signed with the v0 scheme (Slack API docs,
 * "Verifying requests from Slack"): signature = 'v0=' + hex HMAC-SHA256(signing secret,
 * 'v0:' + timestamp + ':' + raw body), in X-Slack-Signature, with X-Slack-Request-Timestamp.
 * Bolt's receiver checks the clock itself, so timestamps here are real seconds.
 */
import { createHmac } from 'node:crypto';

export function signature(secret: string, timestamp: number, body: string): string {
  return 'v0=' + createHmac('sha256', secret).update(`v0:${timestamp}:${body}`).digest('hex');
}

export interface SendOptions {
  readonly secret?: string;
  readonly contentType: string;
  /** Seconds; now when absent. */
  readonly timestamp?: number;
  /** Extra headers (X-Slack-Retry-Num …); an explicit signature header replaces the computed one. */
  readonly headers?: Record<string, string>;
  /** Sign one body, send another (a body altered in transit). */
  readonly sendBody?: string;
  readonly unsigned?: boolean;
}

export async function sendToSlackEndpoint(url: string, body: string, options: SendOptions): Promise<Response> {
  const timestamp = options.timestamp ?? Math.floor(Date.now() / 1000);
  const headers: Record<string, string> = { 'content-type': options.contentType };
  if (!options.unsigned) {
    headers['x-slack-request-timestamp'] = String(timestamp);
    headers['x-slack-signature'] = signature(options.secret ?? '', timestamp, body);
  }
  Object.assign(headers, options.headers ?? {});
  return fetch(url, { method: 'POST', headers, body: options.sendBody ?? body });
}

export const FORM = 'application/x-www-form-urlencoded';
export const JSON_TYPE = 'application/json';

export interface SlashFields {
  readonly text: string;
  readonly userId?: string;
  readonly channelId?: string;
  readonly teamId?: string;
  readonly triggerId: string;
  readonly responseUrl: string;
  readonly command?: string;
}

/** A slash-command POST body (form fields as Slack documents them). */
export function slashCommandBody(f: SlashFields): string {
  return new URLSearchParams({
    token: 'deprecated-verification-token',
    team_id: f.teamId ?? 'T0HGF3',
    team_domain: 'harrowgate-fab3',
    channel_id: f.channelId ?? 'C0ETCHBAY',
    channel_name: 'etch-bay',
    user_id: f.userId ?? 'U0PRIYA',
    user_name: 'priya.okonkwo-hale',
    command: f.command ?? '/shiftprobe',
    text: f.text,
    api_app_id: 'A0SHIFTPROBE',
    is_enterprise_install: 'false',
    response_url: f.responseUrl,
    trigger_id: f.triggerId,
  }).toString();
}

/** An Events API callback body. */
export function eventCallbackBody(event: Record<string, unknown>, eventId: string, teamId = 'T0HGF3'): string {
  return JSON.stringify({
    token: 'deprecated-verification-token',
    team_id: teamId,
    api_app_id: 'A0SHIFTPROBE',
    event,
    type: 'event_callback',
    event_id: eventId,
    event_time: 1_930_000_000,
    authorizations: [{ team_id: teamId, user_id: 'U0SHIFTBOT', is_bot: true, is_enterprise_install: false }],
  });
}

/** An interactivity POST body: form field `payload` holding the JSON. */
export function interactionBody(payload: Record<string, unknown>): string {
  return new URLSearchParams({ payload: JSON.stringify(payload) }).toString();
}
