/**
 * Arora, Hauser and Roulston 1982: low-field electron and hole mobility in silicon against
 * total impurity density and temperature.
 *
 * Source: N. D. Arora, J. R. Hauser, D. J. Roulston, "Electron and hole mobilities in silicon as
 *   a function of concentration and temperature", IEEE Trans. Electron Devices ED-29, 292–295
 *   (1982), doi:10.1109/T-ED.1982.20698 (DOI from memory). Form and parameters as quoted in a
 *   device-simulator manual (see docs/references.md, tag [V]).
 *
 *   μ(N, T) = μmin(T) + μ0(T) / (1 + (N / Nref(T))^α(T)),   Tn = T / 300 K
 *
 * | carrier  | μmin (cm²/V·s)  | μ0 (cm²/V·s, T in K) | Nref (cm⁻³)       | α                |
 * |----------|-----------------|----------------------|-------------------|------------------|
 * | electron | 88·Tn^−0.57     | 7.4e8·T^−2.33        | 1.26e17·Tn^2.4    | 0.88·Tn^−0.146   |
 * | hole     | 54.3·Tn^−0.57   | 1.36e8·T^−2.23       | 2.35e17·Tn^2.4    | 0.88·Tn^−0.146   |
 *
 * Validity (the paper's abstract): impurity density up to ~1e20 cm⁻³, 250–500 K, within ±13 %
 * of the experimental values it was fitted to. N is the total ionized impurity density
 * N_D + N_A; the model has no separate minority-carrier branch and ignores carrier–carrier
 * scattering, so carrier densities in the conditions are not used.
 */
import { DOPANT_TYPE, type Dopant, type Parameter, type Range } from '../types.js';
import {
  majorityMobilityCm2PerVs,
  type MobilityConditions,
  type TemperatureMobilityModel,
} from './temperature-model.js';
import { powPositive } from '../numeric/pow.js';

export interface AroraParameters {
  /** μmin at 300 K and its exponent in Tn. */
  readonly minimumAt300KCm2PerVs: number;
  readonly minimumExponent: number;
  /** μ0 = coefficient · T^exponent, T in K. */
  readonly rangeCoefficientCm2PerVs: number;
  readonly rangeExponent: number;
  /** Nref at 300 K and its exponent in Tn. */
  readonly referenceAt300KPerCm3: number;
  readonly referenceExponent: number;
  /** α at 300 K and its exponent in Tn. */
  readonly alphaAt300K: number;
  readonly alphaExponent: number;
}

export const ARORA_1982: Readonly<{ electron: AroraParameters; hole: AroraParameters }> = {
  electron: {
    minimumAt300KCm2PerVs: 88,
    minimumExponent: -0.57,
    rangeCoefficientCm2PerVs: 7.4e8,
    rangeExponent: -2.33,
    referenceAt300KPerCm3: 1.26e17,
    referenceExponent: 2.4,
    alphaAt300K: 0.88,
    alphaExponent: -0.146,
  },
  hole: {
    minimumAt300KCm2PerVs: 54.3,
    minimumExponent: -0.57,
    rangeCoefficientCm2PerVs: 1.36e8,
    rangeExponent: -2.23,
    referenceAt300KPerCm3: 2.35e17,
    referenceExponent: 2.4,
    alphaAt300K: 0.88,
    alphaExponent: -0.146,
  },
};

export const ARORA_1982_VALIDITY: Readonly<{ temperatureK: Range; impurityDensityPerCm3: Range }> = {
  temperatureK: { min: 250, max: 500 },
  impurityDensityPerCm3: { min: 0, max: 1e20 },
};

export const ARORA_1982_CITATION =
  'N. D. Arora, J. R. Hauser, D. J. Roulston, IEEE Trans. Electron Devices ED-29, 292 (1982)';

/** Kernel: mobility for total ionized impurity density N (cm⁻³) at temperature T (K). */
export function aroraMobilityCm2PerVs(
  p: AroraParameters,
  impurityDensityPerCm3: number,
  temperatureK: number,
): number {
  const tn = temperatureK / 300;
  const muMin = p.minimumAt300KCm2PerVs * powPositive(tn, p.minimumExponent);
  const mu0 = p.rangeCoefficientCm2PerVs * powPositive(temperatureK, p.rangeExponent);
  const nRef = p.referenceAt300KPerCm3 * powPositive(tn, p.referenceExponent);
  const alpha = p.alphaAt300K * powPositive(tn, p.alphaExponent);
  return muMin + mu0 / (1 + powPositive(Math.max(impurityDensityPerCm3, 0) / nRef, alpha));
}

