/**
 * Caughey–Thomas mobility model, silicon, 300 K.
 *
 * Source: D. M. Caughey, R. E. Thomas, "Carrier mobilities in silicon empirically related to
 *   doping and field", Proc. IEEE 55, 2192–2193 (1967).
 *
 *   μ = μmin + (μmax − μmin) / (1 + (N/Nref)^α)
 *
 * | carrier | μmin | μmax | Nref (cm⁻³) | α    |
 * |---------|------|------|-------------|------|
 * | e       | 65   | 1330 | 8.5e16      | 0.72 |
 * | h       | 47.7 | 495  | 6.3e16      | 0.76 |
 *
 * The form is verified; THE PARAMETER VALUES ARE FROM MEMORY (tag [M] in docs/references.md),
 * not confirmed against the paper. Replies using this model say so (see `notes`).
 *
 * Electrons serve for P, As and Sb (the 1967 fit does not distinguish donors); holes for B.
 * Validity: 300 K; the data the fit was made to span roughly 1e13–1e20 cm⁻³ (from memory).
 * The form has no high-density clustering term, so above ~1e19 it overstates mobility and
 * understates resistivity compared with Masetti.
 */
import type { CarrierType, Dopant, Parameter } from '../types.js';
import type { MobilityModel } from './mobility-model.js';
import { powPositive } from '../numeric/pow.js';

export interface CaugheyThomasParameters {
  readonly muMin: number;
  readonly muMax: number;
  readonly nRefPerCm3: number;
  readonly alpha: number;
}

export const CAUGHEY_THOMAS_1967: Readonly<Record<CarrierType, CaugheyThomasParameters>> = {
  n: { muMin: 65, muMax: 1330, nRefPerCm3: 8.5e16, alpha: 0.72 },
  p: { muMin: 47.7, muMax: 495, nRefPerCm3: 6.3e16, alpha: 0.76 },
};

/** Kernel: Caughey–Thomas mobility for one parameter set, cm²/(V·s). */
export function caugheyThomasMobilityCm2PerVs(p: CaugheyThomasParameters, dopantDensityPerCm3: number): number {
  return p.muMin + (p.muMax - p.muMin) / (1 + powPositive(dopantDensityPerCm3 / p.nRefPerCm3, p.alpha));
}

const VALIDITY = { min: 1e13, max: 1e20 };
const carrierOf = (dopant: Dopant): CarrierType => (dopant === 'boron' ? 'p' : 'n');

export const caugheyThomas1967: MobilityModel = {
  id: 'caughey-thomas-1967',
  name: 'Caughey & Thomas (1967)',
  citation:
    'D. M. Caughey, R. E. Thomas, "Carrier mobilities in silicon empirically related to doping and field", Proc. IEEE 55, 2192 (1967)',
  dopants: ['phosphorus', 'arsenic', 'antimony', 'boron'],
  referenceTemperatureK: 300,
  validityTemperatureK: { min: 300, max: 300 },
  validityDensityPerCm3: { phosphorus: VALIDITY, arsenic: VALIDITY, antimony: VALIDITY, boron: VALIDITY },
  equations: ['μ = μmin + (μmax − μmin)/(1 + (N/Nref)^α)'],
  notes: [
    'Parameter values are from memory and were not confirmed against the 1967 paper (the form is confirmed).',
    'One electron parameter set serves P, As and Sb; holes serve B.',
    'Density range 1e13–1e20 cm⁻³ is from memory.',
  ],
  parameters(dopant: Dopant): readonly Parameter[] {
    const p = CAUGHEY_THOMAS_1967[carrierOf(dopant)];
    const src = 'Caughey & Thomas 1967 (values from memory)';
    return [
      { name: 'μmin', value: p.muMin, unit: 'cm²/V·s', source: src },
      { name: 'μmax', value: p.muMax, unit: 'cm²/V·s', source: src },
      { name: 'Nref', value: p.nRefPerCm3, unit: 'cm⁻³', source: src },
      { name: 'α', value: p.alpha, source: src },
    ];
  },
  carrier: carrierOf,
  mobilityCm2PerVs(dopantDensityPerCm3: number, dopant: Dopant): number {
    return caugheyThomasMobilityCm2PerVs(CAUGHEY_THOMAS_1967[carrierOf(dopant)], dopantDensityPerCm3);
  },
};
