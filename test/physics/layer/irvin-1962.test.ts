import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  layerSheetConductance,
  layerSheetResistance,
  layerSurfaceConcentration,
  type LayerForwardRequest,
  type LayerResult,
} from '../../../src/physics/layer/irvin-1962.js';
import { ERFC_PROFILE, GAUSSIAN_PROFILE, type ProfileDescriptor } from '../../../src/physics/layer/profiles.js';
import { masetti1983 } from '../../../src/physics/mobility/masetti-1983.js';
import { klaassen1992 } from '../../../src/physics/mobility/klaassen-1992.js';

const Q = 1.602176634e-19; // CODATA 2018, exact

/** Independent erf for the closed forms: the alternating Maclaurin series (fine for x ≤ 4). */
function erfSeries(x: number): number {
  let term = x;
  let sum = x;
  for (let n = 1; n < 200; n++) {
    term *= (-x * x) / n;
    sum += term / (2 * n + 1);
  }
  return (2 / Math.sqrt(Math.PI)) * sum;
}

function forward(req: LayerForwardRequest): LayerResult {
  const r = layerSheetResistance(req);
  if (!r.ok) throw new Error(`refused: ${JSON.stringify(r.refusal)}`);
  return r.value;
}

const base = {
  dopant: 'phosphorus' as const,
  backgroundDopant: 'boron' as const,
  backgroundDensityPerCm3: 1e15,
  junctionDepthCm: 0.8e-4,
};

