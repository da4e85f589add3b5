/**
 * `vdp`: van der Pauw measurement → sheet resistance (src/physics/hall/van-der-pauw-1958.ts),
 * with a thickness → resistivity → dopant density (the same conversion as `rho`), and with a
 * Hall voltage, current and field → sheet carrier density and Hall mobility.
 */
import { z } from 'zod';
import { hallAnalysis, hallCoefficientFromVoltage } from '../physics/hall/hall-effect.js';
import { vanDerPauwSheetResistance } from '../physics/hall/van-der-pauw-1958.js';
import { ELEMENTARY_CHARGE_C } from '../physics/constants.js';
import { convertResistivityToDensity } from '../physics/resistivity/convert.js';
import { errorReply, okReply } from '../reply/build.js';
import { CONFIRM_PROCEDURE, ELECTRICAL_HAZARD } from '../reply/cautions.js';
import { formatNumber } from '../reply/format.js';
import type { ReplyInput, ReplyValue } from '../reply/reply.js';
import { ArgError } from './args.js';
import { DopantSchema, identity, readDopant } from './common.js';
import { capital, conversionModel, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';

export const VdpRequest = z.object({
  r1Ohm: z.number().finite(),
  r2Ohm: z.number().finite(),
  thicknessCm: z.number().finite().optional(),
  dopant: DopantSchema.optional(),
  hall: z.object({ voltageV: z.number().finite(), currentA: z.number().finite(), fieldT: z.number().finite() }).optional(),
  asTyped: z.record(z.string(), z.string()),
});
export type VdpRequest = z.infer<typeof VdpRequest>;

const USAGE = 'vdp <R1> <R2> [thick <t>] [p|n|dopant] [hall <V_H> current <I> field <B>]';
const EXAMPLE = 'vdp 12.4 ohm 11.9 ohm thick 500um p';
const Q = ELEMENTARY_CHARGE_C;

export const vdpCommand = defineCommand<VdpRequest>({
  verb: 'vdp',
  aliases: ['van-der-pauw', 'vanderpauw'],
  help: {
    summary: 'van der Pauw measurement: two four-terminal resistances → sheet resistance; with a thickness, resistivity and dopant density; with a Hall voltage, sheet carrier density and mobility.',
    usage: USAGE,
    examples: ['vdp 12.4 ohm 11.9 ohm', 'vdp 12.4 ohm 11.9 ohm thick 500um p', 'vdp 250 ohm 240 ohm hall -3.1mV current 100uA field 0.5T'],
    options: [
      'R1 = R_AB,CD = V_CD/I_AB and R2 = R_BC,DA = V_DA/I_BC (Ω; average each over both current directions first)',
      'thick <t>: sample thickness → resistivity, and with p|n|dopant the dopant density',
      'hall <V_H> current <I> field <B>: the Hall voltage (sign as measured, R_H = V_H·t/(I·B) convention), the current and the field (T, mT, G, kG)',
    ],
    seeAlso: ['hall', 'sheet', 'rho'],
  },
  schema: VdpRequest,
  parse(args) {
    const asTyped: Record<string, string> = {};
    const thickness = args.keyed(['thick', 'thickness', 't'], 'length');
    const hallV = args.keyed(['hall', 'vh', 'hall-voltage'], 'voltage');
    const current = args.keyed(['current', 'i'], 'current');
    const field = args.keyed(['field', 'b'], 'magneticField');
    const r1 = args.quantity(['resistance']);
    const r2 = args.quantity(['resistance']);
    if (!r1 || !r2) throw new ArgError('missing_value', `Give both van der Pauw resistances in ohms, e.g. ${EXAMPLE}`);
    if (hallV && !(current && field)) throw new ArgError('missing_value', `With a Hall voltage give the current and the field too, e.g. vdp 250 ohm 240 ohm hall -3.1mV current 100uA field 0.5T`);
    for (const [k, q] of Object.entries({ r1, r2, thickness, hallV, current, field })) if (q) asTyped[k] = q.raw;
    const d = readDopant(args);
    return {
      r1Ohm: r1.value,
      r2Ohm: r2.value,
      thicknessCm: thickness?.value,
      dopant: d?.dopant,
      ...(hallV && current && field ? { hall: { voltageV: hallV.value, currentA: current.value, fieldT: field.value } } : {}),
      asTyped,
    };
  },
  run(req, ctx) {
    const vdp = vanDerPauwSheetResistance(req.r1Ohm, req.r2Ohm);
    if (!vdp.ok) return errorReply(vdp.refusal.code, refusalMessage(vdp.refusal), { usage: USAGE, example: EXAMPLE });
    const rs = vdp.value.sheetResistanceOhmPerSq;
    const values: ReplyValue[] = [
      { key: 'sheetResistanceOhmPerSq', value: rs, unit: 'Ω/□', label: 'Sheet resistance', headline: true },
      { key: 'vanDerPauwFactor', value: vdp.value.correctionFactor, unit: '', label: 'van der Pauw factor f(R1/R2)', sigFigs: 4 },
      { key: 'resistanceRatio', value: vdp.value.ratio, unit: '', label: 'Ratio of the two resistances', sigFigs: 3 },
    ];
    const problems = [...vdp.value.problems];
    const assumptions = ['Contacts small and on the edge of a flat sample of uniform thickness without holes (van der Pauw’s conditions).'];
    let model;
    const t = req.thicknessCm;
    const rho = t !== undefined ? rs * t : undefined;
    if (rho !== undefined) {
      values.push({ key: 'resistivityOhmCm', value: rho, unit: 'Ω·cm', label: 'Resistivity (Rs × t)' });
      if (req.dopant) {
        const conv = convertResistivityToDensity({ resistivityOhmCm: rho, dopant: req.dopant });
        if (conv.ok) {
          values.push({ key: 'dopantDensityPerCm3', value: conv.value.dopantDensityPerCm3, unit: 'cm⁻³', label: `${capital(req.dopant)} density (from the resistivity)` });
          problems.push(...conv.value.problems);
          model = conversionModel(conv.value.model, req.dopant);
          assumptions.push('Resistivity at 23 °C for the conversion; uncompensated material, all dopants ionized.');
        }
      }
    }
    const steps = [`exp(−π·${formatNumber(req.r1Ohm, { sigFigs: 6 })}/Rs) + exp(−π·${formatNumber(req.r2Ohm, { sigFigs: 6 })}/Rs) = 1 → Rs = ${formatNumber(rs, { sigFigs: 6 })} Ω/□`];
    if (req.hall) {
      // The sheet Hall coefficient (t = 1): R_Hs = V_H/(I·B); n_s = 1/(q·|R_Hs|); μ_H = |R_Hs|/Rs.
      const rhs = hallCoefficientFromVoltage(req.hall.voltageV, req.hall.currentA, req.hall.fieldT, 1);
      if (!rhs.ok) return errorReply(rhs.refusal.code, refusalMessage(rhs.refusal), { usage: USAGE, example: EXAMPLE });
      const h = hallAnalysis({ hallCoefficientCm3PerC: rhs.value, resistivityOhmCm: rs });
      if (!h.ok) return errorReply(h.refusal.code, refusalMessage(h.refusal), { usage: USAGE, example: EXAMPLE });
      values.push(
        { key: 'carrierType', value: h.value.carrierType, unit: '', label: 'Carrier type (sign of the Hall voltage)' },
        { key: 'sheetCarrierDensityPerCm2', value: h.value.carrierDensityPerCm3, unit: 'cm⁻²', label: 'Sheet carrier density 1/(q·|R_H,s|)', headline: true },
        { key: 'hallMobilityCm2PerVs', value: h.value.hallMobilityCm2PerVs!, unit: 'cm²/V·s', label: 'Hall mobility |R_H,s|/Rs' },
      );
      if (t !== undefined) values.push({ key: h.value.carrierType === 'n' ? 'electronDensityPerCm3' : 'holeDensityPerCm3', value: h.value.carrierDensityPerCm3 / t, unit: 'cm⁻³', label: 'Carrier density (sheet density / t)' });
      steps.push(`R_H,s = V_H/(I·B) = ${formatNumber(rhs.value, { sigFigs: 6 })} cm²/C; n_s = 1/(q·|R_H,s|) = ${formatNumber(h.value.carrierDensityPerCm3, { sigFigs: 6 })} cm⁻² (q = ${Q} C)`);
      assumptions.push('Hall scattering factor r_H = 1; one kind of carrier conducts (in near-intrinsic or compensated samples the sign can flip).', 'Hall voltage sign as measured with R_H = V_H·t/(I·B): a negative value means electrons (n-type).');
    }
    const inputs: Record<string, ReplyInput> = {
      r1: { value: req.r1Ohm, unit: 'Ω', label: 'R1 = R_AB,CD', asTyped: req.asTyped['r1'] ?? '' },
      r2: { value: req.r2Ohm, unit: 'Ω', label: 'R2 = R_BC,DA', asTyped: req.asTyped['r2'] ?? '' },
      ...(t !== undefined ? { thickness: { value: t * 1e4, unit: 'µm', label: 'Thickness', asTyped: req.asTyped['thickness'] ?? '' } } : {}),
    };
    return okReply(identity(ctx), {
      command: 'vdp',
      title: `van der Pauw: ${formatNumber(rs)} Ω/□`,
      values,
      inputs,
      assumptions,
      model: model ?? { id: 'van-der-pauw-1958', name: 'van der Pauw (1958)', citation: 'L. J. van der Pauw, Philips Res. Rep. 13, 1 (1958)' },
      problems,
      cautions: [ELECTRICAL_HAZARD, CONFIRM_PROCEDURE],
      derivation: {
        equations: ['exp(−π·R1/Rs) + exp(−π·R2/Rs) = 1', 'Rs = π/ln 2 · (R1 + R2)/2 · f(R1/R2)', ...(rho !== undefined ? ['ρ = Rs·t'] : []), ...(req.hall ? ['R_H,s = V_H/(I·B)', 'n_s = 1/(q·|R_H,s|)', 'μ_H = |R_H,s|/Rs'] : [])],
        parameters: [{ name: 'q', value: Q, unit: 'C', source: 'CODATA 2018 (exact)' }],
        steps,
        sources: ['L. J. van der Pauw, Philips Res. Rep. 13, 1 (1958)'],
      },
    });
  },
});
