/**
 * Everything `lot <id>` shows, as data: the product, readings latest first, per-wafer values,
 * spread, spec margins against the current spec, open flags and who recorded what. Pure.
 */
import { windowCheck } from './checks/window.js';
import type { Check } from './evaluation-types.js';
import { isOpen, type StoredFlag } from './flags.js';
import { currentReadings, type StoredReading } from './readings.js';
import type { LotHistory, LotRecord } from './repository.js';
import type { Product, SpecCatalog } from './spec/schema.js';
import { waferSummaries, waferToWaferSpread, type PlaceValue, type Spread } from './spread.js';

export type WindowMargin = Extract<Check, { check: 'window' }>;

export interface WaferView {
  readonly wafer: number;
  readonly meanOhmCm: number;
  readonly placeCount: number;
  readonly siteSpread?: Spread;
  readonly siteLimitPercent?: number;
  /** The place closest to (or furthest past) a window limit, against the current spec. */
  readonly worstMargin?: WindowMargin;
  /** Carrier type(s) found on this wafer by its current type readings. */
  readonly types: readonly ('n' | 'p' | 'indeterminate')[];
  /** The wafer's latest current map reading: its sites and non-uniformity (1σ/mean). */
  readonly map?: { readonly readingId: number; readonly count: number; readonly nonUniformityPercent: number; readonly limitPercent?: number };
}

export interface Contributor {
  readonly name: string;
  readonly readings: number;
  readonly lastAt: string;
}

export interface LotView {
  readonly lot: LotRecord;
  readonly product?: Product;
  /** All readings, latest first (corrected ones included, marked by `supersededBy`). */
  readonly readings: readonly StoredReading[];
  readonly currentCount: number;
  readonly wafers: readonly WaferView[];
  readonly waferSpread?: Spread;
  readonly waferLimitPercent?: number;
  /** Lot-level readings (no wafer) margins. */
  readonly openFlags: readonly StoredFlag[];
  readonly closedFlags: readonly StoredFlag[];
  readonly contributors: readonly Contributor[];
}

export function lotView(history: LotHistory, catalog: SpecCatalog): LotView {
  const product = history.lot.productId !== undefined ? catalog.find(history.lot.productId) : undefined;
  const current = currentReadings(history.readings);
  const definition = product?.spread?.definition ?? 'range-over-mean';
  const points: PlaceValue[] = [];
  for (const r of current) {
    if (r.wafer === undefined || r.resistivityOhmCm === undefined || r.quantity === 'type') continue;
    points.push({ wafer: r.wafer, ...(r.site !== undefined ? { site: r.site } : {}), resistivityOhmCm: r.resistivityOhmCm, readingId: r.id });
  }
  const summaries = waferSummaries(points, definition);
  const byId = new Map(current.map((r) => [r.id, r]));

  const wafers: WaferView[] = summaries.map((w) => {
    let worst: WindowMargin | undefined;
    if (product) {
      for (const place of w.places) {
        const m = marginOf(byId.get(place.readingId), product);
        if (m && (!worst || signed(m) < signed(worst))) worst = m;
      }
    }
    const types = current.filter((r) => r.quantity === 'type' && r.wafer === w.wafer && r.carrierType !== undefined).map((r) => r.carrierType!);
    const mapReading = current.filter((r) => r.wafer === w.wafer && r.evaluation.map !== undefined).sort((a, b) => b.id - a.id)[0];
    const limit = product?.uniformity?.nonUniformityPercentMax;
    return {
      wafer: w.wafer,
      meanOhmCm: w.meanOhmCm,
      placeCount: w.places.length,
      ...(w.siteSpread ? { siteSpread: w.siteSpread } : {}),
      ...(product?.spread?.siteToSitePercent !== undefined ? { siteLimitPercent: product.spread.siteToSitePercent } : {}),
      ...(worst ? { worstMargin: worst } : {}),
      types: [...new Set(types)],
      ...(mapReading?.evaluation.map
        ? { map: { readingId: mapReading.id, count: mapReading.evaluation.map.count, nonUniformityPercent: mapReading.evaluation.map.nonUniformityPercent, ...(limit !== undefined ? { limitPercent: limit } : {}) } }
        : {}),
    };
  });
  // Wafers with only type readings still get a row.
  for (const r of current) {
    if (r.quantity !== 'type' || r.wafer === undefined || wafers.some((w) => w.wafer === r.wafer)) continue;
    const types = current.filter((t) => t.quantity === 'type' && t.wafer === r.wafer && t.carrierType !== undefined).map((t) => t.carrierType!);
    wafers.push({ wafer: r.wafer, meanOhmCm: Number.NaN, placeCount: 0, types: [...new Set(types)] });
  }
  wafers.sort((a, b) => a.wafer - b.wafer);

  const waferSpread = waferToWaferSpread(summaries, definition);
  const contributors = new Map<string, { readings: number; lastAt: string }>();
  for (const r of history.readings) {
    const name = r.actor.userName ?? r.actor.userId;
    const c = contributors.get(name) ?? { readings: 0, lastAt: '' };
    c.readings += 1;
    if (r.recordedAt > c.lastAt) c.lastAt = r.recordedAt;
    contributors.set(name, c);
  }
  return {
    lot: history.lot,
    ...(product ? { product } : {}),
    readings: [...history.readings].sort((a, b) => b.id - a.id),
    currentCount: current.length,
    wafers,
    ...(waferSpread ? { waferSpread } : {}),
    ...(product?.spread?.waferToWaferPercent !== undefined ? { waferLimitPercent: product.spread.waferToWaferPercent } : {}),
    openFlags: history.flags.filter(isOpen).sort((a, b) => b.id - a.id),
    closedFlags: history.flags.filter((f) => !isOpen(f)).sort((a, b) => b.id - a.id),
    contributors: [...contributors.entries()]
      .map(([name, c]) => ({ name, ...c }))
      .sort((a, b) => b.lastAt.localeCompare(a.lastAt)),
  };
}

/** The window margin of one reading against the product's current window. */
export function marginOf(r: StoredReading | undefined, product: Product): WindowMargin | undefined {
  if (!r) return undefined;
  if (product.resistivityOhmCm && r.resistivityOhmCm !== undefined) {
    return windowCheck('resistivityOhmCm', r.resistivityOhmCm, product.resistivityOhmCm);
  }
  if (product.dopantDensityPerCm3 && r.dopantDensityPerCm3 !== undefined) {
    return windowCheck('dopantDensityPerCm3', r.dopantDensityPerCm3, product.dopantDensityPerCm3);
  }
  return undefined;
}

/** Margin with a sign: positive inside the window, negative outside. */
function signed(m: WindowMargin): number {
  return m.status === 'pass' ? m.marginPercent : -m.marginPercent;
}
