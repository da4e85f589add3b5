/**
 * A trend chart as SVG (our own look): each reading against time, lot means joined by a line,
 * the spec window, the individuals-chart control limits (centre and ±3σ), flagged readings
 * filled red, and the points that break a Western Electric rule ringed with the rule's number.
 * Rasterised by png.ts.
 */
import { formatNumber } from '../../reply/format.js';
import type { TrendPicture } from '../../reply/reply.js';
import { dotsPath, INK, n2, niceTicks, svgDocument, text } from './svg.js';

export const TREND_WIDTH = 1000;
export const TREND_HEIGHT = 640;
const PLOT = { x: 90, y: 90, w: 650, h: 420 };
const DAY_MS = 86_400_000;
/** Rule numbers are written over at most this many ringed points. */
const MAX_RULE_LABELS = 40;

function dayTicks(t0: number, t1: number): number[] {
  const span = Math.max(t1 - t0, DAY_MS) / DAY_MS;
  const step = [1, 2, 5, 7, 14, 30, 61, 91, 182, 365].find((s) => span / s <= 8) ?? 365;
  const first = Math.ceil(t0 / DAY_MS) * DAY_MS;
  const out: number[] = [];
  for (let t = first; t <= t1; t += step * DAY_MS) out.push(t);
  return out;
}

