import { describe, expect, it } from 'vitest';
import { solveNeutrality } from '../../../src/physics/carriers/neutrality.js';

const base = {
  temperatureK: 300,
  intrinsicDensityPerCm3: 1e10,
  bandgapEv: 1.12,
  conductionBandDensityPerCm3: 2.86e19,
  valenceBandDensityPerCm3: 3.1e19,
};

describe('charge-neutrality kernel', () => {
  it('is intrinsic with no dopants: n = p = n_i and E_F = E_i', () => {
    const r = solveNeutrality({ ...base, donors: [], acceptors: [] });
    expect(r.converged).toBe(true);
    expect(r.electronDensityPerCm3).toBeWithinRelative(1e10, 1e-9);
    expect(Math.abs(r.fermiLevelEv)).toBeLessThan(1e-9);
  });

  // Textbook: E_i sits (kT/2)·ln(Nv/Nc) above midgap, so E_c − E_i = Eg/2 + (kT/2)·ln(Nc/Nv).
  it('places the band edges about E_i from Eg and Nc/Nv', () => {
    const r = solveNeutrality({ ...base, donors: [], acceptors: [] });
    const kT = (1.380649e-23 / 1.602176634e-19) * 300;
    expect(r.conductionEdgeAboveIntrinsicEv).toBeWithinRelative(0.56 + 0.5 * kT * Math.log(2.86 / 3.1), 1e-12);
    expect(r.conductionEdgeAboveIntrinsicEv + r.valenceEdgeBelowIntrinsicEv).toBeWithinRelative(1.12, 1e-12);
  });

  it('reports failure for meaningless input instead of returning NaN silently', () => {
    const r = solveNeutrality({ ...base, intrinsicDensityPerCm3: Number.NaN, donors: [{ densityPerCm3: 1e15, ionizationEnergyEv: 0.045, degeneracy: 2 }], acceptors: [] });
    expect(r.converged).toBe(false);
    expect(r.status).toBe('not_finite');
  });

  it('stays finite at 20 K for 1e20 cm⁻³ (u near its largest), with the donors mostly frozen out', () => {
    const r = solveNeutrality({
      ...base,
      temperatureK: 20,
      intrinsicDensityPerCm3: 1e-120,
      donors: [{ densityPerCm3: 1e20, ionizationEnergyEv: 0.045, degeneracy: 2 }],
      acceptors: [],
    });
    expect(r.converged).toBe(true);
    expect(Number.isFinite(r.electronDensityPerCm3)).toBe(true);
    expect((r.ionizedDonorsPerCm3[0] ?? 1) / 1e20).toBeLessThan(0.01);
  });
});
