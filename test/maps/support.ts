/** Measurement files for the map tests, made in code (positions on a Fermat spiral inside a wafer). */
export function spiralSites(count: number, radiusMm: number): [number, number][] {
  const golden = Math.PI * (3 - Math.sqrt(5));
  const out: [number, number][] = [];
  for (let i = 0; i < count; i++) {
    const r = radiusMm * Math.sqrt((i + 0.5) / count);
    out.push([Number((r * Math.cos(i * golden)).toFixed(3)), Number((r * Math.sin(i * golden)).toFixed(3))]);
  }
  return out;
}

/** A CSV with x, y and one measured column. */
export function csv(header: string, sites: readonly (readonly [number, number])[], value: (i: number, x: number, y: number) => number | string): string {
  return `x (mm),y (mm),${header}\n` + sites.map(([x, y], i) => `${x},${y},${value(i, x, y)}`).join('\n') + '\n';
}

/**
 * NIST StRD NumAcc2 (univariate summary statistics): 1.2, then 500 pairs 1.1, 1.3 — certified
 * mean 1.2 and standard deviation 0.1 (pattern from memory; the certified values follow from it).
 */
export function numAcc2(): number[] {
  const out = [1.2];
  for (let i = 0; i < 500; i++) out.push(1.1, 1.3);
  return out;
}
