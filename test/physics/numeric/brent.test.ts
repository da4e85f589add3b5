import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { brentRoot } from '../../../src/physics/numeric/brent.js';

describe('Brent root finder', () => {
  // Source: the cube root of 2 (mathematics; Math.cbrt is correctly rounded to ~1 ulp).
  it('finds ∛2 as the root of x³ − 2 on [0, 2]', () => {
    const r = brentRoot((x) => x * x * x - 2, 0, 2, { xTolerance: 1e-14 });
    expect(r.converged).toBe(true);
    expect(r.x).toBeWithinRelative(Math.cbrt(2), 1e-13);
  });
  // Source: the Dottie number, root of cos x = x, 0.7390851332151607 (from memory; the test also
  // checks the defining identity cos x = x to 1e-13).
  it('finds the Dottie number, root of cos x − x', () => {
    const r = brentRoot((x) => Math.cos(x) - x, 0, 1, { xTolerance: 1e-15 });
    expect(r.converged).toBe(true);
    expect(Math.abs(Math.cos(r.x) - r.x)).toBeLessThan(1e-13);
    expect(r.x).toBeWithinRelative(0.7390851332151607, 1e-12);
  });
  it('reports a missing sign change as data, not NaN', () => {
    const r = brentRoot((x) => x * x + 1, -1, 1);
    expect(r.converged).toBe(false);
    expect(r.status).toBe('no_sign_change');
    expect(Number.isFinite(r.x)).toBe(true);
  });
  it('reports a non-finite function as data', () => {
    const r = brentRoot(() => Number.NaN, 0, 1);
    expect(r.converged).toBe(false);
    expect(r.status).toBe('not_finite');
  });
  it('reports running out of iterations as data', () => {
    const r = brentRoot((x) => x - 0.123456789, 0, 1, { maxIterations: 1, xTolerance: 1e-15 });
    expect(r.converged).toBe(false);
    expect(r.status).toBe('max_iterations');
  });
  // Property: any monotonic cubic with a root inside the bracket is found to the tolerance.
  it('converges for every shifted cubic with a root in the bracket (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -9.9, max: 9.9, noNaN: true }), (root) => {
        const r = brentRoot((x) => (x - root) ** 3 + (x - root), -10, 10, { xTolerance: 1e-12 });
        return r.converged && Math.abs(r.x - root) < 1e-10;
      }),
    );
  });
});
