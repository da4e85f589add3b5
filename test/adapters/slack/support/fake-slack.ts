/**
 * A small fake of the Slack Web API on loopback. The app under test points
 * `clientOptions.slackApiUrl` here; every call is recorded (method, parameters, token), and so is
 * every message sent to a response URL (the fake hands out response URLs on itself). Answers are
 * what the Web API reference documents for each method; a test can override any method.
 */
import { createServer, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface ApiCall {
  readonly method: string;
  readonly params: Record<string, unknown>;
  readonly token: string | undefined;
}

export interface ResponseUrlPost {
  readonly id: string;
  readonly body: Record<string, unknown>;
}

type Answer = (params: Record<string, unknown>) => Record<string, unknown>;

export const FAKE_TEAM = 'T0HGF3';
export const FAKE_BOT_USER = 'U0SHIFTBOT';
export const FAKE_BOT_ID = 'B0SHIFTBOT';

async function readBytes(req: IncomingMessage): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const c of req) chunks.push(c as Buffer);
  return Buffer.concat(chunks);
}

/** Form values that hold JSON (blocks, view, …) are decoded, as Slack does. */
function decodeParams(raw: string, contentType: string | undefined): Record<string, unknown> {
  if (contentType?.includes('application/json')) return raw ? (JSON.parse(raw) as Record<string, unknown>) : {};
  const out: Record<string, unknown> = {};
  for (const [k, v] of new URLSearchParams(raw)) {
    if (/^[[{]/.test(v)) {
      try {
        out[k] = JSON.parse(v);
        continue;
      } catch {
        /* a plain string that starts with a bracket */
      }
    }
    out[k] = v;
  }
  return out;
}

/** A file uploaded through files.uploadV2 (the bytes sent to the upload URL, and the completion call). */
export interface Upload {
  readonly fileId: string;
  readonly bytes: Buffer;
}

export class FakeSlack {
  readonly calls: ApiCall[] = [];
  /** Bytes received at upload URLs, by file id. */
  readonly uploads: Upload[] = [];
  /** Files a test shares in a message: served at /files/<name> to a request with a bot token. */
  private readonly sharedFiles = new Map<string, { body: string; contentType: string }>();
  /** Authorization headers of file downloads. */
  readonly downloads: { path: string; authorization: string | undefined }[] = [];
  private uploadCount = 0;
  readonly responsePosts: ResponseUrlPost[] = [];
  private readonly overrides = new Map<string, Answer>();
  /** Milliseconds to wait before answering a Web API method (a slow Slack). */
  readonly delays = new Map<string, number>();
  private server: Server | undefined;
  private port = 0;
  private ts = 1_930_000_000;

  get apiUrl(): string {
    return `http://127.0.0.1:${this.port}/api/`;
  }

  responseUrl(id: string): string {
    return `http://127.0.0.1:${this.port}/respond/${id}`;
  }

  /** A file as Slack would list it in a message event, its private URL on this fake. */
  shareFile(name: string, body: string, contentType = 'text/csv'): Record<string, unknown> {
    this.sharedFiles.set(name, { body, contentType });
    const url = `http://127.0.0.1:${this.port}/files/${encodeURIComponent(name)}`;
    return { id: `F0${name.length}${this.sharedFiles.size}`, name, mimetype: contentType, filetype: name.endsWith('.csv') ? 'csv' : 'text', size: Buffer.byteLength(body), url_private: url, url_private_download: url };
  }

  /** Replace the answer to one Web API method. */
  answer(method: string, answer: Answer): void {
    this.overrides.set(method, answer);
  }

  callsTo(method: string): ApiCall[] {
    return this.calls.filter((c) => c.method === method);
  }

  postsTo(id: string): ResponseUrlPost[] {
    return this.responsePosts.filter((p) => p.id === id);
  }

  /** Resolves once `check` holds (polled every few ms), or fails after `timeoutMs`. */
  async until(check: () => boolean, timeoutMs = 5000): Promise<void> {
    const started = Date.now();
    while (!check()) {
      if (Date.now() - started > timeoutMs) throw new Error('timed out waiting for the app to call the fake Slack API');
      await new Promise((r) => setTimeout(r, 5));
    }
  }

  private nextTs(): string {
    this.ts += 1;
    return `${this.ts}.000100`;
  }

  private defaultAnswer(method: string, params: Record<string, unknown>): Record<string, unknown> {
    switch (method) {
      case 'auth.test':
        return { ok: true, url: 'https://harrowgate-fab3.slack.com/', team: 'Harrowgate Fab 3', user: 'shiftprobe', team_id: FAKE_TEAM, user_id: FAKE_BOT_USER, bot_id: FAKE_BOT_ID };
      case 'chat.postMessage':
        return { ok: true, channel: params.channel, ts: this.nextTs(), message: { text: params.text } };
      case 'chat.postEphemeral':
        return { ok: true, message_ts: this.nextTs() };
      case 'views.open':
        return { ok: true, view: { id: 'V0PICKER', ...(params.view as object) } };
      case 'conversations.history':
        return { ok: false, error: 'missing_scope', needed: 'channels:history', provided: 'commands,chat:write,app_mentions:read,im:history' };
      case 'files.getUploadURLExternal': {
        const fileId = `F0UP${++this.uploadCount}`;
        return { ok: true, file_id: fileId, upload_url: `http://127.0.0.1:${this.port}/upload/${fileId}` };
      }
      case 'files.completeUploadExternal':
        return { ok: true, files: ((params.files as { id: string; title?: string }[]) ?? []).map((f) => ({ id: f.id, title: f.title })) };
      case 'apps.connections.open':
        return { ok: false, error: 'not_allowed_token_type' };
      default:
        return { ok: false, error: 'unknown_method' };
    }
  }

  async start(): Promise<void> {
    this.server = createServer(async (req, res) => {
      const url = new URL(req.url ?? '/', 'http://127.0.0.1');
      const bytes = await readBytes(req);
      const raw = bytes.toString('utf8');
      if (url.pathname.startsWith('/upload/')) {
        this.uploads.push({ fileId: url.pathname.slice('/upload/'.length), bytes });
        res.writeHead(200, { 'content-type': 'text/plain' }).end('OK - ' + bytes.length);
        return;
      }
      if (url.pathname.startsWith('/files/')) {
        const name = decodeURIComponent(url.pathname.slice('/files/'.length));
        this.downloads.push({ path: url.pathname, authorization: req.headers.authorization });
        const f = this.sharedFiles.get(name);
        // Slack answers a download without a valid token with its sign-in page.
        if (!f || !req.headers.authorization?.startsWith('Bearer xoxb-')) {
          res.writeHead(200, { 'content-type': 'text/html' }).end('<html>sign in</html>');
          return;
        }
        res.writeHead(200, { 'content-type': f.contentType }).end(f.body);
        return;
      }
      if (url.pathname.startsWith('/respond/')) {
        this.responsePosts.push({ id: url.pathname.slice('/respond/'.length), body: JSON.parse(raw || '{}') as Record<string, unknown> });
        res.writeHead(200, { 'content-type': 'text/plain' }).end('ok');
        return;
      }
      const method = url.pathname.replace(/^\/api\//, '');
      const params = decodeParams(raw, req.headers['content-type']);
      const auth = req.headers.authorization;
      const token = auth?.startsWith('Bearer ') ? auth.slice(7) : typeof params.token === 'string' ? params.token : undefined;
      delete params.token;
      this.calls.push({ method, params, token });
      const delay = this.delays.get(method);
      if (delay) await new Promise((r) => setTimeout(r, delay));
      const answer = this.overrides.get(method)?.(params) ?? this.defaultAnswer(method, params);
      res.writeHead(200, { 'content-type': 'application/json; charset=utf-8' }).end(JSON.stringify(answer));
    });
    await new Promise<void>((resolve) => this.server!.listen(0, '127.0.0.1', resolve));
    this.port = (this.server.address() as AddressInfo).port;
  }

  async stop(): Promise<void> {
    this.server?.closeAllConnections();
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }
}
