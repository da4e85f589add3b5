/**
 * Irvin's method for diffused layers: sheet resistance from the dopant profile by integrating
 * the conductivity over the layer, and the inverse (the surface concentration that gives a
 * measured sheet resistance at a given junction depth).
 *
 * Source: J. C. Irvin, "Resistivity of bulk silicon and of diffused layers in silicon", Bell
 *   Syst. Tech. J. 41, 387–410 (1962). Irvin computed his diffused-layer curves (average
 *   conductivity against surface concentration, for erfc and Gaussian profiles on several
 *   background densities) exactly this way, with the mobility curves of his day; we compute,
 *   we do not quote his curves (none were retrieved), and the mobility model is named.
 *
 *   N_net(x) = N(x) − N_B                       (diffused dopant minus background, 0 ≤ x ≤ xj)
 *   G_s = 1/R_s = ∫₀^xj q·μ(x)·N_net(x) dx       (sheet conductance, S)
 *   σ̄ = G_s/xj,  ρ̄ = R_s·xj                      (average conductivity and resistivity)
 *
 * The mobility is that of the layer's majority carrier at the local impurity densities: the
 * total ionized impurity density N(x) + N_B scatters (for Klaassen, donors and acceptors enter
 * separately with the carrier density N_net(x), which is how it treats compensation; for the
 * single-curve models, μ is read at N(x) + N_B). Full ionization; the junction's depletion
 * region and minority carriers are neglected, as in Irvin's curves.
 *
 * Numerics: adaptive Gauss–Kronrod G7–K15 (src/physics/numeric/gauss-kronrod.ts) to a relative
 * error estimate of 1e-7, far inside the 0.1 % the result is quoted to (tests check it against
 * closed-form integrals). The inverse is Brent's method in log10 Cs between just above N_B and
 * 1e22 cm⁻³; R_s falls monotonically as Cs rises at fixed xj (property-tested).
 */
import { ELEMENTARY_CHARGE_C } from '../constants.js';
import { integrateAdaptive } from '../numeric/gauss-kronrod.js';
import { brentRoot } from '../numeric/brent.js';
import { findMobilityModel, MOBILITY_MODELS } from '../mobility/registry.js';
import type { MobilityModel } from '../mobility/mobility-model.js';
import { mobilityPair } from '../mobility/temperature-model.js';
import { checkPositive, ok, refuse, type Outcome } from '../outcome.js';
import type { Problem } from '../problems.js';
import { DOPANT_TYPE, type CarrierType, type Dopant, type Range } from '../types.js';
import { PROFILES, type ProfileDescriptor, type ProfileShape } from './profiles.js';

export const DEFAULT_LAYER_MOBILITY_MODEL_ID = 'klaassen-1992';
export const LAYER_REFERENCE_TEMPERATURE_K = 300;
/** Relative tolerance of the sheet-conductance integral. */
export const LAYER_INTEGRATION_REL_TOLERANCE = 1e-7;
/** Bracket of the inverse in log10 Cs: upper end, cm⁻³. */
export const LAYER_SURFACE_MAX_PER_CM3 = 1e22;

export interface LayerGeometry {
  readonly profile: ProfileShape;
  /** The diffused dopant (its kind sets the layer's type). */
  readonly dopant: Dopant;
  /** The background dopant, of the opposite kind. */
  readonly backgroundDopant: Dopant;
  readonly backgroundDensityPerCm3: number;
  readonly junctionDepthCm: number;
  /** Default 300 K (Irvin's curves are room-temperature curves). */
  readonly temperatureK?: number;
  /** Default Klaassen 1992. */
  readonly mobilityModelId?: string;
}

export interface LayerForwardRequest extends LayerGeometry {
  readonly surfaceConcentrationPerCm3: number;
}

export interface LayerInverseRequest extends LayerGeometry {
  readonly sheetResistanceOhmPerSq: number;
}

export interface LayerResult {
  readonly profile: ProfileDescriptor;
  readonly dopant: Dopant;
  readonly layerType: CarrierType;
  readonly backgroundDopant: Dopant;
  readonly backgroundDensityPerCm3: number;
  readonly junctionDepthCm: number;
  readonly surfaceConcentrationPerCm3: number;
  readonly sheetResistanceOhmPerSq: number;
  readonly sheetConductanceS: number;
  readonly averageConductivitySPerCm: number;
  /** ρ̄ = R_s·xj. */
  readonly averageResistivityOhmCm: number;
  /** The profile's characteristic length L, cm. */
  readonly characteristicLengthCm: number;
  /** Mobility of the layer's majority carrier at the surface, cm²/(V·s). */
  readonly surfaceMobilityCm2PerVs: number;
  readonly temperatureK: number;
  readonly mobilityModel: MobilityModel;
  readonly integration: { readonly relativeErrorEstimate: number; readonly evaluations: number };
  readonly problems: readonly Problem[];
  readonly assumptionCodes: readonly string[];
}