describe("Irvin's method: sheet resistance of a diffused layer", () => {
  // Analytic case 1: constant profile N(x) = Cs over 0…xj, constant μ: G = q·μ·(Cs − N_B)·xj.
  // The issue asks for 0.1 %; we require 1e-6.
  it('integrates a constant profile exactly (G = qμ(Cs − N_B)·xj, 1e-6)', () => {
    const flat: ProfileDescriptor = { ...ERFC_PROFILE, lengthCm: () => 1, densityPerCm3: (cs) => cs };
    const k = layerSheetConductance(flat, 1e18, 1e15, 2e-4, () => 250);
    expect(k.converged).toBe(true);
    expect(k.sheetConductanceS).toBeWithinRelative(Q * 250 * (1e18 - 1e15) * 2e-4, 1e-6);
  });

  // Analytic case 2: erfc profile, constant μ. ∫₀^xj [Cs·erfc(x/L) − N_B] dx
  //   = Cs·L·[a·erfc(a) + (1 − e^(−a²))/√π] − N_B·xj = Cs·L·(1 − e^(−a²))/√π, a = xj/L
  // (∫ erfc = u·erfc(u) − e^(−u²)/√π, and Cs·erfc(a) = N_B). Tolerance 1e-6 (issue: 0.1 %).
  it('integrates the erfc profile to its closed form with constant mobility (1e-6)', () => {
    for (const [cs, xj] of [
      [1e20, 0.8e-4],
      [1e17, 2e-4],
      [1e21, 0.2e-4],
    ] as const) {
      const k = layerSheetConductance(ERFC_PROFILE, cs, 1e15, xj, () => 100);
      const a = xj / k.lengthCm;
      const closed = Q * 100 * cs * k.lengthCm * (1 - Math.exp(-a * a)) / Math.sqrt(Math.PI);
      expect(k.sheetConductanceS).toBeWithinRelative(closed, 1e-6);
    }
  });

  // Analytic case 3: Gaussian, constant μ: ∫₀^xj [Cs·e^(−(x/L)²) − N_B] dx = Cs·L·(√π/2)·erf(a) − N_B·xj,
  // a = √ln(Cs/N_B). erf from an independent series. Tolerance 1e-6.
  it('integrates the Gaussian profile to its closed form with constant mobility (1e-6)', () => {
    for (const [cs, xj] of [
      [1e19, 0.5e-4],
      [1e17, 3e-4],
    ] as const) {
      const k = layerSheetConductance(GAUSSIAN_PROFILE, cs, 1e15, xj, () => 300);
      const a = Math.sqrt(Math.log(cs / 1e15));
      const closed = Q * 300 * (cs * k.lengthCm * (Math.sqrt(Math.PI) / 2) * erfSeries(a) - 1e15 * xj);
      expect(k.sheetConductanceS).toBeWithinRelative(closed, 1e-6);
    }
  });

  // With the real (Klaassen) mobility there is no closed form: compare with an independent
  // composite Simpson rule on 200 000 panels (error ≪ 1e-6 for this smooth integrand). 1e-5.
  it('agrees with a brute-force Simpson integral using the Klaassen mobility (1e-5)', () => {
    const r = forward({ ...base, profile: 'erfc', surfaceConcentrationPerCm3: 1e20 });
    const L = r.characteristicLengthCm;
    const n = 200000;
    const h = base.junctionDepthCm / n;
    const f = (x: number) => {
      const nd = ERFC_PROFILE.densityPerCm3(1e20, L, x);
      const net = Math.max(nd - 1e15, 0);
      const mu = klaassen1992.electronMobilityCm2PerVs({ donorDensityPerCm3: nd, acceptorDensityPerCm3: 1e15, electronDensityPerCm3: net, holeDensityPerCm3: 0, temperatureK: 300, donor: 'phosphorus' });
      return Q * mu * net;
    };
    let s = f(0) + f(base.junctionDepthCm);
    for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(i * h);
    expect(r.sheetConductanceS).toBeWithinRelative((s * h) / 3, 1e-5);
    expect(r.integration.relativeErrorEstimate).toBeLessThan(1e-3);
  });

  it('reports average resistivity ρ̄ = R_s·xj and average conductivity σ̄ = 1/ρ̄', () => {
    const r = forward({ ...base, profile: 'gaussian', surfaceConcentrationPerCm3: 1e19 });
    expect(r.averageResistivityOhmCm).toBeWithinRelative(r.sheetResistanceOhmPerSq * base.junctionDepthCm, 1e-12);
    expect(r.averageConductivitySPerCm).toBeWithinRelative(1 / r.averageResistivityOhmCm, 1e-12);
    expect(r.layerType).toBe('n');
  });

  // Physics: more surface concentration or a deeper junction means more carriers, so lower R_s.
  it('is monotonic: R_s falls as Cs or xj rises, for both profiles and both layer types (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 16.5, max: 21, noNaN: true }),
        fc.double({ min: -5, max: -3.3, noNaN: true }),
        fc.constantFrom('erfc' as const, 'gaussian' as const),
        fc.boolean(),
        (u, v, profile, nLayer) => {
          const g = nLayer
            ? { ...base, profile }
            : { ...base, profile, dopant: 'boron' as const, backgroundDopant: 'phosphorus' as const };
          const cs = Math.pow(10, u);
          const xj = Math.pow(10, v);
          const rs = forward({ ...g, surfaceConcentrationPerCm3: cs, junctionDepthCm: xj }).sheetResistanceOhmPerSq;
          expect(forward({ ...g, surfaceConcentrationPerCm3: cs * 1.2, junctionDepthCm: xj }).sheetResistanceOhmPerSq).toBeLessThan(rs);
          expect(forward({ ...g, surfaceConcentrationPerCm3: cs, junctionDepthCm: xj * 1.2 }).sheetResistanceOhmPerSq).toBeLessThan(rs);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('inverts: R_s → Cs → R_s round trip to 1e-6 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 16.5, max: 21, noNaN: true }), fc.constantFrom('erfc' as const, 'gaussian' as const), (u, profile) => {
        const cs = Math.pow(10, u);
        const rs = forward({ ...base, profile, surfaceConcentrationPerCm3: cs }).sheetResistanceOhmPerSq;
        const inv = layerSurfaceConcentration({ ...base, profile, sheetResistanceOhmPerSq: rs });
        expect(inv.ok).toBe(true);
        if (inv.ok) {
          expect(inv.value.surfaceConcentrationPerCm3).toBeWithinRelative(cs, 1e-6);
          expect(inv.value.sheetResistanceOhmPerSq).toBeWithinRelative(rs, 1e-6);
        }
      }),
      { numRuns: 40 },
    );
  });

  // Stated assumption: single-curve models are read at the total ionized impurity density.
  it('reads a single-curve model (Masetti) at N(x) + N_B, and names the model used', () => {
    const r = forward({ ...base, profile: 'erfc', surfaceConcentrationPerCm3: 1e19, mobilityModelId: 'masetti-1983' });
    expect(r.surfaceMobilityCm2PerVs).toBe(masetti1983.mobilityCm2PerVs(1e19 + 1e15, 'phosphorus'));
    expect(r.mobilityModel.id).toBe('masetti-1983');
    expect(forward({ ...base, profile: 'erfc', surfaceConcentrationPerCm3: 1e19 }).mobilityModel.id).toBe('klaassen-1992');
  });

  it('refuses a layer of the same kind as its background, Cs ≤ N_B, and an unreachable R_s', () => {
    const same = layerSheetResistance({ ...base, backgroundDopant: 'arsenic', profile: 'erfc', surfaceConcentrationPerCm3: 1e19 });
    expect(same.ok ? 'ok' : same.refusal.code).toBe('dopant_pairing');
    const low = layerSheetResistance({ ...base, profile: 'erfc', surfaceConcentrationPerCm3: 1e15 });
    expect(low.ok ? 'ok' : low.refusal.code).toBe('no_junction');
    const tooLow = layerSurfaceConcentration({ ...base, profile: 'erfc', sheetResistanceOhmPerSq: 0.01 });
    expect(tooLow.ok ? 'ok' : tooLow.refusal.code).toBe('outside_domain');
    const neg = layerSurfaceConcentration({ ...base, profile: 'erfc', sheetResistanceOhmPerSq: -5 });
    expect(neg.ok ? 'ok' : neg.refusal.code).toBe('nonpositive_input');
  });

  it('warns when Cs is beyond the mobility model’s fitted range (Arora above 1e20)', () => {
    const r = forward({ ...base, profile: 'erfc', surfaceConcentrationPerCm3: 5e20, mobilityModelId: 'arora-1982' });
    expect(r.problems).toContainEqual(expect.objectContaining({ code: 'outside_validity', quantity: 'surfaceConcentrationPerCm3', model: 'arora-1982' }));
  });
});
