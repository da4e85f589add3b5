/**
 * `hall`: a Hall measurement → carrier type, carrier density and (with the resistivity) Hall
 * mobility, and the dopant density the resistivity implies for comparison
 * (src/physics/hall/hall-effect.ts). From the Hall coefficient, or from the Hall voltage, current,
 * field and thickness.
 */
import { z } from 'zod';
import { hallAnalysis, hallCoefficientFromVoltage } from '../physics/hall/hall-effect.js';
import { ELEMENTARY_CHARGE_C } from '../physics/constants.js';
import { convertResistivityToDensity } from '../physics/resistivity/convert.js';
import { errorReply, okReply } from '../reply/build.js';
import { ELECTRICAL_HAZARD, HALL_HAZARD } from '../reply/cautions.js';
import { formatNumber } from '../reply/format.js';
import type { ReplyInput, ReplyValue } from '../reply/reply.js';
import { ArgError } from './args.js';
import { identity } from './common.js';
import { conversionModel, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';

export const HallRequest = z.object({
  hallCoefficientCm3PerC: z.number().finite().optional(),
  fromVoltage: z.object({ voltageV: z.number().finite(), currentA: z.number().finite(), fieldT: z.number().finite(), thicknessCm: z.number().finite() }).optional(),
  resistivityOhmCm: z.number().finite().optional(),
  scatteringFactor: z.number().finite().optional(),
  asTyped: z.record(z.string(), z.string()),
});
export type HallRequest = z.infer<typeof HallRequest>;

const USAGE = 'hall <R_H> [rho <ρ>] [rh <r_H>]  ·  hall <V_H> current <I> field <B> thick <t> [rho <ρ>] [rh <r_H>]';
const EXAMPLE = 'hall -1.3e3 cm3/C rho 1.1 ohm-cm';
const Q = ELEMENTARY_CHARGE_C;

export const hallCommand = defineCommand<HallRequest>({
  verb: 'hall',
  aliases: ['hall-effect'],
  help: {
    summary: 'Hall measurement → carrier type, carrier density, Hall mobility (with the resistivity) and the dopant density the resistivity implies.',
    usage: USAGE,
    examples: ['hall -1.3e3 cm3/C rho 1.1 ohm-cm', 'hall -1.3e-3 m3/C', 'hall -2.6mV current 1mA field 0.5T thick 500um rho 1.1 ohm-cm', 'hall 4.2e3 cm3/C rho 11 ohm-cm rh 1.18'],
    options: [
      'R_H: the Hall coefficient (cm³/C or m³/C); negative means electrons (n-type)',
      'or the Hall voltage V_H with current <I>, field <B> (T, mT, G, kG) and thick <t>: R_H = V_H·t/(I·B)',
      'rho <ρ>: the resistivity → Hall mobility |R_H|/ρ and the dopant density it implies',
      'rh <r_H>: the Hall scattering factor (default 1)',
    ],
    seeAlso: ['vdp', 'type', 'rho'],
  },
  schema: HallRequest,
  parse(args) {
    const asTyped: Record<string, string> = {};
    args.flag(['coefficient', 'coeff', 'effect']); // "hall coefficient -1300 cm3/C"
    const rho = args.keyed(['rho', 'resistivity'], 'resistivity');
    const current = args.keyed(['current', 'i'], 'current');
    const field = args.keyed(['field', 'b'], 'magneticField');
    const thickness = args.keyed(['thick', 'thickness', 't'], 'length');
    const rhWord = args.keyedWord(['rh', 'r_h', 'scattering']);
    const rh = args.quantity(['hallCoefficient']);
    const v = rh ? undefined : args.quantity(['voltage']);
    if (!rh && !v) throw new ArgError('missing_value', `Give the Hall coefficient (cm³/C) or the Hall voltage with current, field and thickness, e.g. ${EXAMPLE}`);
    if (v && !(current && field && thickness)) throw new ArgError('missing_value', 'With a Hall voltage give current <I>, field <B> and thick <t> too, e.g. hall -2.6mV current 1mA field 0.5T thick 500um');
    const scattering = rhWord !== undefined ? Number(rhWord) : undefined;
    if (scattering !== undefined && !(scattering > 0 && scattering < 5)) throw new ArgError('bad_value', `rh is the Hall scattering factor, a number near 1 (e.g. rh 1.18), not "${rhWord}"`);
    for (const [k, q] of Object.entries({ rh, v, current, field, thickness, rho })) if (q) asTyped[k] = q.raw;
    return {
      ...(rh ? { hallCoefficientCm3PerC: rh.value } : {}),
      ...(v && current && field && thickness ? { fromVoltage: { voltageV: v.value, currentA: current.value, fieldT: field.value, thicknessCm: thickness.value } } : {}),
      ...(rho ? { resistivityOhmCm: rho.value } : {}),
      ...(scattering !== undefined ? { scatteringFactor: scattering } : {}),
      asTyped,
    };
  },
  run(req, ctx) {
    let rh = req.hallCoefficientCm3PerC;
    if (rh === undefined && req.fromVoltage) {
      const f = req.fromVoltage;
      const r = hallCoefficientFromVoltage(f.voltageV, f.currentA, f.fieldT, f.thicknessCm);
      if (!r.ok) return errorReply(r.refusal.code, refusalMessage(r.refusal), { usage: USAGE, example: EXAMPLE });
      rh = r.value;
    }
    const h = hallAnalysis({ hallCoefficientCm3PerC: rh!, ...(req.resistivityOhmCm !== undefined ? { resistivityOhmCm: req.resistivityOhmCm } : {}), ...(req.scatteringFactor !== undefined ? { scatteringFactor: req.scatteringFactor } : {}) });
    if (!h.ok) return errorReply(h.refusal.code, refusalMessage(h.refusal), { usage: USAGE, example: EXAMPLE });
    const r = h.value;
    const densityKey = r.carrierType === 'n' ? 'electronDensityPerCm3' : 'holeDensityPerCm3';
    const values: ReplyValue[] = [
      { key: 'carrierType', value: r.carrierType, unit: '', label: 'Carrier type (sign of R_H)', headline: true },
      { key: densityKey, value: r.carrierDensityPerCm3, unit: 'cm⁻³', label: `${r.carrierType === 'n' ? 'Electron' : 'Hole'} density r_H/(q·|R_H|)`, headline: true },
      { key: 'hallCoefficientCm3PerC', value: r.hallCoefficientCm3PerC, unit: 'cm³/C', label: 'Hall coefficient R_H' },
    ];
    const problems = [];
    let model;
    if (r.hallMobilityCm2PerVs !== undefined) {
      values.push({ key: 'hallMobilityCm2PerVs', value: r.hallMobilityCm2PerVs, unit: 'cm²/V·s', label: 'Hall mobility |R_H|/ρ' });
      const dopant = r.carrierType === 'n' ? 'phosphorus' : 'boron';
      const conv = convertResistivityToDensity({ resistivityOhmCm: req.resistivityOhmCm!, dopant });
      if (conv.ok) {
        values.push({ key: 'dopantDensityPerCm3', value: conv.value.dopantDensityPerCm3, unit: 'cm⁻³', label: `Dopant density the resistivity implies (${dopant}, for comparison)` });
        problems.push(...conv.value.problems);
        model = conversionModel(conv.value.model, dopant);
      }
    }
    const inputs: Record<string, ReplyInput> = {
      ...(req.hallCoefficientCm3PerC !== undefined ? { hallCoefficient: { value: req.hallCoefficientCm3PerC, unit: 'cm³/C', label: 'Hall coefficient', asTyped: req.asTyped['rh'] ?? '' } } : {}),
      ...(req.fromVoltage
        ? {
            hallVoltage: { value: req.fromVoltage.voltageV * 1e3, unit: 'mV', label: 'Hall voltage', asTyped: req.asTyped['v'] ?? '' },
            current: { value: req.fromVoltage.currentA * 1e3, unit: 'mA', label: 'Current', asTyped: req.asTyped['current'] ?? '' },
            field: { value: req.fromVoltage.fieldT, unit: 'T', label: 'Field', asTyped: req.asTyped['field'] ?? '' },
            thickness: { value: req.fromVoltage.thicknessCm * 1e4, unit: 'µm', label: 'Thickness', asTyped: req.asTyped['thickness'] ?? '' },
          }
        : {}),
      ...(req.resistivityOhmCm !== undefined ? { resistivity: { value: req.resistivityOhmCm, unit: 'Ω·cm', label: 'Resistivity', asTyped: req.asTyped['rho'] ?? '' } } : {}),
    };
    return okReply(identity(ctx), {
      command: 'hall',
      title: `Hall: ${r.carrierType}-type, ${formatNumber(r.carrierDensityPerCm3)} cm⁻³`,
      values,
      inputs,
      assumptions: [
        `Hall scattering factor r_H = ${formatNumber(r.scatteringFactor, { sigFigs: 3 })}${req.scatteringFactor === undefined ? ' (default; about 1.18 for lattice and 1.93 for ionized-impurity scattering in the simple theory — give rh to use another)' : ''}.`,
        'One kind of carrier conducts: in near-intrinsic or compensated material both do and the sign of R_H can flip.',
        ...(req.fromVoltage ? ['Hall voltage sign as measured with R_H = V_H·t/(I·B) (current along +x, field along +z, V_H across +y).'] : []),
        ...(model ? ['The dopant for the comparison follows the sign: phosphorus for n-type, boron for p-type; uncompensated material, 23 °C.'] : []),
      ],
      ...(model ? { model } : { model: { id: 'hall-effect', name: 'Hall effect, single carrier', citation: 'S. M. Sze, K. K. Ng, Physics of Semiconductor Devices, 3rd ed. (2007), §1.5.3' } }),
      problems: [...problems, { code: 'mixed_conduction' as const, method: 'hall' }],
      cautions: [HALL_HAZARD, ELECTRICAL_HAZARD],
      derivation: {
        equations: ['n = r_H/(q·|R_H|)', 'μ_H = |R_H|/ρ', ...(req.fromVoltage ? ['R_H = V_H·t/(I·B)'] : [])],
        parameters: [{ name: 'q', value: Q, unit: 'C', source: 'CODATA 2018 (exact)' }, { name: 'r_H', value: r.scatteringFactor, unit: '' }],
        steps: [`R_H = ${formatNumber(r.hallCoefficientCm3PerC, { sigFigs: 6 })} cm³/C → ${r.carrierType}-type; n = ${formatNumber(r.carrierDensityPerCm3, { sigFigs: 6 })} cm⁻³`],
        sources: ['S. M. Sze, K. K. Ng, Physics of Semiconductor Devices, 3rd ed. (2007), §1.5.3', 'E. H. Hall, Am. J. Math. 2, 287 (1879)'],
      },
    });
  },
});