interface Prepared {
  readonly profile: ProfileDescriptor;
  readonly model: MobilityModel;
  readonly donorDiffused: boolean;
  readonly temperatureK: number;
}

/** Kernel: local majority-carrier mobility in the layer, cm²/(V·s). */
function layerMobility(p: Prepared, diffused: Dopant, background: Dopant, nDiff: number, nBg: number): number {
  const net = Math.max(nDiff - nBg, 0);
  const donors = p.donorDiffused ? nDiff : nBg;
  const acceptors = p.donorDiffused ? nBg : nDiff;
  const donor = p.donorDiffused ? diffused : background;
  const mu = mobilityPair(p.model, {
    donorDensityPerCm3: donors,
    acceptorDensityPerCm3: acceptors,
    electronDensityPerCm3: p.donorDiffused ? net : 0,
    holeDensityPerCm3: p.donorDiffused ? 0 : net,
    temperatureK: p.temperatureK,
    donor,
  });
  return p.donorDiffused ? mu.electronCm2PerVs : mu.holeCm2PerVs;
}

export interface SheetKernel {
  readonly sheetConductanceS: number;
  readonly lengthCm: number;
  readonly relativeError: number;
  readonly evaluations: number;
  readonly converged: boolean;
}

/**
 * Kernel: sheet conductance G_s = ∫₀^xj q·μ·N_net dx of a profile, for any local mobility
 * μ(N_diffused, N_background). Never throws; NaN conductance when Cs ≤ N_B (no junction).
 */
export function layerSheetConductance(
  profile: ProfileDescriptor,
  surfaceConcentrationPerCm3: number,
  backgroundDensityPerCm3: number,
  junctionDepthCm: number,
  mobilityCm2PerVs: (diffusedPerCm3: number, backgroundPerCm3: number) => number,
): SheetKernel {
  const cs = surfaceConcentrationPerCm3;
  const nb = backgroundDensityPerCm3;
  const xj = junctionDepthCm;
  const l = profile.lengthCm(cs, nb, xj);
  if (!(l > 0) || !Number.isFinite(l)) {
    return { sheetConductanceS: Number.NaN, lengthCm: l, relativeError: Number.NaN, evaluations: 0, converged: false };
  }
  const integrand = (x: number) => {
    const nDiff = profile.densityPerCm3(cs, l, x);
    const net = nDiff - nb;
    if (!(net > 0)) return 0;
    return ELEMENTARY_CHARGE_C * mobilityCm2PerVs(nDiff, nb) * net;
  };
  const r = integrateAdaptive(integrand, 0, xj, { relTolerance: LAYER_INTEGRATION_REL_TOLERANCE, maxIntervals: 400 });
  return {
    sheetConductanceS: r.value,
    lengthCm: l,
    relativeError: r.value > 0 ? r.errorEstimate / r.value : Number.POSITIVE_INFINITY,
    evaluations: r.evaluations,
    converged: r.converged,
  };
}

function sheetConductance(p: Prepared, g: LayerGeometry, cs: number): SheetKernel {
  return layerSheetConductance(p.profile, cs, g.backgroundDensityPerCm3, g.junctionDepthCm, (nDiff, nBg) =>
    layerMobility(p, g.dopant, g.backgroundDopant, nDiff, nBg),
  );
}

function prepare(g: LayerGeometry): Outcome<Prepared> {
  for (const [quantity, v] of [
    ['backgroundDensityPerCm3', g.backgroundDensityPerCm3],
    ['junctionDepthCm', g.junctionDepthCm],
  ] as const) {
    const bad = checkPositive(quantity, v);
    if (bad) return refuse(bad);
  }
  const temperatureK = g.temperatureK ?? LAYER_REFERENCE_TEMPERATURE_K;
  const badT = checkPositive('temperatureK', temperatureK);
  if (badT) return refuse(badT);
  if (DOPANT_TYPE[g.dopant] === DOPANT_TYPE[g.backgroundDopant]) {
    return refuse({ code: 'dopant_pairing', dopant: g.dopant, background: g.backgroundDopant });
  }
  const id = g.mobilityModelId ?? DEFAULT_LAYER_MOBILITY_MODEL_ID;
  const model = findMobilityModel(id);
  if (!model) return refuse({ code: 'unknown_model', model: id, known: MOBILITY_MODELS.map((m) => m.id) });
  return ok({ profile: PROFILES[g.profile], model, donorDiffused: DOPANT_TYPE[g.dopant] === 'n', temperatureK });
}

function outside(quantity: string, input: number, range: Range | undefined, model: string): Problem[] {
  if (!range) return [];
  return input < range.min || input > range.max
    ? [{ code: 'outside_validity', quantity, input, min: range.min, max: range.max, model }]
    : [];
}

