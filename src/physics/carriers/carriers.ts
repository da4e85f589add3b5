/**
 * Public API: equilibrium carriers in a uniformly doped crystal at any temperature, with
 * incomplete ionization and compensation (any mix of donors and acceptors).
 *
 * Physics: neutrality.ts (the solver), ionization-energies.ts (levels, g_D = 2, g_A = 4),
 * n_i(T) from the intrinsic-density models (src/physics/intrinsic), Eg(T) from Thurmond's
 * Varshni fit, Nc/Nv from src/physics/materials.ts, and the resistivity at that temperature
 * from a temperature-dependent mobility model (default Klaassen 1992), evaluated at the
 * ionized impurity densities and the solved n and p: ρ = 1/(q·(n·μn + p·μp)).
 *
 * Refuses what it cannot compute (GaAs has no levels for B/P/As/Sb; Ge has no mobility, so
 * its resistivity is left out with a 'quantity_not_covered' problem). Warns where the simple
 * ionization model overstates freeze-out (> 1e18 cm⁻³), where the crystal is degenerate
 * (E_F within 3 kT of a band edge), where n_i is comparable with the net doping, and where any
 * fit is used outside its range.
 */
import { BANDGAP_VALIDITY_TEMPERATURE_K, bandgapEv } from '../bandgap/varshni-thurmond-1975.js';
import { BOLTZMANN_EV_PER_K, ELEMENTARY_CHARGE_C, F723_REFERENCE_TEMPERATURE_K } from '../constants.js';
import { convertDensityToResistivity } from '../resistivity/convert.js';
import { densityOfStatesIntrinsicPerCm3 } from '../intrinsic/density-of-states.js';
import { defaultIntrinsicModel, findIntrinsicModel, INTRINSIC_MODELS } from '../intrinsic/registry.js';
import type { IntrinsicModel } from '../intrinsic/intrinsic-model.js';
import { conductionBandDensityPerCm3, DENSITY_OF_STATES, valenceBandDensityPerCm3 } from '../materials.js';
import { findMobilityModel, MOBILITY_MODELS } from '../mobility/registry.js';
import type { MobilityModel } from '../mobility/mobility-model.js';
import { mobilityPair } from '../mobility/temperature-model.js';
import { checkPositive, ok, refuse, type Outcome } from '../outcome.js';
import type { Problem } from '../problems.js';
import { DOPANT_TYPE, type CarrierType, type Dopant, type Material, type Range } from '../types.js';
import {
  ACCEPTOR_DEGENERACY,
  DONOR_DEGENERACY,
  IONIZATION_MATERIALS,
  IONIZATION_MODEL_LIMIT_PER_CM3,
  ionizationLevel,
} from './ionization-energies.js';
import { solveNeutrality, type DopantLevel } from './neutrality.js';

/** Temperatures the solver computes at at all (beyond: 'outside_domain'). 20 K keeps exp in range. */
export const CARRIERS_DOMAIN_TEMPERATURE_K: Range = { min: 20, max: 1600 };
/** Degenerate when E_F is within this many kT of a band edge. */
export const DEGENERACY_LIMIT_KT = 3;
/** n_i above this fraction of the net doping: say the carriers are set by temperature. */
export const INTRINSIC_REGIME_FRACTION = 0.1;
/** Default mobility model for resistivity at temperature. */
export const DEFAULT_TEMPERATURE_MOBILITY_MODEL_ID = 'klaassen-1992';
/** Materials the mobility models cover (resistivity at temperature). */
export const MOBILITY_MATERIALS: readonly Material[] = ['Si'];

export interface DopantAmount {
  readonly dopant: Dopant;
  readonly densityPerCm3: number;
}

export interface CarriersRequest {
  /** One or more dopants; donors and acceptors may be mixed (compensation). */
  readonly dopants: readonly DopantAmount[];
  readonly temperatureK: number;
  /** Default 'Si'. */
  readonly material?: Material;
  /** Mobility model for the resistivity (default Klaassen 1992). */
  readonly mobilityModelId?: string;
  /** Intrinsic-density model (default per material). */
  readonly intrinsicModelId?: string;
}

