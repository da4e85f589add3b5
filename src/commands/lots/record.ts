/**
 * `record`: store a lot reading, check it against the product spec, say pass or which flag.
 *
 *   record <lot> [w<n>] [site <n>] rho <ρ> | sheet <Rs> thick <t> [spacing <s>] | type <method> <reading> | type n|p
 *          [at <temperature>] [product <id>] [corrects <reading number>]
 */
import { z } from 'zod';
import { LIMITS, RecordRequestFields, type MapSite, type PrimaryMeasurement, type RecordRequest, type TypeMeasurement } from '../../lots/readings.js';
import type { Product } from '../../lots/spec/schema.js';
import { analyseMap } from '../map-analysis.js';
import { readAttachedFile } from '../map.js';
import { errorReply } from '../../reply/build.js';
import type { ReplyOk } from '../../reply/reply.js';
import { formatNumber } from '../../reply/format.js';
import { ArgError, type Args } from '../args.js';
import { identity } from '../common.js';
import { defineCommand } from '../spec.js';
import { POLARITY_WORDS, PROBE_METHOD_WORDS, type ProbeMethodWord } from '../words.js';
import type { Dimension, Quantity } from '../units.js';
import { actorOf, lotsOf, NOT_SET_UP, takeLotId, takeSite, takeWafer } from './parse.js';
import { afterRecordNotes, implausibleQuestion, implausibleReading, productOfRecord } from './record-context.js';
import { recordReply } from './record-reply.js';
import { lotErrorReply } from './wording.js';

/** `record <lot> w<n> map …`: the file is read when the command runs (it is attached, not typed). */
export const PendingMap = z.object({
  thicknessCm: z.number().finite().optional(),
  spacingCm: z.number().finite().optional(),
  diameterMm: z.number().finite().optional(),
  edgeExclusionMm: z.number().finite().optional(),
  valueUnit: z.string().optional(),
  asTyped: z.record(z.string(), z.string()),
});
export type PendingMap = z.infer<typeof PendingMap>;

export const RecordCommandRequest = z.object({
  /** Checked in full by the lot service (RecordRequest); a map's sites are added when it runs. */
  record: RecordRequestFields,
  map: PendingMap.optional(),
  /** The person confirmed a reading far outside its window ("confirm"). */
  confirmed: z.boolean(),
  /** The command as typed, to offer it again with "confirm". */
  commandText: z.string(),
  bareNumber: z.boolean(),
  asTyped: z.record(z.string(), z.string()),
});
export type RecordCommandRequest = z.infer<typeof RecordCommandRequest>;

const USAGE =
  'record <lot> [w<n>] [site <n>] rho <ρ> | sheet <Rs> thick <t> | type <hot|cold|hall|point|spv> <reading> | type n|p  [at <T>] [product <id>] [corrects <#>]   ·   record <lot> w<n> map [thick <t>] [edge <mm>] [diam <d>] with the measurement file attached';
const MAP_EXAMPLE = 'record LOT-A17 w4 map thick 725um';
const NO_MAP_FILE =
  'A map reading needs its measurement file: attach the CSV to the message (Slack: to the message that mentions me, or in a DM), or on the command line give --file wafer.csv. The layout is in docs/measurement-files.md.';
const EXAMPLE = 'record LOT-A17 w3 rho 8.4 ohm-cm';

const TYPE_METHOD_WORDS: Readonly<Record<string, ProbeMethodWord>> = PROBE_METHOD_WORDS;
const MERGED_TYPE_WORDS: Readonly<Record<string, 'n' | 'p'>> = { 'n-type': 'n', 'p-type': 'p' };
const STATED_TYPE_WORDS: Readonly<Record<string, 'n' | 'p'>> = { n: 'n', p: 'p', 'n-type': 'n', 'p-type': 'p', ntype: 'n', ptype: 'p' };

function checkRange(what: string, q: Quantity, limits: { min: number; max: number }, unit: string, scale = 1): void {
  if (!(q.value > 0)) throw new ArgError('bad_value', `${what} must be a positive number; "${q.raw}" is not. ${EXAMPLE}`);
  if (q.value < limits.min || q.value > limits.max) {
    throw new ArgError(
      'bad_value',
      `${what} "${q.raw}" is outside what a silicon reading can be here (${formatNumber(limits.min * scale)} to ${formatNumber(limits.max * scale)} ${unit}); check the number and its unit.`,
    );
  }
}

