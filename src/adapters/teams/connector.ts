/**
 * Sending to the connector: replies into a conversation and new posts (shared cards, the daily
 * summary), with a bearer token from the app's client credentials, kept until shortly before it
 * expires. Failures come back as data (status and a short code), never as a thrown library error.
 */
import type { Secret } from '../secret.js';

export interface Sent {
  readonly ok: boolean;
  readonly status: number;
  readonly id?: string;
  readonly error?: string;
}

export class Connector {
  private token: { value: string; until: number } | undefined;

  constructor(
    private readonly appId: string,
    private readonly password: Secret,
    private readonly tokenUrl: string,
    private readonly fetchFn: typeof fetch = globalThis.fetch.bind(globalThis),
  ) {}

  private async bearer(): Promise<string> {
    if (this.token && Date.now() < this.token.until) return this.token.value;
    const res = await this.fetchFn(this.tokenUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({
        grant_type: 'client_credentials',
        client_id: this.appId,
        client_secret: this.password.reveal(),
        scope: 'https://api.botframework.com/.default',
      }),
      signal: AbortSignal.timeout(10_000),
    });
    if (!res.ok) throw new Error(`token endpoint answered HTTP ${res.status} (check TEAMS_APP_ID and TEAMS_APP_PASSWORD)`);
    const j = (await res.json()) as { access_token?: string; expires_in?: number };
    if (!j.access_token) throw new Error('token endpoint gave no access_token');
    this.token = { value: j.access_token, until: Date.now() + Math.max(60, (j.expires_in ?? 3600) - 300) * 1000 };
    return j.access_token;
  }

  private async post(url: string, activity: Record<string, unknown>): Promise<Sent> {
    try {
      const res = await this.fetchFn(url, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${await this.bearer()}` },
        body: JSON.stringify(activity),
        signal: AbortSignal.timeout(15_000),
      });
      const body = (await res.json().catch(() => ({}))) as { id?: string; error?: { code?: string } };
      return res.ok ? { ok: true, status: res.status, ...(body.id ? { id: body.id } : {}) } : { ok: false, status: res.status, error: body.error?.code ?? `HTTP ${res.status}` };
    } catch (e) {
      return { ok: false, status: 0, error: e instanceof Error ? e.message : 'error' };
    }
  }

  /** A reply in the conversation (in a channel: in the message's reply chain). */
  reply(serviceUrl: string, conversationId: string, replyToId: string, activity: Record<string, unknown>): Promise<Sent> {
    const base = serviceUrl.endsWith('/') ? serviceUrl : `${serviceUrl}/`;
    return this.post(`${base}v3/conversations/${encodeURIComponent(conversationId)}/activities/${encodeURIComponent(replyToId)}`, { ...activity, replyToId });
  }

  /** A new post in a conversation (in a channel: a new thread). */
  send(serviceUrl: string, conversationId: string, activity: Record<string, unknown>): Promise<Sent> {
    const base = serviceUrl.endsWith('/') ? serviceUrl : `${serviceUrl}/`;
    return this.post(`${base}v3/conversations/${encodeURIComponent(conversationId)}/activities`, activity);
  }
}
