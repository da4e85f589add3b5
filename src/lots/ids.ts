/**
 * Lot ids, wafer and site numbers. Lot ids follow the fab's own scheme (LOT_PATTERN, a regular
 * expression over the upper-cased id); the default fits the demo fab's 'LOT-A17', 'LOT-B204'.
 */

export const DEFAULT_LOT_PATTERN = '^LOT-[A-Z][0-9]{1,5}$';
/** An example that matches the default pattern, for error messages. */
export const DEFAULT_LOT_EXAMPLE = 'LOT-A17';

/** Wafers in a lot: a 25- or 50-slot carrier. */
export const WAFER_MIN = 1;
export const WAFER_MAX = 50;
/** Sites on a wafer map (5, 9, 49, 121… points). */
export const SITE_MIN = 1;
export const SITE_MAX = 999;

export interface LotIdRule {
  readonly pattern: RegExp;
  readonly source: string;
  readonly example: string;
}

export function lotIdRule(source: string = DEFAULT_LOT_PATTERN, example: string = DEFAULT_LOT_EXAMPLE): LotIdRule {
  return { pattern: new RegExp(source), source, example };
}

/** Upper-cased, trimmed lot id if it fits the rule; undefined otherwise. */
export function normalizeLotId(text: string, rule: LotIdRule): string | undefined {
  const id = text.trim().toUpperCase();
  if (id.length === 0 || id.length > 64) return undefined;
  return rule.pattern.test(id) ? id : undefined;
}

/** 'w3' → 3; 'w03' → 3; undefined when not a wafer token or out of range. */
export function parseWaferToken(token: string): number | undefined {
  const m = /^w(?:afer)?[-#]?(\d{1,3})$/i.exec(token);
  if (!m) return undefined;
  const n = Number(m[1]);
  return n >= WAFER_MIN && n <= WAFER_MAX ? n : undefined;
}

export function isWaferNumber(n: number): boolean {
  return Number.isInteger(n) && n >= WAFER_MIN && n <= WAFER_MAX;
}

export function isSiteNumber(n: number): boolean {
  return Number.isInteger(n) && n >= SITE_MIN && n <= SITE_MAX;
}

/** 'w3 s2', 'w3', 'lot' — the place a reading or flag refers to, for people. */
export function placeLabel(wafer: number | undefined, site: number | undefined): string {
  if (wafer === undefined) return site === undefined ? 'lot' : `site ${site}`;
  return site === undefined ? `w${wafer}` : `w${wafer} site ${site}`;
}
