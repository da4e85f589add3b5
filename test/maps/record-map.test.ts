/**
 * `record <lot> w<n> map …`: a wafer map kept as one reading of its wafer, every site stored
 * append-only beside it, on SQLite and PostgreSQL, and checked against the product's uniformity
 * limits. The statistics are checked against values computed here from their definitions
 * (mean, sample standard deviation with n − 1; 1σ/mean × 100): common practice, no published
 * source (the definitions are stated in the reply). The site values are invented test data.
 */
import { readFileSync } from 'node:fs';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import type { MapMeasurement, MapSite } from '../../src/lots/readings.js';
import type { ReplyOk, WaferMapPicture } from '../../src/reply/reply.js';
import { testContext } from '../helpers/context.js';
import { CONSOLE, DRIVERS, openHarness, type Harness } from '../lots/harness.js';

/** n sites on a square grid inside a 200 mm wafer, resistivity from `rho(i, x, y)`. */
function grid(n: number, rho: (i: number, x: number, y: number) => number): MapSite[] {
  const sites: MapSite[] = [];
  const side = Math.ceil(Math.sqrt((n * 4) / Math.PI)) + 2;
  const step = 180 / side;
  for (let gy = 0; gy < side && sites.length < n; gy++) {
    for (let gx = 0; gx < side && sites.length < n; gx++) {
      const x = -90 + gx * step;
      const y = -90 + gy * step;
      if (Math.hypot(x, y) > 90) continue;
      const r = rho(sites.length, x, y);
      sites.push({ label: `S${sites.length + 1}`, xMm: x, yMm: y, value: r / 0.0725, resistivityOhmCm: r, included: true });
    }
  }
  if (sites.length < n) throw new Error(`grid holds ${sites.length} sites, not ${n}`);
  return sites;
}

function mapOf(sites: MapSite[]): MapMeasurement {
  return { kind: 'map', measured: 'sheet', fileName: 'test.csv', thicknessCm: 0.0725, diameterMm: 200, edgeExclusionMm: 3, sites, asEntered: `map test.csv (${sites.length} sites)` };
}

/** Mean and 1σ/mean × 100 from their definitions (sample standard deviation, n − 1). */
function byDefinition(values: number[]): { mean: number; nonUniformityPercent: number } {
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  const sd = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1));
  return { mean, nonUniformityPercent: (100 * sd) / mean };
}

