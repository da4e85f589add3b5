/**
 * The product-window check: a value inside [min, max] passes, with its margin to the nearest
 * limit in % of that limit; outside fails, with how far past the limit it is in % of it.
 */
import type { Check, LotNote } from '../evaluation-types.js';
import type { FlagFinding } from '../flags.js';
import type { Product, SpecWindow } from '../spec/schema.js';
import type { CheckOutput, FindingPlace } from './conversion.js';

export function windowCheck(
  quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3',
  value: number,
  window: SpecWindow,
): Extract<Check, { check: 'window' }> {
  if (value > window.max) {
    return { check: 'window', quantity, value, min: window.min, max: window.max, status: 'fail', limit: 'max', marginPercent: ((value - window.max) / window.max) * 100 };
  }
  if (value < window.min) {
    return { check: 'window', quantity, value, min: window.min, max: window.max, status: 'fail', limit: 'min', marginPercent: ((window.min - value) / window.min) * 100 };
  }
  const toMin = ((value - window.min) / window.min) * 100;
  const toMax = ((window.max - value) / window.max) * 100;
  return toMin <= toMax
    ? { check: 'window', quantity, value, min: window.min, max: window.max, status: 'pass', limit: 'min', marginPercent: toMin }
    : { check: 'window', quantity, value, min: window.min, max: window.max, status: 'pass', limit: 'max', marginPercent: toMax };
}

/**
 * The product's window (resistivity, or dopant density when the spec is in density) at 23 °C
 * (for a map's mean with `basis` 'map_mean': the product's uniformity mean window if it has one):
 * outside → an `out_of_window` flag; inside but nearer a limit than the product's
 * `nearLimitPercent` → a note.
 */
export function productWindowCheck(product: Product, rho: number, density: number | undefined, where: FindingPlace, basis?: 'map_mean'): CheckOutput {
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  const notes: LotNote[] = [];
  // A map's mean is checked against the product's uniformity mean window when it has one.
  const mapMeanWindow = basis === 'map_mean' ? product.uniformity?.meanOhmCm : undefined;
  const windowQuantity = mapMeanWindow || product.resistivityOhmCm ? 'resistivityOhmCm' : 'dopantDensityPerCm3';
  const window = (mapMeanWindow ?? product.resistivityOhmCm ?? product.dopantDensityPerCm3) as SpecWindow;
  const tag = mapMeanWindow ? { basis: 'map_mean' as const } : {};
  const value = windowQuantity === 'resistivityOhmCm' ? rho : density;
  if (value === undefined) {
    notes.push({ code: 'window_not_checked', reason: 'conversion_refused' });
  } else {
    const w = { ...windowCheck(windowQuantity, value, window), ...tag };
    checks.push(w);
    if (w.status === 'fail') {
      findings.push({
        code: 'out_of_window',
        ...where,
        detail: {
          code: 'out_of_window',
          quantity: windowQuantity,
          value,
          min: window.min,
          max: window.max,
          side: w.limit === 'max' ? 'above' : 'below',
          marginPercent: w.marginPercent,
          ...tag,
        },
      });
    } else if (product.nearLimitPercent !== undefined && w.marginPercent < product.nearLimitPercent) {
      notes.push({
        code: 'near_limit',
        quantity: windowQuantity,
        marginPercent: w.marginPercent,
        limit: w.limit,
        thresholdPercent: product.nearLimitPercent,
      });
    }
  }
  return { checks, findings, notes };
}
