/**
 * `map`: a site-by-site measurement file (attached to the message, or `--file` on the CLI) →
 * every site converted through the core, uniformity statistics over the sites inside the edge
 * exclusion, outlier sites, a radial profile, and a wafer-map picture.
 */
import { z } from 'zod';
import { errorReply, okReply } from '../reply/build.js';
import { formatNumber } from '../reply/format.js';
import type { ReplyInput } from '../reply/reply.js';
import { ArgError } from './args.js';
import { DopantSchema, identity, readDopant, readModelId } from './common.js';
import type { Args } from './args.js';
import type { HandleContext } from './context.js';
import { analyseMap, type MapAnalysis, type ShownQuantity } from './map-analysis.js';
import { MeasurementFileError, readMeasurementFile, type MeasurementFile } from './measurement-file.js';
import { defineCommand } from './spec.js';
import { lotsOf, NOT_SET_UP, takeLotId, takeWafer } from './lots/parse.js';
import { countValue, lotErrorReply } from './lots/wording.js';
import type { Reply } from '../reply/reply.js';

export const MapOptionsSchema = z.object({
  thicknessCm: z.number().finite().optional(),
  spacingCm: z.number().finite().optional(),
  diameterMm: z.number().finite().optional(),
  edgeExclusionMm: z.number().finite().optional(),
  dopant: DopantSchema.optional(),
  dopantAsTyped: z.string().optional(),
  modelId: z.string().optional(),
  show: z.enum(['rs', 'rho', 'density', 'thickness']).optional(),
  valueUnit: z.string().optional(),
  /** `map <lot> w<n>`: draw the wafer's recorded map (no file). */
  lotId: z.string().optional(),
  wafer: z.number().int().optional(),
  asTyped: z.record(z.string(), z.string()),
});
export type MapOptionsRequest = z.infer<typeof MapOptionsSchema>;

export const MAP_USAGE =
  'map [thick <t>] [p|n|dopant] [diam <d>] [edge <mm>] [spacing <s>] [show rs|rho|density] [unit <u>] — with the measurement file attached   ·   map <lot> w<n> [show rs|rho|density] — a recorded map';
export const MAP_EXAMPLE = 'map thick 525um p diam 200mm edge 5mm';
const NO_FILE =
  'A map needs its measurement file: attach the CSV to the message (Slack: to the message that mentions me, or in a DM), or on the command line give --file wafer.csv. The layout is in docs/measurement-files.md.';

const SHOW_WORDS: Readonly<Record<string, ShownQuantity>> = {
  rs: 'rs',
  sheet: 'rs',
  rho: 'rho',
  resistivity: 'rho',
  density: 'density',
  doping: 'density',
  thickness: 'thickness',
  thk: 'thickness',
};

/** The map options of `map …` and `record <lot> <wafer> map …` (the words after the verb). */
export function readMapOptions(args: Args): MapOptionsRequest {
  const asTyped: Record<string, string> = {};
  // "show thickness" first, so that its word is not read as the thickness key.
  const showWord = args.keyedWord(['show', 'colour', 'color']);
  const thickness = args.keyed(['thick', 'thickness', 't'], 'length');
  const spacing = args.keyed(['spacing', 'pitch', 's'], 'length');
  const diameter = args.keyed(['diam', 'diameter', 'd', 'wafer'], 'length');
  const edge = args.keyed(['edge', 'ee', 'exclusion'], 'length');
  const unitWord = args.keyedWord(['unit', 'units']);
  let show: ShownQuantity | undefined;
  if (showWord !== undefined) {
    show = Object.hasOwn(SHOW_WORDS, showWord.toLowerCase()) ? SHOW_WORDS[showWord.toLowerCase()] : undefined;
    if (!show) throw new ArgError('bad_show', `"show ${showWord}" is not one I draw: show rs, show rho or show density (or show thickness for a thickness map).`);
  }
  for (const [k, q] of Object.entries({ thickness, spacing, diameter, edge })) if (q) asTyped[k] = q.raw;
  const d = readDopant(args);
  const modelId = readModelId(args);
  return {
    ...(thickness ? { thicknessCm: thickness.value } : {}),
    ...(spacing ? { spacingCm: spacing.value } : {}),
    ...(diameter ? { diameterMm: diameter.value * 10 } : {}),
    ...(edge ? { edgeExclusionMm: edge.value * 10 } : {}),
    ...(d ? { dopant: d.dopant, dopantAsTyped: d.raw } : {}),
    ...(modelId ? { modelId } : {}),
    ...(show ? { show } : {}),
    ...(unitWord ? { valueUnit: unitWord } : {}),
    asTyped,
  };
}

