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
  // issue 5
  referenceTemperatureK: { name: 'reference temperature', unit: 'K' },
  surfaceConcentrationPerCm3: { name: 'surface concentration', unit: 'cm⁻³' },
  backgroundDensityPerCm3: { name: 'background density', unit: 'cm⁻³' },
  netDopingPerCm3: { name: 'net doping', unit: 'cm⁻³' },
  junctionDepthCm: { name: 'junction depth', unit: 'cm' },
  temperatureCoefficientPerK: { name: 'temperature coefficient', unit: '/K' },
};

function q(quantity: string, value: number): string {
  const w = QUANTITY_WORDS[quantity];
  const n = formatNumber(value);
  return w ? `${n}${w.unit ? ' ' + w.unit : ''}` : n;
}

/** A quantity's name for people: "resistivity" for resistivityOhmCm; never the identifier itself. */
export function nameOf(quantity: string): string {
  if (Object.hasOwn(QUANTITY_WORDS, quantity)) return QUANTITY_WORDS[quantity]!.name;
  // An identifier without its wording yet: strip the unit and split the words.
  return quantity
    .replace(/(OhmCm|OhmPerSq|PerCm3|PerCm2|Cm2PerVs|PerK|Ev|Cm|K|V|A)$/, '')
    .replace(/([A-Z])/g, ' $1')
    .toLowerCase()
    .trim();
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
    case 'large_temperature_correction': {
      const dT = p.temperatureK - p.referenceK;
      return `The reading was taken ${formatNumber(Math.abs(dT), { sigFigs: 3 })} K ${dT > 0 ? 'above' : 'below'} ${formatNumber(p.referenceK - 273.15, { sigFigs: 3 })} °C and the correction changes it by ${p.changePercent > 0 ? '+' : ''}${formatNumber(p.changePercent, { sigFigs: 2 })} % (${p.model}). A correction like this is trusted within about ±${formatNumber(p.trustedWithinK)} K of the reference and under 10 % (common practice, no source): re-measure near ${formatNumber(p.referenceK - 273.15, { sigFigs: 3 })} °C, or use your procedure's coefficient, before acting on it.`;
    }
    case 'thickness_factor_unknown':
      return `No probe spacing given or configured: the thickness factor F(t/s) was taken as 1. For this ${formatNumber(p.thicknessCm * 1e4, { sigFigs: 3 })} µm sample under a 1 mm head F = ${formatNumber(p.factorAtOneMm, { sigFigs: 4 })}, so the resistivity would be ${formatNumber((1 - p.factorAtOneMm) * 100, { sigFigs: 2 })} % lower. Give spacing <s>, or set the fab's head (PROBE_SPACING_MM, or probeSpacingMm for the product).`;
    case 'combined_geometry':
      return `Both geometry corrections are large (thickness F = ${formatNumber(p.thicknessFactor, { sigFigs: 4 })}, diameter C/C∞ = ${formatNumber(p.diameterFactor, { sigFigs: 4 })}); applied as independent factors their product is an approximation. Measure nearer the centre of a larger or thinner sample, or use your procedure's correction table.`;
    case 'contact_asymmetry':
      return `The two van der Pauw resistances differ by a factor ${formatNumber(p.ratio, { sigFigs: 3 })} (≥ ${formatNumber(p.limit)}): the method still holds, but errors in contact size and placement weigh more; check the contacts and the sample's symmetry.`;
    case 'ionization_model_limit':
      return `At ${formatNumber(p.dopantDensityPerCm3)} cm⁻³ (above ~${formatNumber(p.limitPerCm3)} cm⁻³) the simple ionization model overstates freeze-out: the ionization energy falls with density and the levels merge into a band, so the real ionized fraction is higher than shown.`;
    case 'degenerate':
      return `The Fermi level is ${p.separationKT < 0 ? `${formatNumber(-p.separationKT, { sigFigs: 2 })} kT inside` : `${formatNumber(p.separationKT, { sigFigs: 2 })} kT from`} the ${p.band} band edge (within ${formatNumber(p.limitKT)} kT): the material is degenerate and Boltzmann statistics, used here, are not accurate.`;
    case 'unverified_parameter':
      return `The ${p.parameter} (${formatNumber(p.value)} ${p.unit}) is from memory, not confirmed against a source (${p.source}); treat the result as an estimate.`;
    case 'intrinsic_regime':
      return `n_i (${formatNumber(p.intrinsicDensityPerCm3)} cm⁻³) is comparable with the net doping (${formatNumber(p.netDopingPerCm3)} cm⁻³): at this temperature the carriers are set by temperature, not by the dopants.`;
    case 'method_not_covered':
      return `${p.standard} does not cover the ${p.method} method on ${p.material}; treat the type as indicative and confirm it with another method.`;
    case 'quantity_not_covered':
      return `The ${nameOf(p.quantity)} is not computed for ${p.material}: only ${p.covered.join(', ')} is covered for it.`;
    case 'other':
      return p.message;
    default:
      return describeUnknown(p as unknown as Record<string, unknown>);
  }
}

