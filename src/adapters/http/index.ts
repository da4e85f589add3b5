/**
 * The HTTP JSON API for fab systems (HTTP_API_PORT): a thin surface over the application layer,
 * built with hono and @hono/zod-openapi. Every request except /healthz, /readyz and the OpenAPI
 * document needs an API key; the client's name is the recorder of its readings ("api:<name>").
 *
 * Status codes: 200 for every reply (also ok:false for bad input: the error is inside, as on
 * `shiftprobe --json`), 400 for a body that is not JSON or does not fit the schema, 401 without a
 * valid key, 413 for a body over the limit, 429 over the client's rate. Errors never carry a
 * stack trace or a library's own text.
 */
import { readFileSync } from 'node:fs';
import { OpenAPIHono } from '@hono/zod-openapi';
import { bodyLimit } from 'hono/body-limit';
import type { Context } from 'hono';
import type { Application } from '../../app/application.js';
import { convertDensities, convertResistivities } from '../../app/convert.js';
import type { FailureLog } from '../../commands/context.js';
import { SurfaceConfigError, type Surface } from '../../app/surface.js';
import { toJson } from '../../render/json.js';
import { addServiceRoutes, listen, type Listening } from '../serving.js';
import { KeyRing, presentedKey, RateLimiter } from './auth.js';
import { parseKeyList, type ApiKey, type HttpApiConfig } from './config.js';
import { askRoute, convertDensityRoute, convertResistivityRoute, readingsRoute } from './routes.js';

type Env = { Variables: { client: string } };

const USAGE: Record<string, string> = {
  '/v1/ask': 'POST /v1/ask {"text": "rho 8.2 ohm-cm p"}',
  '/v1/convert/resistivity': 'POST /v1/convert/resistivity {"resistivityOhmCm": [8.2, 9.1], "dopant": "boron"}',
  '/v1/convert/density': 'POST /v1/convert/density {"dopantDensityPerCm3": 1e15, "dopant": "phosphorus"}',
  '/v1/readings': 'POST /v1/readings {"lotId": "LOT-A21", "wafer": 3, "primary": {"kind": "resistivity", "resistivityOhmCm": 9.6}}',
};

function apiError(c: Context, status: 400 | 401 | 404 | 413 | 429 | 500, code: string, message: string): Response {
  const usage = USAGE[c.req.path];
  return c.json({ ok: false, error: { code, message, ...(usage ? { usage } : {}) } }, status);
}

interface Issue {
  readonly code?: string;
  readonly path: readonly PropertyKey[];
  readonly message: string;
  readonly expected?: unknown;
  readonly minimum?: unknown;
  readonly maximum?: unknown;
  readonly keys?: readonly string[];
  readonly values?: readonly unknown[];
  readonly origin?: string;
}

/** One issue in our words: the field and what is expected (our own messages pass through). */
function issueWords(i: Issue): string {
  const field = i.path.map(String).join('.') || 'body';
  switch (i.code) {
    case 'invalid_type':
      return i.message.startsWith('Invalid input') ? `${field}: expected ${i.expected === 'undefined' ? 'no value' : `a ${String(i.expected)}`}` : `${field}: ${i.message}`;
    case 'unrecognized_keys':
      return `${field === 'body' ? '' : `${field}: `}unknown field${(i.keys ?? []).length === 1 ? '' : 's'} ${(i.keys ?? []).join(', ')}`;
    case 'too_small':
      return i.message.startsWith('Too small') ? `${field}: at least ${String(i.minimum)}${i.origin === 'string' ? ' characters' : i.origin === 'array' ? ' values' : ''}` : `${field}: ${i.message}`;
    case 'too_big':
      return i.message.startsWith('Too big') ? `${field}: at most ${String(i.maximum)}${i.origin === 'string' ? ' characters' : i.origin === 'array' ? ' values' : ''}` : `${field}: ${i.message}`;
    case 'invalid_union':
      return `${field}: not one of the accepted forms (see the usage)`;
    case 'invalid_value':
      return i.message.startsWith('Invalid') ? `${field}: one of ${(i.values ?? []).map(String).join(', ')}` : `${field}: ${i.message}`;
    default:
      return i.message.startsWith('Invalid') ? `${field}: not valid here (see the usage)` : `${field}: ${i.message}`;
  }
}

