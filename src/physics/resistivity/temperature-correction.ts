/**
 * Public API: a resistivity reading taken off 23 °C, corrected to 23 °C (or another reference).
 *
 * Model route (default): find the dopant density N that makes the temperature-dependent model
 * reproduce the reading at the reading's temperature, ρ(N, T) = ρ_reading (Brent in log10 N,
 * src/physics/numeric/invert-density.ts), then
 *   ρ_ref = ρ(N, T_ref)                                   (the corrected value)
 *   α(T) = (1/ρ)·dρ/dT = d ln ρ(N, T)/dT at the reading   (central difference, ±0.5 K)
 *   ᾱ = (ρ_reading/ρ_ref − 1)/(T − T_ref)                 (the linear coefficient that maps exactly)
 * with ρ(N, T) from resistivity-at-temperature.ts (full ionization, n_i(T), mobility from
 * Klaassen 1992 by default, or Arora 1982). This is a MODEL ESTIMATE: the standard's own
 * temperature-coefficient table (ASTM F84) is not used; every result carries an
 * 'estimate_only' problem saying so.
 *
 * User route: a coefficient α (fraction per K, e.g. 0.0075 for 0.75 %/K) applied linearly,
 *   ρ_ref = ρ_reading / (1 + α·(T − T_ref)).
 *
 * Textbook behaviour the tests check: lightly doped Si rises by roughly 0.7–0.8 %/K near room
 * temperature (lattice scattering, μ ∝ T^−2.2…−2.3); heavily doped material is nearly flat
 * (impurity scattering dominates). Masetti and F723 stay fixed-temperature models (300 K and
 * 23 °C) and cannot make this correction.
 */
import { F723_REFERENCE_TEMPERATURE_K } from '../constants.js';
import { defaultIntrinsicModel, findIntrinsicModel, INTRINSIC_MODELS } from '../intrinsic/registry.js';
import type { IntrinsicModel } from '../intrinsic/intrinsic-model.js';
import { findMobilityModel, MOBILITY_MODELS } from '../mobility/registry.js';
import type { MobilityModel } from '../mobility/mobility-model.js';
import { invertResistivityForDensity } from '../numeric/invert-density.js';
import { checkFinite, checkPositive, ok, refuse, type Outcome } from '../outcome.js';
import type { Problem } from '../problems.js';
import type { Dopant, Range } from '../types.js';
import { resistivityAtTemperature } from './resistivity-at-temperature.js';

export const DEFAULT_TEMPERATURE_CORRECTION_MODEL_ID = 'klaassen-1992';
/** Step of the central difference for the local coefficient, K. */
export const COEFFICIENT_STEP_K = 0.5;
/**
 * A model-based (or linear) correction is trusted within this distance of the reference (23 °C ±
 * 10 K), and for changes below TRUSTED_CHANGE; beyond either the reply says how large the
 * correction is and from which model (common practice, no source: there the measurement's own
 * temperature uncertainty no longer dominates the model's).
 */
export const TRUSTED_WITHIN_K = 10;
export const TRUSTED_CHANGE = 0.1;

function sizeWarning(T: number, tRef: number, factor: number, model: string): Problem[] {
  if (Math.abs(T - tRef) <= TRUSTED_WITHIN_K && Math.abs(factor - 1) < TRUSTED_CHANGE) return [];
  return [{ code: 'large_temperature_correction', temperatureK: T, referenceK: tRef, changePercent: (factor - 1) * 100, model, trustedWithinK: TRUSTED_WITHIN_K }];
}

/** Readings outside this range are refused: no silicon reading is taken there. */
export const READING_DOMAIN_TEMPERATURE_K: Range = { min: 200, max: 600 };
/** Upper end of the density search, log10 cm⁻³. */
const DENSITY_MAX_LOG10 = 21.5;

export interface TemperatureCorrectionRequest {
  /** The reading, Ω·cm, at `temperatureK`. */
  readonly resistivityOhmCm: number;
  /** Temperature of the reading, K. */
  readonly temperatureK: number;
  readonly dopant: Dopant;
  /** Default 296.15 K (23 °C, the ASTM F723 reference). */
  readonly referenceTemperatureK?: number;
  /** The user's coefficient, fraction per K (0.0075 = 0.75 %/K); replaces the model. */
  readonly coefficientPerK?: number;
  /** Temperature-dependent mobility model (default Klaassen 1992). */
  readonly mobilityModelId?: string;
  readonly intrinsicModelId?: string;
}

