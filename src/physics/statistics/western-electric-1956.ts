/**
 * The Western Electric rules for a control chart: Western Electric Co., Statistical Quality
 * Control Handbook (1956), as given in D. C. Montgomery, Introduction to Statistical Quality
 * Control, 6th ed. (2009), §5.3.6. A point breaks
 *   rule 1: it lies beyond 3σ from the centre line;
 *   rule 2: it is the second of two out of three successive points beyond 2σ on the same side;
 *   rule 3: it is the fourth of four out of five successive points beyond 1σ on the same side;
 *   rule 4: it is the eighth of eight successive points on the same side of the centre line.
 * A point is marked at the point that completes the pattern (the rule's window ends there).
 */

export const WESTERN_ELECTRIC_CITATION = 'Western Electric Co., Statistical Quality Control Handbook (1956); rules as in Montgomery (2009) §5.3.6';

export type WesternElectricRule = 1 | 2 | 3 | 4;

export const WESTERN_ELECTRIC_RULE_TEXT: Readonly<Record<WesternElectricRule, string>> = {
  1: 'beyond the 3σ control limit',
  2: '2 of 3 successive points beyond 2σ on one side',
  3: '4 of 5 successive points beyond 1σ on one side',
  4: '8 successive points on one side of the centre line',
};

export interface RuleBreak {
  /** Index of the point that completes the pattern. */
  readonly index: number;
  readonly rule: WesternElectricRule;
  /** +1 above the centre line, −1 below. */
  readonly side: 1 | -1;
}

/** Count of points in values[end−window+1..end] beyond `sigmas`·σ on `side`. */
function beyond(z: readonly number[], end: number, window: number, sigmas: number, side: 1 | -1): number {
  let count = 0;
  for (let j = Math.max(0, end - window + 1); j <= end; j++) if (side * z[j]! > sigmas) count++;
  return count;
}

/** Every rule break of values (time order) against a centre line and σ. */
export function westernElectricBreaks(values: ArrayLike<number>, centre: number, sigma: number): RuleBreak[] {
  const out: RuleBreak[] = [];
  if (!(sigma > 0)) return out;
  const z: number[] = [];
  for (let i = 0; i < values.length; i++) z.push((values[i]! - centre) / sigma);
  for (let i = 0; i < z.length; i++) {
    for (const side of [1, -1] as const) {
      const here = side * z[i]!;
      if (here > 3) out.push({ index: i, rule: 1, side });
      if (i >= 1 && here > 2 && beyond(z, i, 3, 2, side) >= 2) out.push({ index: i, rule: 2, side });
      if (i >= 3 && here > 1 && beyond(z, i, 5, 1, side) >= 4) out.push({ index: i, rule: 3, side });
      if (i >= 7 && beyond(z, i, 8, 0, side) === 8) out.push({ index: i, rule: 4, side });
    }
  }
  return out;
}