function readTypeReading(args: Args, word: string): TypeMeasurement {
  const lower = word.toLowerCase();
  const stated = STATED_TYPE_WORDS[lower];
  if (stated) return { kind: 'stated-type', carrierType: stated, asEntered: word };
  const method = TYPE_METHOD_WORDS[lower];
  if (!method) {
    throw new ArgError('bad_value', `"type ${word}": give n or p, or a probe reading such as "type hot -1.2mV", "type hall -1.3e3 cm3/C", "type point +"`);
  }
  if (method === 'point') {
    args.flag(['forward', 'easy', 'fwd']);
    const pol = args.word(POLARITY_WORDS);
    if (!pol) throw new ArgError('missing_value', 'Give the polarity of the point at easy (forward) conduction: "type point +" or "type point -"');
    return { kind: 'type', method, reading: pol.value, asEntered: `point ${pol.raw}` };
  }
  const dim: Dimension = method === 'hall' ? 'hallCoefficient' : 'voltage';
  const q = args.quantity([dim]);
  if (!q) {
    const other = args.anyNumber();
    const ex = method === 'hall' ? 'type hall -1.3e3 cm3/C' : `type ${method} -1.2mV`;
    throw new ArgError(other ? 'wrong_dimension' : 'missing_value', other ? `"${other.raw}" is not ${dim === 'voltage' ? 'a voltage' : 'a Hall coefficient'}; e.g. ${ex}` : `Give the signed reading, e.g. ${ex}`);
  }
  if (q.bareNumber) throw new ArgError('bad_unit', `Give the ${method} reading with its unit, e.g. type ${method} ${q.raw}${dim === 'voltage' ? 'mV' : ' cm3/C'}`);
  return { kind: 'type', method, reading: q.value, asEntered: `${method} ${q.raw}` };
}

