/**
 * `layer`: diffused layers by Irvin's method. Sheet resistance and junction depth → surface
 * concentration, or surface concentration → sheet resistance, for erfc or Gaussian profiles
 * on a background of the opposite type.
 */
import { z } from 'zod';
import { layerSheetResistance, layerSurfaceConcentration } from '../physics/layer/irvin-1962.js';
import { DOPANT_TYPE, type Dopant } from '../physics/types.js';
import { errorReply, okReply } from '../reply/build.js';
import { MODEL_ESTIMATE } from '../reply/cautions.js';
import { formatNumber } from '../reply/format.js';
import { assumptionText } from '../reply/messages.js';
import type { ReplyInput, ReplyValue } from '../reply/reply.js';
import { ArgError, lookup } from './args.js';
import { DopantSchema, identity, readModelId } from './common.js';
import { parameterRows, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';
import { resolveMobilityModelId } from './temperature-common.js';
import { DOPANT_WORDS } from './words.js';

const PROFILE_WORDS: Readonly<Record<string, 'erfc' | 'gaussian'>> = {
  erfc: 'erfc',
  'error-function': 'erfc',
  predep: 'erfc',
  gaussian: 'gaussian',
  gauss: 'gaussian',
  'drive-in': 'gaussian',
};

export const LayerRequest = z
  .object({
    sheetResistanceOhmPerSq: z.number().finite().optional(),
    surfaceConcentrationPerCm3: z.number().finite().optional(),
    junctionDepthCm: z.number().finite(),
    profile: z.enum(['erfc', 'gaussian']),
    profileDefaulted: z.boolean(),
    dopant: DopantSchema,
    dopantDefaulted: z.boolean(),
    backgroundDopant: DopantSchema,
    backgroundDensityPerCm3: z.number().finite(),
    temperatureK: z.number().finite().optional(),
    modelId: z.string().optional(),
    asTyped: z.record(z.string(), z.string()),
  })
  .refine((r) => (r.sheetResistanceOhmPerSq === undefined) !== (r.surfaceConcentrationPerCm3 === undefined), {
    message: 'Give either the sheet resistance (e.g. 45 ohm/sq) or the surface concentration (e.g. Cs 1e19), not both.',
  });
export type LayerRequest = z.infer<typeof LayerRequest>;

const USAGE = 'layer <Rs ohm/sq | Cs <N>> xj <depth> [erfc|gaussian] [dopant] on <N_B> <p|n|dopant> [model <mobility>]';
const EXAMPLE = 'layer 45 ohm/sq xj 0.8um erfc on 1e15 p';

const OPPOSITE_DEFAULT: Readonly<Record<'n' | 'p', Dopant>> = { n: 'boron', p: 'phosphorus' };

export const layerCommand = defineCommand<LayerRequest>({
  verb: 'layer',
  aliases: ['diffused', 'irvin'],
  help: {
    summary: "Diffused layer (Irvin's method): sheet resistance and junction depth → surface concentration, or Cs → sheet resistance, average conductivity and resistivity.",
    usage: USAGE,
    examples: [
      'layer 45 ohm/sq xj 0.8um erfc on 1e15 p',
      'layer Cs 1e19 xj 0.8um gaussian on 1e15 p',
      'layer 120 ohm/sq xj 0.5um gaussian boron on 2e15 n',
      'layer 20 Ω/□ xj 1.2um erfc arsenic on 1e16 B model masetti',
    ],
    options: [
      'xj <depth>: metallurgical junction depth (µm, um, nm)',
      'erfc (constant-source diffusion, default) or gaussian (limited-source / drive-in)',
      'on <N_B> <p|n|dopant>: the background the layer is diffused into (opposite type)',
      'the layer dopant may be named (phosphorus, arsenic, boron…); by default the usual one of the opposite type',
      'model <id>: mobility — klaassen (default), arora, masetti, caughey-thomas; at <T> for another temperature (default 300 K)',
    ],
    seeAlso: ['sheet', 'rho', 'why'],
  },
  schema: LayerRequest,
  // The layer is of the type opposite to its background, so a lone "P" cannot be both: on a
  // p background it is phosphorus, on an n background it means a p-type layer.
  lonePRule(tokens) {
    const i = tokens.findIndex((t) => t.kind === 'word' && ['on', 'background', 'bg', 'substrate'].includes(t.text.toLowerCase()));
    const word = i >= 0 ? tokens[i + 2] : undefined;
    if (!word || word.kind !== 'word' || word.text === 'P') return undefined;
    const background = lookup(DOPANT_WORDS, word.text);
    if (!background) return undefined;
    return DOPANT_TYPE[background] === 'p' ? 'phosphorus' : 'p-type';
  },
  parse(args) {
    const asTyped: Record<string, string> = {};
    const xj = args.keyed(['xj', 'junction', 'depth'], 'length');
    const cs = args.keyed(['cs', 'surface', 'c_s'], 'density');
    const bg = args.keyedWithWord(['on', 'background', 'bg', 'substrate'], 'density', DOPANT_WORDS);
    const at = args.keyed(['at'], 'temperature');
    const modelId = readModelId(args);
    const profile = args.word(PROFILE_WORDS);
    const rs = cs ? undefined : args.quantity(['sheetResistance']);
    const named = args.word(DOPANT_WORDS);
    if (!xj) throw new ArgError('missing_value', `Give the junction depth, e.g. ${EXAMPLE}`);
    if (!bg) throw new ArgError('missing_value', `Give the background the layer is diffused into, e.g. "on 1e15 p": ${EXAMPLE}`);
    if (!bg.word) throw new ArgError('missing_dopant', `Say the background's type right after its density, e.g. "on 1e15 p" or "on 2e15 n"`);
    if (!cs && !rs) {
      const other = args.anyNumber();
      throw new ArgError(
        other ? 'wrong_dimension' : 'missing_value',
        other ? `"${other.raw}" is not a sheet resistance; give it in ohm/sq, or give Cs <N>: ${EXAMPLE}` : `Give the sheet resistance (e.g. 45 ohm/sq) or the surface concentration (Cs 1e19): ${EXAMPLE}`,
      );
    }
    for (const [k, q] of Object.entries({ xj, cs, rs, at })) if (q) asTyped[k] = q.raw;
    asTyped['background'] = bg.quantity.raw;
    asTyped['backgroundDopant'] = bg.word.raw;
    if (named) asTyped['dopant'] = named.raw;
    const background = bg.word.value;
    const dopant = named?.value ?? OPPOSITE_DEFAULT[DOPANT_TYPE[background]];
    return {
      ...(rs ? { sheetResistanceOhmPerSq: rs.value } : {}),
      ...(cs ? { surfaceConcentrationPerCm3: cs.value } : {}),
      junctionDepthCm: xj.value,
      profile: profile?.value ?? 'erfc',
      profileDefaulted: !profile,
      dopant,
      dopantDefaulted: !named,
      backgroundDopant: background,
      backgroundDensityPerCm3: bg.quantity.value,
      ...(at ? { temperatureK: at.value } : {}),
      ...(modelId ? { modelId } : {}),
      asTyped,
    };
  },
  run(req, ctx) {
    const geometry = {
      profile: req.profile,
      dopant: req.dopant,
      backgroundDopant: req.backgroundDopant,
      backgroundDensityPerCm3: req.backgroundDensityPerCm3,
      junctionDepthCm: req.junctionDepthCm,
      ...(req.temperatureK !== undefined ? { temperatureK: req.temperatureK } : {}),
      ...(req.modelId ? { mobilityModelId: resolveMobilityModelId(req.modelId) } : {}),
    };
    const inverse = req.sheetResistanceOhmPerSq !== undefined;
    const outcome = inverse
      ? layerSurfaceConcentration({ ...geometry, sheetResistanceOhmPerSq: req.sheetResistanceOhmPerSq! })
      : layerSheetResistance({ ...geometry, surfaceConcentrationPerCm3: req.surfaceConcentrationPerCm3! });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    const t = req.asTyped;
    const values: ReplyValue[] = [
      { key: 'surfaceConcentrationPerCm3', value: r.surfaceConcentrationPerCm3, unit: 'cm⁻³', label: `Surface concentration Cs (${r.dopant})`, headline: inverse },
      { key: 'sheetResistanceOhmPerSq', value: r.sheetResistanceOhmPerSq, unit: 'Ω/□', label: 'Sheet resistance', headline: !inverse },
      { key: 'averageConductivitySPerCm', value: r.averageConductivitySPerCm, unit: 'S/cm', label: 'Average conductivity σ̄ = 1/(Rs·xj)' },
      { key: 'averageResistivityOhmCm', value: r.averageResistivityOhmCm, unit: 'Ω·cm', label: 'Average resistivity ρ̄ = Rs·xj' },
      { key: 'carrierType', value: r.layerType, unit: '', label: 'Layer type' },
      { key: 'surfaceMobilityCm2PerVs', value: r.surfaceMobilityCm2PerVs, unit: 'cm²/V·s', label: 'Majority-carrier mobility at the surface' },
    ];
    const inputs: Record<string, ReplyInput> = {
      ...(inverse ? { sheetResistance: { value: r.sheetResistanceOhmPerSq, unit: 'Ω/□', label: 'Sheet resistance', asTyped: t['rs'] ?? '' } } : { surfaceConcentration: { value: r.surfaceConcentrationPerCm3, unit: 'cm⁻³', label: 'Surface concentration', asTyped: t['cs'] ?? '' } }),
      junctionDepth: { value: r.junctionDepthCm * 1e4, unit: 'µm', label: 'Junction depth', asTyped: t['xj'] ?? '' },
      profile: { value: r.profile.shape, label: 'Profile' },
      dopant: { value: r.dopant, label: 'Layer dopant', ...(t['dopant'] ? { asTyped: t['dopant'] } : {}) },
      background: { value: r.backgroundDensityPerCm3, unit: 'cm⁻³', label: `Background (${r.backgroundDopant})`, asTyped: `${t['background'] ?? ''} ${t['backgroundDopant'] ?? ''}`.trim() },
      ...(t['at'] ? { temperature: { value: r.temperatureK, unit: 'K', label: 'Temperature', asTyped: t['at'] } } : {}),
    };
    const assumptions = [
      ...(req.profileDefaulted ? ['No profile named: erfc (constant-source diffusion).'] : []),
      ...(req.dopantDefaulted ? [`No layer dopant named: ${r.dopant}, the usual ${r.layerType}-type dopant.`] : []),
      ...(req.temperatureK === undefined ? ['At 300 K, the temperature of the mobility fits (Irvin’s curves are room-temperature curves).'] : []),
      `${r.profile.name}: ${r.profile.equation}.`,
      ...r.assumptionCodes.map(assumptionText),
      `Mobility from ${r.mobilityModel.name}.`,
    ];
    return okReply(identity(ctx), {
      command: 'layer',
      title: inverse
        ? `Diffused layer: ${formatNumber(r.sheetResistanceOhmPerSq)} Ω/□ at xj ${formatNumber(r.junctionDepthCm * 1e4)} µm → Cs ${formatNumber(r.surfaceConcentrationPerCm3)} cm⁻³ ${r.dopant}`
        : `Diffused layer: Cs ${formatNumber(r.surfaceConcentrationPerCm3)} cm⁻³ ${r.dopant}, xj ${formatNumber(r.junctionDepthCm * 1e4)} µm → ${formatNumber(r.sheetResistanceOhmPerSq)} Ω/□`,
      values,
      inputs,
      assumptions,
      model: {
        id: 'irvin-1962',
        name: `Irvin's method (integrated conductivity), ${r.profile.shape} profile, mobility ${r.mobilityModel.name}`,
        citation: `J. C. Irvin, Bell Syst. Tech. J. 41, 387 (1962); mobility: ${r.mobilityModel.citation}`,
        validity: `${r.mobilityModel.validityTemperatureK.min === r.mobilityModel.validityTemperatureK.max ? `mobility fit at ${formatNumber(r.mobilityModel.validityTemperatureK.min)} K` : `mobility fit ${formatNumber(r.mobilityModel.validityTemperatureK.min)}–${formatNumber(r.mobilityModel.validityTemperatureK.max)} K`}; integration to 1e-7 relative`,
      },
      problems: r.problems,
      cautions: [MODEL_ESTIMATE],
      derivation: {
        equations: [
          r.profile.equation,
          'N_net(x) = N(x) − N_B, 0 ≤ x ≤ xj',
          '1/Rs = ∫₀^xj q·μ(N(x), N_B)·N_net(x) dx (adaptive Gauss–Kronrod G7–K15)',
          ...(inverse ? ['Cs: Brent’s method on ln Rs(Cs) in log10 Cs'] : []),
          'σ̄ = 1/(Rs·xj), ρ̄ = Rs·xj',
        ],
        parameters: parameterRows(r.mobilityModel.parameters(r.dopant)),
        steps: [
          `L = ${formatNumber(r.characteristicLengthCm * 1e4, { sigFigs: 5 })} µm`,
          `1/Rs = ${formatNumber(r.sheetConductanceS, { sigFigs: 6 })} S (estimated integration error ${formatNumber(r.integration.relativeErrorEstimate, { sigFigs: 2 })} relative, ${r.integration.evaluations} evaluations)`,
          `Rs = ${formatNumber(r.sheetResistanceOhmPerSq, { sigFigs: 6 })} Ω/□, Cs = ${formatNumber(r.surfaceConcentrationPerCm3, { sigFigs: 6 })} cm⁻³`,
        ],
        sources: ['J. C. Irvin, Bell Syst. Tech. J. 41, 387 (1962)', r.mobilityModel.citation],
      },
    });
  },
});
