/**
 * Wording for lot records: flags, checks, notes, errors and the lot cautions. The lot domain
 * (src/lots) returns data; this is the one place it becomes sentences, for every surface.
 */
import type { LotError } from '../../lots/errors.js';
import type { Check, LotNote } from '../../lots/evaluation-types.js';
import { FLAG_WORDS, flagHandle, type FlagDetail, type StoredFlag } from '../../lots/flags.js';
import { placeLabel } from '../../lots/ids.js';
import type { StoredReading } from '../../lots/readings.js';
import { errorReply } from '../../reply/build.js';
import { formatNumber } from '../../reply/format.js';
import { assumptionText, problemMessage } from '../../reply/messages.js';
import type { ReplyError, ReplyValue } from '../../reply/reply.js';
import { formatAge } from '../../lots/time.js';
import { refusalMessage } from '../describe.js';

export const LOT_FLAG_CAUTION =
  'A flag is a prompt to check, not a disposition: hold, re-measure or release the lot as your hold/release procedure says.';

export const DEMO_SPECS_NOTE =
  'These are the invented demo specs of "Harrowgate Fab 3" (fixtures/lots/). Set SPEC_FILE to your fab’s controlled spec file before recording real lots.';

const pct = (v: number): string => `${formatNumber(v, { sigFigs: 2 })} %`;
const ohmCm = (v: number): string => `${formatNumber(v)} Ω·cm`;
const perCm3 = (v: number): string => `${formatNumber(v)} cm⁻³`;

export function quantityValue(quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3', v: number): string {
  return quantity === 'resistivityOhmCm' ? ohmCm(v) : perCm3(v);
}

/** '8.00 – 12.0 Ω·cm' */
export function windowText(quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3', min: number, max: number): string {
  return `${formatNumber(min)} – ${quantityValue(quantity, max)}`;
}

/** '5 h ago', 'just now' */
export function ago(iso: string, now: Date): string {
  const age = formatAge(iso, now);
  return age === 'just now' ? age : `${age} ago`;
}

/** A count as a reply value: a number, shown without decimals. */
export function countValue(key: string, n: number, label: string, headline = false): ReplyValue {
  return { key, value: n, unit: '', label, sigFigs: Math.max(1, String(Math.trunc(Math.abs(n))).length), ...(headline ? { headline } : {}) };
}

const SPREAD_DEFINITION: Record<string, string> = {
  'range-over-mean': 'range over mean',
  'range-over-min': 'range over minimum',
};

/** One line describing what a flag found, e.g. "12.9 Ω·cm is 7.5 % above the 12.0 Ω·cm maximum". */
export function flagDetailText(d: FlagDetail): string {
  switch (d.code) {
    case 'out_of_window': {
      const limit = d.side === 'above' ? d.max : d.min;
      const what = d.basis === 'map_mean' ? 'map mean resistivity' : d.quantity === 'resistivityOhmCm' ? 'resistivity' : 'dopant density';
      return `${what} ${quantityValue(d.quantity, d.value)} is ${pct(d.marginPercent)} ${d.side} the ${quantityValue(d.quantity, limit)} ${d.side === 'above' ? 'maximum' : 'minimum'} (window ${windowText(d.quantity, d.min, d.max)})`;
    }
    case 'type_mismatch':
      return `reads ${d.found}-type (${d.method === 'stated' ? 'as stated' : `${d.method} probe`}); the product is ${d.expected}-type`;
    case 'spread_over_limit':
      return d.across === 'sites'
        ? `site-to-site spread ${pct(d.spreadPercent)} on w${d.wafer ?? '?'} over the ${pct(d.limitPercent)} limit (${d.count} sites, ${ohmCm(d.minOhmCm)} – ${ohmCm(d.maxOhmCm)}, ${SPREAD_DEFINITION[d.definition] ?? d.definition})`
        : `wafer-to-wafer spread ${pct(d.spreadPercent)} over the ${pct(d.limitPercent)} limit (${d.count} wafers, means ${ohmCm(d.minOhmCm)} – ${ohmCm(d.maxOhmCm)}, ${SPREAD_DEFINITION[d.definition] ?? d.definition})`;
    case 'uniformity_over_limit':
      return `map non-uniformity ${pct(d.nonUniformityPercent)} (1σ/mean) on w${d.wafer} over the ${pct(d.limitPercent)} limit (${d.count} sites)`;
    case 'outside_model_validity':
      if (d.refusal) return `the ρ → N conversion could not be made: ${refusalMessage(d.refusal)}`;
      return `the ρ → N conversion is outside the ${d.model} model's range: ${d.quantity === 'resistivityOhmCm' ? ohmCm(d.input) : formatNumber(d.input)} against ${d.min !== undefined && d.max !== undefined ? `${formatNumber(d.min)} – ${formatNumber(d.max)}${d.quantity === 'resistivityOhmCm' ? ' Ω·cm' : ''}` : 'its stated range'}; the density is an extrapolation`;
    case 'no_spec':
      return `product ${d.productId} has no spec in the spec file${d.suggestion ? ` (did you mean ${d.suggestion}?)` : ''}; nothing could be checked`;
    default:
      return JSON.stringify(d);
  }
}

