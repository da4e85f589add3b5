/**
 * Spread of resistivity across the sites of a wafer and across the wafers of a lot. Pure.
 *
 * Which values count: for each place (wafer, site) the latest current reading (a re-measurement
 * replaces the earlier value there; a corrected reading no longer counts). A wafer's value is
 * the mean of its places. Spread is the range (max − min) in % of the mean ('range-over-mean',
 * the default) or of the minimum ('range-over-min'), as the product spec says.
 */
import type { SpreadDefinition } from './spec/schema.js';

export interface PlaceValue {
  readonly wafer: number;
  readonly site?: number;
  readonly resistivityOhmCm: number;
  readonly readingId: number;
}

export interface Spread {
  readonly spreadPercent: number;
  readonly minOhmCm: number;
  readonly maxOhmCm: number;
  readonly meanOhmCm: number;
  readonly count: number;
}

export function spreadOf(values: readonly number[], definition: SpreadDefinition): Spread | undefined {
  if (values.length < 2) return undefined;
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
    sum += v;
  }
  return spreadOfRange(min, max, sum / values.length, values.length, definition);
}

/** The spread of values known by their minimum, maximum, mean and count (a map's summary). */
export function spreadOfRange(min: number, max: number, mean: number, count: number, definition: SpreadDefinition): Spread {
  const base = definition === 'range-over-min' ? min : mean;
  return { spreadPercent: ((max - min) / base) * 100, minOhmCm: min, maxOhmCm: max, meanOhmCm: mean, count };
}

/**
 * The latest value per place, from resistivity points given in recording order (ascending id).
 * Points without a wafer are lot-level readings and take no part in spread.
 */
export function latestPerPlace(points: readonly PlaceValue[]): PlaceValue[] {
  const byPlace = new Map<string, PlaceValue>();
  for (const p of points) {
    const key = `${p.wafer}/${p.site ?? ''}`;
    const prev = byPlace.get(key);
    if (!prev || prev.readingId < p.readingId) byPlace.set(key, p);
  }
  return [...byPlace.values()].sort((a, b) => a.wafer - b.wafer || (a.site ?? 0) - (b.site ?? 0));
}

export interface WaferSummary {
  readonly wafer: number;
  readonly meanOhmCm: number;
  readonly places: readonly PlaceValue[];
  /** Site-to-site spread, when the wafer has two or more sites. */
  readonly siteSpread?: Spread;
}

export function waferSummaries(points: readonly PlaceValue[], definition: SpreadDefinition): WaferSummary[] {
  const latest = latestPerPlace(points);
  const byWafer = new Map<number, PlaceValue[]>();
  for (const p of latest) {
    const list = byWafer.get(p.wafer) ?? [];
    list.push(p);
    byWafer.set(p.wafer, list);
  }
  const out: WaferSummary[] = [];
  for (const [wafer, places] of [...byWafer.entries()].sort((a, b) => a[0] - b[0])) {
    const values = places.map((p) => p.resistivityOhmCm);
    const mean = values.reduce((s, v) => s + v, 0) / values.length;
    // Site-to-site spread counts the numbered sites only.
    const siteValues = places.filter((p) => p.site !== undefined).map((p) => p.resistivityOhmCm);
    const siteSpread = spreadOf(siteValues, definition);
    out.push({ wafer, meanOhmCm: mean, places, ...(siteSpread ? { siteSpread } : {}) });
  }
  return out;
}

export function waferToWaferSpread(wafers: readonly WaferSummary[], definition: SpreadDefinition): Spread | undefined {
  return spreadOf(
    wafers.map((w) => w.meanOhmCm),
    definition,
  );
}
