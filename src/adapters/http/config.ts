/**
 * The HTTP API's settings, a section of the configuration (assembled in src/config.ts):
 *
 *   HTTP_API_PORT              turns the API on, listening on this port (HOST applies)
 *   HTTP_API_KEYS              name:key pairs, comma-separated (keys ≥ 24 characters); the name
 *                              records readings as "api:<name>"
 *   HTTP_API_KEYS_FILE         or a file of name:key lines (# comments), read at start
 *   HTTP_API_BODY_LIMIT_BYTES  the largest request body (default 2 000 000: 10 000 values fit)
 *   HTTP_API_RATE_PER_MINUTE   requests per key per minute before 429 (default 600)
 */
import { z } from 'zod';
import { Secret } from '../secret.js';

export const API_CLIENT_NAME = /^[a-z0-9][a-z0-9_-]{0,31}$/;
export const MIN_KEY_LENGTH = 24;

export interface ApiKey {
  readonly name: string;
  readonly key: Secret;
}

export interface HttpApiConfig {
  readonly port: number;
  /** Keys given inline; more may come from `keysFile` at start. */
  readonly keys: readonly ApiKey[];
  readonly keysFile?: string;
  readonly bodyLimitBytes: number;
  readonly ratePerMinute: number;
}

/** name:key pairs → keys, or the problem (never quoting a key). */
export function parseKeyList(text: string, variable: string): { ok: true; keys: ApiKey[] } | { ok: false; message: string } {
  const keys: ApiKey[] = [];
  const entries = text
    .split(/[,\n]/)
    .map((s) => s.trim())
    .filter((s) => s !== '' && !s.startsWith('#'));
  for (const [i, entry] of entries.entries()) {
    const colon = entry.indexOf(':');
    const name = colon > 0 ? entry.slice(0, colon).trim() : '';
    const key = colon > 0 ? entry.slice(colon + 1).trim() : '';
    if (!API_CLIENT_NAME.test(name)) {
      return { ok: false, message: `${variable}: entry ${i + 1} must be name:key with a name of lower-case letters, digits, - or _ (e.g. mes-line3:<key>)` };
    }
    if (key.length < MIN_KEY_LENGTH || /\s/.test(key)) {
      return { ok: false, message: `${variable}: the key for ${name} must be at least ${MIN_KEY_LENGTH} characters without spaces (e.g. from "openssl rand -hex 24")` };
    }
    if (keys.some((k) => k.name === name)) return { ok: false, message: `${variable}: the name ${name} appears twice` };
    keys.push({ name, key: new Secret(key) });
  }
  return { ok: true, keys };
}

const wholeNumber = (variable: string, min: number, max: number, example: string) =>
  z
    .string()
    .optional()
    .refine((s) => s === undefined || (/^\d{1,10}$/.test(s) && Number(s) >= min && Number(s) <= max), {
      error: `${variable} must be a whole number from ${min} to ${max}, e.g. ${example}`,
    });

export const HttpApiEnv = z
  .object({
    HTTP_API_PORT: wholeNumber('HTTP_API_PORT', 0, 65535, '8080'),
    HTTP_API_KEYS: z.string().optional(),
    HTTP_API_KEYS_FILE: z.string().optional(),
    HTTP_API_BODY_LIMIT_BYTES: wholeNumber('HTTP_API_BODY_LIMIT_BYTES', 1024, 50_000_000, '2000000'),
    HTTP_API_RATE_PER_MINUTE: wholeNumber('HTTP_API_RATE_PER_MINUTE', 1, 1_000_000, '600'),
  })
  .superRefine((e, ctx) => {
    if (e.HTTP_API_KEYS !== undefined) {
      const parsed = parseKeyList(e.HTTP_API_KEYS, 'HTTP_API_KEYS');
      if (!parsed.ok) ctx.addIssue({ code: 'custom', path: ['HTTP_API_KEYS'], message: parsed.message });
    }
    if (e.HTTP_API_PORT !== undefined && e.HTTP_API_KEYS === undefined && e.HTTP_API_KEYS_FILE === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['HTTP_API_KEYS'],
        message: 'HTTP_API_KEYS is missing: the HTTP API (HTTP_API_PORT) needs at least one name:key, or HTTP_API_KEYS_FILE',
      });
    }
  })
  .transform((e): HttpApiConfig | undefined => {
    if (e.HTTP_API_PORT === undefined) return undefined;
    const inline = e.HTTP_API_KEYS !== undefined ? parseKeyList(e.HTTP_API_KEYS, 'HTTP_API_KEYS') : { ok: true as const, keys: [] };
    return {
      port: Number(e.HTTP_API_PORT),
      keys: inline.ok ? inline.keys : [],
      ...(e.HTTP_API_KEYS_FILE !== undefined ? { keysFile: e.HTTP_API_KEYS_FILE } : {}),
      bodyLimitBytes: Number(e.HTTP_API_BODY_LIMIT_BYTES ?? 2_000_000),
      ratePerMinute: Number(e.HTTP_API_RATE_PER_MINUTE ?? 600),
    };
  });
