/** `ni`: intrinsic carrier density and band gap at a temperature; n·p = n_i². */
import { z } from 'zod';
import { intrinsicDensity } from '../physics/intrinsic/index.js';
import { PASSLER_CITATION, passlerParameters } from '../physics/bandgap/passler-2002.js';
import { BANDGAP_CITATION, bandgapParameters } from '../physics/bandgap/varshni-thurmond-1975.js';
import { errorReply, okReply } from '../reply/build.js';
import { formatNumber, formatTemperature } from '../reply/format.js';
import { ArgError } from './args.js';
import { identity, readModelId } from './common.js';
import { parameterRows, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';
import { MATERIAL_LABEL, MATERIAL_WORDS } from './words.js';

export const NiRequest = z.object({
  temperatureK: z.number().finite(),
  temperatureAsTyped: z.string(),
  defaulted: z.boolean(),
  material: z.enum(['Si', 'Ge', 'GaAs']),
  modelId: z.string().optional(),
});
export type NiRequest = z.infer<typeof NiRequest>;

const USAGE = 'ni [<temperature>] [Si|Ge|GaAs] [model <id>]';
const EXAMPLE = 'ni 85C';

export const niCommand = defineCommand<NiRequest>({
  verb: 'ni',
  aliases: ['intrinsic', 'n_i'],
  help: {
    summary: 'Intrinsic carrier density and band gap at a temperature (Si by default; Ge, GaAs).',
    usage: USAGE,
    examples: ['ni 85C', 'ni 400K Ge', 'ni 300K', 'ni 27 degC GaAs', 'ni 350K model sproul-green', 'ni'],
    options: ['temperature: K, °C, degC or C; 300 K when not given', 'model <id>: misiakos-tsamakis, sproul-green, density-of-states'],
    seeAlso: ['models', 'why'],
  },
  schema: NiRequest,
  parse(args) {
    args.flag(['at']);
    const t = args.quantity(['temperature']);
    const material = args.word(MATERIAL_WORDS)?.value ?? 'Si';
    if (t && t.bareNumber) throw new ArgError('bad_unit', `Give the temperature with its unit, e.g. ni ${t.raw}K or ni ${t.raw}C`);
    if (!t && args.anyNumber()) {
      throw new ArgError('wrong_dimension', `"${args.anyNumber()!.raw}" is not a temperature; e.g. ${EXAMPLE} or ni 358K`);
    }
    return {
      temperatureK: t?.value ?? 300,
      temperatureAsTyped: t?.raw ?? '300 K (default)',
      defaulted: !t,
      material,
      modelId: readModelId(args),
    };
  },
  run(req, ctx) {
    const outcome = intrinsicDensity({
      temperatureK: req.temperatureK,
      material: req.material,
      ...(req.modelId ? { modelId: req.modelId } : {}),
    });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    const ownGap = r.model.bandgapEv !== undefined;
    const assumptions = [
      'Intrinsic (undoped) material in thermal equilibrium; n = p = n_i.',
      `Mass-action law: in any non-degenerate ${MATERIAL_LABEL[r.material]} at this temperature, n·p = n_i² = ${formatNumber(r.massActionProductPerCm6)} cm⁻⁶.`,
    ];
    if (req.defaulted) assumptions.unshift('No temperature given: 300 K.');
    return okReply(identity(ctx), {
      command: 'ni',
      title: `Intrinsic density of ${MATERIAL_LABEL[r.material]} at ${formatTemperature(r.temperatureK)}`,
      values: [
        { key: 'intrinsicDensityPerCm3', value: r.intrinsicDensityPerCm3, unit: 'cm⁻³', label: 'Intrinsic carrier density n_i', headline: true },
        { key: 'bandgapEv', value: r.bandgapEv, unit: 'eV', label: 'Band gap Eg(T)', sigFigs: 4 },
        { key: 'massActionProductPerCm6', value: r.massActionProductPerCm6, unit: 'cm⁻⁶', label: 'n·p = n_i²' },
        { key: 'temperatureK', value: r.temperatureK, unit: 'K', label: 'Temperature', sigFigs: Number.isInteger(r.temperatureK) ? 3 : 5 },
        { key: 'conductionBandDensityPerCm3', value: r.conductionBandDensityPerCm3, unit: 'cm⁻³', label: 'Nc(T)' },
        { key: 'valenceBandDensityPerCm3', value: r.valenceBandDensityPerCm3, unit: 'cm⁻³', label: 'Nv(T)' },
      ],
      inputs: {
        temperature: { value: r.temperatureK, unit: 'K', label: 'Temperature', asTyped: req.temperatureAsTyped },
        material: { value: MATERIAL_LABEL[r.material], label: 'Material' },
      },
      assumptions,
      model: {
        id: r.model.id,
        name: r.model.name,
        citation: r.model.citation,
        validity: `${formatNumber(r.model.validityTemperatureK.min)} to ${formatNumber(r.model.validityTemperatureK.max)} K`,
      },
      problems: r.problems,
      derivation: {
        // A model with its own gap (the Si default: Pässler's) lists it among its own parameters.
        equations: [...r.model.equations, ...(ownGap ? [] : ['Eg(T) = Eg0 − α·T²/(T + β)']), 'n·p = n_i²'],
        parameters: [...parameterRows(r.model.parameters(r.material)), ...(ownGap ? [] : parameterRows(bandgapParameters(r.material)))],
        steps: [
          `T = ${formatNumber(r.temperatureK, { sigFigs: 6 })} K`,
          `Eg = ${formatNumber(r.bandgapEv, { sigFigs: 6 })} eV`,
          `n_i = ${formatNumber(r.intrinsicDensityPerCm3, { sigFigs: 6 })} cm⁻³`,
        ],
        sources: [r.model.citation, ownGap ? PASSLER_CITATION : BANDGAP_CITATION],
      },
    });
  },
});
