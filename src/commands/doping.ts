/** `doping`: dopant density → resistivity (silicon, 23 °C). */
import { z } from 'zod';
import { convertDensityToResistivity } from '../physics/resistivity/convert.js';
import { errorReply } from '../reply/build.js';
import { formatNumber } from '../reply/format.js';
import { ArgError } from './args.js';
import { DopantSchema, identity, readModelId, requireDopant } from './common.js';
import { capital, conversionReply, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';

export const DopingRequest = z.object({
  dopantDensityPerCm3: z.number().finite(),
  densityAsTyped: z.string(),
  bareNumber: z.boolean(),
  dopant: DopantSchema,
  dopantAsTyped: z.string(),
  typeOnly: z.boolean(),
  modelId: z.string().optional(),
});
export type DopingRequest = z.infer<typeof DopingRequest>;

const USAGE = 'doping <density> <p|n|dopant> [model <id>]';
const EXAMPLE = 'doping 2e15 boron';

export const dopingCommand = defineCommand<DopingRequest>({
  verb: 'doping',
  aliases: ['density', 'dope', 'conc'],
  help: {
    summary: 'Dopant density → resistivity at 23 °C (silicon), with the mobility it implies.',
    usage: USAGE,
    examples: ['doping 2e15 boron', 'doping 3.1x10^16 cm^-3 phos', 'doping 1.5×10¹⁸ /cm3 arsenic', 'doping 5e14 n model caughey-thomas', '2e15 cm-3 B'],
    options: ['a bare number is read as cm⁻³', 'model <id>: another conversion (see `models`)'],
    seeAlso: ['rho', 'models', 'why'],
  },
  schema: DopingRequest,
  parse(args) {
    const q = args.quantity(['density']);
    if (!q) {
      const other = args.anyNumber();
      throw new ArgError(
        other ? 'wrong_dimension' : 'missing_value',
        other ? `"${other.raw}" is not a dopant density. Give it in cm⁻³, e.g. ${EXAMPLE}` : `Give the dopant density, e.g. ${EXAMPLE}`,
      );
    }
    const d = requireDopant(args, EXAMPLE);
    return {
      dopantDensityPerCm3: q.value,
      densityAsTyped: q.raw,
      bareNumber: q.bareNumber,
      dopant: d.dopant,
      dopantAsTyped: d.raw,
      typeOnly: d.typeOnly,
      modelId: readModelId(args),
    };
  },
  run(req, ctx) {
    const outcome = convertDensityToResistivity({
      dopantDensityPerCm3: req.dopantDensityPerCm3,
      dopant: req.dopant,
      ...(req.modelId ? { modelId: req.modelId } : {}),
    });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    const extraAssumptions: string[] = [];
    if (req.typeOnly) extraAssumptions.push(`"${req.dopantAsTyped}" read as ${r.dopant}, the usual ${r.carrierType}-type dopant.`);
    if (req.bareNumber) extraAssumptions.push(`No unit given: ${req.densityAsTyped} read as cm⁻³.`);
    return conversionReply(identity(ctx), r, {
      command: 'doping',
      title: `Resistivity of ${formatNumber(r.dopantDensityPerCm3)} cm⁻³ ${r.dopant}`,
      headline: 'resistivity',
      inputs: {
        dopantDensity: { value: req.dopantDensityPerCm3, unit: 'cm⁻³', label: `${capital(r.dopant)} density`, asTyped: req.densityAsTyped },
        dopant: { value: r.dopant, label: 'Dopant', asTyped: req.dopantAsTyped },
        material: { value: 'silicon', label: 'Material' },
      },
      extraAssumptions,
    });
  },
});
