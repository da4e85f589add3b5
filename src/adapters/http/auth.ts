/**
 * API keys and rates. A presented key is hashed and compared with every configured key's hash
 * in constant time (no early exit, so timing does not tell how close a guess was). Keys are never
 * logged. Each client has a token bucket: `ratePerMinute` requests, refilled continuously.
 */
import { createHash, timingSafeEqual } from 'node:crypto';
import type { ApiKey } from './config.js';

const digest = (s: string): Buffer => createHash('sha256').update(s, 'utf8').digest();

export class KeyRing {
  private readonly entries: { name: string; hash: Buffer }[];
  constructor(keys: readonly ApiKey[]) {
    this.entries = keys.map((k) => ({ name: k.name, hash: digest(k.key.reveal()) }));
  }

  get size(): number {
    return this.entries.length;
  }

  /** The client's name for a presented key, or undefined. */
  identify(presented: string | undefined): string | undefined {
    if (!presented) return undefined;
    const h = digest(presented);
    let found: string | undefined;
    for (const e of this.entries) if (timingSafeEqual(h, e.hash) && found === undefined) found = e.name;
    return found;
  }
}

/** The key from `Authorization: Bearer <key>` or `X-Api-Key: <key>`. */
export function presentedKey(authorization: string | undefined, apiKeyHeader: string | undefined): string | undefined {
  if (apiKeyHeader) return apiKeyHeader.trim();
  const m = /^Bearer\s+(\S+)\s*$/i.exec(authorization ?? '');
  return m?.[1];
}

export class RateLimiter {
  private readonly buckets = new Map<string, { tokens: number; at: number }>();
  constructor(
    private readonly perMinute: number,
    private readonly now: () => number = () => Date.now(),
  ) {}

  /** 0 when allowed (one token taken), else the seconds until the next token. */
  take(client: string): number {
    const t = this.now();
    const b = this.buckets.get(client) ?? { tokens: this.perMinute, at: t };
    b.tokens = Math.min(this.perMinute, b.tokens + ((t - b.at) / 60_000) * this.perMinute);
    b.at = t;
    this.buckets.set(client, b);
    if (b.tokens >= 1) {
      b.tokens -= 1;
      return 0;
    }
    return Math.max(1, Math.ceil(((1 - b.tokens) * 60) / this.perMinute));
  }
}
