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
import { mapUniformityScope, type FlagFinding } from '../flags.js';
import { spreadOfRange } from '../spread.js';
import { siteSpreadCheck } from './spread.js';
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
  if (product.spread && map.count > 1) {
    const sites = siteSpreadCheck(product, wafer, spreadOfRange(map.minimumOhmCm, map.maximumOhmCm, map.meanOhmCm, map.count, product.spread.definition));
    checks.push(...sites.checks);
    findings.push(...sites.findings);
  }
  return { checks, findings };
}
