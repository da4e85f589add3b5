/**
 * What every hono-served surface (the HTTP API, Teams) shares: the service routes beside its own
 * (/healthz, /readyz — the database answers — and /metrics), listening on a port, and stopping
 * with a grace period for requests in flight.
 */
import type { AddressInfo } from 'node:net';
import { serve as serveHttp, type ServerType } from '@hono/node-server';
import type { Hono } from 'hono';
import type { Application } from '../app/application.js';

/** /healthz, /readyz and /metrics on `http`. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any hono app, whatever its env
export function addServiceRoutes(http: Hono<any, any, any>, app: Application): void {
  http.get('/healthz', (c) => c.json({ status: 'alive' }));
  http.get('/readyz', async (c) => {
    const store = (await app.backend.healthy().catch(() => false)) ? 'ok' : 'failing';
    return c.json({ ready: store === 'ok', store }, store === 'ok' ? 200 : 503);
  });
  http.get('/metrics', async (c) => {
    const m = await app.metrics.exposition();
    return c.body(m.body, 200, { 'content-type': m.contentType, 'cache-control': 'no-store' });
  });
}

export interface Listening {
  readonly port: number;
  /** No new connections; requests in flight get `graceMs` to finish, then their connections close. */
  close(graceMs: number): Promise<void>;
}

/** Serve `fetch` on a port (0: any free one); a port in use rejects with EADDRINUSE. */
export async function listen(fetch: Hono['fetch'], port: number, host: string | undefined): Promise<Listening> {
  const server = await new Promise<ServerType>((resolve, reject) => {
    const s = serveHttp({ fetch, port, hostname: host ?? '0.0.0.0' }, () => resolve(s));
    s.once('error', reject);
  });
  const s = server as unknown as { close(cb: () => void): void; closeIdleConnections?(): void; closeAllConnections?(): void };
  return {
    port: (server.address() as AddressInfo).port,
    close: (graceMs) =>
      new Promise<void>((resolve) => {
        s.close(() => resolve());
        // Idle keep-alive connections would hold close() open.
        s.closeIdleConnections?.();
        setTimeout(() => s.closeAllConnections?.(), graceMs).unref();
      }),
  };
}