export const FLAG_TITLES: Record<string, string> = {
  out_of_window: 'outside window',
  type_mismatch: 'type mismatch',
  spread_over_limit: 'spread over limit',
  uniformity_over_limit: 'non-uniform map',
  outside_model_validity: 'outside model validity',
  no_spec: 'no product spec',
};

/** "F12 outside window (w3): 12.9 Ω·cm is 7.5 % above …" */
export function flagLine(f: StoredFlag): string {
  const where = f.wafer !== undefined ? ` (${placeLabel(f.wafer, f.site)})` : '';
  return `${flagHandle(f.id)} ${FLAG_TITLES[f.code] ?? f.code}${where}: ${flagDetailText(f.detail)}`;
}

export function flagWord(f: StoredFlag): string {
  return FLAG_WORDS[f.code];
}

export function clearanceText(f: StoredFlag): string {
  const c = f.clearance;
  if (!c) return 'open';
  return c.kind === 'correction'
    ? `closed automatically: ${c.reason}`
    : `cleared by ${c.byUserName ?? c.byUserId}: “${c.reason}”`;
}

export function checkText(c: Check, modelName?: string): { name: string; result: string; detail: string } {
  switch (c.check) {
    case 'window': {
      const inside = c.status === 'pass';
      const limitWord = c.limit === 'max' ? 'maximum' : 'minimum';
      return {
        name: c.basis === 'map_mean' ? 'Map mean window' : c.quantity === 'resistivityOhmCm' ? 'Resistivity window' : 'Density window',
        result: inside ? 'pass' : 'FLAG',
        detail: inside
          ? `${quantityValue(c.quantity, c.value)} in ${windowText(c.quantity, c.min, c.max)}; ${pct(c.marginPercent)} inside the ${limitWord}`
          : `${quantityValue(c.quantity, c.value)} is ${pct(c.marginPercent)} ${c.limit === 'max' ? 'above the maximum' : 'below the minimum'} (${quantityValue(c.quantity, c.limit === 'max' ? c.max : c.min)})`,
      };
    }
    case 'validity':
      return {
        name: 'Conversion validity',
        result: c.status === 'pass' ? 'pass' : 'FLAG',
        detail: `${c.status === 'pass' ? 'inside' : 'outside'} the range of ${modelName ?? c.model}`,
      };
    case 'type':
      return {
        name: 'Conductivity type',
        result: c.status === 'pass' ? 'pass' : c.status === 'fail' ? 'FLAG' : 'no call',
        detail:
          c.status === 'indeterminate'
            ? `reading inside the noise band; product is ${c.expected}-type`
            : `${c.found}-type (${c.method === 'stated' ? 'stated' : c.method}); product is ${c.expected}-type`,
      };
    case 'site_spread':
      return { name: `Site spread w${c.wafer}`, result: c.status === 'pass' ? 'pass' : 'FLAG', detail: `${pct(c.spreadPercent)} over ${c.count} sites (limit ${pct(c.limitPercent)})` };
    case 'uniformity':
      return { name: `Non-uniformity w${c.wafer}`, result: c.status === 'pass' ? 'pass' : 'FLAG', detail: `${pct(c.nonUniformityPercent)} (1σ/mean) over ${c.count} sites (limit ${pct(c.limitPercent)})` };
    case 'wafer_spread':
      return { name: 'Wafer-to-wafer spread', result: c.status === 'pass' ? 'pass' : 'FLAG', detail: `${pct(c.spreadPercent)} over ${c.count} wafers (limit ${pct(c.limitPercent)})` };
    case 'spec':
      return { name: 'Product spec', result: 'FLAG', detail: `no spec for ${c.productId}` };
    default:
      return { name: 'check', result: '', detail: JSON.stringify(c) };
  }
}

