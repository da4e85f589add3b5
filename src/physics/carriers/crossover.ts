/**
 * Public API: the intrinsic crossover temperature, where n_i(T) equals the net doping
 * |Σ N_D − Σ N_A|. Above it the carrier densities are set by temperature, not by the dopants
 * (at the crossover itself, with full ionization, the majority density is (1 + √5)/2 ≈ 1.618
 * times the net doping).
 *
 * Method: Brent's method (src/physics/numeric/brent.ts) on ln n_i(T) − ln N_net in the variable
 * 1/T, over 20 K to the melting point; ln n_i is close to linear in 1/T, so a handful of
 * evaluations suffice. n_i(T) from the named or default intrinsic-density model, which the
 * result names; outside that model's fitted range the answer is an extrapolation and says so.
 *
 * Melting points (from memory, the usual handbook values): Si 1687 K, Ge 1211 K, GaAs 1511 K.
 * No crossover is reported above the melting point.
 */
import { defaultIntrinsicModel, findIntrinsicModel, INTRINSIC_MODELS } from '../intrinsic/registry.js';
import type { IntrinsicModel } from '../intrinsic/intrinsic-model.js';
import { brentRoot } from '../numeric/brent.js';
import { checkPositive, ok, refuse, type Outcome } from '../outcome.js';
import type { Problem } from '../problems.js';
import { DOPANT_TYPE, type Material, type Range } from '../types.js';
import { bandModelProblems, type DopantAmount } from './carriers.js';

export { MELTING_POINT_K } from '../materials.js';
import { MELTING_POINT_K } from '../materials.js';
export const CROSSOVER_LOWEST_K = 20;

export interface CrossoverRequest {
  /** Either dopants (net doping computed, compensation allowed) … */
  readonly dopants?: readonly DopantAmount[];
  /** … or the net doping directly, cm⁻³. */
  readonly netDopingPerCm3?: number;
  readonly material?: Material;
  readonly intrinsicModelId?: string;
}

export interface CrossoverResult {
  readonly temperatureK: number;
  readonly netDopingPerCm3: number;
  /** n_i at the crossover temperature (equals the net doping to the solver's tolerance). */
  readonly intrinsicDensityPerCm3: number;
  readonly material: Material;
  readonly model: IntrinsicModel;
  /** The range searched, K. */
  readonly searchedTemperatureK: Range;
  readonly problems: readonly Problem[];
  readonly assumptionCodes: readonly string[];
}

export function intrinsicCrossover(req: CrossoverRequest): Outcome<CrossoverResult> {
  const material = req.material ?? 'Si';
  let net: number;
  if (req.dopants !== undefined && req.dopants.length > 0) {
    let signed = 0;
    for (const d of req.dopants) {
      const bad = checkPositive('dopantDensityPerCm3', d.densityPerCm3);
      if (bad) return refuse(bad);
      signed += DOPANT_TYPE[d.dopant] === 'n' ? d.densityPerCm3 : -d.densityPerCm3;
    }
    net = Math.abs(signed);
  } else if (req.netDopingPerCm3 !== undefined) {
    net = req.netDopingPerCm3;
  } else {
    return refuse({ code: 'missing_input', quantity: 'netDopingPerCm3', needs: ['a dopant density', 'or dopants'] });
  }
  const bad = checkPositive('netDopingPerCm3', net);
  if (bad) return refuse(bad);

  let model: IntrinsicModel;
  if (req.intrinsicModelId !== undefined) {
    const found = findIntrinsicModel(req.intrinsicModelId);
    if (!found) return refuse({ code: 'unknown_model', model: req.intrinsicModelId, known: INTRINSIC_MODELS.map((m) => m.id) });
    if (!found.materials.includes(material)) {
      return refuse({ code: 'model_material', model: found.id, material, supported: [...found.materials] });
    }
    model = found;
  } else {
    model = defaultIntrinsicModel(material);
  }

  const range: Range = { min: CROSSOVER_LOWEST_K, max: MELTING_POINT_K[material] };
  const lnNet = Math.log(net);
  const f = (inverseT: number) => Math.log(model.intrinsicDensityPerCm3(material, 1 / inverseT)) - lnNet;
  // f decreases with 1/T: positive at the melting point end when a crossover exists.
  const r = brentRoot(f, 1 / range.max, 1 / range.min, { xTolerance: 1e-14, maxIterations: 200 });
  if (!r.converged) {
    if (r.status === 'no_sign_change') {
      const niMax = model.intrinsicDensityPerCm3(material, range.max);
      const niMin = model.intrinsicDensityPerCm3(material, range.min);
      return refuse({ code: 'outside_domain', quantity: 'netDopingPerCm3', input: net, min: niMin, max: niMax, model: model.id });
    }
    return refuse({ code: 'no_solution', quantity: 'temperatureK', model: model.id, status: r.status });
  }
  const T = 1 / r.x;
  const ni = model.intrinsicDensityPerCm3(material, T);
  if (!Number.isFinite(T) || !Number.isFinite(ni)) {
    return refuse({ code: 'no_solution', quantity: 'temperatureK', model: model.id, status: 'not_finite' });
  }
  return ok({
    temperatureK: T,
    netDopingPerCm3: net,
    intrinsicDensityPerCm3: ni,
    material,
    model,
    searchedTemperatureK: range,
    problems: bandModelProblems(material, T, model),
    assumptionCodes: ['crossover_definition', 'full_ionization'],
  });
}