describe.each(DRIVERS)('map readings on %s', (driver) => {
  let h: Awaited<ReturnType<typeof openHarness>>;
  beforeEach(async () => {
    h = await openHarness(driver);
  });
  afterEach(async () => {
    await h.close();
  });

  // 1 200 sites: more than the 999 numbered sites of spot readings.
  it('stores every site beside one wafer reading (the map mean), with the statistics, and flags a non-uniform map', async () => {
    const sites = grid(1200, (i, x, y) => 10 * (1 + 0.0006 * (x + y)) * (1 + 0.04 * Math.sin(i)));
    sites[7] = { ...sites[7]!, value: null, resistivityOhmCm: null }; // an empty cell
    sites[8] = { ...sites[8]!, included: false }; // in the edge exclusion
    const r = await h.service.record({ lotId: 'LOT-M01', wafer: 3, productId: 'HX-200P', primary: mapOf(sites) }, { actor: CONSOLE });
    if (!r.ok) throw new Error(JSON.stringify(r.error));
    const [reading] = r.value.outcome.readings;
    const counted = sites.filter((s) => s.included && s.resistivityOhmCm !== null).map((s) => s.resistivityOhmCm!);
    const expected = byDefinition(counted);
    const map = reading!.evaluation.map!;
    expect(map.count).toBe(1198);
    expect(map.siteCount).toBe(1200);
    // Sums of 1 198 terms in a different order: 1e-12 relative.
    expect(map.meanOhmCm).toBeWithinRelative(expected.mean, 1e-12);
    expect(map.nonUniformityPercent).toBeWithinRelative(expected.nonUniformityPercent, 1e-9);
    expect(reading!.resistivityOhmCm).toBeWithinRelative(expected.mean, 1e-12);
    expect(reading!.wafer).toBe(3);
    expect(reading!.site).toBeUndefined();
    // HX-200P (demo spec): non-uniformity ≤ 3 %; this map is about 3.5 %.
    expect(expected.nonUniformityPercent).toBeGreaterThan(3);
    expect(r.value.outcome.raised.map((f) => f.code)).toContain('uniformity_over_limit');

    const stored = await h.repo.mapSites(reading!.id);
    expect(stored).toEqual(sites);
    expect(await h.repo.mapSites(reading!.id + 1000)).toEqual([]);
  });

  it('writes the sites once when the same message is delivered twice', async () => {
    const sites = grid(300, (i) => 10 + 0.01 * (i % 7));
    const req = { lotId: 'LOT-M02', wafer: 1, productId: 'HX-200P', primary: mapOf(sites) };
    const a = await h.service.record(req, { actor: CONSOLE, eventId: 'ev-map-1' });
    const b = await h.service.record(req, { actor: CONSOLE, eventId: 'ev-map-1' });
    if (!a.ok || !b.ok) throw new Error('record failed');
    expect(b.value.duplicate).toBe(true);
    expect(b.value.outcome.readings[0]!.id).toBe(a.value.outcome.readings[0]!.id);
    expect(await h.repo.countReadings()).toBe(1);
    expect((await h.repo.mapSites(a.value.outcome.readings[0]!.id)).length).toBe(300);
    const lot = await h.repo.getLot('LOT-M02');
    expect(lot!.readings).toHaveLength(1);
  });

  it('refuses to change or delete a stored site (append-only in the database)', async () => {
    const r = await h.service.record({ lotId: 'LOT-M03', wafer: 1, productId: 'HX-200P', primary: mapOf(grid(20, () => 10)) }, { actor: CONSOLE });
    expect(r.ok).toBe(true);
    await expect(h.exec('UPDATE lot_map_sites SET value = 1')).rejects.toThrow(/append-only/);
    await expect(h.exec('DELETE FROM lot_map_sites')).rejects.toThrow(/append-only/);
  });

  it('checks a map mean against the uniformity mean window rather than the product window', async () => {
    // 8.2 Ω·cm: inside HX-200P's 8–12 window, outside its map-mean window 8.5–11.5.
    const r = await h.service.record({ lotId: 'LOT-M04', wafer: 2, productId: 'HX-200P', primary: mapOf(grid(40, () => 8.2)) }, { actor: CONSOLE });
    if (!r.ok) throw new Error(JSON.stringify(r.error));
    const window = r.value.outcome.readings[0]!.evaluation.checks.find((c) => c.check === 'window');
    expect(window).toMatchObject({ status: 'fail', min: 8.5, max: 11.5, basis: 'map_mean', limit: 'min' });
    expect(r.value.outcome.raised).toContainEqual(expect.objectContaining({ code: 'out_of_window', wafer: 2 }));
    // The uniformity check passes (every site alike), and says so.
    expect(r.value.outcome.readings[0]!.evaluation.checks).toContainEqual(expect.objectContaining({ check: 'uniformity', status: 'pass', nonUniformityPercent: 0 }));
  });

  it('a corrected map closes the flags of the map it replaces; both maps keep their sites', async () => {
    const bad = grid(60, (i) => (i % 2 ? 9 : 11));
    const first = await h.service.record({ lotId: 'LOT-M05', wafer: 1, productId: 'HX-200P', primary: mapOf(bad) }, { actor: CONSOLE });
    if (!first.ok) throw new Error('first');
    const id = first.value.outcome.readings[0]!.id;
    expect(first.value.outcome.raised.map((f) => f.code)).toContain('uniformity_over_limit');
    const good = grid(60, () => 10);
    const second = await h.service.record({ lotId: 'LOT-M05', wafer: 1, primary: mapOf(good), corrects: id }, { actor: CONSOLE });
    if (!second.ok) throw new Error(JSON.stringify(second.error));
    expect(second.value.outcome.closed.map((f) => f.code)).toContain('uniformity_over_limit');
    expect((await h.repo.mapSites(id)).map((s) => s.resistivityOhmCm)).toEqual(bad.map((s) => s.resistivityOhmCm));
    expect((await h.repo.mapSites(second.value.outcome.readings[0]!.id)).length).toBe(60);
  });

  it('refuses a map without its wafer, or with a site, and stores nothing', async () => {
    const m = mapOf(grid(10, () => 10));
    const noWafer = await h.service.record({ lotId: 'LOT-M06', productId: 'HX-200P', primary: m }, { actor: CONSOLE });
    const withSite = await h.service.record({ lotId: 'LOT-M06', wafer: 1, site: 2, productId: 'HX-200P', primary: m }, { actor: CONSOLE });
    expect(noWafer.ok || withSite.ok).toBe(false);
    expect(await h.repo.countReadings()).toBe(0);
  });
});

const demoFile = (name: string) => ({ name, text: readFileSync(`examples/maps/${name}`, 'utf8') });

