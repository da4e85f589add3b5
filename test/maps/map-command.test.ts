/**
 * `map`: statistics of a measurement file, per-site conversion, and the errors of bad files.
 *
 * Statistics check: NIST StRD NumAcc2 (certified mean 1.2, s = 0.1) laid on 1001 sites, so the
 * map's figures are checked against certified values: non-uniformity = 100·0.1/1.2 = 8.333 % and
 * range non-uniformity = 100·(1.3 − 1.1)/(2·1.2) = 8.333 %. Tolerance 1e-9 relative (double
 * arithmetic on 1001 values; the certified values are exact in decimal).
 * Per-site conversion check: each site against the single-value path of the core (ASTM F723 by
 * `convertResistivityToDensity`, Uhlir's F(t/s)), to 1e-12 relative: the batch path must give the
 * same numbers as the path `rho` and `sheet` use.
 */
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { thicknessCorrectionFactor } from '../../src/physics/four-point/uhlir-1955-thickness.js';
import { convertResistivityToDensity } from '../../src/physics/resistivity/convert.js';
import type { Reply, ReplyOk, WaferMapPicture } from '../../src/reply/reply.js';
import { toJson } from '../../src/render/json.js';
import { JsonReply } from '../../src/render/json-schema.js';
import { testContext } from '../helpers/context.js';
import { csv, numAcc2, spiralSites } from './support.js';

async function mapWith(text: string, fileText: string, name = 'w.csv'): Promise<Reply> {
  return handle(text, testContext({ attachment: { name, text: fileText } }));
}

function value(r: Reply, key: string): number {
  if (!r.ok) throw new Error(r.error.message);
  const v = r.values.find((x) => x.key === key);
  if (!v) throw new Error(`no ${key}`);
  return v.value as number;
}

function errorOf(r: Reply): string {
  if (r.ok) throw new Error('expected an error reply');
  return r.error.message;
}

describe('map statistics (NIST StRD NumAcc2 on 1001 sites)', () => {
  const values = numAcc2();
  const file = csv('rs (ohm/sq)', spiralSites(values.length, 140), (i) => values[i]!);
  it('gives the certified mean and standard deviation and both non-uniformity figures', async () => {
    const r = await mapWith('map diam 300mm edge 0mm', file);
    const rel = (a: number, b: number) => Math.abs(a / b - 1);
    expect(value(r, 'siteCount')).toBe(1001);
    expect(rel(value(r, 'mean'), 1.2)).toBeLessThan(1e-9);
    expect(rel(value(r, 'standardDeviation'), 0.1)).toBeLessThan(1e-9);
    expect(rel(value(r, 'nonUniformityPercent'), 100 / 12)).toBeLessThan(1e-9);
    expect(rel(value(r, 'rangeNonUniformityPercent'), 100 / 12)).toBeLessThan(1e-9);
    expect(value(r, 'minimum')).toBeCloseTo(1.1, 12);
    expect(value(r, 'maximum')).toBeCloseTo(1.3, 12);
    const ok = r as ReplyOk;
    expect(ok.values.find((v) => v.key === 'mean')!.unit).toBe('Ω/□');
    expect(ok.cautions.join(' ')).toMatch(/controlled procedure/);
  });
  it('leaves the sites beyond the edge exclusion out of the statistics and says how many were used', async () => {
    const r = (await mapWith('map diam 300mm edge 50mm', file)) as ReplyOk;
    const pic = r.picture as WaferMapPicture;
    const inside = pic.sites.xMm.filter((x, i) => Math.hypot(x, pic.sites.yMm[i]!) <= 100).length;
    expect(value(r, 'siteCount')).toBe(inside);
    expect(pic.sites.included.filter(Boolean).length).toBe(inside);
    expect(r.sections![0]!.lines!.join(' ')).toContain(`${inside} sites`);
  });
  it('puts every site in the JSON reply, which the contract schema accepts', async () => {
    const r = await mapWith('map diam 300mm', file);
    const json = toJson(r);
    expect(JsonReply.safeParse(json).success).toBe(true);
    expect((json['picture'] as WaferMapPicture).sites.value).toHaveLength(1001);
  });
});

