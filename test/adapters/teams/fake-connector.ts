/**
 * A fake of the connector side, on loopback: the OpenID configuration and key set that incoming
 * tokens are checked against, the token endpoint our replies authenticate with, and the
 * conversation endpoints that record every activity we send. Tokens are signed here with a key
 * made for the test run (jose), so valid, expired, wrong-audience and wrong-key tokens can all
 * be made.
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { exportJWK, generateKeyPair, SignJWT, type JWK } from 'jose';

export interface SentActivity {
  readonly path: string;
  readonly conversationId: string;
  readonly replyToId?: string;
  readonly body: Record<string, unknown>;
  readonly authorization?: string;
}

type KeyPair = Awaited<ReturnType<typeof generateKeyPair>>;

export class FakeConnector {
  readonly sent: SentActivity[] = [];
  readonly tokenRequests: URLSearchParams[] = [];
  failSends = 0;
  private server: Server | undefined;
  private port = 0;
  private signing!: KeyPair;
  private stranger!: KeyPair;
  private jwk!: JWK;

  get base(): string {
    return `http://127.0.0.1:${this.port}`;
  }
  get openIdUrl(): string {
    return `${this.base}/openid`;
  }
  get tokenUrl(): string {
    return `${this.base}/token`;
  }
  /** The service URL activities name. */
  get serviceUrl(): string {
    return `${this.base}/svc/`;
  }

  async start(): Promise<void> {
    this.signing = await generateKeyPair('RS256');
    this.stranger = await generateKeyPair('RS256');
    this.jwk = { ...(await exportJWK(this.signing.publicKey)), kid: 'fab3-test-key', use: 'sig', alg: 'RS256' };
    this.server = createServer((req, res) => {
      let raw = '';
      req.on('data', (d: Buffer) => (raw += d.toString('utf8')));
      req.on('end', () => {
        const url = new URL(req.url ?? '/', this.base);
        const json = (status: number, body: unknown) => res.writeHead(status, { 'content-type': 'application/json' }).end(JSON.stringify(body));
        if (url.pathname === '/openid') return json(200, { issuer: 'https://api.botframework.com', jwks_uri: `${this.base}/keys` });
        if (url.pathname === '/keys') return json(200, { keys: [this.jwk] });
        if (url.pathname === '/token') {
          this.tokenRequests.push(new URLSearchParams(raw));
          return json(200, { token_type: 'Bearer', expires_in: 3600, access_token: 'outbound-token-for-tests' });
        }
        const m = /^\/svc\/v3\/conversations\/([^/]+)\/activities(?:\/([^/]+))?$/.exec(url.pathname);
        if (m && req.method === 'POST') {
          if (this.failSends > 0) {
            this.failSends -= 1;
            return json(503, { error: { code: 'ServiceUnavailable' } });
          }
          this.sent.push({
            path: url.pathname,
            conversationId: decodeURIComponent(m[1]!),
            ...(m[2] ? { replyToId: decodeURIComponent(m[2]) } : {}),
            body: JSON.parse(raw || '{}') as Record<string, unknown>,
            ...(req.headers.authorization ? { authorization: req.headers.authorization } : {}),
          });
          return json(201, { id: `act-${this.sent.length}` });
        }
        json(404, { error: { code: 'NotFound' } });
      });
    });
    await new Promise<void>((r) => this.server!.listen(0, '127.0.0.1', r));
    this.port = (this.server.address() as AddressInfo).port;
  }

  async stop(): Promise<void> {
    this.server?.closeAllConnections();
    await new Promise<void>((r) => (this.server ? this.server.close(() => r()) : r()));
  }

  /** A token as the connector would send it; `wrong` makes one bad in a single way. */
  async token(appId: string, wrong: 'expired' | 'audience' | 'key' | 'issuer' | 'serviceUrl' | 'none' = 'none'): Promise<string> {
    const now = Math.floor(Date.now() / 1000);
    const jwt = new SignJWT({ serviceurl: wrong === 'serviceUrl' ? 'https://elsewhere.example/' : this.serviceUrl })
      .setProtectedHeader({ alg: 'RS256', kid: 'fab3-test-key' })
      .setIssuer(wrong === 'issuer' ? 'https://issuer.elsewhere.example' : 'https://api.botframework.com')
      .setAudience(wrong === 'audience' ? '00000000-0000-4000-8000-000000000000' : appId)
      .setIssuedAt(wrong === 'expired' ? now - 7200 : now - 10)
      .setExpirationTime(wrong === 'expired' ? now - 3600 : now + 3600);
    return jwt.sign(wrong === 'key' ? this.stranger.privateKey : this.signing.privateKey);
  }
}
