import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MOBILITY_MODELS } from '../../../src/physics/mobility/registry.js';
import { invertResistivityForDensity } from '../../../src/physics/numeric/invert-density.js';
import { resistivityFromMobilityOhmCm } from '../../../src/physics/resistivity/mobility-conversion.js';

// Issue 2: the inverse must converge over the whole range 1e12–1e21 cm⁻³ for every mobility
// model and dopant. Tolerance 1e-9 relative in N: the solver works to 1e-12 in log10 N
// (2.3e-12 relative); the margin covers the slope of ln ρ in u.
describe('ρ → N inversion by Brent in log10 N', () => {
  for (const model of MOBILITY_MODELS) {
    for (const dopant of model.dopants) {
      it(`${model.id} / ${dopant}: recovers N over 1e12–1e21 cm⁻³ (property)`, () => {
        const rhoOf = (n: number) => resistivityFromMobilityOhmCm(n, model.mobilityCm2PerVs(n, dopant));
        fc.assert(
          fc.property(fc.double({ min: 12, max: 21, noNaN: true }), (u) => {
            const n = Math.pow(10, u);
            const r = invertResistivityForDensity(rhoOf, rhoOf(n));
            return r.converged && Math.abs(r.dopantDensityPerCm3 / n - 1) < 1e-9 && r.evaluations < 60;
          }),
          { numRuns: 300 },
        );
      });
    }
  }
  it('reports a target outside the bracket as data (no NaN)', () => {
    const rhoOf = (n: number) => resistivityFromMobilityOhmCm(n, 1000);
    const r = invertResistivityForDensity(rhoOf, 1e12);
    expect(r.converged).toBe(false);
    expect(r.status).toBe('no_sign_change');
    expect(Number.isFinite(r.dopantDensityPerCm3)).toBe(true);
  });
  it('reports a nonpositive target as data', () => {
    const r = invertResistivityForDensity((n) => 1 / n, -1);
    expect(r.converged).toBe(false);
  });
});