/**
 * A problem without its wording (a test walks every code, so this is a safety net): a plain
 * sentence, never the code or the object's fields.
 */
function describeUnknown(p: Record<string, unknown>): string {
  if (typeof p['message'] === 'string') return p['message'];
  return 'The model reported a condition that has no wording yet; treat this value as an estimate and ask the process engineer.';
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
  majority_carriers_only: 'Conduction by majority carriers only (minority density negligible).',
  temperature_23C: 'Resistivity at 23 °C, the ASTM F723 reference temperature.',
  temperature_300K: 'At 300 K (26.85 °C), the temperature the mobility fit was made for.',
  collinear_equal_spacing: 'Collinear four-point probe with equal pin spacing.',
  probe_centred: 'Probe centred on the wafer (the diameter factor assumes it).',
  diameter_factor_not_applied_no_spacing: 'Wafer diameter given without the probe spacing: no diameter correction applied.',
  infinite_sheet: 'No wafer diameter given: sample taken as laterally infinite (probe far from every edge).',
  sheet_resistance_as_read_thin_sheet: 'The sheet resistance as read is taken to be the thin-sheet value (π/ln2 · V/I).',
  insulating_bottom: 'Layer on an insulating (or junction-isolated) base, for the thickness factor.',
  separable_corrections: 'Thickness and diameter corrections applied as independent factors.',
  thickness_factor_assumed_1: 'No probe spacing given: thickness factor F(t/s) taken as 1 (layer thin against the spacing).',
  crossover_definition: 'Crossover: the temperature where n_i equals the net doping.',
  equilibrium: 'Thermal equilibrium, no light or injection.',
  incomplete_ionization: 'Dopant ionization computed (incomplete ionization), not assumed complete.',
  resistivity_anchored_23C: 'Resistivity: the room-temperature conversion `doping` uses, at 23 °C, times the mobility model’s change from 23 °C to this temperature (the mobility model gives only the temperature dependence).',
  freeze_out_band_edges: 'Below the n_i fit’s measured range the band edges come from Nc(T), Nv(T) (Green 1990) and Eg(T) (Thurmond 1975) directly, scaled to the fit at the bottom of its range, not from the fit’s extrapolation.',
  boltzmann_statistics: 'Boltzmann statistics for the carriers (non-degenerate).',
  dopant_degeneracy_2_4: 'Dopant degeneracy factors 2 (donors) and 4 (acceptors).',
  mobility_ionized_impurities: 'Mobility evaluated at the total ionized-impurity density.',
  layer_profile: 'The layer follows the stated profile shape from the surface to the junction.',
  layer_full_ionization: 'All dopants in the layer ionized.',
  layer_mobility_total_impurities: 'Local mobility evaluated at the total impurity density (layer dopant plus background).',
  layer_no_depletion: 'Conduction counted from the surface to the metallurgical junction (depletion width neglected).',
  tc_linear_user: 'Your temperature coefficient applied linearly between the reading temperature and 23 °C.',
  tc_full_ionization: 'Dopants fully ionized at both temperatures.',
  map_infinite_sheet_factor: 'Sheet resistance at each site from V/I with the infinite-sheet factor π/ln2; no site-by-site edge correction (sites within a few probe spacings of the edge read high).',
  map_thin_sheet: 'No probe spacing known: thickness factor F(t/s) taken as 1 at every site (layer thin against the spacing).',
  tc_self_consistent: 'Doping found self-consistently from the reading at its own temperature, then ρ recomputed at 23 °C.',
};

export function assumptionText(code: string): string {
  if (Object.hasOwn(ASSUMPTIONS, code)) return ASSUMPTIONS[code]!;
  // Sentences pass through; a code without wording becomes words, never the code.
  return /\s/.test(code) ? code : `${code.replace(/_/g, ' ')}.`;
}

/** The assumption codes that have wording (a test checks every code the core uses is here). */
export function hasAssumptionWording(code: string): boolean {
  return Object.hasOwn(ASSUMPTIONS, code);
}