/** The request's inputs as the reply shows them. */
export function mapInputs(req: MapOptionsRequest, fileName: string, sites: number, spacingCm: number | undefined): Record<string, ReplyInput> {
  const t = req.asTyped;
  const inputs: Record<string, ReplyInput> = { file: { value: fileName, label: 'Measurement file', asTyped: `${fileName} (${sites} site${sites === 1 ? '' : 's'})` } };
  if (req.thicknessCm !== undefined) inputs['thickness'] = { value: req.thicknessCm * 1e4, unit: 'µm', label: 'Thickness', asTyped: t['thickness'] ?? '' };
  if (spacingCm !== undefined) inputs['spacing'] = { value: spacingCm * 10, unit: 'mm', label: 'Probe spacing', asTyped: t['spacing'] ?? 'configured head' };
  if (req.diameterMm !== undefined) inputs['diameter'] = { value: req.diameterMm, unit: 'mm', label: 'Wafer diameter', asTyped: t['diameter'] ?? '' };
  if (req.edgeExclusionMm !== undefined) inputs['edge'] = { value: req.edgeExclusionMm, unit: 'mm', label: 'Edge exclusion', asTyped: t['edge'] ?? '' };
  if (req.dopant) inputs['dopant'] = { value: req.dopant, label: 'Dopant', asTyped: req.dopantAsTyped ?? req.dopant };
  return inputs;
}

/** Read the attached file for `map` (errors as ArgError so they reach the person with the form). */
export async function readAttachedFile(ctx: HandleContext, valueUnit: string | undefined): Promise<MeasurementFile> {
  if (!ctx.attachment) throw new ArgError('missing_file', NO_FILE);
  try {
    return await readMeasurementFile(ctx.attachment.name, ctx.attachment.text, valueUnit ? { valueUnit } : {});
  } catch (e) {
    if (e instanceof MeasurementFileError) throw new ArgError('bad_file', `${ctx.attachment.name}, ${e.message}. The layout is in docs/measurement-files.md.`);
    throw e;
  }
}

export const mapCommand = defineCommand<MapOptionsRequest>({
  verb: 'map',
  aliases: ['wafermap', 'wafer-map'],
  help: {
    summary: 'Wafer map from a measurement file: every site converted, uniformity (1σ/mean and range), outlier sites, radial profile, and the map as a picture.',
    usage: MAP_USAGE,
    examples: ['map', 'map thick 525um p', 'map thick 525um p show density diam 200mm edge 5mm', 'map show rs edge 6mm'],
    options: [
      'the file: a CSV with x, y (mm, wafer-centred, notch down) and the measured value (docs/measurement-files.md)',
      'thick <t>: wafer or layer thickness — sites converted to resistivity',
      'p | n | dopant: resistivity → dopant density at every site',
      'diam <d>: wafer diameter (default: the smallest standard size holding every site)',
      'edge <mm>: edge exclusion for the statistics (default 3 mm)',
      'spacing <s>: probe pin spacing for the thickness factor (default: the fab\'s configured head)',
      'show rs | rho | density: the quantity coloured and summarised (default: what was measured)',
      'unit <u>: the unit of a "value" column whose header has none (unit ohm/sq)',
      '<lot> w<n> (no file): the map recorded for that wafer with "record <lot> w<n> map", drawn again from its stored sites',
    ],
    seeAlso: ['record', 'trend', 'sheet'],
  },
  schema: MapOptionsSchema,
  parse(args) {
    // "map LOT-A17 w6": a recorded map, drawn again from its stored sites.
    const wafer = takeWafer(args);
    const lotId = wafer !== undefined ? takeLotId(args, 'map LOT-A17 w6') : undefined;
    const options = readMapOptions(args);
    return { ...options, ...(lotId !== undefined && wafer !== undefined ? { lotId, wafer } : {}) };
  },
  async run(req, ctx) {
    if (req.lotId !== undefined && req.wafer !== undefined && !ctx.attachment) return recordedMap(req, req.lotId, req.wafer, ctx);
    let file;
    let analysis;
    const spacingCm = req.spacingCm ?? ctx.probeSpacingCm;
    try {
      file = await readAttachedFile(ctx, req.valueUnit);
      analysis = analyseMap(file, {
        ...req,
        ...(spacingCm !== undefined ? { spacingCm, spacingFromHead: req.spacingCm === undefined } : {}),
      });
    } catch (e) {
      if (e instanceof ArgError) return errorReply(e.code, e.message, { usage: MAP_USAGE, example: MAP_EXAMPLE });
      throw e;
    }
    const s = analysis.statistics;
    return okReply(identity(ctx), {
      command: 'map',
      title: `Wafer map ${analysis.picture.title}: non-uniformity ${formatNumber(s.nonUniformityPercent, { sigFigs: 3 })} % (1σ), mean ${formatNumber(s.mean, { sigFigs: 4 })} ${analysis.unit}`,
      values: analysis.values,
      inputs: mapInputs(req, file.name, file.xMm.length, analysis.shown === 'thickness' ? undefined : spacingCm),
      assumptions: analysis.assumptions,
      ...analysisParts(analysis, `Read ${file.xMm.length} sites from ${file.name} (${file.delimiter === ';' ? 'semicolons, decimal commas' : 'commas'})`),
    });
  },
});

