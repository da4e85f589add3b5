/**
 * Bracketed root finding: Brent's method (inverse quadratic interpolation and secant steps,
 * safeguarded by bisection).
 *
 * Method: R. P. Brent, "Algorithms for Minimization without Derivatives" (Prentice-Hall, 1973),
 *   chapter 4 (the procedure "zero"); the same algorithm as W. H. Press et al., Numerical
 *   Recipes, 3rd ed. (2007), §9.3. Guaranteed to converge for any continuous f with a sign
 *   change on [lo, hi]; never worse than about (log2((hi − lo)/tol))² evaluations.
 *
 * This kernel never throws and never returns NaN silently: a missing sign change, a
 * non-finite f, or too many iterations is reported in `status` with `converged: false`.
 */

export type RootStatus = 'converged' | 'no_sign_change' | 'not_finite' | 'max_iterations';

export interface RootResult {
  readonly converged: boolean;
  readonly status: RootStatus;
  /** Best estimate of the root (for a failure: the bracket end with the smaller |f|). */
  readonly x: number;
  /** f at x. */
  readonly fx: number;
  /** Function evaluations used. */
  readonly evaluations: number;
}

export interface RootOptions {
  /** Absolute tolerance on x (default 1e-12). */
  readonly xTolerance?: number;
  /** Maximum iterations (default 100). */
  readonly maxIterations?: number;
}

const EPS = Number.EPSILON;

export function brentRoot(
  f: (x: number) => number,
  lo: number,
  hi: number,
  options: RootOptions = {},
): RootResult {
  const tol = options.xTolerance ?? 1e-12;
  const maxIterations = options.maxIterations ?? 100;
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  let evaluations = 2;
  if (!Number.isFinite(fa) || !Number.isFinite(fb) || !Number.isFinite(a) || !Number.isFinite(b)) {
    const aFinite = Number.isFinite(fa);
    return {
      converged: false,
      status: 'not_finite',
      x: aFinite ? a : b,
      fx: aFinite ? fa : fb,
      evaluations,
    };
  }
  if (fa === 0) return { converged: true, status: 'converged', x: a, fx: fa, evaluations };
  if (fb === 0) return { converged: true, status: 'converged', x: b, fx: fb, evaluations };
  if ((fa > 0) === (fb > 0)) {
    const useA = Math.abs(fa) < Math.abs(fb);
    return { converged: false, status: 'no_sign_change', x: useA ? a : b, fx: useA ? fa : fb, evaluations };
  }
  let c = b;
  let fc = fb;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIterations; iter++) {
    if ((fb > 0) === (fc > 0)) {
      // Root lies between a and b: rename so that c is the other end of the bracket.
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * EPS * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) {
      return { converged: true, status: 'converged', x: b, fx: fb, evaluations };
    }
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      // Attempt inverse quadratic interpolation (secant when a == c).
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
    evaluations++;
    if (!Number.isFinite(fb)) {
      return { converged: false, status: 'not_finite', x: a, fx: fa, evaluations };
    }
  }
  return { converged: false, status: 'max_iterations', x: b, fx: fb, evaluations };
}
