/**
 * Intrinsic carrier density of silicon, Couderc–Amara–Lemiti reassessment (the default for Si).
 *
 * Source: R. Couderc, M. Amara, M. Lemiti, "Reassessment of the intrinsic carrier density
 *   temperature dependence in crystalline silicon", J. Appl. Phys. 115, 093705 (2014).
 *
 *   n_i(T) = 1.541e15 · T^1.712 · exp(−Eg(T) / (2·k·T))   cm⁻³,  T in K,
 *   Eg(T) from Pässler's dispersion-related form (src/physics/bandgap/passler-2002.ts).
 *
 * | parameter | value    | unit           |
 * |-----------|----------|----------------|
 * | A         | 1.541e15 | cm⁻³·K^−1.712  |
 * | exponent  | 1.712    |                |
 * | Eg(T)     | Pässler 2002, Si set | eV |
 *
 * What it is: Sproul and Green's 1993 measured form (n_i ∝ T^1.706·exp(−Eg/2kT), 77–300 K)
 * re-evaluated without band-gap narrowing, the same correction Altermatt et al. (J. Appl.
 * Phys. 93, 1598 (2003)) made at 300 K, carried over the whole temperature range. It is one
 * smooth function of T (no switching between fits), so `ni` and `crossover` agree by
 * construction and there is no step between neighbouring kelvins.
 *
 * Provenance: the coefficients and the pairing with Pässler's gap are verified via several
 * independent public implementations, not against the paper itself (docs/references.md). The
 * validity 50–400 K is the paper's as quoted by one of them. At 300 K it gives 9.69e9 cm⁻³,
 * 0.4 % above Altermatt's 9.65e9; against Misiakos and Tsamakis's measured points (78–340 K)
 * it stays within 5 meV of band-gap equivalent (tests). Above 400 K the same form is an
 * extrapolation and the reply says so; from 350 to 700 K it stays within 3.2 % of Wasserab's 1977
 * wide-range evaluation (test), the only published value above 400 K we could check against.
 */
import { BOLTZMANN_EV_PER_K } from '../constants.js';
import { passlerParameters, passlerSiliconBandgapEv } from '../bandgap/passler-2002.js';
import type { Material, Parameter } from '../types.js';
import type { IntrinsicModel } from './intrinsic-model.js';

export const COUDERC_2014 = { prefactorPerCm3: 1.541e15, exponent: 1.712 } as const;

export function coudercDensityPerCm3(temperatureK: number): number {
  const gapEv = passlerSiliconBandgapEv(temperatureK);
  return COUDERC_2014.prefactorPerCm3 * Math.exp(COUDERC_2014.exponent * Math.log(temperatureK) - gapEv / (2 * BOLTZMANN_EV_PER_K * temperatureK));
}

export const couderc2014: IntrinsicModel = {
  id: 'couderc-2014',
  name: 'Couderc, Amara & Lemiti (2014)',
  citation:
    'R. Couderc, M. Amara, M. Lemiti, "Reassessment of the intrinsic carrier density temperature dependence in crystalline silicon", J. Appl. Phys. 115, 093705 (2014); band gap: R. Pässler, Phys. Rev. B 66, 085201 (2002)',
  materials: ['Si'],
  validityTemperatureK: { min: 50, max: 400 },
  equations: ['n_i = 1.541e15·T^1.712·exp(−Eg(T)/2kT) cm⁻³', 'Eg(T): Pässler 2002 (silicon set)'],
  notes: [
    'Coefficients and validity as quoted by independent public implementations; not checked against the paper itself.',
    'Free of band-gap narrowing: the intrinsic density of undoped silicon.',
  ],
  aliases: ['couderc', 'cal', 'couderc-amara-lemiti'],
  parameters(_material: Material): Parameter[] {
    const s = 'Couderc, Amara & Lemiti 2014';
    return [
      { name: 'A', value: COUDERC_2014.prefactorPerCm3, unit: 'cm⁻³·K^−1.712', source: s },
      { name: 'exponent', value: COUDERC_2014.exponent, source: s },
      ...passlerParameters(),
    ];
  },
  bandgapEv(material: Material, temperatureK: number): number {
    return material === 'Si' ? passlerSiliconBandgapEv(temperatureK) : Number.NaN;
  },
  intrinsicDensityPerCm3(material: Material, temperatureK: number): number {
    return material === 'Si' ? coudercDensityPerCm3(temperatureK) : Number.NaN;
  },
};