/** Notes that are warnings (shown under "Check") vs assumptions. */
export function noteText(n: LotNote): { kind: 'warning' | 'assumption'; code: string; message: string } {
  switch (n.code) {
    case 'temperature_corrected':
      return {
        kind: 'assumption',
        code: n.code,
        message: `Read at ${formatNumber(n.temperatureK - 273.15, { sigFigs: 3 })} °C: ${ohmCm(n.measuredOhmCm)} corrected to ${ohmCm(n.correctedOhmCm)} at 23 °C (${formatNumber(n.coefficientPerK * 100, { sigFigs: 2 })} %/K, ${n.model.name}) before the checks.`,
      };
    case 'temperature_uncorrected':
      return {
        kind: 'warning',
        code: n.code,
        message: `Read at ${formatNumber(n.temperatureK - 273.15, { sigFigs: 3 })} °C and used as read: no correction to 23 °C could be made (lightly doped silicon changes about 0.7–0.8 % per K).`,
      };
    case 'near_limit':
      return {
        kind: 'warning',
        code: n.code,
        message: `Within ${pct(n.marginPercent)} of the ${n.limit === 'max' ? 'maximum' : 'minimum'} (the spec warns inside ${pct(n.thresholdPercent)}).`,
      };
    case 'problem':
      return { kind: 'warning', code: n.problem.code, message: problemMessage(n.problem) };
    case 'assumption':
      return { kind: 'assumption', code: n.assumption, message: assumptionText(n.assumption) };
    case 'type_not_checked':
      return { kind: 'warning', code: n.code, message: 'The type reading is inside the noise band: no type call, so no type check. Re-seat the probes and repeat.' };
    case 'window_not_checked':
      return { kind: 'warning', code: n.code, message: 'The window could not be checked because the conversion to dopant density could not be made.' };
    default:
      return { kind: 'warning', code: 'note', message: JSON.stringify(n) };
  }
}

/** '8.4 ohm-cm', 'hot -1.2mV' — a reading as entered, with its place. */
export function readingLabel(r: StoredReading): string {
  return r.quantity === 'type' ? `type ${r.asEntered}` : r.quantity === 'sheet' ? `sheet ${r.asEntered}` : `rho ${r.asEntered}`;
}

export function readingResult(r: StoredReading): string {
  const parts: string[] = [];
  if (r.quantity === 'sheet' && r.resistivityOhmCm !== undefined) parts.push(`→ ${ohmCm(r.resistivityOhmCm)}`);
  if (r.quantity === 'type' && r.carrierType) parts.push(r.carrierType === 'indeterminate' ? 'no call' : `${r.carrierType}-type`);
  parts.push(r.verdict === 'pass' ? 'pass' : r.verdict === 'flagged' ? 'FLAG' : 'no verdict');
  if (r.supersededBy !== undefined) parts.push(`corrected by #${r.supersededBy}`);
  if (r.supersedes !== undefined) parts.push(`corrects #${r.supersedes}`);
  return parts.join(' ');
}

const WRITE_WHO: Record<'record' | 'clear', string> = { record: 'record readings', clear: 'clear flags' };

