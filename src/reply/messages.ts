/**
 * Wording of problems, refusals and assumptions: the one place where core data becomes
 * sentences. Every surface renders these strings; none builds its own.
 */
import type { Problem } from '../physics/problems.js';
import type { ReplyWarning } from './reply.js';
import { formatNumber } from './format.js';

const QUANTITY_WORDS: Record<string, { name: string; unit: string }> = {
  resistivityOhmCm: { name: 'resistivity', unit: 'Ω·cm' },
  dopantDensityPerCm3: { name: 'dopant density', unit: 'cm⁻³' },
  temperatureK: { name: 'temperature', unit: 'K' },
  sheetResistanceOhmPerSq: { name: 'sheet resistance', unit: 'Ω/□' },
  thicknessOverSpacing: { name: 'thickness/spacing', unit: '' },
  diameterOverSpacing: { name: 'diameter/spacing', unit: '' },
  intrinsicDensityPerCm3: { name: 'intrinsic density n_i of silicon at 300 K', unit: 'cm⁻³' },
};

function q(quantity: string, value: number): string {
  const w = QUANTITY_WORDS[quantity];
  const n = formatNumber(value);
  return w ? `${n}${w.unit ? ' ' + w.unit : ''}` : n;
}

function nameOf(quantity: string): string {
  return QUANTITY_WORDS[quantity]?.name ?? quantity;
}

export function problemMessage(p: Problem): string {
  switch (p.code) {
    case 'outside_validity':
      return `The ${nameOf(p.quantity)} ${q(p.quantity, p.input)} is outside the range the ${p.model} model was fitted for (${q(p.quantity, p.min)} to ${q(p.quantity, p.max)}); the value is an extrapolation.`;
    case 'near_boundary':
      return `The ${nameOf(p.quantity)} ${q(p.quantity, p.input)} is close to the edge of the ${p.model} model's range (${q(p.quantity, p.boundary)}).`;
    case 'estimate_only':
      return `Estimate only (${p.model}): ${p.reason}`;
    case 'substitute_model':
      return `For ${p.forDopant}, the ${p.model} conversion is used: ${p.reason}`;
    case 'indeterminate_reading':
      return `The ${p.method} reading ${formatNumber(p.input)} ${p.unit} is inside the noise band of ±${formatNumber(p.noiseBand)} ${p.unit}: the type cannot be told from it. Re-seat the probes, check contact, and repeat.`;
    case 'method_range':
      return `${p.standard} gives the ${p.method} method as dependable from ${q('resistivityOhmCm', p.min)} to ${q('resistivityOhmCm', p.max)}; at ${q('resistivityOhmCm', p.resistivityOhmCm)} confirm the type with another method.`;
    case 'type_mismatch':
      return `Expected ${p.expected}-type but the reading says ${p.found}-type. Hold the wafer/lot and confirm before it moves on.`;
    case 'epitaxial_caution':
      return `The ${p.method} method is not qualified on epitaxial layers (ASTM F42 scope): the substrate can dominate the reading.`;
    case 'mixed_conduction':
      return `In near-intrinsic or compensated material both carriers conduct and the ${p.method} sign can flip; confirm with a second method.`;
    case 'outdated_value':
      return `The often-quoted ${formatNumber(p.outdated)} cm⁻³ for the ${nameOf(p.quantity)} is outdated; the current value is ${formatNumber(p.current)} cm⁻³ (${p.source}).`;
    case 'geometry_limit':
      return `The ${p.factor} correction is outside its useful range (ratio ${formatNumber(p.ratio)}, needs at least ${formatNumber(p.min)}).`;
    case 'other':
      return p.message;
    default:
      return describeUnknown(p as unknown as Record<string, unknown>);
  }
}

/** Codes added by newer models before their wording is written here still reach people. */
function describeUnknown(p: Record<string, unknown>): string {
  if (typeof p['message'] === 'string') return p['message'];
  return Object.entries(p)
    .map(([k, v]) => `${k}: ${typeof v === 'number' ? formatNumber(v) : String(v)}`)
    .join(', ');
}

export function problemsToWarnings(problems: readonly Problem[]): ReplyWarning[] {
  const seen = new Set<string>();
  const out: ReplyWarning[] = [];
  for (const p of problems) {
    const message = problemMessage(p);
    if (seen.has(message)) continue;
    seen.add(message);
    out.push({ code: p.code, message });
  }
  return out;
}

/** Assumption codes from the core → sentences. Unknown codes are shown as they are. */
const ASSUMPTIONS: Record<string, string> = {
  uncompensated: 'Uncompensated material: one dopant kind only.',
  full_ionization: 'All dopants ionized (room temperature, not degenerate).',
  temperature_23C: 'Resistivity at 23 °C, the ASTM F723 reference temperature.',
  temperature_300K: 'At 300 K (26.85 °C), the temperature the mobility fit was made for.',
  thin_sheet: 'Thin-sheet formula: layer much thinner than the probe spacing.',
  no_thickness_correction: 'No probe spacing given: thickness correction F(t/s) taken as 1 (thin layer).',
  infinite_diameter: 'No wafer diameter given: sample taken as laterally infinite (centred probe far from edges).',
  centred_probe: 'Probe centred on the wafer.',
  insulating_base: 'Layer on an insulating (or junction-isolated) base.',
  collinear_equal_spacing: 'Collinear four-point probe with equal pin spacing.',
  majority_carriers_only: 'Conduction by majority carriers only (minority density negligible).',
};

export function assumptionText(code: string): string {
  return ASSUMPTIONS[code] ?? code;
}