export interface DopantIonization {
  readonly dopant: Dopant;
  readonly kind: 'donor' | 'acceptor';
  readonly densityPerCm3: number;
  readonly ionizedDensityPerCm3: number;
  readonly ionizedFraction: number;
  readonly ionizationEnergyEv: number;
}

export interface CarriersResult {
  readonly material: Material;
  readonly temperatureK: number;
  readonly electronDensityPerCm3: number;
  readonly holeDensityPerCm3: number;
  readonly intrinsicDensityPerCm3: number;
  /** Majority carrier (n when n > p). */
  readonly carrierType: CarrierType;
  /** Σ N_D − Σ N_A, cm⁻³ (negative for net acceptors). */
  readonly netDonorDensityPerCm3: number;
  readonly dopants: readonly DopantIonization[];
  /** Ionized fraction of the dopant kind in excess (all of that kind together). */
  readonly ionizedFraction: number;
  /** E_F − E_i, eV (positive above the intrinsic level). */
  readonly fermiLevelEv: number;
  /** E_c − E_F, eV (positive when E_F is below the conduction band edge). */
  readonly fermiBelowConductionBandEv: number;
  /** E_F − E_v, eV (positive when E_F is above the valence band edge). */
  readonly fermiAboveValenceBandEv: number;
  readonly bandgapEv: number;
  readonly conductionBandDensityPerCm3: number;
  readonly valenceBandDensityPerCm3: number;
  readonly thermalEnergyEv: number;
  /** Present when the material's mobility is covered (Si). */
  readonly resistivityOhmCm?: number;
  readonly electronMobilityCm2PerVs?: number;
  readonly holeMobilityCm2PerVs?: number;
  readonly mobilityModel?: MobilityModel;
  /**
   * One dopant in Si: the resistivity is the room-temperature conversion `doping` uses (its
   * model and value at 23 °C), times the mobility model's ratio ρ(T)/ρ(23 °C), so the two
   * commands agree at 23 °C and the mobility model gives only the temperature dependence.
   */
  readonly resistivityAnchor?: { readonly modelId: string; readonly modelName: string; readonly resistivityAt23COhmCm: number; readonly mobilityModelAt23COhmCm: number };
  readonly intrinsicModel: IntrinsicModel;
  readonly problems: readonly Problem[];
  readonly assumptionCodes: readonly string[];
  readonly solver: { readonly evaluations: number; readonly relativeResidual: number };
}

function outside(quantity: string, input: number, range: Range, model: string): Problem[] {
  return input < range.min || input > range.max
    ? [{ code: 'outside_validity', quantity, input, min: range.min, max: range.max, model }]
    : [];
}

function resolveIntrinsic(material: Material, id?: string): Outcome<IntrinsicModel> {
  // The material's default, as for the `ni` command.
  if (id === undefined) return ok(defaultIntrinsicModel(material));
  const m = findIntrinsicModel(id);
  if (!m) return refuse({ code: 'unknown_model', model: id, known: INTRINSIC_MODELS.map((x) => x.id) });
  if (!m.materials.includes(material)) {
    return refuse({ code: 'model_material', model: m.id, material, supported: [...m.materials] });
  }
  return ok(m);
}

function resolveMobility(id?: string): Outcome<MobilityModel> {
  const wanted = id ?? DEFAULT_TEMPERATURE_MOBILITY_MODEL_ID;
  const m = findMobilityModel(wanted);
  if (!m) return refuse({ code: 'unknown_model', model: wanted, known: MOBILITY_MODELS.map((x) => x.id) });
  return ok(m);
}

/** Problems for the intrinsic, band-gap and density-of-states fits at a temperature. */
export function bandModelProblems(material: Material, temperatureK: number, intrinsic: IntrinsicModel): Problem[] {
  return [
    ...outside('temperatureK', temperatureK, intrinsic.validityTemperatureKFor?.(material) ?? intrinsic.validityTemperatureK, intrinsic.id),
    ...outside('temperatureK', temperatureK, BANDGAP_VALIDITY_TEMPERATURE_K, 'varshni-thurmond-1975'),
  ];
}

