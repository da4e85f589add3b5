/**
 * The checks of a recorded wafer map against the product spec:
 *  - non-uniformity 1σ/mean of the site resistivities against `uniformity.nonUniformityPercentMax`
 *    (flag `uniformity_over_limit`, one per wafer);
 *  - site-to-site spread of the map's sites against `spread.siteToSitePercent`, with the product's
 *    spread definition (the same flag as spot readings raise: `spread_over_limit` on the wafer's
 *    sites).
 * The map's mean against a window is the window check (checks/window.ts), with the uniformity
 * mean window when the product has one.
 */
import type { Check, MapSummary } from '../evaluation-types.js';
import { mapUniformityScope, siteSpreadScope, type FlagFinding } from '../flags.js';
import type { Product } from '../spec/schema.js';

export function uniformityChecks(product: Product, wafer: number, map: MapSummary): { checks: Check[]; findings: FlagFinding[] } {
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  const limit = product.uniformity?.nonUniformityPercentMax;
  if (limit !== undefined && Number.isFinite(map.nonUniformityPercent)) {
    const status = map.nonUniformityPercent > limit ? 'fail' : 'pass';
    checks.push({ check: 'uniformity', wafer, nonUniformityPercent: map.nonUniformityPercent, limitPercent: limit, count: map.count, status });
    if (status === 'fail') {
      findings.push({
        code: 'uniformity_over_limit',
        scope: mapUniformityScope(wafer),
        wafer,
        detail: { code: 'uniformity_over_limit', wafer, nonUniformityPercent: map.nonUniformityPercent, limitPercent: limit, count: map.count },
      });
    }
  }
  const siteLimit = product.spread?.siteToSitePercent;
  if (siteLimit !== undefined && map.count > 1) {
    const definition = product.spread!.definition;
    const base = definition === 'range-over-min' ? map.minimumOhmCm : map.meanOhmCm;
    const spreadPercent = (100 * (map.maximumOhmCm - map.minimumOhmCm)) / base;
    const status = spreadPercent > siteLimit ? 'fail' : 'pass';
    checks.push({ check: 'site_spread', wafer, spreadPercent, limitPercent: siteLimit, count: map.count, status });
    if (status === 'fail') {
      findings.push({
        code: 'spread_over_limit',
        scope: siteSpreadScope(wafer),
        wafer,
        detail: {
          code: 'spread_over_limit',
          across: 'sites',
          wafer,
          spreadPercent,
          limitPercent: siteLimit,
          definition,
          minOhmCm: map.minimumOhmCm,
          maxOhmCm: map.maximumOhmCm,
          count: map.count,
        },
      });
    }
  }
  return { checks, findings };
}