/** zod issues → one line a person can act on (field and what is expected), never zod's own dump. */
function issuesText(issues: readonly Issue[]): string {
  return issues.slice(0, 5).map(issueWords).join('; ');
}

export interface HttpApiOptions {
  readonly config: HttpApiConfig;
  readonly host?: string | undefined;
  readonly log: FailureLog & { info?(...a: unknown[]): void };
  readonly now?: () => number;
  /** How long stopping waits for requests in flight before closing their connections. */
  readonly stopGraceMs?: number;
}

/** The hono app (exported for tests that call it without a socket). */
export function createHttpApi(app: Application, keys: readonly ApiKey[], options: HttpApiOptions): OpenAPIHono<Env> {
  const ring = new KeyRing(keys);
  const limiter = new RateLimiter(options.config.ratePerMinute, options.now);
  const api = new OpenAPIHono<Env>({
    defaultHook: (result, c) => {
      if (!result.success) return apiError(c, 400, 'bad_request', issuesText(result.error.issues as unknown as Issue[]));
      return undefined;
    },
  });

  api.onError((err, c) => {
    // A body that is not JSON surfaces here from the validator.
    if (/JSON|Malformed/i.test(err.message) || (err as { status?: number }).status === 400) return apiError(c, 400, 'bad_request', 'the body is not valid JSON');
    options.log.error({ err, path: c.req.path }, 'shiftprobe: an HTTP API request failed');
    return apiError(c, 500, 'internal', 'Something went wrong on our side; the cause has been logged. Nothing was stored unless the reply said so.');
  });
  api.notFound((c) => apiError(c, 404, 'not_found', `no such endpoint: ${c.req.method} ${c.req.path}; see /v1/openapi.json`));

  addServiceRoutes(api, app);

  api.use('/v1/*', async (c, next) => {
    if (c.req.path === '/v1/openapi.json') return next();
    const client = ring.identify(presentedKey(c.req.header('authorization'), c.req.header('x-api-key')));
    if (!client) return apiError(c, 401, 'unauthorized', 'Send an API key: "Authorization: Bearer <key>" (keys are set with HTTP_API_KEYS).');
    const wait = limiter.take(client);
    if (wait > 0) {
      c.header('Retry-After', String(wait));
      return apiError(c, 429, 'rate_limited', `Too many requests for ${client}; try again in ${wait} s (HTTP_API_RATE_PER_MINUTE).`);
    }
    c.set('client', client);
    return next();
  });
  api.use(
    '/v1/*',
    bodyLimit({
      maxSize: options.config.bodyLimitBytes,
      onError: (c) => apiError(c, 413, 'too_large', `The body is larger than ${options.config.bodyLimitBytes} bytes (HTTP_API_BODY_LIMIT_BYTES); send fewer values per call.`),
    }),
  );

  const callerOf = (c: Context<Env>) => {
    const name = `api:${c.get('client')}`;
    return { userId: name, displayName: name, channelId: 'api' };
  };
  const effectKeyOf = (c: Context<Env>): string | undefined => {
    const key = c.req.header('idempotency-key');
    return key ? `http:${c.get('client')}:${key}` : undefined;
  };

  api.openapi(askRoute, async (c) => {
    const { text, file } = c.req.valid('json');
    const effectKey = effectKeyOf(c);
    const asked = await app.ask({ text, surface: 'http', caller: callerOf(c), ...(effectKey ? { effectKey } : {}), ...(file ? { attachment: file } : {}), log: options.log });
    if (asked.duplicate) return apiError(c, 500, 'internal', 'unexpected duplicate') as never;
    await asked.settle();
    return c.json(toJson(asked.reply) as never, 200);
  });

  api.openapi(convertResistivityRoute, async (c) => c.json(convertResistivities(c.req.valid('json')) as never, 200));
  api.openapi(convertDensityRoute, async (c) => c.json(convertDensities(c.req.valid('json')) as never, 200));

  api.openapi(readingsRoute, async (c) => {
    const { confirm, ...fields } = c.req.valid('json');
    // The lot records keep the reading as entered; a system sends numbers, so say where it came from.
    const withText = {
      ...fields,
      ...(fields.primary ? { primary: { ...fields.primary, asEntered: fields.primary.asEntered ?? describePrimary(fields.primary) } } : {}),
      ...(fields.typeReading ? { typeReading: { ...fields.typeReading, asEntered: fields.typeReading.asEntered ?? describeType(fields.typeReading) } } : {}),
    };
    const effectKey = effectKeyOf(c);
    const reply = await app.recordTyped(withText, { surface: 'http', caller: callerOf(c), ...(effectKey ? { effectKey } : {}), ...(confirm ? { confirm } : {}), log: options.log });
    return c.json(toJson(reply) as never, 200);
  });

  api.doc31('/v1/openapi.json', {
    openapi: '3.1.0',
    info: {
      title: 'shiftprobe HTTP API',
      version: '1.0.0',
      description:
        'Answers for fab systems: the command language (`/v1/ask`, the JSON contract of `shiftprobe --json`), typed conversions in batches, and lot readings. Every reply that drives a decision carries the caution to confirm against the fab’s controlled procedures.',
    },
  });
  api.openAPIRegistry.registerComponent('securitySchemes', 'apiKey', { type: 'http', scheme: 'bearer', description: 'An API key from HTTP_API_KEYS' });
  return api;
}

