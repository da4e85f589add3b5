/**
 * Thermoelectric (Seebeck) conductivity-type tests: hot probe and cold probe.
 *
 * Sign convention (hot probe): with the heated probe on the meter's + terminal, n-type silicon
 * reads positive — the majority carriers diffuse away from the hot contact, leaving it charged
 * with the sign of the ionized dopants (positive donors in n-type). Source: B. Van Zeghbroeck,
 * Principles of Semiconductor Devices (University of Colorado, online textbook), §2.4.7.9
 * "The hot-probe experiment".
 * Cold probe [derived from the same physics]: the cooled contact gathers majority carriers, so
 * with the cold probe on the meter's + terminal n-type reads negative.
 *
 * Dependable ranges, ASTM F42 / SEMI MF42 [V scope]: thermal EMF (hot or cold probe) in Si up
 * to 1000 Ω·cm; cold probe in Ge up to 20 Ω·cm. Not tested on epitaxial layers. In
 * high-resistivity or near-intrinsic silicon a thermal probe can read n-type whatever the
 * doping, because electron mobility is about three times hole mobility.
 *
 * Default noise band 0.1 mV: a thermoelectric reading is typically millivolts to tens of
 * millivolts, and a bench meter resolves 0.01 mV; a tenth of a millivolt is a margin for
 * contact and lead thermo-EMFs (common practice, no source).
 */
import type { Problem } from '../problems.js';
import { F42, type CautionContext, type TypeMethod } from './method.js';

export const THERMAL_PROBE_MAX_RESISTIVITY_OHM_CM = { Si: 1000, GeCold: 20 } as const;

const HOT_SOURCE =
  'B. Van Zeghbroeck, Principles of Semiconductor Devices (online textbook), §2.4.7.9 "The hot-probe experiment"; ranges ASTM F42';
const NOISE_BASIS = '0.1 mV: margin for contact and lead thermo-EMFs on a bench meter (common practice, no source)';

function thermalCautions(method: 'hot' | 'cold', ctx: CautionContext): Problem[] {
  const out: Problem[] = [];
  const rho = ctx.resistivityOhmCm;
  if (ctx.material === 'GaAs') {
    out.push({ code: 'method_not_covered', method, material: ctx.material, standard: F42 });
  }
  if (rho === undefined) return out;
  const max =
    ctx.material === 'Si'
      ? THERMAL_PROBE_MAX_RESISTIVITY_OHM_CM.Si
      : ctx.material === 'Ge' && method === 'cold'
        ? THERMAL_PROBE_MAX_RESISTIVITY_OHM_CM.GeCold
        : undefined;
  if (max !== undefined && rho > max) {
    out.push({ code: 'method_range', method, resistivityOhmCm: rho, min: 0, max, standard: F42 });
    // Near-intrinsic material: the thermal EMF favours electrons (μn ≈ 3μp) and can read n.
    if (ctx.material === 'Si') out.push({ code: 'mixed_conduction', method });
  }
  return out;
}

export const hotProbe: TypeMethod = {
  method: 'hot',
  name: 'hot probe (thermoelectric)',
  unit: 'V',
  nTypeSign: 1,
  defaultNoiseBand: 1e-4,
  noiseBandBasis: NOISE_BASIS,
  conventionText: "Meter + terminal on the hot probe: a positive reading means n-type, a negative one p-type.",
  source: HOT_SOURCE,
  cautions: (ctx) => thermalCautions('hot', ctx),
};

export const coldProbe: TypeMethod = {
  method: 'cold',
  name: 'cold probe (thermoelectric)',
  unit: 'V',
  nTypeSign: -1,
  defaultNoiseBand: 1e-4,
  noiseBandBasis: NOISE_BASIS,
  conventionText: "Meter + terminal on the cold probe: a negative reading means n-type, a positive one p-type.",
  source: `${HOT_SOURCE} (cold-probe sign derived from the same thermoelectric physics)`,
  cautions: (ctx) => thermalCautions('cold', ctx),
};
