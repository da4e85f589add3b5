/**
 * `sheet`: four-point-probe reading (Rs as read, or V and I) → sheet resistance with the
 * geometry factors → resistivity (with a thickness) → dopant density (with a dopant).
 */
import { z } from 'zod';
import { fourPointProbe } from '../physics/four-point/sheet.js';
import { DIAMETER_FACTOR_CITATION, DIAMETER_FACTOR_EQUATION } from '../physics/four-point/smits-1958-diameter.js';
import { THICKNESS_FACTOR_CITATION, THICKNESS_FACTOR_EQUATIONS } from '../physics/four-point/uhlir-1955-thickness.js';
import { errorReply, okReply } from '../reply/build.js';
import { ELECTRICAL_HAZARD } from '../reply/cautions.js';
import { formatNumber } from '../reply/format.js';
import { assumptionText } from '../reply/messages.js';
import type { ReplyInput, ReplyValue } from '../reply/reply.js';
import { ArgError } from './args.js';
import { DopantSchema, identity, readDopant, readModelId } from './common.js';
import { conversionReply, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';
import { correctReading, readReadingTemperature } from './temperature-common.js';
import { convertResistivityToDensity } from '../physics/resistivity/convert.js';

export const SheetRequest = z
  .object({
    sheetResistanceOhmPerSq: z.number().finite().optional(),
    voltageV: z.number().finite().optional(),
    currentA: z.number().finite().optional(),
    thicknessCm: z.number().finite().optional(),
    spacingCm: z.number().finite().optional(),
    diameterCm: z.number().finite().optional(),
    dopant: DopantSchema.optional(),
    dopantAsTyped: z.string().optional(),
    modelId: z.string().optional(),
    // issue 5: a reading taken off 23 °C, and optionally the person's coefficient
    temperatureK: z.number().finite().optional(),
    temperatureAsTyped: z.string().optional(),
    coefficientPerK: z.number().finite().optional(),
    coefficientAsTyped: z.string().optional(),
    asTyped: z.record(z.string(), z.string()),
  })
  .refine((r) => r.sheetResistanceOhmPerSq !== undefined || (r.voltageV !== undefined && r.currentA !== undefined), {
    message: 'Give the sheet resistance (e.g. 45 ohm/sq) or the voltage and current (e.g. 4.1mV 1mA).',
  });
export type SheetRequest = z.infer<typeof SheetRequest>;

const USAGE = 'sheet <Rs ohm/sq | V I> [thick <t>] [spacing <s>] [diam <d>] [p|n|dopant] [model <id>] [at <T> [tc <x>%/K]]';
const EXAMPLE = 'sheet 45 ohm/sq thick 525um n';

export const sheetCommand = defineCommand<SheetRequest>({
  verb: 'sheet',
  aliases: ['4pp', 'four-point', 'fourpoint', '4pt', 'rs'],
  help: {
    summary: 'Four-point-probe reading → sheet resistance, resistivity and dopant density, with each geometry factor.',
    usage: USAGE,
    examples: [
      'sheet 45 ohm/sq thick 525um n',
      'sheet 4.1mV 1mA thick 725um spacing 1mm diam 200mm p',
      'sheet 120 Ω/□',
      'sheet 2.2mV 10uA thick=0.5mm spacing=1.59mm boron',
      '45 ohm/sq thick 525um n',
      'sheet 45 ohm/sq thick 525um n at 27C',
      'sheet 4.1mV 1mA thick 725um spacing 1mm p at 25C tc 0.75%/K',
    ],
    options: [
      'thick <t>: wafer or layer thickness (µm, um, mm) — needed for resistivity',
      'spacing <s>: probe pin spacing — enables the finite-thickness factor F(t/s)',
      'diam <d>: wafer diameter, probe centred — enables the finite-diameter factor C(d/s)',
      'p | n | dopant: converts the resistivity to a dopant density',
      'at <T>: reading taken at T; the resistivity is corrected to 23 °C (model coefficient, needs thick and the dopant) — a model estimate',
      'tc <x>%/K: your coefficient instead (with at <T> and thick)',
    ],
    seeAlso: ['rho', 'why'],
  },
  schema: SheetRequest,
  parse(args) {
    const temperature = readReadingTemperature(args, 'sheet 45 ohm/sq thick 525um n');
    const asTyped: Record<string, string> = {};
    const thickness = args.keyed(['thick', 'thickness', 't'], 'length');
    const spacing = args.keyed(['spacing', 'pitch', 's'], 'length');
    const diameter = args.keyed(['diam', 'diameter', 'd', 'wafer'], 'length');
    const rs = args.quantity(['sheetResistance']);
    const v = rs ? undefined : args.quantity(['voltage']);
    const i = rs ? undefined : args.quantity(['current']);
    if (!rs && !(v && i)) {
      const bad = args.anyNumber();
      throw new ArgError(
        bad ? 'wrong_dimension' : 'missing_value',
        bad && !v && !i
          ? `"${bad.raw}" is not a sheet resistance; give it in ohm/sq (Ω/□), or give the voltage and the current, e.g. ${EXAMPLE}`
          : `Give the sheet resistance in ohm/sq, or both the voltage and the current (e.g. sheet 4.1mV 1mA thick 725um p).`,
      );
    }
    for (const [k, q] of Object.entries({ rs, v, i, thickness, spacing, diameter })) if (q) asTyped[k] = q.raw;
    const d = readDopant(args);
    return {
      sheetResistanceOhmPerSq: rs?.value,
      voltageV: v?.value,
      currentA: i?.value,
      thicknessCm: thickness?.value,
      spacingCm: spacing?.value,
      diameterCm: diameter?.value,
      dopant: d?.dopant,
      dopantAsTyped: d?.raw,
      modelId: readModelId(args),
      ...temperature,
      asTyped,
    };
  },
  run(rawReq, ctx) {
    // No spacing typed: the fab's configured head (PROBE_SPACING_MM), said in the reply.
    const headSpacing = rawReq.spacingCm === undefined ? ctx.probeSpacingCm : undefined;
    const req = headSpacing !== undefined ? { ...rawReq, spacingCm: headSpacing } : rawReq;
    const outcome = fourPointProbe({
      ...(req.sheetResistanceOhmPerSq !== undefined ? { sheetResistanceOhmPerSq: req.sheetResistanceOhmPerSq } : {}),
      ...(req.voltageV !== undefined ? { voltageV: req.voltageV } : {}),
      ...(req.currentA !== undefined ? { currentA: req.currentA } : {}),
      ...(req.thicknessCm !== undefined ? { thicknessCm: req.thicknessCm } : {}),
      ...(req.spacingCm !== undefined ? { spacingCm: req.spacingCm } : {}),
      ...(req.diameterCm !== undefined ? { diameterCm: req.diameterCm } : {}),
      // With `at <T>` the conversion waits until the resistivity is corrected to 23 °C (below).
      ...(req.dopant && req.temperatureK === undefined ? { dopant: req.dopant } : {}),
      ...(req.modelId && req.temperatureK === undefined ? { modelId: req.modelId } : {}),
    });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    // issue 5: a reading off 23 °C (src/commands/temperature-common.ts)
    let corrected: import('./temperature-common.js').CorrectionParts | undefined;
    let conversion = r.conversion;
    if (req.temperatureK !== undefined) {
      if (r.resistivityOhmCm === undefined) {
        return errorReply('missing_input', 'To correct the reading to 23 °C give the thickness (thick <t>): the coefficient depends on the resistivity.', { usage: USAGE, example: 'sheet 45 ohm/sq thick 525um n at 27C' });
      }
      if (!req.dopant && req.coefficientPerK === undefined) {
        return errorReply('missing_dopant', 'To correct the reading to 23 °C give the type or dopant (p, n, boron…), or your coefficient (tc 0.75%/K).', { usage: USAGE, example: 'sheet 45 ohm/sq thick 525um n at 27C' });
      }
      const c = correctReading(r.resistivityOhmCm, req.dopant ?? 'phosphorus', { ...req, temperatureK: req.temperatureK }, req.modelId);
      if (!c.ok) return errorReply(c.refusal.code, refusalMessage(c.refusal), { usage: USAGE, example: EXAMPLE });
      corrected = c.value;
      if (req.dopant) {
        const conv = convertResistivityToDensity({ resistivityOhmCm: corrected.result.resistivityOhmCm, dopant: req.dopant, ...(req.modelId ? { modelId: req.modelId } : {}) });
        if (!conv.ok) return errorReply(conv.refusal.code, refusalMessage(conv.refusal), { usage: USAGE, example: EXAMPLE });
        conversion = conv.value;
      }
    }
    const inputs: Record<string, ReplyInput> = {};
    const t = req.asTyped;
    if (req.sheetResistanceOhmPerSq !== undefined) inputs['sheetResistance'] = { value: req.sheetResistanceOhmPerSq, unit: 'Ω/□', label: 'Sheet resistance as read', asTyped: t['rs'] ?? '' };
    if (req.voltageV !== undefined) inputs['voltage'] = { value: req.voltageV * 1e3, unit: 'mV', label: 'Voltage (inner pins)', asTyped: t['v'] ?? '' };
    if (req.currentA !== undefined) inputs['current'] = { value: req.currentA * 1e3, unit: 'mA', label: 'Current (outer pins)', asTyped: t['i'] ?? '' };
    if (req.thicknessCm !== undefined) inputs['thickness'] = { value: req.thicknessCm * 1e4, unit: 'µm', label: 'Thickness', asTyped: t['thickness'] ?? '' };
    if (req.spacingCm !== undefined) inputs['spacing'] = { value: req.spacingCm * 10, unit: 'mm', label: 'Probe spacing', asTyped: t['spacing'] ?? '' };
    if (req.diameterCm !== undefined) inputs['diameter'] = { value: req.diameterCm * 10, unit: 'mm', label: 'Wafer diameter', asTyped: t['diameter'] ?? '' };
    if (req.dopant) inputs['dopant'] = { value: req.dopant, label: 'Dopant', asTyped: req.dopantAsTyped ?? req.dopant };

    const geometryValues: ReplyValue[] = [
      { key: 'sheetResistanceOhmPerSq', value: r.sheetResistanceOhmPerSq, unit: 'Ω/□', label: 'Sheet resistance', headline: r.resistivityOhmCm === undefined },
      { key: 'thicknessCorrectionFactor', value: r.thicknessFactor, unit: '', label: 'Thickness factor F(t/s)', sigFigs: 4 },
      { key: 'diameterCorrectionFactor', value: r.diameterFactor, unit: '', label: 'Diameter factor C(d/s)', sigFigs: 4 },
    ];
    const assumptions = [
      ...(headSpacing !== undefined ? [`Probe spacing ${formatNumber(headSpacing * 10, { sigFigs: 3 })} mm: the fab's configured head (PROBE_SPACING_MM); give spacing <s> if another head was used.`] : []),
      ...r.assumptionCodes.map(assumptionText),
    ];
    const cautions = req.voltageV !== undefined ? [ELECTRICAL_HAZARD] : [];
    const steps = [
      req.voltageV !== undefined
        ? `Rs = C·V/I = ${formatNumber(r.diameterFactor, { sigFigs: 5 })} × ${formatNumber(req.voltageV, { sigFigs: 6 })} V / ${formatNumber(req.currentA ?? Number.NaN, { sigFigs: 6 })} A = ${formatNumber(r.sheetResistanceOhmPerSq, { sigFigs: 6 })} Ω/□`
        : `Rs = Rs as read × C/(π/ln2) = ${formatNumber(req.sheetResistanceOhmPerSq ?? Number.NaN, { sigFigs: 6 })} × ${formatNumber(r.diameterRatioFactor, { sigFigs: 5 })} = ${formatNumber(r.sheetResistanceOhmPerSq, { sigFigs: 6 })} Ω/□`,
      ...(r.resistivityOhmCm !== undefined
        ? [`ρ = Rs·t·F = ${formatNumber(r.sheetResistanceOhmPerSq, { sigFigs: 6 })} × ${formatNumber(req.thicknessCm ?? Number.NaN, { sigFigs: 6 })} cm × ${formatNumber(r.thicknessFactor, { sigFigs: 5 })} = ${formatNumber(r.resistivityOhmCm, { sigFigs: 6 })} Ω·cm`]
        : []),
    ];
    const geometryEquations = [DIAMETER_FACTOR_EQUATION, ...THICKNESS_FACTOR_EQUATIONS];
    const geometrySources = [DIAMETER_FACTOR_CITATION, THICKNESS_FACTOR_CITATION];
    if (corrected) {
      Object.assign(inputs, corrected.inputs);
      geometryValues.push(...corrected.values);
      assumptions.push(...corrected.assumptions, 'The sheet resistance is shown as read; the resistivity is the value corrected to 23 °C.');
      steps.push(...corrected.steps);
    }
    if (conversion) {
      return conversionReply(identity(ctx), conversion, {
        command: 'sheet',
        title: `Four-point probe: ${formatNumber(r.sheetResistanceOhmPerSq)} Ω/□ → ${formatNumber(conversion.resistivityOhmCm)} Ω·cm ${conversion.dopant}${corrected ? ' (at 23 °C)' : ''}`,
        headline: 'density',
        inputs,
        extraValues: geometryValues,
        extraAssumptions: assumptions,
        extraProblems: [...r.problems, ...(corrected?.problems ?? [])],
        extraSteps: steps,
        extraEquations: [...geometryEquations, ...(corrected?.equations ?? [])],
        extraSources: [...geometrySources, ...(corrected?.sources ?? [])],
        cautions,
      });
    }
    const values = [...geometryValues];
    const rho23 = corrected ? corrected.result.resistivityOhmCm : r.resistivityOhmCm;
    if (rho23 !== undefined) values.unshift({ key: 'resistivityOhmCm', value: rho23, unit: 'Ω·cm', label: corrected ? 'Resistivity at 23 °C' : 'Resistivity', headline: true });
    const hints: string[] = [];
    if (req.thicknessCm === undefined) hints.push('Add `thick <t>` for the resistivity.');
    else if (!req.dopant) hints.push('Add the type or dopant (p, n, boron…) for the dopant density.');
    return okReply(identity(ctx), {
      command: 'sheet',
      title: rho23 !== undefined ? `Four-point probe: ${formatNumber(rho23)} Ω·cm${corrected ? ' at 23 °C' : ''}` : `Four-point probe: ${formatNumber(r.sheetResistanceOhmPerSq)} Ω/□`,
      values,
      inputs,
      assumptions: [...assumptions, ...hints],
      model: {
        id: 'four-point-geometry',
        name: 'Collinear four-point probe, geometry corrections',
        citation: geometrySources.join('; '),
        validity: 'F(t/s) for a layer on an insulating base; C(d/s) for a centred probe, d/s > √3',
      },
      problems: [...r.problems, ...(corrected?.problems ?? [])],
      cautions,
      derivation: {
        equations: [...geometryEquations, ...(corrected?.equations ?? [])],
        parameters: [],
        steps,
        sources: [...geometrySources, ...(corrected?.sources ?? [])],
      },
    });
  },
});
