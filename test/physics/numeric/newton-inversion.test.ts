/**
 * The table-guided Newton inversion every mobility-model ρ → N uses (issue 12) against Brent's
 * bracketed search, the reference it replaced (src/physics/numeric/invert-density.ts, tolerance
 * 1e-12 in log10 N). Tolerance 1e-9 relative in N: the accuracy issue 12 asks for; both methods
 * solve the same equation, so any larger gap is a fault of the fast path, not of the physics.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { invertResistivityForDensity } from '../../../src/physics/numeric/invert-density.js';
import { buildInversionTable, invertWithTable } from '../../../src/physics/numeric/newton-inversion.js';
import { CONVERSION_MODELS } from '../../../src/physics/resistivity/registry.js';

const MOBILITY_CONVERSIONS = CONVERSION_MODELS.filter((m) => m.equations[0]?.startsWith('ρ = 1/(q·N·μ(N))'));

describe('Newton inversion with a tabulated guess', () => {
  it('covers every mobility-model conversion (five models)', () => {
    expect(MOBILITY_CONVERSIONS.map((m) => m.id).sort()).toEqual(
      ['arora-1982', 'caughey-thomas-1967', 'klaassen-1992', 'masetti-1983', 'masetti-1983-as-for-sb'].sort(),
    );
  });

  for (const model of MOBILITY_CONVERSIONS) {
    for (const dopant of model.dopants) {
      const domain = model.domain[dopant];
      if (!domain) continue;
      it(`${model.id}, ${dopant}: the public ρ → N agrees with Brent to 1e-9 over the whole domain`, () => {
        const rhoOf = (n: number) => model.resistivityFromDopantDensity(n, dopant);
        const lo = Math.log10(domain.resistivityOhmCm.min);
        const hi = Math.log10(domain.resistivityOhmCm.max);
        fc.assert(
          fc.property(fc.double({ min: lo, max: hi, noNaN: true }), (u) => {
            const rho = Math.pow(10, u);
            const brent = invertResistivityForDensity(rhoOf, rho);
            expect(brent.converged).toBe(true);
            const fast = model.dopantDensityFromResistivity(rho, dopant);
            expect(Math.abs(fast / brent.dopantDensityPerCm3 - 1)).toBeLessThan(1e-9);
          }),
          { numRuns: 300 },
        );
      });
    }
  }

  it('takes the Newton path, not the fallback, for values inside the table', () => {
    const masetti = MOBILITY_CONVERSIONS.find((m) => m.id === 'masetti-1983')!;
    const rhoOf = (n: number) => masetti.resistivityFromDopantDensity(n, 'boron');
    const table = buildInversionTable(rhoOf, { min: 10, max: 22 });
    expect(table).toBeDefined();
    let evaluations = 0;
    for (let k = 0; k < 200; k++) {
      const r = invertWithTable(table!, rhoOf, Math.pow(10, -3 + (6 * k) / 199));
      expect(r.converged).toBe(true);
      evaluations += r.evaluations;
    }
    // One or two evaluations of ρ(N) each (Brent takes about eight).
    expect(evaluations / 200).toBeLessThan(2);
  });

  it('reports no convergence outside the table so that the caller falls back', () => {
    const rhoOf = (n: number) => 1 / (1.602176634e-19 * n * 400);
    const table = buildInversionTable(rhoOf, { min: 10, max: 22 })!;
    expect(invertWithTable(table, rhoOf, 1e9).converged).toBe(false);
    expect(invertWithTable(table, rhoOf, 1e-9).converged).toBe(false);
    expect(invertWithTable(table, rhoOf, Number.NaN).converged).toBe(false);
  });

  it('builds no table for a law that is not decreasing (the caller keeps Brent)', () => {
    expect(buildInversionTable((n) => 1 + Math.sin(Math.log(n)), { min: 10, max: 22 })).toBeUndefined();
  });

  it('inverts a constant-mobility law exactly: N = 1/(q·ρ·μ)', () => {
    const q = 1.602176634e-19; // CODATA 2018, exact
    const rhoOf = (n: number) => 1 / (q * n * 400);
    const table = buildInversionTable(rhoOf, { min: 10, max: 22 })!;
    for (const rho of [1e-4, 0.01, 3.3, 170, 5e4]) {
      const r = invertWithTable(table, rhoOf, rho);
      expect(r.converged).toBe(true);
      expect(r.dopantDensityPerCm3 / (1 / (q * rho * 400)) - 1).toBeCloseTo(0, 12);
    }
  });
});
