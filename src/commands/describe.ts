/**
 * Core results → reply parts shared by several commands: model descriptors, validity
 * sentences, refusals, derivations of a conversion.
 */
import type { Refusal } from '../physics/outcome.js';
import type { ConversionModel, ConversionResult, Dopant, Parameter } from '../physics/types.js';
import { formatNumber } from '../reply/format.js';
import { assumptionText, nameOf } from '../reply/messages.js';
import { okReply } from '../reply/build.js';
import type { ReplyModel, ReplyValue } from '../reply/reply.js';
import { DOPANT_LABEL, MATERIAL_LABEL } from './words.js';

export function validitySentence(model: ConversionModel, dopant: Dopant): string {
  const v = model.validity[dopant];
  const parts: string[] = [];
  if (v?.resistivityOhmCm) parts.push(`${formatNumber(v.resistivityOhmCm.min)} to ${formatNumber(v.resistivityOhmCm.max)} Ω·cm`);
  if (v?.dopantDensityPerCm3) parts.push(`${formatNumber(v.dopantDensityPerCm3.min)} to ${formatNumber(v.dopantDensityPerCm3.max)} cm⁻³`);
  const t = Math.abs(model.referenceTemperatureK - 296.15) < 0.01 ? '23 °C' : `${formatNumber(model.referenceTemperatureK)} K`;
  return `${dopant}: ${parts.join(', ') || 'range not stated'} at ${t}`;
}

export function conversionModel(model: ConversionModel, dopant: Dopant): ReplyModel {
  return { id: model.id, name: model.name, citation: model.citation, validity: validitySentence(model, dopant) };
}

export function conversionValues(r: ConversionResult, headline: 'density' | 'resistivity'): ReplyValue[] {
  const carrierKey = r.carrierType === 'n' ? 'electronDensityPerCm3' : 'holeDensityPerCm3';
  const carrierLabel = r.carrierType === 'n' ? 'Electron density (majority)' : 'Hole density (majority)';
  const values: ReplyValue[] = [
    { key: 'dopantDensityPerCm3', value: r.dopantDensityPerCm3, unit: 'cm⁻³', label: `${capital(r.dopant)} density`, headline: headline === 'density' },
    { key: 'resistivityOhmCm', value: r.resistivityOhmCm, unit: 'Ω·cm', label: 'Resistivity', headline: headline === 'resistivity' },
    { key: 'carrierType', value: r.carrierType, unit: '', label: 'Conductivity type' },
    { key: 'mobilityCm2PerVs', value: r.mobilityCm2PerVs, unit: 'cm²/V·s', label: 'Majority-carrier mobility (1/qNρ)' },
    { key: carrierKey, value: r.dopantDensityPerCm3, unit: 'cm⁻³', label: carrierLabel },
  ];
  return headline === 'density' ? values : [values[1]!, values[0]!, ...values.slice(2)];
}

export function conversionAssumptions(r: ConversionResult): string[] {
  return r.assumptionCodes.map(assumptionText);
}

export function parameterRows(params: readonly Parameter[]): { name: string; value: number; unit?: string; source?: string }[] {
  return params.map((p) => ({ name: p.name, value: p.value, ...(p.unit ? { unit: p.unit } : {}), ...(p.source ? { source: p.source } : {}) }));
}

const QUANTITY_UNITS: Record<string, string> = {
  resistivityOhmCm: 'Ω·cm',
  dopantDensityPerCm3: 'cm⁻³',
  temperatureK: 'K',
  sheetResistanceOhmPerSq: 'Ω/□',
  referenceTemperatureK: 'K',
  surfaceConcentrationPerCm3: 'cm⁻³',
  backgroundDensityPerCm3: 'cm⁻³',
  netDopingPerCm3: 'cm⁻³',
};

function describeInput(quantity: string, value: number): string {
  const unit = QUANTITY_UNITS[quantity];
  return unit ? `${formatNumber(value)} ${unit}` : formatNumber(value);
}

const DOPANT_NAMES = ['boron', 'phosphorus', 'arsenic', 'antimony'];

/** A model's equations that concern this dopant (lines labelled with another dopant are left out). */
export function equationsFor(model: ConversionModel, dopant: Dopant): string[] {
  return model.equations.filter((e) => {
    const label = DOPANT_NAMES.find((d) => e.toLowerCase().startsWith(d));
    return label === undefined || label === dopant;
  });
}

export function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

export function dopantLabel(d: Dopant): string {
  return DOPANT_LABEL[d];
}

