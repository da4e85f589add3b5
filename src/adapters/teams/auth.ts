/**
 * Checking the bearer token on every incoming activity: signed by a key the connector publishes
 * (its OpenID configuration names the key set), issued by the connector, addressed to our app id,
 * not expired (5 minutes of clock skew allowed, as the connector's own guidance allows — from
 * memory), and — when the token names one — for the service URL the activity came from.
 * jose does the JWT and key-set work (fetching, caching, refetching on an unknown key id).
 */
import { createRemoteJWKSet, customFetch, jwtVerify, type JWTVerifyGetKey } from 'jose';
import { CONNECTOR_ISSUER } from './config.js';

export type TokenCheck = { readonly ok: true } | { readonly ok: false; readonly reason: string; readonly unavailable?: boolean };

export class TokenValidator {
  private keys: JWTVerifyGetKey | undefined;
  private keysAt = 0;

  constructor(
    private readonly appId: string,
    private readonly openIdUrl: string,
    private readonly fetchFn: typeof fetch = globalThis.fetch.bind(globalThis),
  ) {}

  /** The key set, from the OpenID configuration (re-read once a day). */
  private async keySet(): Promise<JWTVerifyGetKey> {
    if (this.keys && Date.now() - this.keysAt < 24 * 3600_000) return this.keys;
    const res = await this.fetchFn(this.openIdUrl, { signal: AbortSignal.timeout(10_000) });
    if (!res.ok) throw new Error(`OpenID configuration: HTTP ${res.status}`);
    const doc = (await res.json()) as { jwks_uri?: unknown };
    if (typeof doc.jwks_uri !== 'string') throw new Error('OpenID configuration without jwks_uri');
    this.keys = createRemoteJWKSet(new URL(doc.jwks_uri), { timeoutDuration: 10_000, cooldownDuration: 30_000, [customFetch]: this.fetchFn });
    this.keysAt = Date.now();
    return this.keys;
  }

  async check(authorization: string | undefined, serviceUrl: string | undefined): Promise<TokenCheck> {
    const m = /^Bearer\s+(\S+)$/i.exec(authorization ?? '');
    if (!m) return { ok: false, reason: 'no bearer token' };
    let keys: JWTVerifyGetKey;
    try {
      keys = await this.keySet();
    } catch (e) {
      return { ok: false, reason: `the connector's keys could not be read (${e instanceof Error ? e.message : 'error'})`, unavailable: true };
    }
    try {
      const { payload } = await jwtVerify(m[1]!, keys, { issuer: CONNECTOR_ISSUER, audience: this.appId, clockTolerance: 300, algorithms: ['RS256'] });
      const claimed = payload['serviceurl'] ?? payload['serviceUrl'];
      if (typeof claimed === 'string' && serviceUrl !== undefined && claimed.replace(/\/+$/, '') !== serviceUrl.replace(/\/+$/, '')) {
        return { ok: false, reason: 'the token is for another service URL' };
      }
      return { ok: true };
    } catch (e) {
      const code = (e as { code?: string }).code ?? 'ERR_JWT';
      return { ok: false, reason: code.replace(/^ERR_/, '').toLowerCase().replace(/_/g, ' ') };
    }
  }
}
