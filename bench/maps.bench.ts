/**
 * `npm run bench:maps` (issue 12): a measurement file through parse → per-site conversion →
 * statistics → picture, at 10 000 and 150 sites, and a trend chart of 2 000 readings. Targets:
 * 10 000 sites < 0.3 s, 150 sites < 50 ms, trend of 2 000 readings < 0.2 s; peak memory printed.
 * Each case: 3 warm-up runs, then the median of 7 (the machine is shared).
 * Invented data (a dome-shaped map, a drifting process) — for timing only.
 */
import { analyseMap } from '../src/commands/map-analysis.js';
import { readMeasurementFile } from '../src/commands/measurement-file.js';
import { individualsLimits } from '../src/physics/statistics/shewhart-individuals.js';
import { westernElectricBreaks } from '../src/physics/statistics/western-electric-1956.js';
import type { TrendPicture } from '../src/reply/reply.js';
import { rasterise } from '../src/render/picture/png.js';
import { trendSvg } from '../src/render/picture/trend.js';
import { waferMapSvg } from '../src/render/picture/wafer-map.js';

function mapFile(count: number): string {
  const golden = Math.PI * (3 - Math.sqrt(5));
  let text = 'site,x (mm),y (mm),rs (ohm/sq)\n';
  for (let i = 0; i < count; i++) {
    const r = 145 * Math.sqrt((i + 0.5) / count);
    const x = r * Math.cos(i * golden);
    const y = r * Math.sin(i * golden);
    const rs = 52 * (1 + 0.02 * (r / 150) ** 2 + 0.004 * Math.sin(i));
    text += `${i + 1},${x.toFixed(3)},${y.toFixed(3)},${rs.toFixed(4)}\n`;
  }
  return text;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

function time<T>(fn: () => T): [T, number] {
  const t = performance.now();
  const out = fn();
  return [out, performance.now() - t];
}

async function benchMap(count: number): Promise<Record<string, number>> {
  const text = mapFile(count);
  const stages: Record<string, number[]> = { parse: [], convert_and_statistics: [], svg: [], png: [], total: [] };
  for (let run = 0; run < 10; run++) {
    const t0 = performance.now();
    const file = await readMeasurementFile('bench.csv', text);
    const parse = performance.now() - t0;
    const [analysis, analyse] = time(() => analyseMap(file, { thicknessCm: 0.0725, spacingCm: 0.1, dopant: 'phosphorus', diameterMm: 300, show: 'density' }));
    const [svg, svgMs] = time(() => waferMapSvg(analysis.picture));
    const [, pngMs] = time(() => rasterise(svg));
    if (run < 3) continue;
    stages.parse!.push(parse);
    stages.convert_and_statistics!.push(analyse);
    stages.svg!.push(svgMs);
    stages.png!.push(pngMs);
    stages.total!.push(parse + analyse + svgMs + pngMs);
  }
  return Object.fromEntries(Object.entries(stages).map(([k, v]) => [k, median(v)]));
}

function benchTrend(count: number): Record<string, number> {
  const start = Date.parse('2026-09-01T06:00:00Z');
  const values = Array.from({ length: count }, (_, i) => 10 + 0.4 * Math.sin(i / 17) + 0.2 * Math.cos(i * 1.7) + (i > count * 0.8 ? 0.3 : 0));
  const stages: Record<string, number[]> = { limits_and_rules: [], svg: [], png: [], total: [] };
  for (let run = 0; run < 10; run++) {
    const [picture, limitsMs] = time((): TrendPicture => {
      const limits = individualsLimits(values)!;
      const breaks = westernElectricBreaks(values, limits.centre, limits.sigma);
      const rules = new Map<number, number[]>();
      for (const b of breaks) rules.set(b.index, [...(rules.get(b.index) ?? []), b.rule]);
      return {
        kind: 'trend',
        title: 'Trend: product BX-300N, last 90 days',
        quantityLabel: 'Resistivity',
        unit: 'Ω·cm',
        points: values.map((v, i) => ({ at: new Date(start + i * 3_888_000).toISOString(), value: v, label: `LOT-${Math.floor(i / 25)} w${(i % 25) + 1}`, lot: `LOT-${Math.floor(i / 25)}`, flagged: v > 10.6, rules: rules.get(i) ?? [] })),
        lotMeans: Array.from({ length: Math.ceil(count / 25) }, (_, k) => ({ lot: `LOT-${k}`, at: new Date(start + (k * 25 + 24) * 3_888_000).toISOString(), value: values.slice(k * 25, k * 25 + 25).reduce((a, b) => a + b, 0) / Math.min(25, count - k * 25) })),
        spec: { min: 9, max: 11 },
        control: { centre: limits.centre, lower: limits.lower, upper: limits.upper },
      };
    });
    const [svg, svgMs] = time(() => trendSvg(picture));
    const [, pngMs] = time(() => rasterise(svg));
    if (run < 3) continue;
    stages.limits_and_rules!.push(limitsMs);
    stages.svg!.push(svgMs);
    stages.png!.push(pngMs);
    stages.total!.push(limitsMs + svgMs + pngMs);
  }
  return Object.fromEntries(Object.entries(stages).map(([k, v]) => [k, median(v)]));
}

function print(name: string, r: Record<string, number>, targetMs: number): void {
  const parts = Object.entries(r).map(([k, v]) => `${k} ${v.toFixed(1)} ms`);
  console.log(`${name.padEnd(30)} ${parts.join(' · ')}  (target < ${targetMs} ms: ${r['total']! < targetMs ? 'met' : 'NOT met'})`);
}

console.log(`shiftprobe map and trend benchmark — Node ${process.version}, ${process.platform}/${process.arch}, median of 7 after 3 warm-up runs`);
print('map, 10 000 sites (file → PNG)', await benchMap(10_000), 300);
print('map, 150 sites (file → PNG)', await benchMap(150), 50);
print('trend, 2 000 readings (→ PNG)', benchTrend(2_000), 200);
console.log(`peak memory (max RSS of this process): ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
