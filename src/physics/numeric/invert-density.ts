/**
 * Inversion of a resistivity law ρ(N) for the dopant density N, by Brent's method in log10 N.
 *
 * Solves ln ρ(10^u) − ln ρ_target = 0 for u = log10 N over a bracket (default 1e10–1e22 cm⁻³).
 * Working in logarithms makes the residual nearly linear in u for ρ ∝ 1/(q·N·μ(N)), so Brent
 * converges in a handful of evaluations over the whole range. ρ(N) must be continuous and
 * should be monotonic (decreasing) for the root to be unique; the mobility models in
 * src/physics/mobility are, over the bracket (checked by property tests).
 *
 * Never throws, never returns NaN silently: failure is in `status`.
 */
import type { Range } from '../types.js';
import { brentRoot, type RootStatus } from './brent.js';

/** Default bracket of the inversion, log10 of cm⁻³. */
export const DENSITY_BRACKET_LOG10_PER_CM3: Range = { min: 10, max: 22 };

export interface DensityInversion {
  readonly converged: boolean;
  readonly status: RootStatus;
  /** The density found (for a failure: the bracket end nearest the target). */
  readonly dopantDensityPerCm3: number;
  /** ln(ρ(N)/ρ_target) at the answer: the relative residual, ≈ 0 when converged. */
  readonly logResidual: number;
  readonly evaluations: number;
}

/**
 * Find N with resistivityOfDensity(N) = targetResistivityOhmCm.
 * Tolerance: 1e-12 in log10 N, i.e. about 2.3e-12 relative in N.
 */
export function invertResistivityForDensity(
  resistivityOfDensity: (dopantDensityPerCm3: number) => number,
  targetResistivityOhmCm: number,
  bracketLog10: Range = DENSITY_BRACKET_LOG10_PER_CM3,
): DensityInversion {
  if (!(targetResistivityOhmCm > 0) || !Number.isFinite(targetResistivityOhmCm)) {
    return {
      converged: false,
      status: 'not_finite',
      dopantDensityPerCm3: Math.pow(10, bracketLog10.min),
      logResidual: Number.POSITIVE_INFINITY,
      evaluations: 0,
    };
  }
  const lnTarget = Math.log(targetResistivityOhmCm);
  const r = brentRoot(
    (u) => Math.log(resistivityOfDensity(Math.exp(u * Math.LN10))) - lnTarget,
    bracketLog10.min,
    bracketLog10.max,
    { xTolerance: 1e-12, maxIterations: 200 },
  );
  return {
    converged: r.converged,
    status: r.status,
    dopantDensityPerCm3: Math.pow(10, r.x),
    logResidual: r.fx,
    evaluations: r.evaluations,
  };
}
