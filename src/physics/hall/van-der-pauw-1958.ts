/**
 * van der Pauw's method: the sheet resistance of a flat sample of any shape, without holes, with
 * four small contacts A, B, C, D on its edge, from two four-terminal resistances
 * R1 = R_AB,CD = V_CD/I_AB and R2 = R_BC,DA = V_DA/I_BC:
 *
 *   exp(−π·R1/Rs) + exp(−π·R2/Rs) = 1
 *
 * L. J. van der Pauw, "A method of measuring specific resistivity and Hall effect of discs of
 * arbitrary shape", Philips Research Reports 13, 1–9 (1958) (docs/references.md). Equivalently
 * Rs = π/ln 2 · (R1 + R2)/2 · f(R1/R2), with cosh(((r − 1)/(r + 1))·ln 2/f) = ½·exp(ln 2/f) — the
 * same paper's form, used by the tests as an independent check. For R1 = R2 = R: Rs = π·R/ln 2.
 *
 * Solved for y = 1/Rs by Brent's method: the left side falls monotonically in y; by the
 * convexity of exp it is at least 1 at y = 2·ln 2/(π·(R1 + R2)), and at most 1 at
 * y = ln 2/(π·min(R1, R2)), so the root is bracketed for every ratio (hence
 * Rs ≤ π/ln 2 · (R1 + R2)/2, f ≤ 1). Validity: contacts small against the sample and on its edge, uniform thickness,
 * no holes. A large ratio R1/R2 is not wrong in itself, but small contact misplacements then
 * move the result more; the reply warns from a ratio of 3 (common practice, no source).
 */
import { brentRoot } from '../numeric/brent.js';
import { checkFinite, checkPositive, refuse, type Outcome, type Refusal } from '../outcome.js';
import type { Problem } from '../problems.js';

/** The ratio R1/R2 (or R2/R1) from which the reply warns about contact placement (common practice, no source). */
export const VDP_RATIO_WARNING = 3;

export interface VanDerPauwResult {
  readonly sheetResistanceOhmPerSq: number;
  /** max(R1, R2)/min(R1, R2). */
  readonly ratio: number;
  /** van der Pauw's correction factor f(R1/R2): Rs = π/ln 2 · (R1 + R2)/2 · f. */
  readonly correctionFactor: number;
  readonly problems: readonly Problem[];
}

export function vanDerPauwSheetResistance(r1Ohm: number, r2Ohm: number): Outcome<VanDerPauwResult> {
  for (const [q, v] of [
    ['resistance1Ohm', r1Ohm],
    ['resistance2Ohm', r2Ohm],
  ] as const) {
    const bad = checkFinite(q, v) ?? checkPositive(q, v);
    if (bad) return refuse(bad);
  }
  const a = Math.PI * r1Ohm;
  const b = Math.PI * r2Ohm;
  const yLo = (2 * Math.LN2) / (a + b);
  const yHi = Math.LN2 / Math.min(a, b);
  const root = brentRoot((y) => Math.exp(-a * y) + Math.exp(-b * y) - 1, yLo, yHi, { xTolerance: yLo * 1e-15, maxIterations: 200 });
  if (!root.converged) {
    const r: Refusal = { code: 'no_solution', quantity: 'sheetResistanceOhmPerSq', model: 'van-der-pauw-1958', status: root.status };
    return refuse(r);
  }
  const rs = 1 / root.x;
  const ratio = Math.max(r1Ohm, r2Ohm) / Math.min(r1Ohm, r2Ohm);
  const problems: Problem[] = ratio >= VDP_RATIO_WARNING ? [{ code: 'contact_asymmetry', ratio, limit: VDP_RATIO_WARNING }] : [];
  return { ok: true, value: { sheetResistanceOhmPerSq: rs, ratio, correctionFactor: rs / ((Math.PI / Math.LN2) * ((r1Ohm + r2Ohm) / 2)), problems } };
}
