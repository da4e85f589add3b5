/**
 * The wafer-map picture: a valid PNG, wide enough for a phone, the same bytes for the same
 * input, the measured area coloured by the scale (d3-scale-chromatic's cividis) and nothing
 * coloured where nothing was measured. Pixels are read back by decoding the PNG (pngjs).
 */
import { PNG } from 'pngjs';
import { interpolateCividis } from 'd3-scale-chromatic';
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import type { ReplyOk } from '../../src/reply/reply.js';
import { replyPng } from '../../src/render/picture/png.js';
import { INK } from '../../src/render/picture/svg.js';
import { WAFER_MAP_WIDTH } from '../../src/render/picture/wafer-map.js';
import { testContext } from '../helpers/context.js';
import { csv, spiralSites } from './support.js';

// The map's frame (wafer-map.ts): a 640 px square at (30, 86) holds the wafer.
const MAP = { x: 30, y: 86, size: 640 };

async function mapReply(text: string, fileText: string): Promise<ReplyOk> {
  const r = await handle(text, testContext({ attachment: { name: 'w.csv', text: fileText } }));
  if (!r.ok) throw new Error(r.error.message);
  return r;
}

function pixel(png: PNG, x: number, y: number): [number, number, number] {
  const i = (Math.round(y) * png.width + Math.round(x)) * 4;
  return [png.data[i]!, png.data[i + 1]!, png.data[i + 2]!];
}

function rgb(css: string): [number, number, number] {
  const m = /rgb\((\d+), (\d+), (\d+)\)/.exec(css) ?? /#(..)(..)(..)/.exec(css);
  if (!m) throw new Error(css);
  return css.startsWith('#') ? [parseInt(m[1]!, 16), parseInt(m[2]!, 16), parseInt(m[3]!, 16)] : [Number(m[1]), Number(m[2]), Number(m[3])];
}

/** Where on the scale a colour sits (the t of the closest cividis colour). */
function scalePosition(c: [number, number, number]): { t: number; distance: number } {
  let best = { t: 0, distance: Number.POSITIVE_INFINITY };
  for (let k = 0; k <= 1000; k++) {
    const s = rgb(interpolateCividis(k / 1000));
    const d = Math.hypot(s[0] - c[0], s[1] - c[1], s[2] - c[2]);
    if (d < best.distance) best = { t: k / 1000, distance: d };
  }
  return best;
}

/** The first point of a 1 mm grid within `radiusMm` that is at least 3 mm from every site. */
function clearOfSites(sites: readonly (readonly [number, number])[], radiusMm: number): [number, number] {
  for (let y = -radiusMm; y <= radiusMm; y++) {
    for (let x = -radiusMm; x <= radiusMm; x++) {
      if (Math.hypot(x, y) > radiusMm) continue;
      if (sites.every(([sx, sy]) => Math.hypot(sx - x, sy - y) >= 3)) return [x, y];
    }
  }
  throw new Error('no clear point');
}

/** Pixel position of a wafer coordinate (mm) on a map of the given diameter. */
function at(xMm: number, yMm: number, diameterMm: number): [number, number] {
  const s = MAP.size / diameterMm;
  return [MAP.x + MAP.size / 2 + xMm * s, MAP.y + MAP.size / 2 - yMm * s];
}

describe('wafer map picture', () => {
  // A tilt in x: Rs = 100 + 0.5·x (mm) over a 200 mm wafer, sites on a spiral to r = 90 mm.
  const sites = spiralSites(400, 90);
  const file = csv('rs (ohm/sq)', sites, (_i, x) => (100 + 0.5 * x).toFixed(4));

  it('is a PNG at least 800 px wide, and the same input gives the same bytes', async () => {
    const r = await mapReply('map diam 200mm', file);
    const a = replyPng(r)!;
    const b = replyPng(await mapReply('map diam 200mm', file))!;
    expect(Buffer.from(a.subarray(0, 8)).toString('hex')).toBe('89504e470d0a1a0a');
    const png = PNG.sync.read(Buffer.from(a));
    expect(png.width).toBe(WAFER_MAP_WIDTH);
    expect(png.width).toBeGreaterThanOrEqual(800);
    expect(Buffer.compare(Buffer.from(a), Buffer.from(b))).toBe(0);
  });

  it('colours a point inside the measured area by the scale at its interpolated value', async () => {
    const r = await mapReply('map diam 200mm edge 0mm', file);
    const png = PNG.sync.read(Buffer.from(replyPng(r)!));
    const values = sites.map(([x]) => 100 + 0.5 * x);
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    // Points between sites (no dot drawn there): the value is linear in x, so the interpolation is exact.
    for (const [x, y] of [[40.3, 3.1], [-52.7, -20.2], [5.5, 61.9]] as const) {
      const [px, py] = at(x, y, 200);
      const c = pixel(png, px, py);
      const found = scalePosition(c);
      // On the scale (not a frame colour), within one of the 14 colour bands of the value.
      expect(found.distance).toBeLessThan(6);
      expect(Math.abs(found.t - (100 + 0.5 * x - lo) / (hi - lo))).toBeLessThanOrEqual(1 / 14 + 0.01);
    }
  });

  it('leaves the wafer outside the measured hull uncoloured', async () => {
    // Sites only in the upper half: the lower half of the wafer shows the panel colour.
    const upper = spiralSites(200, 90).filter(([, y]) => y > 5);
    const r = await mapReply('map diam 200mm', csv('rs (ohm/sq)', upper, (_i, x) => 100 + x));
    const png = PNG.sync.read(Buffer.from(replyPng(r)!));
    const [px, py] = at(10.2, -60.4, 200);
    expect(pixel(png, px, py)).toEqual(rgb(INK.panel));
    const [qx, qy] = at(10.2, 60.4, 200);
    expect(scalePosition(pixel(png, qx, qy)).distance).toBeLessThan(6);
  });

  it('draws a uniform wafer in the middle colour of the scale', async () => {
    const r = await mapReply('map diam 200mm', csv('rs (ohm/sq)', sites, () => 55));
    const png = PNG.sync.read(Buffer.from(replyPng(r)!));
    // A point at least 3 mm (9.6 px) from every site, so no site dot covers it.
    const [x, y] = clearOfSites(sites, 40);
    const [px, py] = at(x, y, 200);
    const c = pixel(png, px, py);
    const mid = rgb(interpolateCividis(0.5));
    expect(Math.hypot(c[0] - mid[0], c[1] - mid[1], c[2] - mid[2])).toBeLessThan(3);
  });
});
