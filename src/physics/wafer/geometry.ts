/**
 * Wafer geometry for site maps: site radius, the wafer edge, edge exclusion and radial bands.
 * Axes are wafer-centred, in mm, with the notch (or primary flat) at the bottom and +y toward the
 * top, +x to the right seen from the front (device) side: the convention of docs/measurement-files.md.
 *
 * Standard diameters: SEMI M1 (Specification for Polished Single Crystal Silicon Wafers) sizes
 * 100, 125, 150, 200 and 300 mm (common practice, no source for the list being complete: 450 mm
 * is specified too and is accepted when given).
 */

export const STANDARD_WAFER_DIAMETERS_MM: readonly number[] = [100, 125, 150, 200, 300, 450];

/** Distance of a site from the wafer centre, mm. */
export function siteRadiusMm(xMm: number, yMm: number): number {
  return Math.hypot(xMm, yMm);
}

/**
 * The smallest standard diameter that holds every site (undefined when even 450 mm does not):
 * the diameter a map is drawn with when none is given (the reply says so).
 */
export function smallestStandardDiameterMm(xMm: Float64Array, yMm: Float64Array): number | undefined {
  let rMax = 0;
  for (let i = 0; i < xMm.length; i++) rMax = Math.max(rMax, siteRadiusMm(xMm[i]!, yMm[i]!));
  return STANDARD_WAFER_DIAMETERS_MM.find((d) => rMax <= d / 2);
}

/** Indexes of sites outside the wafer (radius beyond d/2), ascending. */
export function sitesOutsideWafer(xMm: Float64Array, yMm: Float64Array, diameterMm: number): number[] {
  const out: number[] = [];
  const r = diameterMm / 2;
  for (let i = 0; i < xMm.length; i++) if (siteRadiusMm(xMm[i]!, yMm[i]!) > r + 1e-9) out.push(i);
  return out;
}

/** 1 for a site inside the edge exclusion's inner circle (radius ≤ d/2 − edge), else 0. */
export function insideEdgeExclusion(xMm: Float64Array, yMm: Float64Array, diameterMm: number, edgeExclusionMm: number): Uint8Array {
  const keep = new Uint8Array(xMm.length);
  const r = diameterMm / 2 - edgeExclusionMm;
  for (let i = 0; i < xMm.length; i++) keep[i] = siteRadiusMm(xMm[i]!, yMm[i]!) <= r + 1e-9 ? 1 : 0;
  return keep;
}

export interface RadialBand {
  readonly innerMm: number;
  readonly outerMm: number;
  readonly count: number;
  readonly mean: number;
}

/**
 * Mean of the included sites in equal-width rings from the centre to the edge-exclusion radius
 * (the last ring closed at its outer edge). Rings without sites have count 0 and mean NaN.
 */
export function radialProfile(
  xMm: Float64Array,
  yMm: Float64Array,
  values: Float64Array,
  include: Uint8Array,
  outerRadiusMm: number,
  bands: number,
): RadialBand[] {
  const width = outerRadiusMm / bands;
  const sums = new Float64Array(bands);
  const counts = new Uint32Array(bands);
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!include[i] || Number.isNaN(v)) continue;
    const k = Math.min(Math.floor(siteRadiusMm(xMm[i]!, yMm[i]!) / width), bands - 1);
    sums[k]! += v;
    counts[k]!++;
  }
  const out: RadialBand[] = [];
  for (let k = 0; k < bands; k++) {
    out.push({ innerMm: k * width, outerMm: (k + 1) * width, count: counts[k]!, mean: counts[k]! > 0 ? sums[k]! / counts[k]! : Number.NaN });
  }
  return out;
}