function result(p: Prepared, g: LayerGeometry, cs: number, k: SheetKernel): LayerResult {
  const rs = 1 / k.sheetConductanceS;
  const m = p.model;
  const problems: Problem[] = [
    ...outside('surfaceConcentrationPerCm3', cs, m.validityDensityPerCm3[g.dopant], m.id),
    ...outside('temperatureK', p.temperatureK, m.validityTemperatureK, m.id),
  ];
  return {
    profile: p.profile,
    dopant: g.dopant,
    layerType: DOPANT_TYPE[g.dopant],
    backgroundDopant: g.backgroundDopant,
    backgroundDensityPerCm3: g.backgroundDensityPerCm3,
    junctionDepthCm: g.junctionDepthCm,
    surfaceConcentrationPerCm3: cs,
    sheetResistanceOhmPerSq: rs,
    sheetConductanceS: k.sheetConductanceS,
    averageConductivitySPerCm: k.sheetConductanceS / g.junctionDepthCm,
    averageResistivityOhmCm: rs * g.junctionDepthCm,
    characteristicLengthCm: k.lengthCm,
    surfaceMobilityCm2PerVs: layerMobility(p, g.dopant, g.backgroundDopant, cs, g.backgroundDensityPerCm3),
    temperatureK: p.temperatureK,
    mobilityModel: m,
    integration: { relativeErrorEstimate: k.relativeError, evaluations: k.evaluations },
    problems,
    assumptionCodes: ['layer_profile', 'layer_full_ionization', 'layer_mobility_total_impurities', 'layer_no_depletion'],
  };
}

/** Forward: Cs, xj, profile, background → sheet resistance, average conductivity and resistivity. */
export function layerSheetResistance(req: LayerForwardRequest): Outcome<LayerResult> {
  const bad = checkPositive('surfaceConcentrationPerCm3', req.surfaceConcentrationPerCm3);
  if (bad) return refuse(bad);
  const prep = prepare(req);
  if (!prep.ok) return prep;
  const cs = req.surfaceConcentrationPerCm3;
  if (!(cs > req.backgroundDensityPerCm3)) {
    return refuse({ code: 'no_junction', surfaceConcentrationPerCm3: cs, backgroundDensityPerCm3: req.backgroundDensityPerCm3 });
  }
  if (cs > LAYER_SURFACE_MAX_PER_CM3) {
    return refuse({ code: 'outside_domain', quantity: 'surfaceConcentrationPerCm3', input: cs, min: req.backgroundDensityPerCm3, max: LAYER_SURFACE_MAX_PER_CM3, model: prep.value.model.id });
  }
  const k = sheetConductance(prep.value, req, cs);
  if (!k.converged || !(k.sheetConductanceS > 0)) {
    return refuse({ code: 'no_solution', quantity: 'sheetResistanceOhmPerSq', model: prep.value.model.id, status: 'integration_not_converged' });
  }
  return ok(result(prep.value, req, cs, k));
}

/** Inverse: R_s, xj, profile, background → the surface concentration. */
export function layerSurfaceConcentration(req: LayerInverseRequest): Outcome<LayerResult> {
  const bad = checkPositive('sheetResistanceOhmPerSq', req.sheetResistanceOhmPerSq);
  if (bad) return refuse(bad);
  const prep = prepare(req);
  if (!prep.ok) return prep;
  const p = prep.value;
  const nb = req.backgroundDensityPerCm3;
  if (nb * 10 >= LAYER_SURFACE_MAX_PER_CM3) {
    return refuse({ code: 'outside_domain', quantity: 'backgroundDensityPerCm3', input: nb, min: 0, max: LAYER_SURFACE_MAX_PER_CM3 / 10, model: p.model.id });
  }
  const lnTarget = Math.log(req.sheetResistanceOhmPerSq);
  // Residual in ln R_s: decreasing in log10 Cs. Just above N_B the layer has almost no net charge.
  const lo = Math.log10(nb) + 1e-6;
  const hi = Math.log10(LAYER_SURFACE_MAX_PER_CM3);
  const residual = (u: number) => -Math.log(sheetConductance(p, req, Math.pow(10, u)).sheetConductanceS) - lnTarget;
  const r = brentRoot(residual, lo, hi, { xTolerance: 1e-10, maxIterations: 200 });
  if (!r.converged) {
    if (r.status === 'no_sign_change') {
      const rsMin = 1 / sheetConductance(p, req, LAYER_SURFACE_MAX_PER_CM3).sheetConductanceS;
      const rsMax = 1 / sheetConductance(p, req, Math.pow(10, lo)).sheetConductanceS;
      return refuse({ code: 'outside_domain', quantity: 'sheetResistanceOhmPerSq', input: req.sheetResistanceOhmPerSq, min: rsMin, max: rsMax, model: p.model.id });
    }
    return refuse({ code: 'no_solution', quantity: 'surfaceConcentrationPerCm3', model: p.model.id, status: r.status });
  }
  const cs = Math.pow(10, r.x);
  const k = sheetConductance(p, req, cs);
  if (!k.converged || !(k.sheetConductanceS > 0)) {
    return refuse({ code: 'no_solution', quantity: 'surfaceConcentrationPerCm3', model: p.model.id, status: 'integration_not_converged' });
  }
  return ok(result(p, req, cs, k));
}