describe('per-site conversion', () => {
  const sites = spiralSites(150, 95);
  const rs = (i: number) => Number((40 + 10 * Math.sin(i)).toFixed(3));
  it('ρ = Rs·t·F(t/s) and N by ASTM F723 at every site, as the single conversion gives', async () => {
    const r = (await mapWith('map thick 525um spacing 1mm p diam 200mm show density', csv('rs (ohm/sq)', sites, rs))) as ReplyOk;
    expect(r.ok).toBe(true);
    const pic = r.picture as WaferMapPicture;
    const F = thicknessCorrectionFactor(0.0525 / 0.1);
    for (let i = 0; i < sites.length; i++) {
      const rho = rs(i) * 0.0525 * F;
      expect(Math.abs(pic.sites.resistivityOhmCm![i]! / rho - 1)).toBeLessThan(1e-12);
      const single = convertResistivityToDensity({ resistivityOhmCm: rho, dopant: 'boron' });
      if (!single.ok) throw new Error('conversion refused');
      expect(Math.abs(pic.sites.dopantDensityPerCm3![i]! / single.value.dopantDensityPerCm3 - 1)).toBeLessThan(1e-12);
    }
    expect(r.values.find((v) => v.key === 'mean')!.unit).toBe('cm⁻³');
  });
  it('reads V/I pairs with semicolons and decimal commas: Rs = (π/ln2)·V/I', async () => {
    const text = 'site;x (mm);y (mm);v (mV);i (mA)\n1;0;0;2,5;1\n2;10,5;0;2,6;1\n3;0;10,5;2,7;1\n';
    const r = (await mapWith('map diam 100mm', text)) as ReplyOk;
    const pic = r.picture as WaferMapPicture;
    expect(pic.sites.xMm[1]).toBe(10.5);
    expect(pic.sites.sheetResistanceOhmPerSq![0]! / ((Math.PI / Math.LN2) * 2.5e-3 / 1e-3) - 1).toBeCloseTo(0, 12);
  });
  it('asks about a lone capital P instead of guessing a type', async () => {
    const r = await mapWith('map thick 525um P', csv('rs (ohm/sq)', sites, rs));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.choices?.length).toBeGreaterThanOrEqual(2);
  });
  it('does not state a dopant density without a type', async () => {
    const r = await mapWith('map thick 525um show density', csv('rs (ohm/sq)', sites, rs));
    expect(errorOf(r)).toMatch(/type or dopant/);
  });
});

describe('bad measurement files get the line and the problem', () => {
  const cases: [string, string, RegExp][] = [
    ['a row with a field missing', 'x,y,rs\n0,0,40\n10,0\n', /line 3: this row has a different number of fields/],
    ['a value that is not a number', 'x,y,rs\n0,0,40\n10,0,4o\n', /line 3: the "rs" value "4o" is not a number/],
    ['a decimal comma between commas', 'x,y,rs\n0,0,"40,5"\n', /line 2: .*decimal commas need semicolons/],
    ['no x column', 'pos,y,rs\n0,0,40\n', /line 1: the header needs x and y/],
    ['no measured column', 'x,y,notes\n0,0,ok\n', /line 1: no measured column/],
    ['two measured columns', 'x,y,rs,rho\n0,0,40,2\n', /line 1: one measured quantity per file/],
    ['a value column with no unit', 'x,y,value\n0,0,40\n', /line 1: the column "value" has no unit/],
    ['a negative value', 'x,y,rs\n0,0,-40\n', /line 2: .*must be above zero/],
    ['an unclosed quote', 'x,y,rs\n0,0,"40\n', /line 2: a quoted field is never closed/],
    ['a header only', 'x,y,rs\n', /line 1: the file has a header but no sites/],
    ['an empty file', '\n\n', /the file is empty/],
    ['two wafers', 'x,y,rs,wafer\n0,0,40,W01\n1,1,41,W02\n', /one wafer per file/],
    // Line numbers past comments and blank lines, counted by us (plain file) and by csv-parse
    // (a quoted header, or a '#' inside a line, sends the file to csv-parse's own counting).
    ['a bad value after comments and blank lines', '# tool 4PP-2\nx,y,rs\n\n0,0,40\n# re-probe\n\n10,0,4o\n', /line 7: the "rs" value "4o" is not a number/],
    ['the same with a quoted header', '# tool 4PP-2\n"x",y,rs\n\n0,0,40\n# re-probe\n\n10,0,4o\n', /line 7: the "rs" value "4o" is not a number/],
    ['the same with a trailing comment', '# tool 4PP-2\nx,y,rs\n\n0,0,40 # centre\n# re-probe\n\n10,0,4o\n', /line 7: the "rs" value "4o" is not a number/],
  ];
  for (const [what, text, message] of cases) {
    it(what, async () => {
      const r = await mapWith('map', text, 'bad.csv');
      expect(errorOf(r)).toMatch(message);
      expect(errorOf(r)).toContain('bad.csv');
      if (!r.ok) expect(r.error.usage).toMatch(/^map /);
    });
  }
  it('more than 10 000 sites: refused at the line of the 10 001st', async () => {
    const sites = spiralSites(10_001, 140);
    const r = await mapWith('map', csv('rs', sites, () => 40));
    expect(errorOf(r)).toMatch(/line 10002: 10001 sites: a map takes at most 10,000/);
  });
  it('sites outside the wafer: refused with their line numbers', async () => {
    const r = await mapWith('map diam 100mm', 'x,y,rs\n0,0,40\n60,0,41\n0,10,42\n-55,-10,43\n');
    expect(errorOf(r)).toMatch(/2 sites lie outside the 100 mm wafer .*lines 3, 5/);
  });
  it('no file: says how to attach one', async () => {
    const r = await handle('map thick 525um p', testContext());
    expect(errorOf(r)).toMatch(/attach the CSV.*--file wafer\.csv/s);
  });
  it('a value column takes the unit from the command', async () => {
    const r = await mapWith('map unit ohm/sq diam 100mm', 'x,y,value\n0,0,40\n10,0,41\n0,10,42\n');
    expect(value(r, 'mean')).toBeCloseTo(41, 12);
  });
});
