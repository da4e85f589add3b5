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

  // Textbook (Sze & Ng 2007, §1.4): n = Nc·exp(−(E_c − E_F)/kT) = n_i·exp((E_F − E_i)/kT), so
  // E_c − E_i = kT·ln(Nc/n_i) and E_i − E_v = kT·ln(Nv/n_i); their sum is kT·ln(Nc·Nv/n_i²), which
  // for a consistent n_i = √(Nc·Nv)·exp(−Eg/2kT) is Eg. Definitions: 1e-12 relative.
  it('places the band edges about E_i from Nc, Nv and n_i (n = Nc·exp(−(E_c − E_F)/kT) exactly)', () => {
    const kT = (1.380649e-23 / 1.602176634e-19) * 300;
    const r = solveNeutrality({ ...base, donors: [], acceptors: [] });
    expect(r.conductionEdgeAboveIntrinsicEv).toBeWithinRelative(kT * Math.log(2.86e19 / 1e10), 1e-12);
    expect(r.valenceEdgeBelowIntrinsicEv).toBeWithinRelative(kT * Math.log(3.1e19 / 1e10), 1e-12);
    const consistentNi = Math.sqrt(2.86e19 * 3.1e19) * Math.exp(-1.12 / (2 * kT));
    const c = solveNeutrality({ ...base, intrinsicDensityPerCm3: consistentNi, donors: [], acceptors: [] });
    expect(c.conductionEdgeAboveIntrinsicEv + c.valenceEdgeBelowIntrinsicEv).toBeWithinRelative(1.12, 1e-12);
    const d = solveNeutrality({ ...base, donors: [{ densityPerCm3: 1e16, ionizationEnergyEv: 0.045, degeneracy: 2 }], acceptors: [] });
    expect(d.electronDensityPerCm3).toBeWithinRelative(2.86e19 * Math.exp(-(d.conductionEdgeAboveIntrinsicEv - d.fermiLevelEv) / kT), 1e-12);
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
