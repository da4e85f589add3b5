/**
 * Intrinsic carrier density of silicon, Sproul–Green fit.
 *
 * Source: A. B. Sproul, M. A. Green, "Improved value for the silicon intrinsic carrier
 *   concentration from 275 to 375 K", J. Appl. Phys. 70, 846 (1991).
 *
 *   n_i(T) = 9.38e19 · (T/300)^2 · exp(−6884 / T)   cm⁻³
 *
 * | parameter | value   | unit |
 * |-----------|---------|------|
 * | A         | 9.38e19 | cm⁻³ |
 * | exponent  | 2       |      |
 * | T0        | 6884    | K    |
 *
 * The form is widely quoted; its attribution to this paper and the paper's 300 K value
 * (1.00e10 cm⁻³) are from memory. Validity: 275–375 K. Silicon only.
 */
import type { Material, Parameter } from '../types.js';
import type { IntrinsicModel } from './intrinsic-model.js';

export const SPROUL_GREEN_1991 = { prefactorPerCm3: 9.38e19, exponent: 2, activationK: 6884 } as const;

export function sproulGreenDensityPerCm3(temperatureK: number): number {
  const p = SPROUL_GREEN_1991;
  return p.prefactorPerCm3 * Math.pow(temperatureK / 300, p.exponent) * Math.exp(-p.activationK / temperatureK);
}

export const sproulGreen1991: IntrinsicModel = {
  id: 'sproul-green-1991',
  name: 'Sproul & Green (1991)',
  citation:
    'A. B. Sproul, M. A. Green, "Improved value for the silicon intrinsic carrier concentration from 275 to 375 K", J. Appl. Phys. 70, 846 (1991)',
  materials: ['Si'],
  validityTemperatureK: { min: 275, max: 375 },
  equations: ['n_i = 9.38e19·(T/300)²·exp(−6884/T) cm⁻³'],
  notes: ['The fit is widely quoted; its attribution and the 300 K value 1.00e10 cm⁻³ are from memory.'],
  aliases: ['sproul', 'sproul-green', 'sg'],
  parameters(_material: Material): Parameter[] {
    const s = 'Sproul & Green 1991 (attribution from memory)';
    return [
      { name: 'A', value: SPROUL_GREEN_1991.prefactorPerCm3, unit: 'cm⁻³', source: s },
      { name: 'exponent', value: SPROUL_GREEN_1991.exponent, source: s },
      { name: 'T0', value: SPROUL_GREEN_1991.activationK, unit: 'K', source: s },
    ];
  },
  intrinsicDensityPerCm3(material: Material, temperatureK: number): number {
    return material === 'Si' ? sproulGreenDensityPerCm3(temperatureK) : Number.NaN;
  },
};