export function carriersAtTemperature(req: CarriersRequest): Outcome<CarriersResult> {
  const r = carriersUnanchored(req);
  if (!r.ok || r.value.resistivityOhmCm === undefined || req.dopants.length !== 1 || (req.material ?? 'Si') !== 'Si') return r;
  // Anchor the resistivity to the conversion `doping` uses at 23 °C (see `resistivityAnchor`).
  const d = req.dopants[0]!;
  const conv = convertDensityToResistivity({ dopantDensityPerCm3: d.densityPerCm3, dopant: d.dopant });
  const ref = carriersUnanchored({ ...req, temperatureK: F723_REFERENCE_TEMPERATURE_K });
  if (!conv.ok || !ref.ok || ref.value.resistivityOhmCm === undefined) return r;
  const scale = conv.value.resistivityOhmCm / ref.value.resistivityOhmCm;
  const v = r.value;
  return ok({
    ...v,
    resistivityOhmCm: v.resistivityOhmCm! * scale,
    ...(v.electronMobilityCm2PerVs !== undefined ? { electronMobilityCm2PerVs: v.electronMobilityCm2PerVs / scale } : {}),
    ...(v.holeMobilityCm2PerVs !== undefined ? { holeMobilityCm2PerVs: v.holeMobilityCm2PerVs / scale } : {}),
    resistivityAnchor: { modelId: conv.value.model.id, modelName: conv.value.model.name, resistivityAt23COhmCm: conv.value.resistivityOhmCm, mobilityModelAt23COhmCm: ref.value.resistivityOhmCm },
    assumptionCodes: [...v.assumptionCodes, 'resistivity_anchored_23C'],
  });
}