export interface TemperatureCorrectionResult {
  readonly measuredResistivityOhmCm: number;
  readonly measuredTemperatureK: number;
  readonly referenceTemperatureK: number;
  /** The corrected value at the reference temperature, Ω·cm. */
  readonly resistivityOhmCm: number;
  /** (1/ρ)·dρ/dT at the reading's temperature (model) or the user's coefficient, per K. */
  readonly temperatureCoefficientPerK: number;
  /** The linear coefficient that maps the reading exactly onto the corrected value, per K. */
  readonly meanCoefficientPerK: number;
  /** ρ_ref / ρ_reading. */
  readonly correctionFactor: number;
  readonly coefficientSource: 'model' | 'user';
  readonly dopant: Dopant;
  /** The self-consistent dopant density (model route only), cm⁻³. */
  readonly dopantDensityPerCm3?: number;
  readonly mobilityModel?: MobilityModel;
  readonly intrinsicModel?: IntrinsicModel;
  readonly problems: readonly Problem[];
  readonly assumptionCodes: readonly string[];
}

function outside(quantity: string, input: number, range: Range | undefined, model: string): Problem[] {
  if (!range) return [];
  return input < range.min || input > range.max
    ? [{ code: 'outside_validity', quantity, input, min: range.min, max: range.max, model }]
    : [];
}