/** What a map reply carries from the analysis: warnings, sections, the picture and the derivation. */
function analysisParts(analysis: MapAnalysis, readStep: string) {
  return {
    warnings: analysis.warnings,
    sections: analysis.sections,
    picture: analysis.picture,
    derivation: {
      equations: analysis.equations,
      parameters: [
        { name: 'edge exclusion', value: analysis.edgeExclusionMm, unit: 'mm' },
        { name: 'wafer diameter', value: analysis.diameterMm, unit: 'mm' },
        { name: 'Tukey fence factor k', value: 1.5, source: 'Tukey 1977' },
      ],
      steps: [
        readStep,
        ...analysis.steps,
        `Statistics of ${analysis.quantityLabel.toLowerCase()} over ${analysis.statistics.count} sites inside ${analysis.edgeExclusionMm} mm of edge exclusion`,
      ],
      sources: analysis.sources,
    },
  };
}

/**
 * `map <lot> w<n>`: the wafer's latest recorded map, drawn again from the sites stored with it,
 * with the thickness, probe spacing, diameter and edge exclusion it was recorded with and the
 * lot's product for the dopant. The values are as measured (the record corrected only its mean
 * to 23 °C).
 */
async function recordedMap(req: MapOptionsRequest, lotIdText: string, wafer: number, ctx: HandleContext): Promise<Reply> {
  const lots = lotsOf(ctx);
  if (!lots) return errorReply('lots_unavailable', NOT_SET_UP);
  const found = await lots.storedMap(lotIdText, wafer);
  if (!found.ok) return lotErrorReply(found.error, { usage: MAP_USAGE, example: `map ${lotIdText} w${wafer}` });
  const { lotId, reading, sites, product } = found.value;
  const summary = reading.evaluation.map!;
  const n = sites.length;
  const file: MeasurementFile = {
    name: summary.fileName,
    delimiter: ',',
    decimalComma: false,
    quantity: summary.measured === 'sheet' ? 'sheetResistance' : 'resistivity',
    columnsAsWritten: [summary.measured === 'sheet' ? 'Rs (Ω/□)' : 'ρ (Ω·cm)'],
    xMm: Float64Array.from(sites, (s) => s.xMm),
    yMm: Float64Array.from(sites, (s) => s.yMm),
    values: Float64Array.from(sites, (s) => s.value ?? Number.NaN),
    lines: Uint32Array.from({ length: n }, (_, i) => i + 1),
    siteNames: sites.map((s, i) => s.label || String(i + 1)),
    emptyLines: sites.flatMap((s, i) => (s.value === null ? [i + 1] : [])),
  };
  let analysis;
  try {
    analysis = analyseMap(file, {
      ...(reading.thicknessCm !== undefined ? { thicknessCm: reading.thicknessCm } : {}),
      ...(reading.spacingCm !== undefined ? { spacingCm: reading.spacingCm } : {}),
      ...(product ? { dopant: product.dopant, ...(product.model ? { modelId: product.model } : {}) } : {}),
      diameterMm: summary.diameterMm,
      edgeExclusionMm: summary.edgeExclusionMm,
      show: req.show ?? 'rho',
      lotId,
      waferLabel: `W${String(wafer).padStart(2, '0')}`,
    });
  } catch (e) {
    if (e instanceof ArgError) return errorReply(e.code, e.message, { usage: MAP_USAGE, example: `map ${lotId} w${wafer}` });
    throw e;
  }
  const s = analysis.statistics;
  const who = reading.actor.userName ?? reading.actor.userId;
  return okReply(identity(ctx), {
    command: 'map',
    title: `Recorded map ${lotId} w${wafer} (#${reading.id}): non-uniformity ${formatNumber(s.nonUniformityPercent, { sigFigs: 3 })} % (1σ), mean ${formatNumber(s.mean, { sigFigs: 4 })} ${analysis.unit}`,
    values: [...analysis.values, countValue('readingId', reading.id, 'Reading number')],
    inputs: {
      lot: { value: lotId, label: 'Lot' },
      wafer: { value: `w${wafer}`, label: 'Wafer' },
      file: { value: summary.fileName, label: 'Recorded from', asTyped: `${summary.fileName} (${n} sites)` },
    },
    assumptions: [
      `The map recorded as reading #${reading.id} on ${reading.recordedAt.slice(0, 16).replace('T', ' ')} UTC by ${who}, drawn from its ${n} stored sites with the thickness, probe spacing, diameter and edge exclusion it was recorded with.`,
      ...(reading.temperatureK !== undefined ? [`Values as measured at ${formatNumber(reading.temperatureK - 273.15, { sigFigs: 3 })} °C; the record corrected only the mean to 23 °C (${formatNumber(reading.resistivityOhmCm!, { sigFigs: 4 })} Ω·cm).`] : []),
      ...analysis.assumptions,
    ],
    ...analysisParts(analysis, `Read ${n} stored sites of reading #${reading.id}`),
  });
}