function carriersUnanchored(req: CarriersRequest): Outcome<CarriersResult> {
  const material = req.material ?? 'Si';
  const badT = checkPositive('temperatureK', req.temperatureK);
  if (badT) return refuse(badT);
  if (req.dopants.length === 0) {
    return refuse({ code: 'missing_input', quantity: 'dopantDensityPerCm3', needs: ['a dopant density and species'] });
  }
  for (const d of req.dopants) {
    const bad = checkPositive('dopantDensityPerCm3', d.densityPerCm3);
    if (bad) return refuse(bad);
  }
  const T = req.temperatureK;
  const dom = CARRIERS_DOMAIN_TEMPERATURE_K;
  if (T < dom.min || T > dom.max) {
    return refuse({ code: 'outside_domain', quantity: 'temperatureK', input: T, min: dom.min, max: dom.max, model: 'charge-neutrality' });
  }
  if (!IONIZATION_MATERIALS.includes(material)) {
    return refuse({ code: 'not_covered', quantity: 'ionizationEnergyEv', material, covered: [...IONIZATION_MATERIALS] });
  }
  const intrinsic = resolveIntrinsic(material, req.intrinsicModelId);
  if (!intrinsic.ok) return intrinsic;
  const mobility = resolveMobility(req.mobilityModelId);
  if (!mobility.ok) return mobility;

  const problems: Problem[] = [];
  const donors: { dopant: Dopant; level: DopantLevel }[] = [];
  const acceptors: { dopant: Dopant; level: DopantLevel }[] = [];
  for (const d of req.dopants) {
    const lvl = ionizationLevel(material, d.dopant);
    if (!lvl) return refuse({ code: 'not_covered', quantity: 'ionizationEnergyEv', material, covered: [...IONIZATION_MATERIALS] });
    if (lvl.fromMemory) {
      problems.push({ code: 'unverified_parameter', parameter: `${d.dopant} ionization energy in ${material}`, value: lvl.ionizationEnergyEv, unit: 'eV', source: lvl.source });
    }
    const donor = DOPANT_TYPE[d.dopant] === 'n';
    const level: DopantLevel = {
      densityPerCm3: d.densityPerCm3,
      ionizationEnergyEv: lvl.ionizationEnergyEv,
      degeneracy: donor ? DONOR_DEGENERACY : ACCEPTOR_DEGENERACY,
    };
    (donor ? donors : acceptors).push({ dopant: d.dopant, level });
    if (d.densityPerCm3 > IONIZATION_MODEL_LIMIT_PER_CM3) {
      problems.push({ code: 'ionization_model_limit', dopantDensityPerCm3: d.densityPerCm3, limitPerCm3: IONIZATION_MODEL_LIMIT_PER_CM3 });
    }
  }

  // Below the n_i fit's measured range (deep freeze-out) the band edges come from Nc(T), Nv(T)
  // and Eg(T) directly — n_i = √(Nc·Nv)·exp(−Eg/2kT) — scaled to the fit at the bottom of its
  // range, instead of the fit's extrapolation (which put 1e16 P at 30 K 38 % too ionized).
  const fitRange = intrinsic.value.validityTemperatureKFor?.(material) ?? intrinsic.value.validityTemperatureK;
  const belowFit = T < fitRange.min && intrinsic.value.id !== 'density-of-states';
  const ni = belowFit
    ? densityOfStatesIntrinsicPerCm3(material, T) * (intrinsic.value.intrinsicDensityPerCm3(material, fitRange.min) / densityOfStatesIntrinsicPerCm3(material, fitRange.min))
    : intrinsic.value.intrinsicDensityPerCm3(material, T);
  const eg = bandgapEv(material, T);
  const nc = conductionBandDensityPerCm3(material, T);
  const nv = valenceBandDensityPerCm3(material, T);
  const sol = solveNeutrality({
    donors: donors.map((d) => d.level),
    acceptors: acceptors.map((a) => a.level),
    temperatureK: T,
    intrinsicDensityPerCm3: ni,
    bandgapEv: eg,
    conductionBandDensityPerCm3: nc,
    valenceBandDensityPerCm3: nv,
  });
  const n = sol.electronDensityPerCm3;
  const p = sol.holeDensityPerCm3;
  if (!sol.converged || !Number.isFinite(n) || !Number.isFinite(p)) {
    return refuse({ code: 'no_solution', quantity: 'fermiLevelEv', model: 'charge-neutrality', status: sol.status });
  }

  problems.push(...(belowFit ? bandModelProblems(material, T, intrinsic.value).filter((p) => p.code !== 'outside_validity' || p.model !== intrinsic.value.id) : bandModelProblems(material, T, intrinsic.value)));
  problems.push(...outside('temperatureK', T, DENSITY_OF_STATES[material].validityTemperatureK, 'density-of-states'));

  const kT = BOLTZMANN_EV_PER_K * T;
  const belowCb = sol.conductionEdgeAboveIntrinsicEv - sol.fermiLevelEv;
  const aboveVb = sol.valenceEdgeBelowIntrinsicEv + sol.fermiLevelEv;
  if (belowCb < DEGENERACY_LIMIT_KT * kT) {
    problems.push({ code: 'degenerate', band: 'conduction', separationKT: belowCb / kT, limitKT: DEGENERACY_LIMIT_KT });
  }
  if (aboveVb < DEGENERACY_LIMIT_KT * kT) {
    problems.push({ code: 'degenerate', band: 'valence', separationKT: aboveVb / kT, limitKT: DEGENERACY_LIMIT_KT });
  }

  const ndTotal = donors.reduce((s, d) => s + d.level.densityPerCm3, 0);
  const naTotal = acceptors.reduce((s, a) => s + a.level.densityPerCm3, 0);
  const net = ndTotal - naTotal;
  if (ni >= INTRINSIC_REGIME_FRACTION * Math.abs(net)) {
    problems.push({ code: 'intrinsic_regime', intrinsicDensityPerCm3: ni, netDopingPerCm3: Math.abs(net) });
  }

  const dopants: DopantIonization[] = [
    ...donors.map((d, i) => {
      const ion = sol.ionizedDonorsPerCm3[i] ?? Number.NaN;
      return { dopant: d.dopant, kind: 'donor' as const, densityPerCm3: d.level.densityPerCm3, ionizedDensityPerCm3: ion, ionizedFraction: ion / d.level.densityPerCm3, ionizationEnergyEv: d.level.ionizationEnergyEv };
    }),
    ...acceptors.map((a, i) => {
      const ion = sol.ionizedAcceptorsPerCm3[i] ?? Number.NaN;
      return { dopant: a.dopant, kind: 'acceptor' as const, densityPerCm3: a.level.densityPerCm3, ionizedDensityPerCm3: ion, ionizedFraction: ion / a.level.densityPerCm3, ionizationEnergyEv: a.level.ionizationEnergyEv };
    }),
  ];
  const ndIon = sol.ionizedDonorsPerCm3.reduce((s, x) => s + x, 0);
  const naIon = sol.ionizedAcceptorsPerCm3.reduce((s, x) => s + x, 0);
  const ionizedFraction = net >= 0 ? ndIon / ndTotal : naIon / naTotal;

  let resistivity: Pick<CarriersResult, 'resistivityOhmCm' | 'electronMobilityCm2PerVs' | 'holeMobilityCm2PerVs' | 'mobilityModel'> = {};
  if (MOBILITY_MATERIALS.includes(material)) {
    const m = mobility.value;
    const mu = mobilityPair(m, {
      donorDensityPerCm3: ndIon,
      acceptorDensityPerCm3: naIon,
      electronDensityPerCm3: n,
      holeDensityPerCm3: p,
      temperatureK: T,
      ...(donors[0] ? { donor: donors[0].dopant } : {}),
    });
    const rho = 1 / (ELEMENTARY_CHARGE_C * (n * mu.electronCm2PerVs + p * mu.holeCm2PerVs));
    problems.push(...outside('temperatureK', T, m.validityTemperatureK, m.id));
    const range = m.validityDensityPerCm3[req.dopants[0]?.dopant ?? 'phosphorus'];
    if (range) problems.push(...outside('dopantDensityPerCm3', ndIon + naIon, range, m.id));
    if (Number.isFinite(rho) && rho > 0) {
      resistivity = { resistivityOhmCm: rho, electronMobilityCm2PerVs: mu.electronCm2PerVs, holeMobilityCm2PerVs: mu.holeCm2PerVs, mobilityModel: m };
    } else {
      problems.push({ code: 'quantity_not_covered', quantity: 'resistivityOhmCm', material, covered: [...MOBILITY_MATERIALS] });
    }
  } else {
    problems.push({ code: 'quantity_not_covered', quantity: 'resistivityOhmCm', material, covered: [...MOBILITY_MATERIALS] });
  }

  const assumptionCodes = [
    'equilibrium',
    'incomplete_ionization',
    'boltzmann_statistics',
    'dopant_degeneracy_2_4',
    ...(belowFit ? ['freeze_out_band_edges'] : []),
    ...(resistivity.resistivityOhmCm !== undefined ? ['mobility_ionized_impurities'] : []),
  ];

  return ok({
    material,
    temperatureK: T,
    electronDensityPerCm3: n,
    holeDensityPerCm3: p,
    intrinsicDensityPerCm3: ni,
    carrierType: n >= p ? 'n' : 'p',
    netDonorDensityPerCm3: net,
    dopants,
    ionizedFraction,
    fermiLevelEv: sol.fermiLevelEv,
    fermiBelowConductionBandEv: belowCb,
    fermiAboveValenceBandEv: aboveVb,
    bandgapEv: eg,
    conductionBandDensityPerCm3: nc,
    valenceBandDensityPerCm3: nv,
    thermalEnergyEv: kT,
    ...resistivity,
    intrinsicModel: intrinsic.value,
    problems,
    assumptionCodes,
    solver: { evaluations: sol.evaluations, relativeResidual: sol.relativeResidual },
  });
}
