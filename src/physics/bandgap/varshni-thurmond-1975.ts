/**
 * Band gap against temperature, Varshni form with Thurmond's parameters.
 *
 *   Eg(T) = Eg0 − α·T² / (T + β)
 *
 * Form: Y. P. Varshni, "Temperature dependence of the energy gap in semiconductors",
 *   Physica 34, 149 (1967), doi:10.1016/0031-8914(67)90062-6.
 * Parameters: C. D. Thurmond, "The standard thermodynamic functions for the formation of
 *   electrons and holes in Ge, Si, GaAs, and GaP", J. Electrochem. Soc. 122, 1133 (1975),
 *   doi:10.1149/1.2134410.
 *
 * | material | Eg0 (eV) | α (eV/K)  | β (K) |
 * |----------|----------|-----------|-------|
 * | Si       | 1.170    | 4.73e-4   | 636   |
 * | Ge       | 0.7437   | 4.774e-4  | 235   |
 * | GaAs     | 1.519    | 5.405e-4  | 204   |
 *
 * Validity: Thurmond fitted 0 K to well above room temperature (Si to ~1200 K from optical
 * and thermodynamic data); we state 0–1000 K and warn outside it. Eg(300 K) for Si is
 * 1.1245 eV by this form (Thurmond's table gives 1.124 eV: checked in the tests).
 */
import type { Material, Parameter, Range } from '../types.js';

export interface VarshniParameters {
  readonly gapAtZeroEv: number;
  readonly alphaEvPerK: number;
  readonly betaK: number;
}

export const THURMOND_1975: Readonly<Record<Material, VarshniParameters>> = {
  Si: { gapAtZeroEv: 1.17, alphaEvPerK: 4.73e-4, betaK: 636 },
  Ge: { gapAtZeroEv: 0.7437, alphaEvPerK: 4.774e-4, betaK: 235 },
  GaAs: { gapAtZeroEv: 1.519, alphaEvPerK: 5.405e-4, betaK: 204 },
};

export const BANDGAP_VALIDITY_TEMPERATURE_K: Range = { min: 0, max: 1000 };

export const BANDGAP_CITATION =
  'C. D. Thurmond, J. Electrochem. Soc. 122, 1133 (1975), Varshni form (Y. P. Varshni, Physica 34, 149 (1967))';

export function bandgapEv(material: Material, temperatureK: number): number {
  const p = THURMOND_1975[material];
  return p.gapAtZeroEv - (p.alphaEvPerK * temperatureK * temperatureK) / (temperatureK + p.betaK);
}

export function bandgapParameters(material: Material): readonly Parameter[] {
  const p = THURMOND_1975[material];
  const source = 'Thurmond 1975';
  return [
    { name: 'Eg0', value: p.gapAtZeroEv, unit: 'eV', source },
    { name: 'α', value: p.alphaEvPerK, unit: 'eV/K', source },
    { name: 'β', value: p.betaK, unit: 'K', source },
  ];
}
