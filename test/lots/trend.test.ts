/**
 * Trend data on both storage backends, and the `trend` command on the demo history.
 * The control limits and rule breaks are checked against the definitions (Montgomery 2009 §6.4;
 * Western Electric 1956), computed here from the same readings in time order.
 */
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { individualsLimits } from '../../src/physics/statistics/shewhart-individuals.js';
import { westernElectricBreaks } from '../../src/physics/statistics/western-electric-1956.js';
import type { ReplyOk, TrendPicture } from '../../src/reply/reply.js';
import { replyPng } from '../../src/render/picture/png.js';
import { testContext } from '../helpers/context.js';
import { CONSOLE, DRIVERS, openHarness, rho, type Harness } from './harness.js';

describe.each(DRIVERS)('trend readings on %s', (driver) => {
  let h: Harness<any>;
  beforeEach(async () => {
    h = await openHarness(driver);
  });
  afterEach(async () => {
    await h.close();
  });
  const record = async (req: Record<string, unknown>) => {
    const r = await h.service.record(req, { actor: CONSOLE });
    if (!r.ok) throw new Error(JSON.stringify(r.error));
    h.clock.advance(3_600_000);
  };

  it('finds the lots whose current product is the one asked for, and their current readings in time order', async () => {
    await record({ lotId: 'LOT-T01', wafer: 1, productId: 'HX-200P', primary: rho(9.5) });
    await record({ lotId: 'LOT-T02', wafer: 1, productId: 'HX-200P', primary: rho(10.5) });
    await record({ lotId: 'LOT-T03', wafer: 1, productId: 'HX-200P', primary: rho(10.1) });
    await record({ lotId: 'LOT-T03', productId: 'HX-50PP' }); // moved to another product
    await record({ lotId: 'LOT-T01', wafer: 2, primary: rho(9.9) });
    expect(await h.repo.lotIdsOfProduct('hx-200p', 10)).toEqual(['LOT-T01', 'LOT-T02']);
    const r = await h.service.trendReadings({ productId: 'HX-200P', sinceIso: '2000-01-01T00:00:00Z' });
    if (!r.ok) throw new Error('trend failed');
    expect(r.value.readings.map((x) => x.resistivityOhmCm)).toEqual([9.5, 10.5, 9.9]);
    expect(r.value.lotCount).toBe(2);
  });
});

describe('the trend command', () => {
  it('charts a lot against limits from its product history, and lists the rule breaks in words', async () => {
    const ctx = testContext();
    const r = (await handle('trend LOT-A17', ctx)) as ReplyOk;
    expect(r.ok).toBe(true);
    const pic = r.picture as TrendPicture;
    expect(pic.kind).toBe('trend');
    const history = await ctx.lots!.trendReadings({ productId: 'HX-200P', sinceIso: '2000-01-01T00:00:00Z' });
    if (!history.ok) throw new Error('no history');
    const limits = individualsLimits(history.value.history.map((x) => x.resistivityOhmCm!))!;
    expect(pic.control!.upper).toBeCloseTo(limits.upper, 12);
    expect(r.values.find((v) => v.key === 'upperControlLimit')!.value).toBeCloseTo(limits.upper, 12);
    const breaks = westernElectricBreaks(pic.points.map((p) => p.value), limits.centre, limits.sigma);
    expect(pic.points.flatMap((p, i) => p.rules.map((rule) => `${i}:${rule}`))).toEqual(breaks.map((b) => `${b.index}:${b.rule}`));
    const words = r.sections!.find((s) => s.heading === 'Rule breaks')!.lines!.join('\n');
    for (const b of breaks) expect(words).toContain(`rule ${b.rule}`);
    expect(pic.spec).toEqual({ min: 8, max: 12 });
    expect(r.cautions.join(' ')).toMatch(/controlled procedure/);
  });
  it('draws it as a PNG, the same bytes each time', async () => {
    const a = replyPng((await handle('trend product HX-200P', testContext())) as ReplyOk)!;
    const b = replyPng((await handle('trend product HX-200P', testContext())) as ReplyOk)!;
    expect(Buffer.from(a.subarray(1, 4)).toString()).toBe('PNG');
    expect(Buffer.compare(Buffer.from(a), Buffer.from(b))).toBe(0);
  });
  it('an unknown lot and a product without readings get clear answers', async () => {
    const unknown = await handle('trend LOT-Z99', testContext());
    expect(unknown.ok).toBe(false);
    if (!unknown.ok) expect(unknown.error.message).toMatch(/No readings have been recorded for LOT-Z99/);
    const none = await handle('trend product NOPE-1', testContext());
    if (none.ok) throw new Error('expected an error');
    expect(none.error.message).toMatch(/No readings of product NOPE-1/);
  });
});
