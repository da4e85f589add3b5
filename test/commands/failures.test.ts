/**
 * Honest failures: a failure at each step of a request is logged with its cause through the
 * surface's log, and the person is told what is known — nothing stored, stored (with the reading
 * number, so it is not entered twice), or not known (with how to check). Never a stack trace.
 */
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import type { HandleContext } from '../../src/commands/context.js';
import { renderText } from '../../src/render/text.js';
import { FIXED_NOW, testContext } from '../helpers/context.js';
import { demoLots } from '../helpers/lots.js';

function setup(overrides: (rt: ReturnType<typeof demoLots>) => Partial<HandleContext> = () => ({})) {
  const rt = demoLots(() => FIXED_NOW);
  const logged: unknown[][] = [];
  const ctx = testContext({ lots: rt.service, log: { error: (...args: unknown[]) => logged.push(args) }, ...overrides(rt) });
  return { rt, ctx, logged, count: async () => Number(await rt.repo.countReadings()) };
}

const boom = () => {
  throw new Error('disk I/O error (injected)');
};

async function failed(ctx: HandleContext, text: string) {
  const r = await handle(text, ctx);
  if (r.ok) throw new Error('expected a failure reply');
  expect(r.error.code).toBe('internal');
  expect(renderText(r)).not.toMatch(/at .*\.ts:\d+|Error:|injected/);
  return r.error.message;
}

describe('a failure at each step', () => {
  it('while reading the request: nothing stored, and the cause is logged', async () => {
    const { ctx, logged, count } = setup();
    const before = await count();
    const broken = Object.create(ctx, { session: { get: boom } }) as HandleContext;
    const message = await failed(broken, 'record LOT-A21 w4 rho 9.8 ohm-cm');
    expect(message).toMatch(/Nothing was stored/);
    expect(await count()).toBe(before);
    expect(logged).toHaveLength(1);
    expect(String((logged[0]![0] as { err: Error }).err.message)).toContain('injected');
  });

  it('while storing: not known, and it says how to check before entering it again', async () => {
    const { ctx, logged, count, rt } = setup();
    const before = await count();
    const service = Object.create(rt.service, { record: { value: boom } });
    const message = await failed({ ...ctx, lots: service }, 'record LOT-A21 w4 rho 9.8 ohm-cm');
    expect(message).toMatch(/cannot tell whether it was stored/);
    expect(message).toContain('lot LOT-A21');
    expect(await count()).toBe(before);
    expect(logged).toHaveLength(1);
  });

  it('after the reading is stored, while making the reply: "stored", with its number', async () => {
    let ids = 0;
    const { ctx, logged, count } = setup();
    const before = await count();
    // The reply's id is drawn after the write: the first draw fails.
    const message = await failed({ ...ctx, newId: () => (++ids === 1 ? boom() : `r-${ids}`) }, 'record LOT-A21 w4 rho 9.8 ohm-cm');
    expect(await count()).toBe(before + 1);
    expect(message).toMatch(/your reading #\d+ for LOT-A21 w4: stored, but the reply could not be completed\. Do not enter it again/i);
    expect(logged).toHaveLength(1);
  });

  it('after the reading is stored, while keeping the result: "stored", and exactly one reading', async () => {
    const { ctx, logged, count } = setup((rt) => ({ results: { save: async () => boom(), get: async () => undefined } }));
    const before = await count();
    const message = await failed(ctx, 'record LOT-A21 w4 site 2 rho 9.8 ohm-cm');
    expect(message).toMatch(/#\d+ for LOT-A21 w4 site 2: stored/);
    expect(await count()).toBe(before + 1);
    expect((logged[0]![0] as { stage: string }).stage).toBe('keeping');
  });

  it('a question that only reads: "nothing was stored" when keeping its result fails', async () => {
    const { ctx } = setup(() => ({ results: { save: async () => boom(), get: async () => undefined } }));
    expect(await failed(ctx, 'rho 8.2 ohm-cm p')).toMatch(/Nothing was stored/);
  });

  it('a clear that failed after it was stored says so', async () => {
    const { ctx } = setup(() => ({ results: { save: async () => boom(), get: async () => undefined } }));
    const message = await failed(ctx, 'clear LOT-B204 type w5 because repeat probe reads n');
    expect(message).toMatch(/clearing of F\d+ on LOT-B204: stored/i);
  });
});
