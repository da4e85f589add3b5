import { describe, expect, it } from 'vitest';
import { klaassen1992 } from '../../../src/physics/mobility/klaassen-1992.js';
import { resistivityAtTemperature } from '../../../src/physics/resistivity/resistivity-at-temperature.js';

const Q = 1.602176634e-19; // CODATA 2018, exact

describe('resistivity at a temperature (full ionization, n_i)', () => {
  it('is 1/(q·N·μ) when N ≫ n_i (1e16 P, 300 K; minority share < 1e-12)', () => {
    const r = resistivityAtTemperature(klaassen1992, 1e16, 'phosphorus', 300, 1e10);
    expect(r.resistivityOhmCm).toBeWithinRelative(1 / (Q * 1e16 * r.electronMobilityCm2PerVs), 1e-9);
    expect(r.electronDensityPerCm3).toBeWithinRelative(1e16, 1e-12);
  });

  // Textbook: intrinsic resistivity 1/(q·n_i·(μn + μp)); N = 1e6 ≪ n_i = 1e10 (relative effect 1e-4).
  it('tends to the intrinsic resistivity 1/(q·n_i·(μn + μp)) when N ≪ n_i', () => {
    const r = resistivityAtTemperature(klaassen1992, 1e6, 'boron', 300, 1e10);
    expect(r.resistivityOhmCm).toBeWithinRelative(1 / (Q * 1e10 * (r.electronMobilityCm2PerVs + r.holeMobilityCm2PerVs)), 1e-3);
    expect(r.electronDensityPerCm3 * r.holeDensityPerCm3).toBeWithinRelative(1e20, 1e-12);
  });
});