describe('the record … map command', () => {
  it('records the demo wafer: the same statistics as `map` on the same file, the picture, and the lot view', async () => {
    const ctx = testContext({ attachment: demoFile('LOT-A17-w04-rs.csv') });
    const r = (await handle('record LOT-A17 w4 map thick 725um', ctx)) as ReplyOk;
    if (!r.ok) throw new Error(JSON.stringify(r));
    const asMap = (await handle('map thick 725um show rho', testContext({ attachment: demoFile('LOT-A17-w04-rs.csv') }))) as ReplyOk;
    const v = (reply: ReplyOk, key: string) => reply.values.find((x) => x.key === key)?.value;
    expect(v(r, 'nonUniformityPercent')).toBeWithinRelative(v(asMap, 'nonUniformityPercent') as number, 1e-12);
    expect(v(r, 'resistivityOhmCm')).toBeWithinRelative(v(asMap, 'mean') as number, 1e-12);
    expect(v(r, 'verdict')).toBeDefined();
    expect((r.picture as WaferMapPicture).kind).toBe('waferMap');
    expect((r.picture as WaferMapPicture).title).toContain('LOT-A17');
    const lot = (await handle('lot LOT-A17', ctx)) as ReplyOk;
    const wafers = lot.sections?.find((s) => s.heading === 'Wafers');
    expect(JSON.stringify(wafers)).toContain('49 (map #');
  });

  it('draws a recorded map again from its stored sites: `map <lot> w<n>` with no file', async () => {
    const ctx = testContext({ attachment: demoFile('LOT-A17-w06-rs.csv') });
    const recorded = (await handle('record LOT-A17 w6 map thick 725um', ctx)) as ReplyOk;
    expect(recorded.ok).toBe(true);
    const again = (await handle('map LOT-A17 w6', { ...ctx, attachment: undefined })) as ReplyOk;
    if (!again.ok) throw new Error(JSON.stringify(again));
    const v = (reply: ReplyOk, key: string) => reply.values.find((x) => x.key === key)?.value;
    expect(v(again, 'nonUniformityPercent')).toBeWithinRelative(v(recorded, 'nonUniformityPercent') as number, 1e-12);
    expect(v(again, 'siteCount')).toBe(49);
    expect(v(again, 'readingId')).toBe(v(recorded, 'readingId'));
    expect((again.picture as WaferMapPicture).title).toContain('LOT-A17 W06');
    // The same picture as the record's (same sites, same code); only the file's line numbers are
    // not kept (the stored sites are numbered in file order).
    const withoutLines = (p: WaferMapPicture) => ({ ...p, sites: { ...p.sites, line: [] } });
    expect(withoutLines(again.picture as WaferMapPicture)).toEqual(withoutLines(recorded.picture as WaferMapPicture));
    const none = await handle('map LOT-A17 w2', { ...ctx, attachment: undefined });
    expect(none.ok).toBe(false);
    if (!none.ok) {
      expect(none.error.code).toBe('no_map');
      expect(none.error.message).toMatch(/LOT-A17 w2 has no recorded map; maps are recorded for w6/);
    }
  });

  it('flags the demo wafer with the low edge ring as non-uniform (HX-200P limit 3 %)', async () => {
    const ctx = testContext({ attachment: demoFile('LOT-A17-w06-rs.csv') });
    const r = (await handle('record LOT-A17 w6 map thick 725um', ctx)) as ReplyOk;
    expect(r.ok).toBe(true);
    expect(r.title).toContain('non-uniform map');
    expect(r.warnings.map((w) => w.code)).toContain('flag_uniformity_over_limit');
  });

  it('a map far outside the window (a wrong thickness) asks to send the file again with confirm; nothing is stored', async () => {
    const ctx = testContext({ attachment: demoFile('LOT-A17-w04-rs.csv') });
    const before = await ctx.lots!.lot('LOT-A17');
    const r = await handle('record LOT-A17 w4 map thick 72.5um', ctx);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('confirm_reading');
    expect(r.error.message).toMatch(/send the file again with "record LOT-A17 w4 map thick 72.5um confirm"/);
    expect(r.error.choices).toBeUndefined();
    const after = await ctx.lots!.lot('LOT-A17');
    if (before.ok && after.ok) expect(after.value.readings.length).toBe(before.value.readings.length);
    const confirmed = (await handle('record LOT-A17 w4 map thick 72.5um confirm', ctx)) as ReplyOk;
    expect(confirmed.ok).toBe(true);
    expect(confirmed.title).toContain('outside window');
  });

  it.each([
    ['record LOT-A17 w4 map thick 725um', undefined, 'missing_file', /attach the CSV/],
    ['record LOT-A17 w4 map', demoFile('LOT-A17-w04-rs.csv'), 'missing_thickness', /give the thickness/],
    ['record LOT-A17 map thick 725um', demoFile('LOT-A17-w04-rs.csv'), 'missing_wafer', /one wafer/],
    ['record LOT-A17 w4 site 2 map thick 725um', demoFile('LOT-A17-w04-rs.csv'), 'bad_request', /whole wafer/],
    ['record LOT-A17 w4 map rho 9 ohm-cm', demoFile('LOT-A17-w04-rs.csv'), 'bad_request', /not both/],
    ['record LOT-A17 w4 map', { name: 't.csv', text: 'x,y,thickness (um)\n0,0,725\n10,0,726\n' }, 'bad_file', /thickness map/],
  ])('"%s" is refused with the right form, and nothing is stored', async (command, attachment, code, message) => {
    const ctx = testContext(attachment ? { attachment } : {});
    const before = await ctx.lots!.lot('LOT-A17');
    const r = await handle(command, ctx);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe(code);
    expect(r.error.message).toMatch(message);
    const after = await ctx.lots!.lot('LOT-A17');
    if (before.ok && after.ok) expect(after.value.readings.length).toBe(before.value.readings.length);
  });
});