function describePrimary(p: { kind: 'resistivity'; resistivityOhmCm: number } | { kind: 'sheet'; sheetResistanceOhmPerSq: number; thicknessCm: number }): string {
  return p.kind === 'resistivity' ? `${p.resistivityOhmCm} ohm-cm (api)` : `${p.sheetResistanceOhmPerSq} ohm/sq thick ${p.thicknessCm * 1e4}um (api)`;
}

function describeType(t: { kind: 'type'; method: string; reading: number } | { kind: 'stated-type'; carrierType: string }): string {
  return t.kind === 'type' ? `${t.method} ${t.reading} (api)` : `type ${t.carrierType} (api)`;
}

/** The keys given inline and those in HTTP_API_KEYS_FILE. */
export function loadApiKeys(config: HttpApiConfig): ApiKey[] {
  if (!config.keysFile) return [...config.keys];
  let text: string;
  try {
    text = readFileSync(config.keysFile, 'utf8');
  } catch (e) {
    throw new SurfaceConfigError('HTTP_API_KEYS_FILE', `HTTP_API_KEYS_FILE (${config.keysFile}) cannot be read (${(e as { code?: string }).code ?? 'error'}).`);
  }
  const parsed = parseKeyList(text, 'HTTP_API_KEYS_FILE');
  if (!parsed.ok) throw new SurfaceConfigError('HTTP_API_KEYS_FILE', parsed.message);
  const all = [...config.keys, ...parsed.keys];
  const names = new Set<string>();
  for (const k of all) {
    if (names.has(k.name)) throw new SurfaceConfigError('HTTP_API_KEYS_FILE', `the API client ${k.name} is named in both HTTP_API_KEYS and HTTP_API_KEYS_FILE`);
    names.add(k.name);
  }
  if (all.length === 0) throw new SurfaceConfigError('HTTP_API_KEYS_FILE', `HTTP_API_KEYS_FILE (${config.keysFile}) holds no name:key line`);
  return all;
}

export function httpApiSurface(app: Application, options: HttpApiOptions): Surface & { readonly port: () => number } {
  let server: Listening | undefined;
  return {
    name: 'http',
    port: () => server?.port ?? 0,
    async start() {
      const api = createHttpApi(app, loadApiKeys(options.config), options);
      server = await listen(api.fetch, options.config.port, options.host);
      return { port: server.port, description: `the HTTP API at :${server.port}/v1 (OpenAPI at /v1/openapi.json)` };
    },
    async stop() {
      const s = server;
      server = undefined;
      await s?.close(options.stopGraceMs ?? 25_000);
    },
    summaryNotifier: () => undefined,
  };
}