export function aroraElectronMobilityCm2PerVs(impurityDensityPerCm3: number, temperatureK: number): number {
  return aroraMobilityCm2PerVs(ARORA_1982.electron, impurityDensityPerCm3, temperatureK);
}

export function aroraHoleMobilityCm2PerVs(impurityDensityPerCm3: number, temperatureK: number): number {
  return aroraMobilityCm2PerVs(ARORA_1982.hole, impurityDensityPerCm3, temperatureK);
}

function parameterTable(carrier: 'electron' | 'hole'): readonly Parameter[] {
  const p = ARORA_1982[carrier];
  const source = 'Arora, Hauser, Roulston 1982';
  return [
    { name: 'μmin(300 K)', value: p.minimumAt300KCm2PerVs, unit: 'cm²/V·s', source },
    { name: 'μmin exponent (Tn)', value: p.minimumExponent, source },
    { name: 'μ0 coefficient (T in K)', value: p.rangeCoefficientCm2PerVs, unit: 'cm²/V·s', source },
    { name: 'μ0 exponent (T)', value: p.rangeExponent, source },
    { name: 'Nref(300 K)', value: p.referenceAt300KPerCm3, unit: 'cm⁻³', source },
    { name: 'Nref exponent (Tn)', value: p.referenceExponent, source },
    { name: 'α(300 K)', value: p.alphaAt300K, source },
    { name: 'α exponent (Tn)', value: p.alphaExponent, source },
  ];
}

function totalImpurities(c: MobilityConditions): number {
  return c.donorDensityPerCm3 + c.acceptorDensityPerCm3;
}

const DENSITY_RANGE: Range = { min: 0, max: 1e20 };

export const arora1982: TemperatureMobilityModel = {
  id: 'arora-1982',
  name: 'Arora, Hauser & Roulston (1982)',
  citation: `${ARORA_1982_CITATION}, doi:10.1109/T-ED.1982.20698`,
  dopants: ['boron', 'phosphorus', 'arsenic', 'antimony'],
  referenceTemperatureK: 300,
  validityTemperatureK: ARORA_1982_VALIDITY.temperatureK,
  validityDensityPerCm3: {
    boron: DENSITY_RANGE,
    phosphorus: DENSITY_RANGE,
    arsenic: DENSITY_RANGE,
    antimony: DENSITY_RANGE,
  },
  accuracy: 'within ±13 % of the experimental values it was fitted to, up to ~1e20 cm⁻³, 250–500 K (paper abstract)',
  minorityCarriers: false,
  equations: [
    'μ = μmin + μ0 / (1 + (N/Nref)^α), Tn = T/300 K, N = N_D + N_A (ionized)',
    'μmin = μmin(300 K)·Tn^−0.57, μ0 = C·T^b, Nref = Nref(300 K)·Tn^2.4, α = 0.88·Tn^−0.146',
  ],
  notes: [
    'Form and parameters as quoted by a device-simulator manual; validity and accuracy from the paper abstract.',
    'One curve per carrier: the dopant species does not enter, and minority carriers take the same curve.',
    'N is the total ionized impurity density; carrier–carrier scattering is not included.',
  ],
  parameters: (dopant: Dopant) => parameterTable(DOPANT_TYPE[dopant] === 'p' ? 'hole' : 'electron'),
  carrier: (dopant: Dopant) => DOPANT_TYPE[dopant],
  mobilityCm2PerVs: (dopantDensityPerCm3: number, dopant: Dopant, temperatureK = 300) =>
    majorityMobilityCm2PerVs(arora1982, dopantDensityPerCm3, dopant, temperatureK),
  electronMobilityCm2PerVs: (c: MobilityConditions) =>
    aroraElectronMobilityCm2PerVs(totalImpurities(c), c.temperatureK),
  holeMobilityCm2PerVs: (c: MobilityConditions) => aroraHoleMobilityCm2PerVs(totalImpurities(c), c.temperatureK),
};
