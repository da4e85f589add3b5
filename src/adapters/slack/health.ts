/**
 * /healthz (the process is alive) and /readyz (the store answers and Slack is connected), on the
 * HTTP port in both modes: Bolt's HTTP receiver serves them beside /slack/events; in Socket
 * Mode a small server of our own does.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';

export type SlackLink = 'connecting' | 'connected' | 'reconnecting' | 'rejected' | 'stopped';

export class Readiness {
  slack: SlackLink = 'connecting';
  constructor(private readonly storeHealthy: () => Promise<boolean>) {}
  async report(): Promise<{ ready: boolean; store: 'ok' | 'failing'; slack: SlackLink }> {
    const store = (await this.storeHealthy().catch(() => false)) ? 'ok' : 'failing';
    return { ready: store === 'ok' && this.slack === 'connected', store, slack: this.slack };
  }
}

function json(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' });
  res.end(text);
}

export interface HealthRoute {
  readonly path: string;
  readonly method: string[];
  readonly handler: (req: IncomingMessage, res: ServerResponse) => void;
}

export function healthRoutes(readiness: Readiness, metrics?: () => Promise<{ contentType: string; body: string }>): HealthRoute[] {
  return [
    ...(metrics
      ? [
          {
            path: '/metrics',
            method: ['GET'],
            handler: (_req: IncomingMessage, res: ServerResponse) => {
              void metrics().then(
                (m) => {
                  res.writeHead(200, { 'content-type': m.contentType, 'cache-control': 'no-store' });
                  res.end(m.body);
                },
                () => json(res, 500, { error: 'metrics unavailable' }),
              );
            },
          },
        ]
      : []),
    { path: '/healthz', method: ['GET', 'HEAD'], handler: (_req, res) => json(res, 200, { status: 'alive' }) },
    {
      path: '/readyz',
      method: ['GET', 'HEAD'],
      handler: (_req, res) => {
        void readiness.report().then((r) => json(res, r.ready ? 200 : 503, r));
      },
    },
  ];
}

/** The Socket Mode health server: the same routes, nothing else (404). */
export function healthServer(routes: readonly HealthRoute[]): Server {
  return createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://localhost').pathname;
    const route = routes.find((r) => r.path === path && r.method.includes(req.method ?? 'GET'));
    if (route) route.handler(req, res);
    else json(res, 404, { error: 'not_found' });
  });
}
