/**
 * The HTTP JSON API in process (hono's own request(), no socket): keys, limits, the reply
 * contract for every help example, typed conversions in batches, readings exactly once per
 * Idempotency-Key, and the OpenAPI document generated from the request schemas.
 * Invented demo lots and clients (Harrowgate Fab 3).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Secret } from '../../../src/adapters/secret.js';
import { createHttpApi } from '../../../src/adapters/http/index.js';
import type { HttpApiConfig } from '../../../src/adapters/http/config.js';
import { openSqliteBackend } from '../../../src/adapters/storage/sqlite/backend.js';
import { Application } from '../../../src/app/application.js';
import { COMMANDS } from '../../../src/commands/registry.js';
import { convertResistivityToDensity } from '../../../src/physics/resistivity/convert.js';
import { JsonReply } from '../../../src/render/json-schema.js';
import { FIXED_NOW } from '../../helpers/context.js';
import { demoLotsConfig } from '../../helpers/lots.js';

const KEY = 'k3y-for-tests-only-0123456789abcdef';
const OTHER_KEY = 'another-test-key-abcdefghijklmnopqr';
const LOG = { error: () => undefined };

async function api(overrides: Partial<HttpApiConfig> = {}) {
  let n = 0;
  const app = await Application.open(openSqliteBackend(':memory:', { now: () => FIXED_NOW }), {
    lots: { ...demoLotsConfig(), permissions: { recordUsers: new Set(['api:mes-line3']), recordChannels: new Set(), clearUsers: new Set(), clearChannels: new Set() } },
    now: () => FIXED_NOW,
    newId: () => `r-${(++n).toString(16).padStart(6, '0')}`,
  });
  const config: HttpApiConfig = { port: 0, keys: [], bodyLimitBytes: 2_000_000, ratePerMinute: 100_000, ...overrides };
  const keys = [
    { name: 'mes-line3', key: new Secret(KEY) },
    { name: 'spc-scripts', key: new Secret(OTHER_KEY) },
  ];
  const hono = createHttpApi(app, keys, { config, log: LOG });
  const post = (path: string, body: unknown, headers: Record<string, string> = {}) =>
    hono.request(path, { method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${KEY}`, ...headers }, body: typeof body === 'string' ? body : JSON.stringify(body) });
  return { app, hono, post };
}

describe('keys', () => {
  it('no key, a wrong key: 401 with the right form; Bearer and X-Api-Key both work', async () => {
    const { hono } = await api();
    const body = JSON.stringify({ text: 'ni 300K' });
    const none = await hono.request('/v1/ask', { method: 'POST', headers: { 'content-type': 'application/json' }, body });
    expect(none.status).toBe(401);
    expect(await none.json()).toMatchObject({ ok: false, error: { code: 'unauthorized' } });
    const wrong = await hono.request('/v1/ask', { method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${KEY}x` }, body });
    expect(wrong.status).toBe(401);
    const viaHeader = await hono.request('/v1/ask', { method: 'POST', headers: { 'content-type': 'application/json', 'x-api-key': OTHER_KEY }, body });
    expect(viaHeader.status).toBe(200);
  });

  it('a client over its rate gets 429 with Retry-After; another client is not affected', async () => {
    const { post } = await api({ ratePerMinute: 3 });
    for (let i = 0; i < 3; i++) expect((await post('/v1/ask', { text: 'ni 300K' })).status).toBe(200);
    const over = await post('/v1/ask', { text: 'ni 300K' });
    expect(over.status).toBe(429);
    expect(Number(over.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
    expect((await post('/v1/ask', { text: 'ni 300K' }, { authorization: `Bearer ${OTHER_KEY}` })).status).toBe(200);
  });
});

describe('bad bodies', () => {
  it('not JSON, a missing field, a wrong type, an unknown field: 400 naming the field, with the right form', async () => {
    const { post } = await api();
    for (const [body, pattern] of [
      ['{"text": ', /not valid JSON/],
      [{}, /text: expected a string/],
      [{ text: 42 }, /text: expected a string/],
      [{ text: 'ni 300K', colour: 'red' }, /unknown field colour/],
    ] as const) {
      const res = await post('/v1/ask', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const j = (await res.json()) as { ok: boolean; error: { code: string; message: string; usage: string } };
      expect(j.ok).toBe(false);
      expect(j.error.code).toBe('bad_request');
      expect(j.error.message).toMatch(pattern);
      expect(j.error.usage).toBe('POST /v1/ask {"text": "rho 8.2 ohm-cm p"}');
      expect(j.error.message).not.toMatch(/ZodError|Invalid input|at Object|\n\s+at /);
    }
  });

  it('a body over the limit: 413', async () => {
    const { post } = await api({ bodyLimitBytes: 2048 });
    const res = await post('/v1/convert/resistivity', { resistivityOhmCm: Array.from({ length: 1000 }, () => 8.2), dopant: 'boron' });
    expect(res.status).toBe(413);
    expect(await res.json()).toMatchObject({ ok: false, error: { code: 'too_large' } });
  });
});

describe('/v1/ask', () => {
  it('answers every help example with the JSON reply contract (bad input is a 200 reply with ok:false)', async () => {
    const { post } = await api();
    const examples = COMMANDS.flatMap((c) => c.help.examples);
    for (const text of examples) {
      const res = await post('/v1/ask', { text });
      expect(res.status, text).toBe(200);
      const parsed = JsonReply.safeParse(await res.json());
      expect(parsed.success, text).toBe(true);
    }
    const bad = await post('/v1/ask', { text: 'rho -8 ohm-cm p' });
    expect(bad.status).toBe(200);
    expect(await bad.json()).toMatchObject({ ok: false, error: { code: expect.any(String), usage: expect.any(String) } });
  });

  it('a decision-driving reply carries the caution to confirm against controlled procedures', async () => {
    const { post } = await api();
    const j = (await (await post('/v1/ask', { text: 'rho 8.2 ohm-cm p' })).json()) as { cautions: string[]; values: Record<string, { value: number }> };
    expect(j.cautions.some((c) => /controlled procedure/i.test(c))).toBe(true);
    expect(j.values['dopantDensityPerCm3']!.value).toBe(convertResistivityToDensity({ resistivityOhmCm: 8.2, dopant: 'boron' }).ok ? (convertResistivityToDensity({ resistivityOhmCm: 8.2, dopant: 'boron' }) as { value: { dopantDensityPerCm3: number } }).value.dopantDensityPerCm3 : NaN);
  });
});

describe('/v1/convert', () => {
  it('one value or 10 000, each equal to the single conversion, each with its status', async () => {
    const { post } = await api();
    const one = (await (await post('/v1/convert/resistivity', { resistivityOhmCm: 8.2, dopant: 'boron' })).json()) as { ok: boolean; results: { dopantDensityPerCm3: number; status: string }[]; models: { id: string; citation: string }[]; cautions: string[] };
    const single = convertResistivityToDensity({ resistivityOhmCm: 8.2, dopant: 'boron' });
    expect(one.ok).toBe(true);
    expect(single.ok && one.results[0]!.dopantDensityPerCm3).toBe(single.ok ? single.value.dopantDensityPerCm3 : NaN);
    expect(one.models[0]!.id).toBe('f723');
    expect(one.cautions.some((c) => /controlled procedure/i.test(c))).toBe(true);
    const values = Array.from({ length: 10_000 }, (_, i) => 0.001 * 1.0015 ** i);
    const many = (await (await post('/v1/convert/resistivity', { resistivityOhmCm: values, dopant: 'phosphorus' })).json()) as { results: { dopantDensityPerCm3: number | null; status: string }[] };
    expect(many.results).toHaveLength(10_000);
    for (const i of [0, 1234, 5000, 9999]) {
      const s = convertResistivityToDensity({ resistivityOhmCm: values[i]!, dopant: 'phosphorus' });
      expect(many.results[i]!.dopantDensityPerCm3).toBe(s.ok ? s.value.dopantDensityPerCm3 : null);
    }
    const tooMany = await post('/v1/convert/resistivity', { resistivityOhmCm: Array.from({ length: 10_001 }, () => 1), dopant: 'boron' });
    expect(tooMany.status).toBe(400);
    expect(((await tooMany.json()) as { error: { message: string } }).error.message).toMatch(/resistivityOhmCm/);
  });

  it('a zero reading in a batch is refused alone, with the reason; a reading at 30 °C is corrected to 23 °C first', async () => {
    const { post } = await api();
    const j = (await (await post('/v1/convert/resistivity', { resistivityOhmCm: [8.2, 0], dopant: 'boron', temperatureC: 30 })).json()) as {
      results: { status: string; dopantDensityPerCm3: number | null; resistivityAt23COhmCm?: number; message?: string }[];
      assumptions: string[];
    };
    expect(j.results[0]!.status).toBe('ok');
    // Resistivity rises with temperature in this range (lattice scattering): the 23 °C value is lower.
    expect(j.results[0]!.resistivityAt23COhmCm!).toBeLessThan(8.2);
    expect(j.results[1]).toMatchObject({ status: 'refused', dopantDensityPerCm3: null });
    expect(j.results[1]!.message).toBeTruthy();
    expect(j.assumptions.join(' ')).toMatch(/30 °C, corrected to 23 °C/);
  });

  it('density → resistivity; an unknown model is ok:false naming the models', async () => {
    const { post } = await api();
    const j = (await (await post('/v1/convert/density', { dopantDensityPerCm3: [1e15, 1e16], dopant: 'phosphorus' })).json()) as { results: { resistivityOhmCm: number }[] };
    expect(j.results[1]!.resistivityOhmCm).toBeLessThan(j.results[0]!.resistivityOhmCm);
    const bad = (await (await post('/v1/convert/density', { dopantDensityPerCm3: 1e15, dopant: 'boron', model: 'astm-f732' })).json()) as { ok: boolean; error: { code: string; message: string } };
    expect(bad).toMatchObject({ ok: false, error: { code: 'unknown_model' } });
    expect(bad.error.message).toMatch(/f723/);
  });
});

describe('/v1/readings', () => {
  it('records as api:<client>; the same Idempotency-Key twice stores one reading and answers the same', async () => {
    const { post, app } = await api();
    const before = await app.lots!.repo.countReadings();
    const body = { lotId: 'LOT-A21', wafer: 4, site: 3, primary: { kind: 'resistivity', resistivityOhmCm: 9.7 } };
    const first = (await (await post('/v1/readings', body, { 'idempotency-key': 'mes-7781' })).json()) as { ok: boolean; values: Record<string, { value: unknown }> };
    const again = (await (await post('/v1/readings', body, { 'idempotency-key': 'mes-7781' })).json()) as { ok: boolean; values: Record<string, { value: unknown }> };
    expect(first.ok).toBe(true);
    expect(again.values).toEqual(first.values);
    expect(await app.lots!.repo.countReadings()).toBe(before + 1);
    const lot = await app.lots!.repo.getLot('LOT-A21');
    expect(lot!.readings.at(-1)!.actor).toMatchObject({ userId: 'api:mes-line3', surface: 'http' });
  });

  it('a client not on the record list is refused and nothing is stored; a bad field names itself', async () => {
    const { post, app } = await api();
    const before = await app.lots!.repo.countReadings();
    const res = await post('/v1/readings', { lotId: 'LOT-A21', wafer: 4, primary: { kind: 'resistivity', resistivityOhmCm: 9.7 } }, { authorization: `Bearer ${OTHER_KEY}` });
    expect(await res.json()).toMatchObject({ ok: false, error: { code: 'not_permitted' } });
    const bad = await post('/v1/readings', { lotId: 'LOT-A21', wafer: 99, primary: { kind: 'resistivity', resistivityOhmCm: 9.7 } });
    expect(((await bad.json()) as { error: { message: string } }).error.message).toMatch(/wafer/);
    expect(await app.lots!.repo.countReadings()).toBe(before);
  });
});

describe('/v1/ask with a measurement file', () => {
  const file = { name: 'LOT-A17-w04-rs.csv', text: readFileSync('examples/maps/LOT-A17-w04-rs.csv', 'utf8') };
  it('map: the statistics and the picture data come back in the JSON contract', async () => {
    const { post } = await api();
    const res = await post('/v1/ask', { text: 'map thick 725um p', file });
    const body = (await res.json()) as { ok: boolean; values: Record<string, { value: number }>; picture: { kind: string; sites: { xMm: number[] } } };
    expect(JsonReply.safeParse(body).success).toBe(true);
    expect(body.ok).toBe(true);
    expect(body.values['siteCount']!.value).toBe(49);
    expect(body.picture.kind).toBe('waferMap');
    expect(body.picture.sites.xMm).toHaveLength(49);
  });
  it('record … map: stored once per Idempotency-Key, every site with it', async () => {
    const { post, app } = await api();
    const before = await app.lots!.repo.countReadings();
    const ask = () => post('/v1/ask', { text: 'record LOT-A17 w4 map thick 725um', file }, { 'idempotency-key': 'mes-map-4' });
    const first = (await (await ask()).json()) as { ok: boolean; values: Record<string, { value: number }> };
    const again = (await (await ask()).json()) as { ok: boolean; values: Record<string, { value: number }> };
    expect(first.ok).toBe(true);
    expect(again.values['readingId']!.value).toBe(first.values['readingId']!.value);
    expect(await app.lots!.repo.countReadings()).toBe(before + 1);
    expect(await app.lots!.repo.mapSites(first.values['readingId']!.value)).toHaveLength(49);
  });
  it('a file field of the wrong shape is a 400 that names it', async () => {
    const { post } = await api();
    const res = await post('/v1/ask', { text: 'map', file: { name: 'w.csv' } });
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/file\.text/);
  });
});

describe('OpenAPI', () => {
  it('GET /v1/openapi.json is OpenAPI 3.1 made from the request schemas, without a key', async () => {
    const { hono } = await api();
    const res = await hono.request('/v1/openapi.json');
    expect(res.status).toBe(200);
    const doc = (await res.json()) as { openapi: string; paths: Record<string, Record<string, { requestBody: { content: { 'application/json': { schema: { properties: Record<string, unknown>; required?: string[] } } } } }>> };
    expect(doc.openapi).toBe('3.1.0');
    expect(Object.keys(doc.paths).sort()).toEqual(['/v1/ask', '/v1/convert/density', '/v1/convert/resistivity', '/v1/readings']);
    const schema = doc.paths['/v1/convert/resistivity']!['post']!.requestBody.content['application/json'].schema;
    expect(Object.keys(schema.properties).sort()).toEqual(['dopant', 'model', 'resistivityOhmCm', 'temperatureC']);
    expect(schema.required?.sort()).toEqual(['dopant', 'resistivityOhmCm']);
  });

  it('/healthz and /readyz need no key', async () => {
    const { hono } = await api();
    expect((await hono.request('/healthz')).status).toBe(200);
    expect(await (await hono.request('/readyz')).json()).toEqual({ ready: true, store: 'ok' });
  });
});
