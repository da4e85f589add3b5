/**
 * The LotPhysics port over the project's physics core (src/physics): the ρ → N conversion with
 * the product's dopant and model, the four-point-probe geometry, and the conductivity-type
 * methods. No physics is computed here; this only adapts shapes.
 */
import { fourPointProbe } from '../physics/four-point/sheet.js';
import { convertResistivityToDensity } from '../physics/resistivity/convert.js';
import { correctResistivityToReference } from '../physics/resistivity/temperature-correction.js';
import { carrierTypeFromReading } from '../physics/type/classify.js';
import type { Dopant } from '../physics/types.js';
import type { LotPhysics } from './physics.js';

function validitySentence(validity: Readonly<Partial<Record<Dopant, { resistivityOhmCm?: { min: number; max: number } }>>>, dopant: Dopant): string | undefined {
  const r = validity[dopant]?.resistivityOhmCm;
  return r ? `${dopant}: ${r.min} to ${r.max} Ω·cm at 23 °C` : undefined;
}

export const corePhysics: LotPhysics = {
  correctTo23C(resistivityOhmCm, temperatureK, dopant) {
    const out = correctResistivityToReference({ resistivityOhmCm, temperatureK, dopant });
    if (!out.ok) return { ok: false, refusal: out.refusal };
    const m = out.value.mobilityModel;
    return {
      ok: true,
      resistivityOhmCm: out.value.resistivityOhmCm,
      coefficientPerK: out.value.meanCoefficientPerK,
      model: m
        ? { id: m.id, name: m.name, citation: m.citation }
        : { id: 'linear-coefficient', name: 'Linear temperature coefficient', citation: '' },
      problems: out.value.problems,
      assumptionCodes: out.value.assumptionCodes,
    };
  },
  densityFromResistivity(resistivityOhmCm, dopant, modelId) {
    const out = convertResistivityToDensity(modelId === undefined ? { resistivityOhmCm, dopant } : { resistivityOhmCm, dopant, modelId });
    if (!out.ok) return { ok: false, refusal: out.refusal };
    const m = out.value.model;
    const validity = validitySentence(m.validity, dopant);
    return {
      ok: true,
      dopantDensityPerCm3: out.value.dopantDensityPerCm3,
      model: { id: m.id, name: m.name, citation: m.citation, ...(validity ? { validity } : {}) },
      problems: out.value.problems,
    };
  },
  resistivityFromSheet(sheetResistanceOhmPerSq, thicknessCm, spacingCm) {
    const out = fourPointProbe(
      spacingCm === undefined ? { sheetResistanceOhmPerSq, thicknessCm } : { sheetResistanceOhmPerSq, thicknessCm, spacingCm },
    );
    if (!out.ok) return { ok: false, refusal: out.refusal };
    const rho = out.value.resistivityOhmCm;
    if (rho === undefined) return { ok: false, refusal: { code: 'missing_input', quantity: 'thicknessCm', needs: ['thicknessCm'] } };
    return {
      ok: true,
      resistivityOhmCm: rho,
      thicknessFactor: out.value.thicknessFactor,
      problems: out.value.problems,
      assumptionCodes: out.value.assumptionCodes,
    };
  },
  typeFromReading(method, reading, resistivityOhmCm) {
    const out = carrierTypeFromReading(resistivityOhmCm === undefined ? { method, reading } : { method, reading, resistivityOhmCm });
    if (!out.ok) return { ok: false, refusal: out.refusal };
    return { ok: true, carrierType: out.value.carrierType, problems: out.value.problems };
  },
};