export function correctResistivityToReference(req: TemperatureCorrectionRequest): Outcome<TemperatureCorrectionResult> {
  const badRho = checkPositive('resistivityOhmCm', req.resistivityOhmCm);
  if (badRho) return refuse(badRho);
  const badT = checkPositive('temperatureK', req.temperatureK);
  if (badT) return refuse(badT);
  const tRef = req.referenceTemperatureK ?? F723_REFERENCE_TEMPERATURE_K;
  const badRef = checkPositive('referenceTemperatureK', tRef);
  if (badRef) return refuse(badRef);
  const T = req.temperatureK;
  const dom = READING_DOMAIN_TEMPERATURE_K;
  for (const [quantity, t] of [
    ['temperatureK', T],
    ['referenceTemperatureK', tRef],
  ] as const) {
    if (t < dom.min || t > dom.max) {
      return refuse({ code: 'outside_domain', quantity, input: t, min: dom.min, max: dom.max, model: 'temperature-correction' });
    }
  }
  const rho = req.resistivityOhmCm;
  const dT = T - tRef;

  if (req.coefficientPerK !== undefined) {
    const badC = checkFinite('temperatureCoefficientPerK', req.coefficientPerK);
    if (badC) return refuse(badC);
    const factor = 1 + req.coefficientPerK * dT;
    if (!(factor > 0)) {
      return refuse({ code: 'outside_domain', quantity: 'temperatureCoefficientPerK', input: req.coefficientPerK, min: -1 / Math.abs(dT || 1), max: 1 / Math.abs(dT || 1), model: 'linear-coefficient' });
    }
    const corrected = rho / factor;
    return ok({
      measuredResistivityOhmCm: rho,
      measuredTemperatureK: T,
      referenceTemperatureK: tRef,
      resistivityOhmCm: corrected,
      temperatureCoefficientPerK: req.coefficientPerK,
      meanCoefficientPerK: req.coefficientPerK,
      correctionFactor: corrected / rho,
      coefficientSource: 'user',
      dopant: req.dopant,
      problems: [
        { code: 'estimate_only', model: 'linear-coefficient', reason: 'the coefficient given is applied linearly, ρ_ref = ρ/(1 + α·ΔT); confirm it against the fab’s procedure' },
        ...sizeWarning(T, tRef, corrected / rho, 'your coefficient, applied linearly'),
      ],
      assumptionCodes: ['tc_linear_user'],
    });
  }

  const id = req.mobilityModelId ?? DEFAULT_TEMPERATURE_CORRECTION_MODEL_ID;
  const model = findMobilityModel(id);
  if (!model) return refuse({ code: 'unknown_model', model: id, known: MOBILITY_MODELS.map((m) => m.id) });
  const tRange = model.validityTemperatureK;
  if (!(tRange.max > tRange.min)) {
    // A fixed-temperature model (Masetti, Caughey–Thomas) has no temperature law to use.
    return refuse({ code: 'outside_domain', quantity: 'temperatureK', input: T, min: tRange.min, max: tRange.max, model: model.id });
  }
  if (!model.dopants.includes(req.dopant)) {
    return refuse({ code: 'model_dopant', model: model.id, dopant: req.dopant, supported: [...model.dopants] });
  }
  let intrinsic: IntrinsicModel;
  if (req.intrinsicModelId !== undefined) {
    const found = findIntrinsicModel(req.intrinsicModelId);
    if (!found) return refuse({ code: 'unknown_model', model: req.intrinsicModelId, known: INTRINSIC_MODELS.map((m) => m.id) });
    if (!found.materials.includes('Si')) {
      return refuse({ code: 'model_material', model: found.id, material: 'Si', supported: [...found.materials] });
    }
    intrinsic = found;
  } else {
    // One model for both temperatures: silicon's default.
    intrinsic = defaultIntrinsicModel('Si');
  }

  const niAt = (t: number) => intrinsic.intrinsicDensityPerCm3('Si', t);
  const rhoAt = (n: number, t: number) => resistivityAtTemperature(model, n, req.dopant, t, niAt(t)).resistivityOhmCm;
  const niT = niAt(T);
  // Above ~3·n_i, ρ(N) falls monotonically (below it, p-type ρ(N) peaks: mixed conduction).
  const loLog10 = Math.max(8, Math.log10(3 * niT));
  const inv = invertResistivityForDensity((n) => rhoAt(n, T), rho, { min: loLog10, max: DENSITY_MAX_LOG10 });
  if (!inv.converged) {
    if (inv.status === 'no_sign_change') {
      return refuse({
        code: 'outside_domain',
        quantity: 'resistivityOhmCm',
        input: rho,
        min: rhoAt(Math.pow(10, DENSITY_MAX_LOG10), T),
        max: rhoAt(Math.pow(10, loLog10), T),
        model: model.id,
      });
    }
    return refuse({ code: 'no_solution', quantity: 'dopantDensityPerCm3', model: model.id, status: inv.status });
  }
  const N = inv.dopantDensityPerCm3;
  const atT = rhoAt(N, T);
  const atRef = rhoAt(N, tRef);
  const corrected = rho * (atRef / atT);
  const h = COEFFICIENT_STEP_K;
  const local = (Math.log(rhoAt(N, T + h)) - Math.log(rhoAt(N, T - h))) / (2 * h);
  const mean = Math.abs(dT) > 1e-6 ? (rho / corrected - 1) / dT : local;
  if (![corrected, local, mean].every(Number.isFinite)) {
    return refuse({ code: 'no_solution', quantity: 'resistivityOhmCm', model: model.id, status: 'not_finite' });
  }

  const problems: Problem[] = [
    {
      code: 'estimate_only',
      model: model.id,
      reason: `temperature coefficient computed with the mobility model ${model.name} at the reading's doping, not the standard's (ASTM F84) table`,
    },
    ...outside('temperatureK', T, tRange, model.id),
    ...outside('referenceTemperatureK', tRef, tRange, model.id),
    ...outside('dopantDensityPerCm3', N, model.validityDensityPerCm3[req.dopant], model.id),
    ...outside('temperatureK', T, intrinsic.validityTemperatureKFor?.('Si') ?? intrinsic.validityTemperatureK, intrinsic.id),
    ...sizeWarning(T, tRef, corrected / rho, model.name),
  ];
  return ok({
    measuredResistivityOhmCm: rho,
    measuredTemperatureK: T,
    referenceTemperatureK: tRef,
    resistivityOhmCm: corrected,
    temperatureCoefficientPerK: local,
    meanCoefficientPerK: mean,
    correctionFactor: corrected / rho,
    coefficientSource: 'model',
    dopant: req.dopant,
    dopantDensityPerCm3: N,
    mobilityModel: model,
    intrinsicModel: intrinsic,
    problems,
    assumptionCodes: ['uncompensated', 'tc_full_ionization', 'tc_self_consistent'],
  });
}
