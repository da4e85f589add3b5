/**
 * Site-to-site spread on the reading's wafer and wafer-to-wafer spread in the lot, against the
 * product's limits, with this reading counted among the lot's current readings.
 */
import {
  siteSpreadScope,
  WAFER_SPREAD_SCOPE,
  type FlagFinding,
} from '../flags.js';
import type { Check } from '../evaluation-types.js';
import type { RecordRequest } from '../readings.js';
import type { Product } from '../spec/schema.js';
import { waferSummaries, waferToWaferSpread, type PlaceValue, type Spread } from '../spread.js';

/** One wafer's site-to-site spread (spot readings or a map's sites) against the product's limit. */
export function siteSpreadCheck(product: Product, wafer: number, s: Spread): { checks: Check[]; findings: FlagFinding[] } {
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  const siteLimit = product.spread?.siteToSitePercent;
  if (siteLimit === undefined) return { checks, findings };
  const status = s.spreadPercent > siteLimit ? 'fail' : 'pass';
  checks.push({ check: 'site_spread', wafer, spreadPercent: s.spreadPercent, limitPercent: siteLimit, count: s.count, status });
  if (status === 'fail') {
    findings.push({
      code: 'spread_over_limit',
      scope: siteSpreadScope(wafer),
      wafer,
      detail: {
        code: 'spread_over_limit',
        across: 'sites',
        wafer,
        spreadPercent: s.spreadPercent,
        limitPercent: siteLimit,
        definition: product.spread!.definition,
        minOhmCm: s.minOhmCm,
        maxOhmCm: s.maxOhmCm,
        count: s.count,
      },
    });
  }
  return { checks, findings };
}

export function spreadChecks(
  product: Product,
  request: RecordRequest,
  rho: number,
  currentPoints: readonly PlaceValue[],
): { checks: Check[]; findings: FlagFinding[] } {
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  if (!product.spread || request.wafer === undefined) return { checks, findings };
  const definition = product.spread.definition;
  const points: PlaceValue[] = [
    ...currentPoints,
    { wafer: request.wafer, ...(request.site !== undefined ? { site: request.site } : {}), resistivityOhmCm: rho, readingId: Number.MAX_SAFE_INTEGER },
  ];
  const wafers = waferSummaries(points, definition);
  const mine = wafers.find((w) => w.wafer === request.wafer);
  if (mine?.siteSpread && request.site !== undefined) {
    const site = siteSpreadCheck(product, request.wafer, mine.siteSpread);
    checks.push(...site.checks);
    findings.push(...site.findings);
  }
  const waferLimit = product.spread.waferToWaferPercent;
  const w2w = waferToWaferSpread(wafers, definition);
  if (waferLimit !== undefined && w2w) {
    const status = w2w.spreadPercent > waferLimit ? 'fail' : 'pass';
    checks.push({ check: 'wafer_spread', spreadPercent: w2w.spreadPercent, limitPercent: waferLimit, count: w2w.count, status });
    if (status === 'fail') {
      findings.push({
        code: 'spread_over_limit',
        scope: WAFER_SPREAD_SCOPE,
        detail: {
          code: 'spread_over_limit',
          across: 'wafers',
          spreadPercent: w2w.spreadPercent,
          limitPercent: waferLimit,
          definition,
          minOhmCm: w2w.minOhmCm,
          maxOhmCm: w2w.maxOhmCm,
          count: w2w.count,
        },
      });
    }
  }
  return { checks, findings };
}
