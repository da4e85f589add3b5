/**
 * Charge neutrality with incomplete ionization, solved for the Fermi level.
 *
 *   p + Σ N_D⁺ = n + Σ N_A⁻
 *   n = n_i·exp(u), p = n_i·exp(−u), u = (E_F − E_i)/kT
 *   N_D⁺ = N_D/(1 + g_D·exp((E_F − E_D)/kT)),  E_F − E_D = u·kT − (E_c − E_i) + ΔE_D
 *   N_A⁻ = N_A/(1 + g_A·exp((E_A − E_F)/kT)),  E_A − E_F = ΔE_A − (E_i − E_v) − u·kT
 *   E_c − E_i = kT·ln(Nc/n_i),  E_i − E_v = kT·ln(Nv/n_i)
 *
 * Non-degenerate (Boltzmann) statistics for the bands; Fermi–Dirac occupancy of the dopant
 * levels (textbook, e.g. S. M. Sze, K. K. Ng, Physics of Semiconductor Devices, 3rd ed. (2007),
 * §1.5). n_i comes from the intrinsic-density model (so the high-temperature limit is that
 * model's n_i exactly); the band edges are placed about E_i from Nc and Nv, so that
 * n = Nc·exp(−(E_c − E_F)/kT) and p = Nv·exp(−(E_F − E_v)/kT) hold exactly and the dopant
 * levels (fixed below E_c / above E_v) see the band densities of states themselves: deep
 * freeze-out then does not depend on the n_i model. The gap this implies,
 * kT·ln(Nc·Nv/n_i²), is the one the n_i model carries (within a few meV of Eg(T), stated in
 * `why`); `bandgapEv` is kept for the reply.
 *
 * The residual is strictly decreasing in u, so the root is unique; it is bracketed explicitly
 * (u_lo where p alone exceeds every acceptor, u_hi where n alone exceeds every donor) and found
 * by Brent's method. Works wherever exp does not overflow: u stays below ~710 for
 * N/n_i < 1e308, i.e. down to ~20 K in Si. Never throws; failure is returned, never a NaN.
 */
import { BOLTZMANN_EV_PER_K } from '../constants.js';
import { brentRoot, type RootStatus } from '../numeric/brent.js';

export interface DopantLevel {
  readonly densityPerCm3: number;
  /** ΔE: below E_c for a donor, above E_v for an acceptor, eV. */
  readonly ionizationEnergyEv: number;
  readonly degeneracy: number;
}

export interface NeutralityInput {
  readonly donors: readonly DopantLevel[];
  readonly acceptors: readonly DopantLevel[];
  readonly temperatureK: number;
  readonly intrinsicDensityPerCm3: number;
  readonly bandgapEv: number;
  readonly conductionBandDensityPerCm3: number;
  readonly valenceBandDensityPerCm3: number;
}

export interface NeutralitySolution {
  readonly converged: boolean;
  readonly status: RootStatus;
  readonly electronDensityPerCm3: number;
  readonly holeDensityPerCm3: number;
  /** Ionized density per dopant, in input order. */
  readonly ionizedDonorsPerCm3: readonly number[];
  readonly ionizedAcceptorsPerCm3: readonly number[];
  /** E_F − E_i, eV (positive above the intrinsic level). */
  readonly fermiLevelEv: number;
  /** E_c − E_i and E_i − E_v, eV. */
  readonly conductionEdgeAboveIntrinsicEv: number;
  readonly valenceEdgeBelowIntrinsicEv: number;
  /** Relative residual of neutrality at the answer. */
  readonly relativeResidual: number;
  readonly evaluations: number;
}

function sum(levels: readonly DopantLevel[]): number {
  let s = 0;
  for (const l of levels) s += l.densityPerCm3;
  return s;
}

/** 1/(1 + g·e^x) without overflow for large x. */
function occupancyComplement(g: number, x: number): number {
  if (x > 0) {
    const e = Math.exp(-x);
    return e / (e + g);
  }
  return 1 / (1 + g * Math.exp(x));
}

export function solveNeutrality(input: NeutralityInput): NeutralitySolution {
  const kT = BOLTZMANN_EV_PER_K * input.temperatureK;
  const ni = input.intrinsicDensityPerCm3;
  const ecMinusEi = kT * Math.log(input.conductionBandDensityPerCm3 / ni);
  const eiMinusEv = kT * Math.log(input.valenceBandDensityPerCm3 / ni);
  const ecT = ecMinusEi / kT;
  const evT = eiMinusEv / kT;
  const donors = input.donors.map((d) => ({ n: d.densityPerCm3, x0: d.ionizationEnergyEv / kT - ecT, g: d.degeneracy }));
  const acceptors = input.acceptors.map((a) => ({ n: a.densityPerCm3, x0: a.ionizationEnergyEv / kT - evT, g: a.degeneracy }));
  const nd = sum(input.donors);
  const na = sum(input.acceptors);

  // Residual scaled by the total charge on hand so that its size is O(1) at every temperature.
  const scale = nd + na + ni;
  const residual = (u: number): number => {
    let pos = ni * Math.exp(-u);
    let neg = ni * Math.exp(u);
    for (const d of donors) pos += d.n * occupancyComplement(d.g, u + d.x0);
    for (const a of acceptors) neg += a.n * occupancyComplement(a.g, a.x0 - u);
    return (pos - neg) / scale;
  };

  const badInput =
    !(ni > 0) || !Number.isFinite(ni) || !(kT > 0) || !Number.isFinite(ecMinusEi) || !Number.isFinite(eiMinusEv);
  const uLo = -Math.log1p(na / ni) - 1;
  const uHi = Math.log1p(nd / ni) + 1;
  const r = badInput
    ? { converged: false, status: 'not_finite' as RootStatus, x: 0, fx: Number.NaN, evaluations: 0 }
    : brentRoot(residual, uLo, uHi, { xTolerance: 1e-12, maxIterations: 200 });
  const u = r.x;
  const ionizedDonorsPerCm3 = donors.map((d) => d.n * occupancyComplement(d.g, u + d.x0));
  const ionizedAcceptorsPerCm3 = acceptors.map((a) => a.n * occupancyComplement(a.g, a.x0 - u));
  return {
    converged: r.converged,
    status: r.status,
    electronDensityPerCm3: ni * Math.exp(u),
    holeDensityPerCm3: ni * Math.exp(-u),
    ionizedDonorsPerCm3,
    ionizedAcceptorsPerCm3,
    fermiLevelEv: u * kT,
    conductionEdgeAboveIntrinsicEv: ecMinusEi,
    valenceEdgeBelowIntrinsicEv: eiMinusEv,
    relativeResidual: r.fx,
    evaluations: r.evaluations,
  };
}
