/**
 * A wafer map as SVG (our own look): the wafer outline with its notch at the bottom, the map
 * filled from the sites, the sites as dots, a colour bar in the value's unit, the statistics and
 * a title. Rasterised by png.ts.
 *
 * Fill method: linear interpolation on the Delaunay triangulation of the sites (d3-delaunay):
 * a grid of 120 × 120 cells over the wafer takes, inside each triangle, the barycentric blend
 * of its three sites; the grid is contoured into 14 equal-width bands (d3-contour) and the
 * bands are clipped to the convex hull of the measured sites (inside the wafer, as every site is), so no colour is
 * drawn where nothing was measured nor beyond the edge. Grid cells outside the hull take the
 * nearest site's value only so that the bands close smoothly at the hull; the clip hides them.
 * Colours: d3-scale-chromatic's cividis, perceptually uniform and readable with the common
 * colour-vision deficiencies.
 */
import { contours } from 'd3-contour';
import { Delaunay } from 'd3-delaunay';
import { interpolateCividis } from 'd3-scale-chromatic';
import { formatNumber } from '../../reply/format.js';
import type { WaferMapPicture } from '../../reply/reply.js';
import { dotsPath, INK, n2, niceTicks, svgDocument, text } from './svg.js';

export const WAFER_MAP_WIDTH = 1000;
export const WAFER_MAP_HEIGHT = 760;
const GRID = 120;
const BANDS = 14;
const MAP = { x: 30, y: 86, size: 640 };

/** Scale colour of a value between lo and hi. */
export function mapColour(value: number, lo: number, hi: number): string {
  const t = hi > lo ? Math.min(Math.max((value - lo) / (hi - lo), 0), 1) : 0.5;
  return interpolateCividis(t);
}

/** Interpolated grid (row-major, y from the top) of the site values; NaN-free. */
function interpolate(delaunay: Delaunay<number>, xs: number[], ys: number[], vs: number[], radius: number): Float64Array {
  const grid = new Float64Array(GRID * GRID).fill(Number.NaN);
  const cell = (2 * radius) / GRID;
  const t = delaunay.triangles;
  // Rasterise each triangle (cell centres inside it get the barycentric blend).
  for (let k = 0; k < t.length; k += 3) {
    const a = t[k]!;
    const b = t[k + 1]!;
    const c = t[k + 2]!;
    const ax = xs[a]!, ay = ys[a]!, bx = xs[b]!, by = ys[b]!, cx = xs[c]!, cy = ys[c]!;
    const det = (by - cy) * (ax - cx) + (cx - bx) * (ay - cy);
    if (Math.abs(det) < 1e-12) continue;
    const i0 = Math.max(0, Math.floor((Math.min(ax, bx, cx) + radius) / cell));
    const i1 = Math.min(GRID - 1, Math.ceil((Math.max(ax, bx, cx) + radius) / cell));
    const j0 = Math.max(0, Math.floor((radius - Math.max(ay, by, cy)) / cell));
    const j1 = Math.min(GRID - 1, Math.ceil((radius - Math.min(ay, by, cy)) / cell));
    for (let j = j0; j <= j1; j++) {
      const py = radius - (j + 0.5) * cell;
      for (let i = i0; i <= i1; i++) {
        const px = -radius + (i + 0.5) * cell;
        const l1 = ((by - cy) * (px - cx) + (cx - bx) * (py - cy)) / det;
        const l2 = ((cy - ay) * (px - cx) + (ax - cx) * (py - cy)) / det;
        const l3 = 1 - l1 - l2;
        if (l1 < -1e-9 || l2 < -1e-9 || l3 < -1e-9) continue;
        grid[j * GRID + i] = l1 * vs[a]! + l2 * vs[b]! + l3 * vs[c]!;
      }
    }
  }
  // Outside the hull: the nearest site (hidden by the hull clip; keeps the contours closed).
  let hint = 0;
  for (let j = 0; j < GRID; j++) {
    for (let i = 0; i < GRID; i++) {
      const g = j * GRID + i;
      if (!Number.isNaN(grid[g]!)) continue;
      hint = delaunay.find(-radius + (i + 0.5) * cell, radius - (j + 0.5) * cell, hint);
      grid[g] = vs[hint]!;
    }
  }
  return grid;
}

