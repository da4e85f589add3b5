import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { carriersAtTemperature } from '../../../src/physics/carriers/carriers.js';
import { intrinsicCrossover, type CrossoverRequest, type CrossoverResult } from '../../../src/physics/carriers/crossover.js';
import { intrinsicDensityPerCm3 } from '../../../src/physics/intrinsic/registry.js';

function crossed(req: CrossoverRequest): CrossoverResult {
  const r = intrinsicCrossover(req);
  if (!r.ok) throw new Error(`refused: ${JSON.stringify(r.refusal)}`);
  return r.value;
}

describe('intrinsic crossover temperature', () => {
  // Round trip with the n_i kernel of the model the result names: n_i(T_x) = N. Tolerance 1e-9
  // (the solver's tolerance is 1e-14 in 1/T, ~1e-10 in n_i).
  it('round-trips with n_i(T) of the named model for Si, Ge and GaAs (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 17, noNaN: true }), fc.constantFrom('Si', 'Ge', 'GaAs' as const), (u, material) => {
        const n = Math.pow(10, u);
        const r = crossed({ netDopingPerCm3: n, material });
        expect(intrinsicDensityPerCm3(material, r.temperatureK, r.model.id)).toBeWithinRelative(n, 1e-9);
        expect(r.intrinsicDensityPerCm3).toBeWithinRelative(n, 1e-9);
      }),
    );
  });

  it('round-trips with a non-default model (Sproul–Green) and names it', () => {
    const r = crossed({ netDopingPerCm3: 1e14, intrinsicModelId: 'sproul-green-1991' });
    expect(r.model.id).toBe('sproul-green-1991');
    expect(intrinsicDensityPerCm3('Si', r.temperatureK, 'sproul-green-1991')).toBeWithinRelative(1e14, 1e-9);
  });

  // Closed form: at the crossover with full ionization, n = N/2 + √(N²/4 + n_i²) with n_i = N,
  // i.e. n/N = (1 + √5)/2. The carrier solver at T_x must agree; tolerance 1e-3 (1e13–1e15 P is
  // ionized to better than 1e-4 at those temperatures).
  it('carriers at the crossover temperature give n/N = (1 + √5)/2 (closed form)', () => {
    for (const n of [1e13, 1e14, 1e15]) {
      const x = crossed({ netDopingPerCm3: n });
      // the same n_i model on both sides of the round trip
      const c = carriersAtTemperature({ dopants: [{ dopant: 'phosphorus', densityPerCm3: n }], temperatureK: x.temperatureK, intrinsicModelId: x.model.id });
      expect(c.ok).toBe(true);
      if (c.ok) expect(c.value.electronDensityPerCm3 / n).toBeWithinRelative((1 + Math.sqrt(5)) / 2, 1e-3);
    }
  });

  // Common textbook figure (e.g. the n-against-1/T plot for 1e15 cm⁻³ Si in Sze's device texts):
  // intrinsic conduction takes over near 500–600 K (from memory). Band check, not a fit check.
  it('puts the crossover for 1e15 cm⁻³ Si between 500 and 600 K (textbook figure, from memory)', () => {
    const r = crossed({ dopants: [{ dopant: 'boron', densityPerCm3: 1e15 }] });
    expect(r.temperatureK).toBeGreaterThan(500);
    expect(r.temperatureK).toBeLessThan(600);
    expect(r.problems.map((p) => p.code)).toContain('outside_validity'); // beyond Misiakos's 340 K
  });

  // Physics: a smaller band gap turns intrinsic sooner; more doping needs a hotter crystal.
  it('rises with doping and is lower for Ge than for Si (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 16, noNaN: true }), (u) => {
        const n = Math.pow(10, u);
        expect(crossed({ netDopingPerCm3: n * 2 }).temperatureK).toBeGreaterThan(crossed({ netDopingPerCm3: n }).temperatureK);
        expect(crossed({ netDopingPerCm3: n, material: 'Ge' }).temperatureK).toBeLessThan(crossed({ netDopingPerCm3: n }).temperatureK);
      }),
    );
  });

  it('uses the net doping of compensated material', () => {
    const a = crossed({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 5e15 }, { dopant: 'boron', densityPerCm3: 4e15 }] });
    const b = crossed({ netDopingPerCm3: 1e15 });
    expect(a.netDopingPerCm3).toBeWithinRelative(1e15, 1e-12);
    expect(a.temperatureK).toBeWithinRelative(b.temperatureK, 1e-9);
  });

  it('refuses when no crossover exists below the melting point, or the doping is zero', () => {
    const r = intrinsicCrossover({ netDopingPerCm3: 1e21 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.refusal).toMatchObject({ code: 'outside_domain', quantity: 'netDopingPerCm3' });
    const z = intrinsicCrossover({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e15 }, { dopant: 'boron', densityPerCm3: 1e15 }] });
    expect(z.ok).toBe(false);
    if (!z.ok) expect(z.refusal.code).toBe('nonpositive_input');
    expect(intrinsicCrossover({}).ok).toBe(false);
  });
});
