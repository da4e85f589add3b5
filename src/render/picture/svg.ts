/**
 * Small helpers for the SVG we write by hand (our own layout): fixed-precision numbers so the
 * same reply gives the same bytes, escaped text, and the one font family the rasteriser loads.
 */

/** The font packed with the project (dejavu-fonts-ttf), loaded by png.ts; no system fonts. */
export const FONT_FAMILY = 'DejaVu Sans';

/** Our palette for the frame of every picture (the data colours come from the colour scale). */
export const INK = {
  text: '#1d2430',
  muted: '#5b6577',
  frame: '#3a4456',
  grid: '#d9dee7',
  paper: '#ffffff',
  panel: '#f4f6f9',
  alert: '#c0392b',
  spec: '#2e7d5b',
  control: '#8a5a00',
} as const;

/** A coordinate with two decimals (deterministic output, small files). */
export function n2(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
}

export function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

export function text(x: number, y: number, content: string, attrs: { size?: number; weight?: 'bold'; anchor?: 'start' | 'middle' | 'end'; fill?: string } = {}): string {
  const a = [`x="${n2(x)}"`, `y="${n2(y)}"`, `font-size="${attrs.size ?? 15}"`, `fill="${attrs.fill ?? INK.text}"`];
  if (attrs.weight) a.push(`font-weight="${attrs.weight}"`);
  if (attrs.anchor && attrs.anchor !== 'start') a.push(`text-anchor="${attrs.anchor}"`);
  return `<text ${a.join(' ')}>${escapeXml(content)}</text>`;
}

export function svgDocument(width: number, height: number, body: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="${FONT_FAMILY}"><rect width="${width}" height="${height}" fill="${INK.paper}"/>${body}</svg>`;
}

/** Evenly spaced "nice" tick values covering [min, max] (1, 2, 2.5, 5 × 10^k steps). */
export function niceTicks(min: number, max: number, target = 6): number[] {
  if (!(max > min)) return [min];
  const raw = (max - min) / target;
  const mag = Math.pow(10, Math.floor(Math.log10(raw)));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(min / step) * step; v <= max + step * 1e-9; v += step) out.push(Number(v.toPrecision(12)));
  return out;
}

/**
 * Many equal dots as one path (a circle per subpath): the rasteriser's cost is per element, so
 * 10 000 site dots drawn as one path take a fraction of the time of 10 000 circles.
 */
export function dotsPath(points: readonly (readonly [number, number])[], r: number): string {
  const d = points.map(([x, y]) => `M${n2(x - r)},${n2(y)}a${r},${r} 0 1,0 ${n2(2 * r)},0a${r},${r} 0 1,0 ${n2(-2 * r)},0`).join('');
  return d;
}
