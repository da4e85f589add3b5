/**
 * Masetti mobility model, silicon, 300 K.
 *
 * Source: G. Masetti, M. Severi, S. Solmi, "Modeling of carrier mobility against carrier
 *   concentration in arsenic-, phosphorus-, and boron-doped silicon", IEEE Trans. Electron
 *   Devices ED-30, 764–769 (1983), doi:10.1109/T-ED.1983.21207, Table I (parameters as quoted
 *   by a device-simulator manual; see docs/references.md).
 *
 *   electrons (P, As): μ = μ0 + (μmax − μ0)/(1 + (N/Cr)^α) − μ1/(1 + (Cs/N)^β)
 *   holes (B):         μ = μ0·exp(−Pc/N) + μmax/(1 + (N/Cr)^α) − μ1/(1 + (Cs/N)^β)
 *
 * | dopant | μ0   | μmax   | Cr (cm⁻³) | α     | μ1   | Cs (cm⁻³) | β    | Pc (cm⁻³) |
 * |--------|------|--------|-----------|-------|------|-----------|------|-----------|
 * | P (e)  | 68.5 | 1414   | 9.20e16   | 0.711 | 56.1 | 3.41e20   | 1.98 | –         |
 * | As (e) | 52.2 | 1417   | 9.68e16   | 0.68  | 43.4 | 3.43e20   | 2.0  | –         |
 * | B (h)  | 44.9 | 470.5  | 2.23e17   | 0.719 | 29.0 | 6.10e20   | 2.0  | 9.23e16   |
 * (mobilities in cm²/(V·s))
 *
 * Validity: 300 K only. N is the carrier density, equal to the dopant density when fully
 * ionized. The fit covers roughly 1e13–1e21 cm⁻³ (from memory: Masetti et al. joined their
 * own high-concentration data to earlier low-concentration data; the exact limits were not
 * retrieved), so that range is stated, not confirmed.
 */
import type { CarrierType, Dopant, Parameter } from '../types.js';
import type { MobilityModel } from './mobility-model.js';
import { powPositive } from '../numeric/pow.js';

export interface MasettiParameters {
  readonly mu0: number;
  readonly muMax: number;
  readonly crPerCm3: number;
  readonly alpha: number;
  readonly mu1: number;
  readonly csPerCm3: number;
  readonly beta: number;
  /** Holes only: the exp(−Pc/N) factor on μ0. */
  readonly pcPerCm3?: number;
}

export const MASETTI_1983: Readonly<Record<'phosphorus' | 'arsenic' | 'boron', MasettiParameters>> = {
  phosphorus: { mu0: 68.5, muMax: 1414, crPerCm3: 9.2e16, alpha: 0.711, mu1: 56.1, csPerCm3: 3.41e20, beta: 1.98 },
  arsenic: { mu0: 52.2, muMax: 1417, crPerCm3: 9.68e16, alpha: 0.68, mu1: 43.4, csPerCm3: 3.43e20, beta: 2.0 },
  boron: {
    mu0: 44.9,
    muMax: 470.5,
    crPerCm3: 2.23e17,
    alpha: 0.719,
    mu1: 29.0,
    csPerCm3: 6.1e20,
    beta: 2.0,
    pcPerCm3: 9.23e16,
  },
};

const CITATION =
  'G. Masetti, M. Severi, S. Solmi, IEEE Trans. Electron Devices ED-30, 764 (1983), doi:10.1109/T-ED.1983.21207';

/** Kernel: Masetti mobility for one parameter set, cm²/(V·s). */
export function masettiMobilityCm2PerVs(p: MasettiParameters, dopantDensityPerCm3: number): number {
  const n = dopantDensityPerCm3;
  const lattice = p.pcPerCm3 === undefined ? p.mu0 : p.mu0 * Math.exp(-p.pcPerCm3 / n);
  const ionized =
    p.pcPerCm3 === undefined
      ? (p.muMax - p.mu0) / (1 + powPositive(n / p.crPerCm3, p.alpha))
      : p.muMax / (1 + powPositive(n / p.crPerCm3, p.alpha));
  const clustering = p.mu1 / (1 + powPositive(p.csPerCm3 / n, p.beta));
  return lattice + ionized - clustering;
}

function paramsFor(dopant: Dopant): MasettiParameters | undefined {
  return dopant === 'antimony' ? undefined : MASETTI_1983[dopant];
}

const VALIDITY = { min: 1e13, max: 1e21 };

export const masetti1983: MobilityModel = {
  id: 'masetti-1983',
  name: 'Masetti, Severi & Solmi (1983)',
  citation: CITATION,
  dopants: ['phosphorus', 'arsenic', 'boron'],
  referenceTemperatureK: 300,
  validityTemperatureK: { min: 300, max: 300 },
  validityDensityPerCm3: { phosphorus: VALIDITY, arsenic: VALIDITY, boron: VALIDITY },
  equations: [
    'electrons: μ = μ0 + (μmax − μ0)/(1 + (N/Cr)^α) − μ1/(1 + (Cs/N)^β)',
    'holes: μ = μ0·exp(−Pc/N) + μmax/(1 + (N/Cr)^α) − μ1/(1 + (Cs/N)^β)',
  ],
  notes: [
    'Parameters from Table I of the paper, as quoted by a device-simulator manual.',
    'Defined at 300 K; N is the carrier density, taken equal to the dopant density (full ionization).',
    'Density range 1e13–1e21 cm⁻³ is from memory, not confirmed against the paper.',
  ],
  parameters(dopant: Dopant): readonly Parameter[] {
    const p = paramsFor(dopant);
    if (!p) return [];
    const src = 'Masetti et al. 1983, Table I';
    const list: Parameter[] = [
      { name: 'μ0', value: p.mu0, unit: 'cm²/V·s', source: src },
      { name: 'μmax', value: p.muMax, unit: 'cm²/V·s', source: src },
      { name: 'Cr', value: p.crPerCm3, unit: 'cm⁻³', source: src },
      { name: 'α', value: p.alpha, source: src },
      { name: 'μ1', value: p.mu1, unit: 'cm²/V·s', source: src },
      { name: 'Cs', value: p.csPerCm3, unit: 'cm⁻³', source: src },
      { name: 'β', value: p.beta, source: src },
    ];
    if (p.pcPerCm3 !== undefined) list.push({ name: 'Pc', value: p.pcPerCm3, unit: 'cm⁻³', source: src });
    return list;
  },
  carrier(dopant: Dopant): CarrierType {
    return dopant === 'boron' ? 'p' : 'n';
  },
  mobilityCm2PerVs(dopantDensityPerCm3: number, dopant: Dopant): number {
    const p = paramsFor(dopant);
    return p ? masettiMobilityCm2PerVs(p, dopantDensityPerCm3) : Number.NaN;
  },
};
