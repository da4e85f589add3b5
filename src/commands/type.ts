/** `type`: conductivity type from a probe reading (hot/cold probe, Hall, point contact, SPV). */
import { z } from 'zod';
import { carrierTypeFromReading } from '../physics/type/index.js';
import { errorReply, okReply } from '../reply/build.js';
import { ELECTRICAL_HAZARD, HALL_HAZARD, HOT_PROBE_HAZARD } from '../reply/cautions.js';
import { formatNumber } from '../reply/format.js';
import type { ReplyInput } from '../reply/reply.js';
import { ArgError, type Args } from './args.js';
import { identity } from './common.js';
import { refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';
import { CARRIER_TYPE_WORDS, MATERIAL_LABEL, MATERIAL_WORDS, POLARITY_WORDS, PROBE_METHOD_WORDS } from './words.js';
import type { Dimension } from './units.js';

const METHODS = PROBE_METHOD_WORDS;
type Method = (typeof METHODS)[keyof typeof METHODS];

const METHOD_NAMES: Record<Method, string> = {
  hot: 'hot probe (thermal EMF)',
  cold: 'cold probe (thermal EMF)',
  hall: 'Hall coefficient',
  point: 'point-contact rectification',
  spv: 'surface photovoltage',
};


export const TypeRequest = z.object({
  method: z.enum(['hot', 'cold', 'hall', 'point', 'spv']),
  reading: z.number().finite(),
  readingAsTyped: z.string(),
  noiseBand: z.number().finite().positive().optional(),
  resistivityOhmCm: z.number().finite().positive().optional(),
  material: z.enum(['Si', 'Ge', 'GaAs']).optional(),
  epitaxial: z.boolean(),
  expect: z.enum(['n', 'p']).optional(),
});
export type TypeRequest = z.infer<typeof TypeRequest>;

const USAGE = 'type <hot|cold|hall|point|spv> <reading> [noise <band>] [rho <ρ>] [epi] [expect n|p] [Si|Ge|GaAs]';
const EXAMPLE = 'type hot +2.1mV';

const READING_DIMENSION: Record<Method, Dimension | undefined> = {
  hot: 'voltage',
  cold: 'voltage',
  spv: 'voltage',
  hall: 'hallCoefficient',
  point: undefined,
};

function readReading(method: Method, args: Args): { value: number; raw: string } {
  if (method === 'point') {
    args.flag(['forward', 'easy', 'fwd']);
    const pol = args.word(POLARITY_WORDS);
    if (!pol) throw new ArgError('missing_value', 'Give the polarity of the point at easy (forward) conduction: + or −, e.g. type point forward +');
    return { value: pol.value, raw: pol.raw };
  }
  const dim = READING_DIMENSION[method]!;
  const q = args.quantity([dim]);
  if (!q) {
    const example = method === 'hall' ? 'type hall -1.3e3 cm3/C' : `type ${method} ${method === 'spv' ? '-15mV' : '+2.1mV'}`;
    const other = args.anyNumber();
    throw new ArgError(
      other ? 'wrong_dimension' : 'missing_value',
      other ? `"${other.raw}" is not ${dim === 'voltage' ? 'a voltage' : 'a Hall coefficient'}; e.g. ${example}` : `Give the signed reading, e.g. ${example}`,
    );
  }
  if (q.bareNumber && dim === 'voltage') throw new ArgError('bad_unit', `Give the reading with its unit (mV or V), e.g. type ${method} ${q.raw}mV`);
  return { value: q.value, raw: q.raw };
}

export const typeCommand = defineCommand<TypeRequest>({
  verb: 'type',
  aliases: ['probe', 'carrier-type'],
  help: {
    summary: 'Conductivity type (n or p) from a hot/cold-probe, Hall, point-contact or surface-photovoltage reading.',
    usage: USAGE,
    examples: [
      'type hot +2.1mV',
      'type cold -0.8mV rho 12 ohm-cm',
      'type hall -1.3e3 cm3/C',
      'type point forward +',
      'type spv -15mV',
      'type hot 0.04mV noise 0.1mV',
      'type hot -1.2mV expect n',
      'type hot +0.9mV rho 2500 ohm-cm',
      'type point + epi',
    ],
    options: [
      'hot / cold: signed thermal EMF with the meter + lead on the hot (or cold) probe',
      'hall: signed Hall coefficient, any volume per charge (cm3/C, m3/C)',
      'point: polarity of the point contact when it conducts easily (+ or −)',
      'spv: signed surface photovoltage (surface relative to bulk, under light)',
      'noise <band>: readings inside ±band are called indeterminate',
      'rho <ρ>: resistivity, for the ASTM F42 range checks; epi: the wafer has an epitaxial layer',
      'expect n|p: flag a mismatch with the expected type',
    ],
    seeAlso: ['rho', 'why'],
  },
  schema: TypeRequest,
  parse(args) {
    const m = args.word(METHODS);
    if (!m) throw new ArgError('missing_method', `Say which reading: hot, cold, hall, point or spv, e.g. ${EXAMPLE}`);
    const method = m.value;
    // Words people add that say nothing more: "hot probe", "hall coefficient", "point contact".
    args.flag(['probe']);
    args.flag(['coefficient', 'coeff']);
    args.flag(['contact']);
    args.flag(['reading', 'reads', 'read']);
    const resistivity = args.keyed(['rho', 'resistivity'], 'resistivity');
    const dim = READING_DIMENSION[method];
    const noise = dim ? args.keyed(['noise', 'band'], dim) : undefined;
    const expectWord = args.keyedWord(['expect', 'expected', 'spec']);
    let expect: 'n' | 'p' | undefined;
    if (expectWord !== undefined) {
      expect = CARRIER_TYPE_WORDS[expectWord.toLowerCase()];
      if (!expect) throw new ArgError('bad_value', `"expect" takes n or p, e.g. type hot -1.2mV expect n`);
    }
    const reading = readReading(method, args);
    const material = args.word(MATERIAL_WORDS)?.value;
    const epitaxial = args.flag(['epi', 'epitaxial']);
    return {
      method,
      reading: reading.value,
      readingAsTyped: reading.raw,
      noiseBand: noise?.value,
      resistivityOhmCm: resistivity?.value,
      material,
      epitaxial,
      expect,
    };
  },
  run(req, ctx) {
    const outcome = carrierTypeFromReading({
      method: req.method,
      reading: req.reading,
      epitaxial: req.epitaxial,
      ...(req.noiseBand !== undefined ? { noiseBandV: req.noiseBand, noiseBand: req.noiseBand } : {}),
      ...(req.resistivityOhmCm !== undefined ? { resistivityOhmCm: req.resistivityOhmCm } : {}),
      ...(req.material ? { material: req.material } : {}),
      ...(req.expect ? { expect: req.expect } : {}),
    });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    const material = req.material ?? 'Si';
    const inputs: Record<string, ReplyInput> = {
      method: { value: METHOD_NAMES[req.method], label: 'Method' },
      reading: {
        value: req.method === 'point' ? (req.reading > 0 ? '+' : '−') : req.method === 'hall' ? req.reading : req.reading * 1e3,
        unit: req.method === 'hall' ? 'cm³/C' : req.method === 'point' ? '' : 'mV',
        label: req.method === 'point' ? 'Point polarity at easy conduction' : 'Reading',
        asTyped: req.readingAsTyped,
      },
      material: { value: MATERIAL_LABEL[material], label: 'Material' },
    };
    if (req.resistivityOhmCm !== undefined) inputs['resistivity'] = { value: req.resistivityOhmCm, unit: 'Ω·cm', label: 'Resistivity' };
    if (req.expect) inputs['expect'] = { value: req.expect, label: 'Expected type' };
    if (req.epitaxial) inputs['epitaxial'] = { value: 'yes', label: 'Epitaxial layer' };
    const cautions =
      req.method === 'hot' ? [HOT_PROBE_HAZARD] : req.method === 'hall' ? [HALL_HAZARD] : req.method === 'point' ? [ELECTRICAL_HAZARD] : [];
    const verdict = r.carrierType === 'indeterminate' ? 'indeterminate' : `${r.carrierType}-type`;
    // Voltages read in mV on the bench: show them so.
    const band = r.noiseBandUnit === 'V' ? { value: r.noiseBand * 1e3, unit: 'mV' } : { value: r.noiseBand, unit: r.noiseBandUnit };
    const banded = req.method !== 'point';
    return okReply(identity(ctx), {
      command: 'type',
      title: `${METHOD_NAMES[req.method]}: ${verdict}`,
      values: [
        { key: 'carrierType', value: r.carrierType, unit: '', label: 'Conductivity type', headline: true },
        ...(banded ? [{ key: 'noiseBand', value: band.value, unit: band.unit, label: 'Noise band (±)' }] : []),
      ],
      inputs,
      assumptions: [r.conventionText, ...(banded ? [`Readings within ±${formatNumber(band.value)} ${band.unit} are called indeterminate.`] : [])],
      model: { id: `type-${req.method}`, name: METHOD_NAMES[req.method], citation: r.source },
      problems: r.problems,
      cautions,
      derivation: {
        equations: [r.conventionText],
        parameters: banded ? [{ name: 'noise band', value: band.value, unit: band.unit }] : [],
        steps: [
          `reading ${req.readingAsTyped} → ${verdict}`,
        ],
        sources: [r.source],
      },
    });
  },
});