export const recordCommand = defineCommand<RecordCommandRequest>({
  verb: 'record',
  aliases: ['rec'],
  help: {
    summary: 'Record a lot reading; it is checked against the product spec and the reply says pass or which flag.',
    usage: USAGE,
    examples: [
      'record LOT-A17 w3 rho 8.4 ohm-cm',
      'record LOT-A17 w3 site 2 rho 9.6 ohm-cm product HX-200P',
      'record LOT-B204 w5 sheet 45 ohm/sq thick 525um',
      'record LOT-B204 w5 type hot -1.2mV',
      'record LOT-A17 w3 rho 8.4 ohm-cm type p at 24C',
      'record LOT-C31 product HX-50PP',
      'record LOT-A17 w4 map thick 725um',
    ],
    options: [
      'w<n> / site <n>: wafer (1–50) and site on the wafer map; leave out for a lot-level reading',
      'rho <ρ>: resistivity (Ω·cm, mΩ·cm, ohm-cm…); sheet <Rs> thick <t> [spacing <s>]: four-point probe reading',
      'type hot|cold|spv <mV>, type hall <cm3/C>, type point +|−: a probe reading; type n|p: a type found otherwise',
      'at <T>: reading temperature; off 23 °C the resistivity is corrected to 23 °C (model estimate) before the check',
      'product <id>: names the lot’s product (needed once per lot); corrects <#>: this replaces reading # (kept in history)',
      'map: a wafer map from the attached measurement file (docs/measurement-files.md): every site is stored, the map mean is the wafer’s reading, and the product’s uniformity limits are checked; thick <t> for a sheet-resistance map, edge <mm>, diam <d>, unit <u> as for `map`',
    ],
    seeAlso: ['lot', 'flags', 'clear', 'digest'],
  },
  schema: RecordCommandRequest,
  parse(args) {
    const asTyped: Record<string, string> = {};
    const commandText = ['record', ...args.tokens.map((t) => t.verbatim)].join(' ');
    const confirmed = args.flag(['confirm', 'confirmed', 'ok']);
    const lotId = takeLotId(args, EXAMPLE);
    const wafer = takeWafer(args);
    const site = takeSite(args);
    const product = args.keyedWord(['product', 'prod']);
    const correctsWord = args.keyedWord(['corrects', 'correcting', 'replaces', 'correction']);
    const isMap = args.flag(['map', 'wafermap', 'wafer-map']);
    const diameter = isMap ? args.keyed(['diam', 'diameter'], 'length') : undefined;
    const edge = isMap ? args.keyed(['edge', 'ee', 'exclusion'], 'length') : undefined;
    const unitWord = isMap ? args.keyedWord(['unit', 'units']) : undefined;
    const rho = args.keyed(['rho', 'resistivity', 'res'], 'resistivity');
    const sheet = args.keyed(['sheet', 'rs'], 'sheetResistance');
    const thick = args.keyed(['thick', 'thickness'], 'length');
    const spacing = args.keyed(['spacing', 'pitch'], 'length');
    const temperature = args.keyed(['at', 'temp', 'temperature'], 'temperature');
    // "type p", "P-type", "type=N" arrive as one word ("p-type", as typed in raw).
    const merged = args.word(MERGED_TYPE_WORDS);
    const typeWord = merged ? undefined : args.keyedWord(['type']);
    const typeReading = merged
      ? ({ kind: 'stated-type', carrierType: merged.value, asEntered: merged.raw } as const)
      : typeWord !== undefined
        ? readTypeReading(args, typeWord)
        : undefined;

    // A reading without its key: "record LOT-A17 w3 8.4 ohm-cm", "… 45 ohm/sq thick 525um".
    let bare = rho ?? sheet ? undefined : args.quantity(['resistivity', 'sheetResistance']);
    if (bare?.bareNumber) {
      throw new ArgError('bad_unit', `"${bare.raw}": say what it is, e.g. "rho ${bare.raw} ohm-cm" or "sheet ${bare.raw} ohm/sq thick 525um"`);
    }
    const rhoQ = rho ?? (bare?.dimension === 'resistivity' ? bare : undefined);
    const sheetQ = sheet ?? (bare?.dimension === 'sheetResistance' ? bare : undefined);
    bare = undefined;

    let primary: PrimaryMeasurement | undefined;
    let bareNumber = false;
    let map: PendingMap | undefined;
    if (rhoQ && sheetQ) throw new ArgError('bad_request', 'One resistivity reading per record: give rho or sheet, not both.');
    if (isMap) {
      if (rhoQ || sheetQ) throw new ArgError('bad_request', `A map is the wafer's reading: give the map or a single rho/sheet reading, not both. e.g. ${MAP_EXAMPLE}`);
      if (wafer === undefined) throw new ArgError('missing_wafer', `A map is of one wafer: say which, e.g. ${MAP_EXAMPLE}`);
      if (site !== undefined) throw new ArgError('bad_request', `A map covers the whole wafer: leave out the site, e.g. ${MAP_EXAMPLE}`);
      if (thick) checkRange('The thickness', thick, LIMITS.thicknessCm, 'µm', 1e4);
      if (spacing) checkRange('The probe spacing', spacing, LIMITS.spacingCm, 'mm', 10);
      const mapTyped: Record<string, string> = {};
      for (const [k, q] of Object.entries({ thickness: thick, spacing, diameter, edge })) if (q) mapTyped[k] = q.raw;
      map = {
        ...(diameter ? { diameterMm: diameter.value * 10 } : {}),
        ...(edge ? { edgeExclusionMm: edge.value * 10 } : {}),
        ...(unitWord ? { valueUnit: unitWord } : {}),
        asTyped: mapTyped,
      };
    } else if (rhoQ) {
      checkRange('A resistivity', rhoQ, LIMITS.resistivityOhmCm, 'Ω·cm');
      bareNumber = rhoQ.unitAsTyped === '';
      primary = { kind: 'resistivity', resistivityOhmCm: rhoQ.value, asEntered: rhoQ.raw };
    } else if (sheetQ) {
      checkRange('A sheet resistance', sheetQ, LIMITS.sheetResistanceOhmPerSq, 'Ω/□');
      if (!thick) throw new ArgError('missing_value', `A sheet reading needs the thickness, e.g. record ${lotId} w5 sheet ${sheetQ.raw} thick 525um`);
      checkRange('The thickness', thick, LIMITS.thicknessCm, 'µm', 1e4);
      if (spacing) checkRange('The probe spacing', spacing, LIMITS.spacingCm, 'mm', 10);
      primary = {
        kind: 'sheet',
        sheetResistanceOhmPerSq: sheetQ.value,
        thicknessCm: thick.value,
        ...(spacing ? { spacingCm: spacing.value } : {}),
        asEntered: [sheetQ.raw, `thick ${thick.raw}`, ...(spacing ? [`spacing ${spacing.raw}`] : [])].join(' '),
      };
    } else if (thick || spacing) {
      throw new ArgError('missing_value', `"thick" goes with a sheet reading, e.g. record ${lotId} w5 sheet 45 ohm/sq thick 525um`);
    }
    if (temperature) {
      asTyped['temperature'] = temperature.raw;
      if (temperature.value < LIMITS.temperatureK.min || temperature.value > LIMITS.temperatureK.max) {
        throw new ArgError('bad_value', `"at ${temperature.raw}": a probe reading is taken between −20 °C and 120 °C; check the number and unit (e.g. at 24C).`);
      }
    }
    let corrects: number | undefined;
    if (correctsWord !== undefined) {
      const m = /^#?(\d{1,12})$/.exec(correctsWord);
      if (!m) throw new ArgError('bad_value', `"corrects ${correctsWord}": give the reading number shown by "lot ${lotId}", e.g. corrects 12`);
      corrects = Number(m[1]);
    }
    if (!primary && !map && !typeReading && product === undefined) {
      throw new ArgError('missing_value', `Give a reading (rho, sheet or type) or a product, e.g. ${EXAMPLE}`);
    }
    return {
      record: {
        lotId,
        ...(wafer !== undefined ? { wafer } : {}),
        ...(site !== undefined ? { site } : {}),
        ...(primary ? { primary } : {}),
        ...(typeReading ? { typeReading } : {}),
        ...(temperature ? { temperatureK: temperature.value, temperatureAsEntered: temperature.raw } : {}),
        ...(product !== undefined ? { productId: product } : {}),
        ...(corrects !== undefined ? { corrects } : {}),
      },
      ...(map ? { map: { ...map, ...(thick ? { thicknessCm: thick.value } : {}), ...(spacing ? { spacingCm: spacing.value } : {}) } } : {}),
      bareNumber,
      asTyped,
      confirmed,
      commandText,
    };
  },
  async run(req, ctx) {
    const lots = lotsOf(ctx);
    if (!lots) return errorReply('lots_unavailable', NOT_SET_UP);
    let record = req.record as RecordRequest;
    let mapAnalysis: ReturnType<typeof analyseMap> | undefined;
    let known: { product: Product | undefined } | undefined;
    if (req.map) {
      try {
        known = { product: await productOfRecord(lots, record) };
        const built = await mapReading(req.map, record, ctx, known.product);
        record = built.record;
        mapAnalysis = built.analysis;
      } catch (e) {
        if (e instanceof ArgError) return errorReply(e.code, e.message, { usage: USAGE, example: MAP_EXAMPLE });
        throw e;
      }
    }
    if (!req.confirmed) {
      const far = await implausibleReading(lots, record, lots.confirmFactor, known);
      if (far) {
        // A map's file cannot ride on an answer button: the person sends file and command again.
        return {
          ok: false,
          error: mapAnalysis
            ? {
                code: 'confirm_reading',
                message: `The map's mean resistivity: ${implausibleQuestion(far).replace('answer `confirm`', `send the file again with "${req.commandText} confirm"`)} (Check the thickness first: a wrong thickness scales every site.)`,
              }
            : {
                code: 'confirm_reading',
                message: implausibleQuestion(far),
                choices: [{ label: 'Store it as typed', answer: 'confirm', command: `${req.commandText} confirm` }],
              },
        };
      }
    }
    const where = `${record.lotId}${record.wafer !== undefined ? ` w${record.wafer}` : ''}${record.site !== undefined ? ` site ${record.site}` : ''}`;
    ctx.effects?.willStore(`your ${mapAnalysis ? 'map' : 'reading'} for ${where}`, `"lot ${record.lotId}" shows what is stored.`);
    const r = await lots.record(record, { actor: actorOf(ctx), ...(ctx.eventId ? { eventId: ctx.eventId } : {}) });
    if (!r.ok) return lotErrorReply(r.error, { usage: USAGE, example: EXAMPLE });
    const numbers = r.value.outcome.readings.map((x) => `#${x.id}`);
    ctx.effects?.didStore(numbers.length > 0 ? `your reading ${numbers.join(', ')} for ${where}` : `the record for ${where}`);
    const reply = recordReply(identity(ctx), r.value, { bareNumber: req.bareNumber, asTyped: req.asTyped });
    const notes = r.value.duplicate ? [] : await afterRecordNotes(lots, r.value.outcome.readings, r.value.outcome.lotId, ctx.now());
    const confirmedNote = req.confirmed ? ['Stored as typed after confirmation, although far outside the product window.'] : [];
    const withMap = mapAnalysis ? withMapDetails(reply, mapAnalysis) : reply;
    return notes.length + confirmedNote.length === 0
      ? withMap
      : { ...withMap, warnings: [...withMap.warnings, ...notes.map((message) => ({ code: 'record_context', message }))], assumptions: [...withMap.assumptions, ...confirmedNote] };
  },
});

