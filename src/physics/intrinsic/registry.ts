/**
 * Intrinsic-density models and the public function.
 * Default: Couderc–Amara–Lemiti for Si (one smooth function of T; 0.4 % from Altermatt 2003's
 * 9.65e9 at 300 K; see its file), the density-of-states form for Ge and GaAs. The older fits
 * stay selectable by id.
 */
import { MELTING_POINT_K } from '../materials.js';
import { PASSLER_VALIDITY_TEMPERATURE_K } from '../bandgap/passler-2002.js';
import { BANDGAP_VALIDITY_TEMPERATURE_K, bandgapEv } from '../bandgap/varshni-thurmond-1975.js';
import { conductionBandDensityPerCm3, valenceBandDensityPerCm3 } from '../materials.js';
import { checkPositive, ok, refuse, type Outcome } from '../outcome.js';
import type { Problem } from '../problems.js';
import type { Material, Range } from '../types.js';
import { densityOfStatesModel } from './density-of-states.js';
import type { IntrinsicModel } from './intrinsic-model.js';
import { couderc2014 } from './couderc-2014.js';
import { misiakosTsamakis1993 } from './misiakos-tsamakis-1993.js';
import { sproulGreen1991 } from './sproul-green-1991.js';

export const INTRINSIC_MODELS: readonly IntrinsicModel[] = [couderc2014, misiakosTsamakis1993, sproulGreen1991, densityOfStatesModel];

/** Current value at 300 K and the outdated one people still expect. */
export const SILICON_INTRINSIC_300K = {
  currentPerCm3: 9.65e9,
  outdatedPerCm3: 1.45e10,
  source: 'P. P. Altermatt et al., J. Appl. Phys. 93, 1598 (2003)',
} as const;

/**
 * Temperatures at which the public API computes at all (beyond: 'outside_domain'). 1 K keeps
 * exp(−Eg/2kT) above underflow for the fits; 2000 K is above the melting points of Si
 * (1687 K), Ge and GaAs (from memory), where no solid-state value means anything.
 */
export const INTRINSIC_DOMAIN_TEMPERATURE_K: Range = { min: 1, max: 2000 };

function normalise(s: string): string {
  return s.trim().toLowerCase().replace(/[\s_–—]+/g, '-');
}

export function findIntrinsicModel(id: string): IntrinsicModel | undefined {
  const key = normalise(id);
  return INTRINSIC_MODELS.find((m) => m.id === key || (m.aliases ?? []).includes(key));
}

/**
 * The default per material, one model each, whatever the temperature. Silicon's is one
 * continuous model on purpose: switching between fits by temperature made steps of several per
 * cent in n_i (and `ni` and `crossover` disagreed); outside its validity the reply warns instead.
 */
const DEFAULT_MODEL: Readonly<Record<Material, IntrinsicModel>> = {
  Si: couderc2014,
  Ge: densityOfStatesModel,
  GaAs: densityOfStatesModel,
};

export function defaultIntrinsicModel(material: Material): IntrinsicModel {
  return DEFAULT_MODEL[material];
}

export interface IntrinsicDensityResult {
  readonly intrinsicDensityPerCm3: number;
  readonly bandgapEv: number;
  /** n·p = n_i² in equilibrium, cm⁻⁶. */
  readonly massActionProductPerCm6: number;
  readonly conductionBandDensityPerCm3: number;
  readonly valenceBandDensityPerCm3: number;
  readonly temperatureK: number;
  readonly material: Material;
  readonly model: IntrinsicModel;
  readonly problems: Problem[];
}

/**
 * Plain kernel for other physics code: n_i in cm⁻³ from the default (or named) model.
 * Never throws; NaN for T ≤ 0, an unknown model id, or a model that lacks the material.
 */
export function intrinsicDensityPerCm3(material: Material, temperatureK: number, modelId?: string): number {
  if (!(temperatureK > 0)) return Number.NaN;
  const model = modelId === undefined ? defaultIntrinsicModel(material) : findIntrinsicModel(modelId);
  if (!model || !model.materials.includes(material)) return Number.NaN;
  return model.intrinsicDensityPerCm3(material, temperatureK);
}

export function intrinsicDensity(req: {
  temperatureK: number;
  material: Material;
  modelId?: string;
}): Outcome<IntrinsicDensityResult> {
  const bad = checkPositive('temperatureK', req.temperatureK);
  if (bad) return refuse(bad);
  const { temperatureK, material } = req;
  let model: IntrinsicModel;
  if (req.modelId !== undefined) {
    const found = findIntrinsicModel(req.modelId);
    if (!found) return refuse({ code: 'unknown_model', model: req.modelId, known: INTRINSIC_MODELS.map((m) => m.id) });
    if (!found.materials.includes(material)) {
      return refuse({ code: 'model_material', model: found.id, material, supported: [...found.materials] });
    }
    model = found;
  } else {
    model = defaultIntrinsicModel(material);
  }
  if (temperatureK > MELTING_POINT_K[material]) {
    return refuse({ code: 'above_melting_point', material, temperatureK, meltingPointK: MELTING_POINT_K[material] });
  }
  const dom = INTRINSIC_DOMAIN_TEMPERATURE_K;
  if (temperatureK < dom.min || temperatureK > dom.max) {
    return refuse({ code: 'outside_domain', quantity: 'temperatureK', input: temperatureK, min: dom.min, max: dom.max, model: model.id });
  }
  const ni = model.intrinsicDensityPerCm3(material, temperatureK);
  const problems: Problem[] = [];
  const validity = model.validityTemperatureKFor?.(material) ?? model.validityTemperatureK;
  if (temperatureK < validity.min || temperatureK > validity.max) {
    problems.push({ code: 'outside_validity', quantity: 'temperatureK', input: temperatureK, min: validity.min, max: validity.max, model: model.id });
  }
  const ownGap = model.bandgapEv !== undefined;
  const gapRange = ownGap ? PASSLER_VALIDITY_TEMPERATURE_K : BANDGAP_VALIDITY_TEMPERATURE_K;
  if (temperatureK > gapRange.max) {
    problems.push({ code: 'outside_validity', quantity: 'temperatureK', input: temperatureK, min: gapRange.min, max: gapRange.max, model: ownGap ? 'passler-2002' : 'varshni-thurmond-1975' });
  }
  if (material === 'Si' && Math.abs(temperatureK - 300) <= 1) {
    problems.push({
      code: 'outdated_value',
      quantity: 'intrinsicDensityPerCm3',
      outdated: SILICON_INTRINSIC_300K.outdatedPerCm3,
      current: SILICON_INTRINSIC_300K.currentPerCm3,
      source: SILICON_INTRINSIC_300K.source,
    });
  }
  return ok({
    intrinsicDensityPerCm3: ni,
    bandgapEv: model.bandgapEv?.(material, temperatureK) ?? bandgapEv(material, temperatureK),
    massActionProductPerCm6: ni * ni,
    conductionBandDensityPerCm3: conductionBandDensityPerCm3(material, temperatureK),
    valenceBandDensityPerCm3: valenceBandDensityPerCm3(material, temperatureK),
    temperatureK,
    material,
    model,
    problems,
  });
}
