/** `crossover`: the temperature at which a doped crystal turns intrinsic (n_i = net doping). */
import { z } from 'zod';
import { bandgapEv } from '../physics/bandgap/varshni-thurmond-1975.js';
import { intrinsicCrossover } from '../physics/carriers/crossover.js';
import { errorReply, okReply } from '../reply/build.js';
import { MODEL_ESTIMATE } from '../reply/cautions.js';
import { formatNumber, formatTemperature } from '../reply/format.js';
import { assumptionText } from '../reply/messages.js';
import type { ReplyInput } from '../reply/reply.js';
import { DopantSchema, identity, readModelId } from './common.js';
import { parameterRows, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';
import { readDopantList } from './temperature-common.js';
import { MATERIAL_LABEL, MATERIAL_WORDS } from './words.js';

export const CrossoverRequest = z.object({
  dopants: z
    .array(z.object({ dopant: DopantSchema, densityPerCm3: z.number().finite(), densityAsTyped: z.string(), dopantAsTyped: z.string(), bareNumber: z.boolean() }))
    .min(1),
  material: z.enum(['Si', 'Ge', 'GaAs']),
  modelId: z.string().optional(),
});
export type CrossoverRequest = z.infer<typeof CrossoverRequest>;

const USAGE = 'crossover <N> <dopant> [and <N2> <dopant2>] [Si|Ge|GaAs] [model <n_i model>]';
const EXAMPLE = 'crossover 1e15 boron';

export const crossoverCommand = defineCommand<CrossoverRequest>({
  verb: 'crossover',
  aliases: ['intrinsic-temperature'],
  help: {
    summary: 'The temperature at which doped material turns intrinsic (n_i equals the net doping), with the n_i model named.',
    usage: USAGE,
    examples: ['crossover 1e15 boron', 'crossover 5e16 phos', 'crossover 1e16 P and 4e15 B', 'crossover 1e14 n Ge', 'crossover 1e15 p model sproul-green'],
    options: [
      'N: dopant density (cm⁻³); with two dopants the net doping |N_D − N_A| is used',
      'Si (default), Ge or GaAs',
      'model <id>: the n_i model (misiakos-tsamakis default for Si, density-of-states for Ge and GaAs)',
    ],
    seeAlso: ['carriers', 'ni', 'why'],
  },
  schema: CrossoverRequest,
  parse(args) {
    const modelId = readModelId(args);
    const material = args.word(MATERIAL_WORDS)?.value ?? 'Si';
    return { dopants: readDopantList(args, EXAMPLE), material, ...(modelId ? { modelId } : {}) };
  },
  run(req, ctx) {
    const outcome = intrinsicCrossover({
      dopants: req.dopants.map((d) => ({ dopant: d.dopant, densityPerCm3: d.densityPerCm3 })),
      material: req.material,
      ...(req.modelId ? { intrinsicModelId: req.modelId } : {}),
    });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    const inputs: Record<string, ReplyInput> = {};
    req.dopants.forEach((d, i) => {
      inputs[`density${i + 1}`] = { value: d.densityPerCm3, unit: 'cm⁻³', label: `Dopant density${req.dopants.length > 1 ? ` ${i + 1}` : ''}`, asTyped: d.densityAsTyped };
      inputs[`dopant${i + 1}`] = { value: d.dopant, label: `Dopant${req.dopants.length > 1 ? ` ${i + 1}` : ''}`, asTyped: d.dopantAsTyped };
    });
    inputs['material'] = { value: MATERIAL_LABEL[r.material], label: 'Material' };
    const validity = r.model.validityTemperatureKFor?.(r.material) ?? r.model.validityTemperatureK;
    return okReply(identity(ctx), {
      command: 'crossover',
      title: `${MATERIAL_LABEL[r.material][0]!.toUpperCase()}${MATERIAL_LABEL[r.material].slice(1)} with ${formatNumber(r.netDopingPerCm3)} cm⁻³ net doping turns intrinsic at ${formatTemperature(r.temperatureK)}`,
      values: [
        { key: 'temperatureK', value: r.temperatureK, unit: 'K', label: 'Crossover temperature (n_i = net doping)', headline: true, sigFigs: 4 },
        { key: 'temperatureC', value: r.temperatureK - 273.15, unit: '°C', label: 'Crossover temperature', sigFigs: 4 },
        { key: 'netDopingPerCm3', value: r.netDopingPerCm3, unit: 'cm⁻³', label: 'Net doping |N_D − N_A|' },
        { key: 'intrinsicDensityPerCm3', value: r.intrinsicDensityPerCm3, unit: 'cm⁻³', label: 'n_i at the crossover' },
        { key: 'bandgapEv', value: r.model.bandgapEv?.(r.material, r.temperatureK) ?? bandgapEv(r.material, r.temperatureK), unit: 'eV', label: 'Band gap there', sigFigs: 4 },
      ],
      inputs,
      assumptions: [
        ...req.dopants.filter((d) => d.bareNumber).map((d) => `No unit given: ${d.densityAsTyped} read as cm⁻³.`),
        ...r.assumptionCodes.map(assumptionText),
        'Above this temperature the carrier densities follow n_i, not the doping (at the crossover itself n = 1.62 × the net doping).',
      ],
      model: {
        id: r.model.id,
        name: r.model.name,
        citation: r.model.citation,
        validity: `${formatNumber(validity.min)} to ${formatNumber(validity.max)} K`,
      },
      problems: r.problems,
      cautions: [MODEL_ESTIMATE],
      derivation: {
        equations: [...r.model.equations, 'n_i(T) = |N_D − N_A|, solved by Brent’s method in 1/T'],
        parameters: parameterRows(r.model.parameters(r.material)),
        steps: [
          `searched ${formatNumber(r.searchedTemperatureK.min)}–${formatNumber(r.searchedTemperatureK.max)} K (melting point of ${MATERIAL_LABEL[r.material]})`,
          `T = ${formatNumber(r.temperatureK, { sigFigs: 6 })} K, n_i(T) = ${formatNumber(r.intrinsicDensityPerCm3, { sigFigs: 6 })} cm⁻³`,
        ],
        sources: [r.model.citation],
      },
    });
  },
});
