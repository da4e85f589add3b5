import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { intrinsicDensityPerCm3 } from '../../src/physics/intrinsic/registry.js';
import type { ReplyOk } from '../../src/reply/reply.js';
import { testContext } from '../helpers/context.js';

async function ok(text: string): Promise<ReplyOk> {
  const r = await handle(text, testContext());
  if (!r.ok) throw new Error(`expected ok for "${text}", got ${r.error.code}: ${r.error.message}`);
  return r;
}
const value = (r: ReplyOk, key: string) => r.values.find((v) => v.key === key)?.value as number;

describe('crossover command', () => {
  it('names the n_i model and round-trips with it (1e-9)', async () => {
    const r = await ok('crossover 1e15 boron');
    expect(r.model?.id).toBe('couderc-2014');
    expect(intrinsicDensityPerCm3('Si', value(r, 'temperatureK'), r.model!.id)).toBeWithinRelative(1e15, 1e-9);
    expect(r.warnings.map((w) => w.code)).toContain('outside_validity');
  });

  it('uses the net doping of two dopants and takes another model or material', async () => {
    expect(value(await ok('crossover 1e16 P and 4e15 B'), 'netDopingPerCm3')).toBeWithinRelative(6e15, 1e-12);
    expect((await ok('crossover 1e15 p model sproul-green')).model?.id).toBe('sproul-green-1991');
    expect(value(await ok('crossover 1e14 n Ge'), 'temperatureK')).toBeLessThan(value(await ok('crossover 1e14 n'), 'temperatureK'));
  });

  it('refuses a doping too high to turn intrinsic below the melting point', async () => {
    const r = await handle('crossover 1e21 phos', testContext());
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.code).toBe('outside_domain');
  });
});
