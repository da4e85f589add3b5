/**
 * Point-contact rectification.
 *
 * Sign [derived: metal–semiconductor contact]: a metal point on n-type silicon forms a
 * Schottky-like contact that conducts easily (forward) with the point positive; on p-type,
 * with the point negative. The reading is the polarity of the point at easy conduction:
 * +1 positive, −1 negative (0: no rectification seen → indeterminate).
 *
 * Dependable range, ASTM F42 / SEMI MF42 [V scope]: 1–1000 Ω·cm in Si; not for Ge.
 * Not tested on epitaxial layers. Default noise band 0 (only a reading of 0 is indeterminate).
 */
import type { Problem } from '../problems.js';
import { F42, type CautionContext, type TypeMethod } from './method.js';

export const RECTIFICATION_RANGE_OHM_CM = { min: 1, max: 1000 } as const;

export const pointContact: TypeMethod = {
  method: 'point',
  name: 'point-contact rectification',
  unit: 'polarity',
  nTypeSign: 1,
  defaultNoiseBand: 0,
  noiseBandBasis: 'polarity reading: only 0 (no rectification seen) is indeterminate',
  conventionText: 'Easy (forward) conduction with the point positive means n-type; with the point negative, p-type.',
  source: 'Metal–semiconductor rectification, device physics (derived); ranges ASTM F42',
  cautions(ctx: CautionContext): Problem[] {
    const out: Problem[] = [];
    if (ctx.material !== 'Si') out.push({ code: 'method_not_covered', method: 'point', material: ctx.material, standard: F42 });
    const rho = ctx.resistivityOhmCm;
    if (ctx.material === 'Si' && rho !== undefined && (rho < RECTIFICATION_RANGE_OHM_CM.min || rho > RECTIFICATION_RANGE_OHM_CM.max)) {
      out.push({
        code: 'method_range',
        method: 'point',
        resistivityOhmCm: rho,
        min: RECTIFICATION_RANGE_OHM_CM.min,
        max: RECTIFICATION_RANGE_OHM_CM.max,
        standard: F42,
      });
    }
    return out;
  },
};
