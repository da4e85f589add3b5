/**
 * Surface photovoltage (SPV) sign.
 *
 * Sign [derived: surface band bending]: the surface of n-type silicon is usually depleted with
 * bands bent up; light flattens them and the surface potential moves positive. On p-type the
 * shift is negative. Reading: change of surface potential (surface relative to the back
 * contact) on illumination, in V. ASTM F42 has no SPV method. An accumulated or inverted
 * surface (e.g. after some cleans or charged oxides) can give a small or reversed signal.
 *
 * Default noise band 1 mV: SPV signals under a usual light source are millivolts to hundreds
 * of millivolts; 1 mV is a margin for pickup and drift (common practice, no source).
 */
import type { Problem } from '../problems.js';
import type { TypeMethod } from './method.js';

export const surfacePhotovoltage: TypeMethod = {
  method: 'spv',
  name: 'surface photovoltage',
  unit: 'V',
  nTypeSign: 1,
  defaultNoiseBand: 1e-3,
  noiseBandBasis: '1 mV: margin for pickup and drift (common practice, no source)',
  conventionText: 'Surface potential shifting positive under illumination means n-type; negative, p-type.',
  source: 'Surface band bending under illumination, device physics (derived); not an ASTM F42 method',
  cautions(): Problem[] {
    return [];
  },
};