export function trendSvg(p: TrendPicture): string {
  const times = p.points.map((q) => Date.parse(q.at));
  const t0 = Math.min(...times);
  const t1 = Math.max(...times);
  const pad = Math.max((t1 - t0) * 0.03, 3_600_000);
  const tMin = t0 - pad;
  const tMax = t1 + pad;
  const values = p.points.map((q) => q.value);
  const bounds = [...values];
  for (const v of [p.spec?.min, p.spec?.max, p.spec?.target, p.control?.lower, p.control?.upper]) if (v !== undefined && Number.isFinite(v)) bounds.push(v);
  let vMin = Math.min(...bounds);
  let vMax = Math.max(...bounds);
  const margin = (vMax - vMin) * 0.08 || Math.abs(vMax) * 0.05 || 1;
  vMin -= margin;
  vMax += margin;
  const toX = (t: number) => PLOT.x + ((t - tMin) / (tMax - tMin)) * PLOT.w;
  const toY = (v: number) => PLOT.y + PLOT.h - ((v - vMin) / (vMax - vMin)) * PLOT.h;

  const parts: string[] = [];
  parts.push(text(30, 40, p.title, { size: 24, weight: 'bold' }));
  parts.push(text(30, 68, `${p.quantityLabel} (${p.unit}) · ${p.points.length} reading${p.points.length === 1 ? '' : 's'} from ${new Date(t0).toISOString().slice(0, 10)} to ${new Date(t1).toISOString().slice(0, 10)}`, { size: 15, fill: INK.muted }));
  parts.push(`<rect x="${PLOT.x}" y="${PLOT.y}" width="${PLOT.w}" height="${PLOT.h}" fill="${INK.paper}" stroke="${INK.frame}" stroke-width="1"/>`);
  for (const v of niceTicks(vMin, vMax, 7)) {
    const y = toY(v);
    if (y < PLOT.y || y > PLOT.y + PLOT.h) continue;
    parts.push(`<line x1="${PLOT.x}" y1="${n2(y)}" x2="${PLOT.x + PLOT.w}" y2="${n2(y)}" stroke="${INK.grid}" stroke-width="1"/>`);
    parts.push(text(PLOT.x - 8, y + 5, formatNumber(v, { sigFigs: 4, trim: true }), { size: 13, anchor: 'end' }));
  }
  for (const t of dayTicks(tMin, tMax)) {
    const x = toX(t);
    parts.push(`<line x1="${n2(x)}" y1="${PLOT.y + PLOT.h}" x2="${n2(x)}" y2="${PLOT.y + PLOT.h + 6}" stroke="${INK.frame}"/>`);
    parts.push(text(x, PLOT.y + PLOT.h + 24, new Date(t).toISOString().slice(5, 10), { size: 13, anchor: 'middle' }));
  }
  parts.push(text(PLOT.x + PLOT.w / 2, PLOT.y + PLOT.h + 48, 'date (UTC, month-day)', { size: 13, anchor: 'middle', fill: INK.muted }));

  const hline = (v: number | undefined, colour: string, dash: string, label: string) => {
    if (v === undefined || !Number.isFinite(v)) return;
    const y = toY(v);
    parts.push(`<line x1="${PLOT.x}" y1="${n2(y)}" x2="${PLOT.x + PLOT.w}" y2="${n2(y)}" stroke="${colour}" stroke-width="2" stroke-dasharray="${dash}"/>`);
    parts.push(text(PLOT.x + PLOT.w + 8, y + 5, `${label} ${formatNumber(v, { sigFigs: 4, trim: true })}`, { size: 13, fill: colour }));
  };
  hline(p.spec?.max, INK.spec, '10 6', 'spec max');
  hline(p.spec?.min, INK.spec, '10 6', 'spec min');
  hline(p.spec?.target, INK.spec, '2 5', 'target');
  hline(p.control?.upper, INK.control, '4 4', 'UCL');
  hline(p.control?.centre, INK.control, '1 0', 'centre');
  hline(p.control?.lower, INK.control, '4 4', 'LCL');

  if (p.lotMeans.length > 1) {
    const d = p.lotMeans.map((m, k) => `${k === 0 ? 'M' : 'L'}${n2(toX(Date.parse(m.at)))},${n2(toY(m.value))}`).join('');
    parts.push(`<path d="${d}" fill="none" stroke="${INK.muted}" stroke-width="1.5"/>`);
  }
  const diamonds = p.lotMeans
    .map((m) => {
      const x = toX(Date.parse(m.at));
      const y = toY(m.value);
      return `M${n2(x - 7)},${n2(y)}L${n2(x)},${n2(y - 7)}L${n2(x + 7)},${n2(y)}L${n2(x)},${n2(y + 7)}Z`;
    })
    .join('');
  if (diamonds) parts.push(`<path d="${diamonds}" fill="${INK.panel}" stroke="${INK.frame}" stroke-width="1.5"/>`);
  const r = p.points.length > 500 ? 2 : 4;
  const plain: [number, number][] = [];
  const flagged: [number, number][] = [];
  const ringed: [number, number][] = [];
  for (const q of p.points) {
    const at: [number, number] = [toX(Date.parse(q.at)), toY(q.value)];
    (q.flagged ? flagged : plain).push(at);
    if (q.rules.length > 0) ringed.push(at);
  }
  // Rule numbers over the rings while they stay readable; beyond that the rings alone (the card
  // lists every break in words).
  if (ringed.length <= MAX_RULE_LABELS) {
    p.points.forEach((q) => {
      if (q.rules.length > 0) parts.push(text(toX(Date.parse(q.at)), toY(q.value) - r - 10, q.rules.join(','), { size: 12, anchor: 'middle', fill: INK.alert, weight: 'bold' }));
    });
  }
  if (plain.length) parts.push(`<path d="${dotsPath(plain, r)}" fill="${INK.frame}"/>`);
  if (flagged.length) parts.push(`<path d="${dotsPath(flagged, r)}" fill="${INK.alert}"/>`);
  if (ringed.length) parts.push(`<path d="${dotsPath(ringed, r + 6)}" fill="none" stroke="${INK.alert}" stroke-width="2"/>`);
  // Legend: one row under the axis.
  const ly = PLOT.y + PLOT.h + 84;
  const legend: [number, string, string][] = [
    [0, `<circle cx="${PLOT.x + 8}" cy="${ly - 5}" r="4" fill="${INK.frame}"/>`, 'reading'],
    [110, `<circle cx="${PLOT.x + 118}" cy="${ly - 5}" r="4" fill="${INK.alert}"/>`, 'flagged reading'],
    [270, `<path d="M${PLOT.x + 271},${ly - 5}L${PLOT.x + 278},${ly - 12}L${PLOT.x + 285},${ly - 5}L${PLOT.x + 278},${ly + 2}Z" fill="${INK.panel}" stroke="${INK.frame}"/>`, 'lot mean'],
    [380, `<circle cx="${PLOT.x + 388}" cy="${ly - 5}" r="8" fill="none" stroke="${INK.alert}" stroke-width="2"/>`, 'Western Electric rule (number above)'],
  ];
  for (const [dx, mark, label] of legend) {
    parts.push(mark);
    parts.push(text(PLOT.x + dx + 22, ly, label, { size: 13, fill: INK.muted }));
  }
  parts.push(text(30, TREND_HEIGHT - 14, 'Control limits: individuals chart, centre ± 3σ with σ = average moving range / 1.128 (Shewhart).', { size: 12, fill: INK.muted }));
  return svgDocument(TREND_WIDTH, TREND_HEIGHT, parts.join(''));
}
