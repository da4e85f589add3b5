/**
 * Intrinsic carrier density of silicon, Misiakos–Tsamakis fit.
 *
 * Source: K. Misiakos, D. Tsamakis, "Accurate measurements of the silicon intrinsic carrier
 *   density from 78 to 340 K", J. Appl. Phys. 74, 3293 (1993).
 *
 *   n_i(T) = 5.29e19 · (T/300)^2.54 · exp(−6726 / T)   cm⁻³
 *
 * | parameter | value   | unit |
 * |-----------|---------|------|
 * | A         | 5.29e19 | cm⁻³ |
 * | exponent  | 2.54    |      |
 * | T0        | 6726    | K    |
 *
 * n_i(300 K) = (9.7 ± 0.1)e9 cm⁻³ (the paper's abstract); the fit is as quoted by independent
 * citations. Validity: 78–340 K (the measured range). Silicon only.
 *
 * Default for silicon: at 300 K it gives 9.70e9 cm⁻³, 0.5 % above the 9.65e9 of Altermatt
 * et al. (J. Appl. Phys. 93, 1598 (2003)), inside the 1 % the issue asks for, and it is a
 * measured fit covering the fab's usual 78–340 K (Sproul–Green gives 1.01e10 at 300 K, 5 %
 * above Altermatt; the density-of-states form with Green's Nc, Nv gives about 1.07e10).
 */
import type { Material, Parameter } from '../types.js';
import type { IntrinsicModel } from './intrinsic-model.js';

export const MISIAKOS_TSAMAKIS_1993 = { prefactorPerCm3: 5.29e19, exponent: 2.54, activationK: 6726 } as const;

export function misiakosTsamakisDensityPerCm3(temperatureK: number): number {
  const p = MISIAKOS_TSAMAKIS_1993;
  return p.prefactorPerCm3 * Math.pow(temperatureK / 300, p.exponent) * Math.exp(-p.activationK / temperatureK);
}

export const misiakosTsamakis1993: IntrinsicModel = {
  id: 'misiakos-tsamakis-1993',
  name: 'Misiakos & Tsamakis (1993)',
  citation:
    'K. Misiakos, D. Tsamakis, "Accurate measurements of the silicon intrinsic carrier density from 78 to 340 K", J. Appl. Phys. 74, 3293 (1993)',
  materials: ['Si'],
  validityTemperatureK: { min: 78, max: 340 },
  equations: ['n_i = 5.29e19·(T/300)^2.54·exp(−6726/T) cm⁻³'],
  notes: ['n_i(300 K) = (9.7 ± 0.1)e9 cm⁻³ measured; fit as quoted by independent citations.'],
  aliases: ['misiakos', 'misiakos-tsamakis', 'mt'],
  parameters(_material: Material): Parameter[] {
    const s = 'Misiakos & Tsamakis 1993';
    return [
      { name: 'A', value: MISIAKOS_TSAMAKIS_1993.prefactorPerCm3, unit: 'cm⁻³', source: s },
      { name: 'exponent', value: MISIAKOS_TSAMAKIS_1993.exponent, source: s },
      { name: 'T0', value: MISIAKOS_TSAMAKIS_1993.activationK, unit: 'K', source: s },
    ];
  },
  intrinsicDensityPerCm3(material: Material, temperatureK: number): number {
    return material === 'Si' ? misiakosTsamakisDensityPerCm3(temperatureK) : Number.NaN;
  },
};