const MAP_LABEL_MAX = 40;

/**
 * Read the attached file and convert every site the way `map` does (same code), with the
 * product's dopant, model, probe head and edge exclusion where the command gives none. The
 * sites go into the record; the lot service computes the statistics it checks from them.
 */
async function mapReading(
  pending: PendingMap,
  base: RecordRequest,
  ctx: Parameters<typeof lotsOf>[0],
  product: Product | undefined,
): Promise<{ record: RecordRequest; analysis: ReturnType<typeof analyseMap> }> {
  if (!ctx.attachment) throw new ArgError('missing_file', NO_MAP_FILE);
  const file = await readAttachedFile(ctx, pending.valueUnit);
  if (file.quantity === 'thickness') {
    throw new ArgError('bad_file', `${file.name} is a thickness map; a map reading is resistivity (sheet resistance, V/I or resistivity columns). Show a thickness map with "map".`);
  }
  if (file.quantity !== 'resistivity' && pending.thicknessCm === undefined) {
    throw new ArgError('missing_thickness', `${file.name} gives sheet resistance: give the thickness so every site has a resistivity, e.g. record ${base.lotId} w${base.wafer ?? 1} map thick 725um`);
  }
  const productSpacingCm = product?.probeSpacingMm !== undefined ? product.probeSpacingMm / 10 : undefined;
  const spacingCm = pending.spacingCm ?? productSpacingCm ?? ctx.probeSpacingCm;
  const edgeExclusionMm = pending.edgeExclusionMm ?? product?.uniformity?.edgeExclusionMm;
  const analysis = analyseMap(file, {
    ...(pending.thicknessCm !== undefined ? { thicknessCm: pending.thicknessCm } : {}),
    ...(spacingCm !== undefined ? { spacingCm, spacingFromHead: pending.spacingCm === undefined && productSpacingCm === undefined } : {}),
    ...(product ? { dopant: product.dopant, ...(product.model ? { modelId: product.model } : {}) } : {}),
    ...(pending.diameterMm !== undefined ? { diameterMm: pending.diameterMm } : {}),
    ...(edgeExclusionMm !== undefined ? { edgeExclusionMm } : {}),
    show: 'rho',
    lotId: base.lotId,
    waferLabel: `W${String(base.wafer).padStart(2, '0')}`,
  });
  const ps = analysis.picture.sites;
  const measuredSheet = file.quantity !== 'resistivity';
  const sites: MapSite[] = ps.xMm.map((x, i) => {
    const rho = ps.resistivityOhmCm?.[i] ?? null;
    const measured = (measuredSheet ? ps.sheetResistanceOhmPerSq?.[i] : rho) ?? null;
    return { label: (ps.name[i] ?? '').slice(0, MAP_LABEL_MAX), xMm: x, yMm: ps.yMm[i]!, value: measured, resistivityOhmCm: rho, included: ps.included[i]! };
  });
  const name = file.name.length > 120 ? `…${file.name.slice(-119)}` : file.name;
  return {
    analysis,
    record: {
      ...base,
      primary: {
        kind: 'map',
        measured: measuredSheet ? 'sheet' : 'resistivity',
        fileName: name,
        ...(pending.thicknessCm !== undefined ? { thicknessCm: pending.thicknessCm } : {}),
        ...(spacingCm !== undefined ? { spacingCm } : {}),
        diameterMm: analysis.diameterMm,
        edgeExclusionMm: analysis.edgeExclusionMm,
        sites,
        asEntered: `map ${name} (${sites.length} site${sites.length === 1 ? '' : 's'})`,
      },
    },
  };
}

/** The record reply with what `map` would say about the same file: the picture, definitions, outliers, notes. */
function withMapDetails(reply: ReplyOk, analysis: ReturnType<typeof analyseMap>): ReplyOk {
  const seen = new Set(reply.assumptions);
  return {
    ...reply,
    picture: analysis.picture,
    assumptions: [...reply.assumptions, ...analysis.assumptions.filter((a) => !seen.has(a))],
    warnings: [...reply.warnings, ...analysis.warnings],
    sections: [...(reply.sections ?? []), ...analysis.sections.slice(0, 3)],
  };
}