function waferOutline(cx: number, cy: number, r: number): string {
  // A notch 3.5° wide at the bottom (drawn slightly larger than life so it reads on a phone).
  const half = (3.5 * Math.PI) / 180;
  const depth = r * 0.035;
  const sx = cx + r * Math.sin(half);
  const sy = cy + r * Math.cos(half);
  const ex = cx - r * Math.sin(half);
  return `M${n2(sx)},${n2(sy)} A${n2(r)},${n2(r)} 0 1 0 ${n2(ex)},${n2(sy)} L${n2(cx)},${n2(cy + r - depth)} Z`;
}

/** Most sites drawn as dots. */
export const DOTS_MAX = 2000;

export function waferMapSvg(p: WaferMapPicture): string {
  const radius = p.diameterMm / 2;
  const scale = MAP.size / p.diameterMm;
  const cx = MAP.x + MAP.size / 2;
  const cy = MAP.y + MAP.size / 2;
  const toX = (x: number) => cx + x * scale;
  const toY = (y: number) => cy - y * scale;

  const xs: number[] = [];
  const ys: number[] = [];
  const vs: number[] = [];
  for (let i = 0; i < p.sites.xMm.length; i++) {
    const v = p.sites.value[i];
    if (v === null || v === undefined) continue;
    xs.push(p.sites.xMm[i]!);
    ys.push(p.sites.yMm[i]!);
    vs.push(v);
  }
  // The colour range is that of the sites in the statistics (edge sites may fall outside: clamped).
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < p.sites.value.length; i++) {
    const v = p.sites.value[i];
    if (v === null || v === undefined || !p.sites.included[i]) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  if (!(hi >= lo)) {
    lo = Math.min(...vs);
    hi = Math.max(...vs);
  }
  const parts: string[] = [];
  parts.push(text(30, 40, p.title, { size: 24, weight: 'bold' }));
  parts.push(text(30, 68, `${p.quantityLabel} (${p.unit}) · ${p.diameterMm} mm wafer, notch down, viewed from the front`, { size: 15, fill: INK.muted }));

  const outline = waferOutline(cx, cy, radius * scale);
  parts.push(`<path d="${outline}" fill="${INK.panel}" stroke="none"/>`);
  if (xs.length >= 3) {
    const delaunay = new Delaunay(Float64Array.from(xs.flatMap((x, i) => [x, ys[i]!])));
    const hull = delaunay.hullPolygon();
    if (hull.length >= 3) {
      const grid = interpolate(delaunay, xs, ys, vs, radius);
      const step = (hi - lo) / BANDS;
      const thresholds = hi > lo ? Array.from({ length: BANDS }, (_, k) => lo + k * step) : [lo];
      const bands = hi > lo ? contours().size([GRID, GRID]).thresholds(thresholds)(Array.from(grid)) : [];
      const cell = MAP.size / GRID;
      const hullPath = hull.map(([x, y], k) => `${k === 0 ? 'M' : 'L'}${n2(toX(x))},${n2(toY(y))}`).join('') + 'Z';
      parts.push(`<defs><clipPath id="measured"><path d="${hullPath}"/></clipPath></defs>`);
      parts.push('<g clip-path="url(#measured)">');
      // A uniform map has no bands: the measured area takes the middle colour of the scale.
      if (!(hi > lo)) parts.push(`<path d="${hullPath}" fill="${mapColour(lo, lo, hi)}"/>`);
      for (const band of hi > lo ? bands : []) {
        const mid = hi > lo ? band.value + step / 2 : lo;
        const d = band.coordinates
          .map((polygon) => polygon.map((ring) => ring.map((pt, k) => `${k === 0 ? "M" : "L"}${n2(MAP.x + pt[0]! * cell)},${n2(MAP.y + pt[1]! * cell)}`).join('') + 'Z').join(''))
          .join('');
        if (d) parts.push(`<path d="${d}" fill="${mapColour(mid, lo, hi)}"/>`);
      }
      parts.push('</g>');
    }
  }
  parts.push(`<path d="${outline}" fill="none" stroke="${INK.frame}" stroke-width="2"/>`);
  if (p.edgeExclusionMm > 0) {
    parts.push(`<circle cx="${n2(cx)}" cy="${n2(cy)}" r="${n2((radius - p.edgeExclusionMm) * scale)}" fill="none" stroke="${INK.muted}" stroke-width="1" stroke-dasharray="6 5"/>`);
  }
  // Sites: small dots (fewer, larger dots on sparse maps); outliers ringed in red; excluded hollow.
  // Above DOTS_MAX sites the dots would cover the map (and cost the rasteriser about 90 ms at
  // 10 000): only the outliers are drawn, and the footer says so.
  const drawDots = p.sites.xMm.length <= DOTS_MAX;
  const dot = p.sites.xMm.length > 400 ? 2 : 3.5;
  const measured: [number, number][] = [];
  const excluded: [number, number][] = [];
  const outliers: [number, number][] = [];
  for (let i = 0; i < p.sites.xMm.length; i++) {
    const at: [number, number] = [toX(p.sites.xMm[i]!), toY(p.sites.yMm[i]!)];
    if (!p.sites.included[i] || p.sites.value[i] === null) excluded.push(at);
    else measured.push(at);
    if (p.sites.outlier[i]) outliers.push(at);
  }
  if (drawDots && excluded.length) parts.push(`<path d="${dotsPath(excluded, dot)}" fill="none" stroke="${INK.muted}" stroke-width="1"/>`);
  if (drawDots && measured.length) parts.push(`<path d="${dotsPath(measured, dot)}" fill="${INK.paper}" stroke="${INK.frame}" stroke-width="0.8"/>`);
  if (outliers.length) parts.push(`<path d="${dotsPath(outliers, dot + 6)}" fill="none" stroke="${INK.alert}" stroke-width="2.5"/>`);

  // Colour bar with ticks in the value's unit.
  const bar = { x: 720, y: 110, w: 28, h: 330 };
  parts.push(text(bar.x, bar.y - 14, `${p.quantityLabel} (${p.unit})`, { size: 15, weight: 'bold' }));
  const steps = 64;
  for (let k = 0; k < steps; k++) {
    const v = hi - ((hi - lo) * (k + 0.5)) / steps;
    parts.push(`<rect x="${bar.x}" y="${n2(bar.y + (bar.h * k) / steps)}" width="${bar.w}" height="${n2(bar.h / steps + 0.6)}" fill="${mapColour(v, lo, hi)}"/>`);
  }
  parts.push(`<rect x="${bar.x}" y="${bar.y}" width="${bar.w}" height="${bar.h}" fill="none" stroke="${INK.frame}" stroke-width="1"/>`);
  const ticks = hi > lo ? niceTicks(lo, hi, 6) : [lo];
  for (const t of ticks) {
    const y = hi > lo ? bar.y + (bar.h * (hi - t)) / (hi - lo) : bar.y + bar.h / 2;
    parts.push(`<line x1="${bar.x + bar.w}" y1="${n2(y)}" x2="${bar.x + bar.w + 6}" y2="${n2(y)}" stroke="${INK.frame}"/>`);
    parts.push(text(bar.x + bar.w + 10, y + 5, formatNumber(t, { sigFigs: 4, trim: true }), { size: 14 }));
  }
  // Statistics panel.
  let y = bar.y + bar.h + 44;
  parts.push(`<rect x="${bar.x - 12}" y="${y - 26}" width="${WAFER_MAP_WIDTH - bar.x - 8}" height="${p.statistics.length * 24 + 64}" fill="${INK.panel}" rx="6"/>`);
  parts.push(text(bar.x, y, 'Statistics', { size: 15, weight: 'bold' }));
  for (const line of p.statistics) {
    y += 24;
    parts.push(text(bar.x, y, line, { size: 14 }));
  }
  y += 30;
  parts.push(`<circle cx="${bar.x + 6}" cy="${y - 5}" r="7" fill="none" stroke="${INK.alert}" stroke-width="2.5"/>`);
  parts.push(text(bar.x + 20, y, 'outlier site (Tukey)', { size: 13, fill: INK.muted }));
  parts.push(
    text(
      30,
      WAFER_MAP_HEIGHT - 14,
      `Filled by linear interpolation between sites (Delaunay); blank where nothing was measured. Dashed: edge exclusion.${drawDots ? '' : ` Sites not drawn above ${DOTS_MAX.toLocaleString('en-US')} (all are in the JSON).`}`,
      { size: 12, fill: INK.muted },
    ),
  );
  return svgDocument(WAFER_MAP_WIDTH, WAFER_MAP_HEIGHT, parts.join(''));
}