/** Every LotError as a friendly error reply with the right form. */
export function lotErrorReply(e: LotError, usage: { usage: string; example: string }): ReplyError {
  switch (e.code) {
    case 'invalid_request':
      return errorReply('bad_request', e.issues.map((i) => issueText(i.path, i.message)).join('; '), usage);
    case 'bad_lot_id':
      return errorReply(
        'bad_lot_id',
        `"${e.input}" is not a lot id here. Lot ids look like ${e.example || `the pattern ${e.pattern}`}${e.example ? ` (pattern ${e.pattern})` : ''}.`,
        usage,
      );
    case 'no_product':
      return errorReply(
        'no_product',
        `${e.lotId} has no product yet, so there is no spec to check against. Name it once with "product <id>"${e.products.length ? ` (known: ${e.products.slice(0, 8).join(', ')})` : ''}. Nothing was recorded.`,
        { usage: usage.usage, example: `record ${e.lotId} w1 rho 9.6 ohm-cm product ${e.products[0] ?? 'HX-200P'}` },
      );
    case 'unknown_reading':
      return errorReply('unknown_reading', `There is no reading #${e.readingId}. "lot <lot>" lists the readings with their numbers. Nothing was recorded.`, usage);
    case 'correction_other_lot':
      return errorReply('correction_other_lot', `Reading #${e.readingId} belongs to ${e.readingLot}, not ${e.lotId}. Nothing was recorded.`, usage);
    case 'already_corrected':
      return errorReply('already_corrected', `Reading #${e.readingId} was already corrected by #${e.by}; correct #${e.by} instead. Nothing was recorded.`, usage);
    case 'measurement_refused':
      return errorReply('measurement_refused', `That ${e.what} reading cannot be used: ${refusalMessage(e.refusal)} Nothing was recorded.`, usage);
    case 'not_permitted':
      return errorReply(
        'not_permitted',
        `Sorry — you are not on the list of people who may ${WRITE_WHO[e.action]} here, so nothing was written. A process engineer can add your Slack user id (or this channel) to ${e.action === 'record' ? 'RECORD_USERS / RECORD_CHANNELS' : 'CLEAR_USERS / CLEAR_CHANNELS'} in shiftprobe's settings. Looking up lots, flags and the summary works for everyone.`,
      );
    case 'unknown_lot':
      return errorReply('unknown_lot', `No readings have been recorded for ${e.lotId} yet.`, usage);
    case 'no_map':
      return errorReply(
        'no_map',
        `${e.lotId} w${e.wafer} has no recorded map${e.wafersWithMaps.length ? `; maps are recorded for ${e.wafersWithMaps.map((w) => `w${w}`).join(', ')}` : ''}. Record one with "record ${e.lotId} w${e.wafer} map thick <t>" and the measurement file, or attach a file to "map".`,
        usage,
      );
    case 'no_such_flag':
      return errorReply(
        'no_such_flag',
        e.open.length === 0
          ? `${e.lotId} has no open flags to clear.`
          : `${e.lotId} has no open ${e.what} flag. Open: ${e.open.map((f) => `F${f.id} ${f.code.replace(/_/g, ' ')} (${f.scope})`).join(', ')}.`,
        usage,
      );
    case 'ambiguous_flag':
      return errorReply(
        'ambiguous_flag',
        `${e.lotId} has ${e.candidates.length} open ${e.what} flags: ${e.candidates.map((f) => `F${f.id} (${f.scope})`).join(', ')}. Say which, by its F-number or its wafer. Nothing was cleared.`,
        { usage: usage.usage, example: `clear ${e.lotId} F${e.candidates[0]?.id ?? 1} because re-measured in spec` },
      );
    case 'flag_already_cleared':
      return errorReply('flag_already_cleared', `F${e.flagId} was already cleared (${e.at.slice(0, 16).replace('T', ' ')} UTC by ${e.by}).`, usage);
    case 'flag_other_lot':
      return errorReply('flag_other_lot', `F${e.flagId} belongs to ${e.flagLot}, not ${e.lotId}. Nothing was cleared.`, usage);
    default:
      return errorReply('lot_error', JSON.stringify(e), usage);
  }
}

const FIELD_WORDS: Record<string, string> = {
  'primary.resistivityOhmCm': 'the resistivity',
  'primary.sheetResistanceOhmPerSq': 'the sheet resistance',
  'primary.thicknessCm': 'the thickness',
  'primary.spacingCm': 'the probe spacing',
  temperatureK: 'the temperature',
  wafer: 'the wafer number',
  site: 'the site number',
  reason: 'the reason',
};

function issueText(path: string, message: string): string {
  const field = FIELD_WORDS[path];
  if (!field) return path ? `${path}: ${message}` : message;
  if (/must be positive/.test(message)) return `${field} must be a positive number`;
  if (/outside/.test(message)) return `${field} is outside the range a silicon reading can have (${message.replace(/^.*outside /, '')})`;
  return `${field}: ${message}`;
}
