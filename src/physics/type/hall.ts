/**
 * Conductivity type from the sign of the Hall coefficient.
 *
 * Sign [derived, standard device physics]: R_H = −r/(q·n) for electrons and +r/(q·p) for
 * holes (r the Hall scattering factor, ≈ 1), so R_H < 0 means n-type. With both carriers,
 * R_H = r·(p·μp² − n·μn²)/(q·(n·μn + p·μp)²): in near-intrinsic material the electron term can
 * win in p-type silicon and flip the sign (μn ≈ 3μp), so a caution is raised when the
 * resistivity is within a factor of 10 of the intrinsic resistivity. ASTM F42 has no Hall
 * method.
 *
 * Canonical unit cm³/C. Default noise band: 1/(q·1e22 cm⁻³) ≈ 6.2e-4 cm³/C — a coefficient
 * smaller than that would imply a carrier density above 1e22 cm⁻³, beyond any doping of
 * silicon (derived; give the measurement's own uncertainty when you have it).
 */
import { ELEMENTARY_CHARGE_C } from '../constants.js';
import { intrinsicDensityPerCm3 } from '../intrinsic/registry.js';
import { MASETTI_1983 } from '../mobility/masetti-1983.js';
import type { Problem } from '../problems.js';
import type { Material } from '../types.js';
import type { CautionContext, TypeMethod } from './method.js';

export const HALL_DEFAULT_NOISE_BAND_CM3_PER_C = 1 / (ELEMENTARY_CHARGE_C * 1e22);

/**
 * Intrinsic resistivity of silicon at 300 K, Ω·cm: 1/(q·n_i·(μn + μp)) with the default n_i
 * and Masetti's lattice-limited mobilities (μmax for P electrons and B holes). Other materials:
 * undefined (no mobility model here).
 */
export function intrinsicResistivityOhmCm(material: Material): number | undefined {
  if (material !== 'Si') return undefined;
  const ni = intrinsicDensityPerCm3('Si', 300);
  const mu = MASETTI_1983.phosphorus.muMax + MASETTI_1983.boron.muMax;
  return 1 / (ELEMENTARY_CHARGE_C * ni * mu);
}

export const hall: TypeMethod = {
  method: 'hall',
  name: 'Hall coefficient',
  unit: 'cm³/C',
  nTypeSign: -1,
  defaultNoiseBand: HALL_DEFAULT_NOISE_BAND_CM3_PER_C,
  noiseBandBasis: '1/(q·1e22 cm⁻³): smaller coefficients would mean more carriers than any Si doping (derived)',
  conventionText: 'A negative Hall coefficient means electrons dominate (n-type); a positive one, holes (p-type).',
  source: 'Hall effect sign, standard device physics (e.g. S. M. Sze, Physics of Semiconductor Devices, 2nd ed., 1981); not an ASTM F42 method',
  cautions(ctx: CautionContext): Problem[] {
    const rhoI = intrinsicResistivityOhmCm(ctx.material);
    if (ctx.resistivityOhmCm !== undefined && rhoI !== undefined && ctx.resistivityOhmCm >= rhoI / 10) {
      return [{ code: 'mixed_conduction', method: 'hall' }];
    }
    return [];
  },
};