/** Refusals from the core → one sentence for the person. */
export function refusalMessage(r: Refusal): string {
  switch (r.code) {
    case 'nonpositive_input':
      return `The ${r.quantity.replace(/(OhmCm|PerCm3|K|OhmPerSq|Cm|V|A)$/, '').replace(/([A-Z])/g, ' $1').toLowerCase()} must be greater than zero (got ${formatNumber(r.input)}).`;
    case 'not_finite':
      return `The ${nameOf(r.quantity)} is not a finite number.`;
    case 'unknown_model':
      return `There is no model "${r.model}". Known models: ${r.known.join(', ')}.`;
    case 'model_dopant':
      return `The ${r.model} model does not cover ${r.dopant}; it covers ${r.supported.join(', ')}.`;
    case 'model_material':
      return `The ${r.model} model does not cover ${MATERIAL_LABEL[r.material]}; it covers ${r.supported.map((m) => MATERIAL_LABEL[m]).join(', ')}.`;
    case 'outside_domain':
      return `${describeInput(r.quantity, r.input)} is too far outside the ${r.model} model's range (${describeInput(r.quantity, r.min)} to ${describeInput(r.quantity, r.max)}) to extrapolate honestly. Check the reading and its unit.`;
    case 'above_melting_point':
      return `${MATERIAL_LABEL[r.material][0]!.toUpperCase()}${MATERIAL_LABEL[r.material].slice(1)} melts at ${formatNumber(r.meltingPointK)} K (${formatNumber(r.meltingPointK - 273.15, { sigFigs: 4 })} °C); at ${formatNumber(r.temperatureK)} K there is no crystal and no intrinsic density to give.`;
    case 'geometry_invalid':
      return `The ${r.factor} correction does not exist for a ratio of ${formatNumber(r.ratio)} (it needs more than ${formatNumber(r.min)}); check the probe spacing and the wafer size.`;
    case 'missing_input':
      return `The ${nameOf(r.quantity)} needs ${r.needs.map(nameOf).join(' and ')}.`;
    case 'not_covered':
      return `That needs ${r.quantity === 'ionizationEnergyEv' ? 'dopant ionization energies' : nameOf(r.quantity)}, which are covered for ${r.covered.map((m) => MATERIAL_LABEL[m]).join(' and ')} only, not ${MATERIAL_LABEL[r.material]}.`;
    case 'no_junction':
      return `A surface concentration of ${formatNumber(r.surfaceConcentrationPerCm3)} cm⁻³ is not above the background (${formatNumber(r.backgroundDensityPerCm3)} cm⁻³): there is no junction. Check Cs and the background.`;
    case 'dopant_pairing':
      return `A diffused layer of ${r.dopant} on a ${r.background} background is not a junction: the layer and the background must be of opposite types (n on p, or p on n).`;
    case 'no_solution':
      return `The solver for the ${nameOf(r.quantity)} did not converge with the ${r.model} model; no value is given rather than a wrong one. Check the inputs.`;
    default: {
      const any = r as unknown as Record<string, unknown>;
      return typeof any['message'] === 'string' ? any['message'] : 'The model cannot answer for these inputs; check the reading and its unit.';
    }
  }
}

export interface ConversionReplyParts {
  readonly command: string;
  readonly title: string;
  readonly headline: 'density' | 'resistivity';
  readonly inputs: Readonly<Record<string, import('../reply/reply.js').ReplyInput>>;
  readonly extraAssumptions?: readonly string[];
  readonly extraValues?: readonly ReplyValue[];
  readonly extraProblems?: readonly import('../physics/problems.js').Problem[];
  readonly extraSteps?: readonly string[];
  readonly extraEquations?: readonly string[];
  readonly extraParameters?: readonly { name: string; value: number | string; unit?: string; source?: string }[];
  readonly extraSources?: readonly string[];
  readonly cautions?: readonly string[];
}

/** The reply of any command whose answer is a ρ ↔ N conversion (rho, doping, sheet). */
export function conversionReply(
  id: import('../reply/build.js').ReplyIdentity,
  r: ConversionResult,
  parts: ConversionReplyParts,
): import('../reply/reply.js').ReplyOk {
  return okReply(id, {
    command: parts.command,
    title: parts.title,
    values: [...(parts.extraValues ?? []), ...conversionValues(r, parts.headline)],
    inputs: parts.inputs,
    assumptions: [...(parts.extraAssumptions ?? []), ...conversionAssumptions(r)],
    model: conversionModel(r.model, r.dopant),
    problems: [...(parts.extraProblems ?? []), ...r.problems],
    ...(parts.cautions ? { cautions: parts.cautions } : {}),
    derivation: {
      equations: [...(parts.extraEquations ?? []), ...equationsFor(r.model, r.dopant), 'μ = 1 / (q·N·ρ)'],
      parameters: [...(parts.extraParameters ?? []), ...parameterRows(r.model.parameters(r.dopant))],
      steps: [
        ...(parts.extraSteps ?? []),
        `ρ = ${formatNumber(r.resistivityOhmCm, { sigFigs: 6 })} Ω·cm, ${r.dopant}`,
        `N = ${formatNumber(r.dopantDensityPerCm3, { sigFigs: 6 })} cm⁻³ (${r.model.name})`,
        `μ = 1/(q·N·ρ) = ${formatNumber(r.mobilityCm2PerVs, { sigFigs: 6 })} cm²/V·s with q = 1.602176634×10⁻¹⁹ C`,
      ],
      sources: [...(parts.extraSources ?? []), r.model.citation, 'CODATA 2018 (q exact)'],
    },
  });
}
