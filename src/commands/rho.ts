/** `rho`: resistivity → dopant density (and mobility, carrier density), silicon at 23 °C. */
import { z } from 'zod';
import { convertResistivityToDensity } from '../physics/resistivity/convert.js';
import { errorReply } from '../reply/build.js';
import { formatNumber } from '../reply/format.js';
import { ArgError } from './args.js';
import { DopantSchema, identity, readModelId, requireDopant } from './common.js';
import { capital, conversionReply, dopantLabel, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';
import { correctReading, readReadingTemperature } from './temperature-common.js';

export const RhoRequest = z.object({
  resistivityOhmCm: z.number().finite(),
  resistivityAsTyped: z.string(),
  bareNumber: z.boolean(),
  dopant: DopantSchema,
  dopantAsTyped: z.string(),
  typeOnly: z.boolean(),
  modelId: z.string().optional(),
  // issue 5: a reading taken off 23 °C, and optionally the person's coefficient
  temperatureK: z.number().finite().optional(),
  temperatureAsTyped: z.string().optional(),
  coefficientPerK: z.number().finite().optional(),
  coefficientAsTyped: z.string().optional(),
});
export type RhoRequest = z.infer<typeof RhoRequest>;

const USAGE = 'rho <resistivity> <p|n|dopant> [model <id>] [at <T> [tc <x>%/K]]';
const EXAMPLE = 'rho 8.2 ohm-cm p';

export const rhoCommand = defineCommand<RhoRequest>({
  verb: 'rho',
  aliases: ['resistivity', 'res'],
  help: {
    summary: 'Resistivity reading → dopant density, mobility and carrier density (silicon, 23 °C).',
    usage: USAGE,
    examples: [
      'rho 8.2 ohm-cm p',
      'rho 0.012 Ω·cm arsenic',
      'rho 25 ohm cm n model masetti',
      'rho 3.3 mΩ·cm Sb',
      '8.2 ohm-cm p',
      'rho 8.2 ohm-cm p at 27C',
      'rho 8.2 ohm-cm p at 27C tc 0.75%/K',
    ],
    options: [
      'dopant: p or n (boron / phosphorus), or boron, B, phosphorus, P, arsenic, As, antimony, Sb',
      'model <id>: use another conversion (see `models`); default ASTM F723 for B and P, Masetti for As',
      'a bare number is read as Ω·cm',
      'at <T>: the reading was taken at T; it is corrected to 23 °C with a coefficient from a temperature-dependent mobility model (Klaassen; model arora for Arora) — a model estimate, not the standard’s table',
      'tc <x>%/K: use your coefficient instead (with at <T>)',
    ],
    seeAlso: ['doping', 'sheet', 'models', 'why'],
  },
  schema: RhoRequest,
  parse(args) {
    const temperature = readReadingTemperature(args, 'rho 8.2 ohm-cm p');
    const q = args.quantity(['resistivity']);
    if (!q) {
      const other = args.anyNumber();
      throw new ArgError(
        other ? 'wrong_dimension' : 'missing_value',
        other ? `"${other.raw}" is not a resistivity. Give it in Ω·cm, e.g. ${EXAMPLE}` : `Give the resistivity, e.g. ${EXAMPLE}`,
      );
    }
    const d = requireDopant(args, EXAMPLE);
    return {
      resistivityOhmCm: q.value,
      resistivityAsTyped: q.raw,
      bareNumber: q.bareNumber,
      dopant: d.dopant,
      dopantAsTyped: d.raw,
      typeOnly: d.typeOnly,
      modelId: readModelId(args),
      ...temperature,
    };
  },
  run(req, ctx) {
    // issue 5: a reading off 23 °C is first corrected to 23 °C (src/commands/temperature-common.ts)
    const correction =
      req.temperatureK !== undefined
        ? correctReading(req.resistivityOhmCm, req.dopant, { ...req, temperatureK: req.temperatureK }, req.modelId)
        : undefined;
    if (correction && !correction.ok) return errorReply(correction.refusal.code, refusalMessage(correction.refusal), { usage: USAGE, example: EXAMPLE });
    const corrected = correction?.ok ? correction.value : undefined;
    const outcome = convertResistivityToDensity({
      resistivityOhmCm: corrected ? corrected.result.resistivityOhmCm : req.resistivityOhmCm,
      dopant: req.dopant,
      ...(req.modelId ? { modelId: req.modelId } : {}),
    });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    const extraAssumptions: string[] = [];
    if (req.typeOnly) extraAssumptions.push(`"${req.dopantAsTyped}" read as ${r.dopant}, the usual ${r.carrierType}-type dopant; name another dopant if the wafer has one.`);
    if (req.bareNumber) extraAssumptions.push(`No unit given: ${req.resistivityAsTyped} read as Ω·cm.`);
    return conversionReply(identity(ctx), r, {
      command: 'rho',
      title: corrected
        ? `${capital(dopantLabel(r.dopant))} from ${formatNumber(req.resistivityOhmCm)} Ω·cm at ${formatNumber(corrected.result.measuredTemperatureK - 273.15, { trim: true })} °C (${formatNumber(r.resistivityOhmCm)} Ω·cm at 23 °C)`
        : `${capital(dopantLabel(r.dopant))} from ${formatNumber(r.resistivityOhmCm)} Ω·cm`,
      headline: 'density',
      inputs: {
        resistivity: { value: req.resistivityOhmCm, unit: 'Ω·cm', label: 'Resistivity', asTyped: req.resistivityAsTyped },
        dopant: { value: r.dopant, label: 'Dopant', asTyped: req.dopantAsTyped },
        material: { value: 'silicon', label: 'Material' },
        ...(corrected?.inputs ?? {}),
      },
      extraAssumptions: [...extraAssumptions, ...(corrected?.assumptions ?? [])],
      ...(corrected
        ? {
            extraValues: corrected.values,
            extraProblems: corrected.problems,
            extraSteps: corrected.steps,
            extraEquations: corrected.equations,
            extraSources: corrected.sources,
          }
        : {}),
    });
  },
});
