/**
 * What a shift lead wants around a `record`, beyond pass or flag:
 *  - before storing: a reading more than a factor away from the product's window (default ×3:
 *    98 for a 9.8 Ω·cm product) is most likely a typo or a wrong unit, so it is not stored until
 *    the person confirms (`confirm`, or the button in chat);
 *  - after storing: a repeat of the same value at the same place within a few minutes is said
 *    ("same as #41, 2 minutes ago; stored as a second reading"), and so are the wafer's other
 *    open flags and type readings that contradict each other or the product.
 */
import { mapSummary } from '../../lots/evaluation.js';
import type { LotService } from '../../lots/service.js';
import type { RecordRequest, StoredReading } from '../../lots/readings.js';
import type { Product } from '../../lots/spec/schema.js';
import { formatNumber } from '../../reply/format.js';
import { flagHandle } from '../../lots/flags.js';
import { FLAG_TITLES } from './wording.js';

/** Default factor beyond the spec window that asks for confirmation (RECORD_CONFIRM_FACTOR). */
export const DEFAULT_CONFIRM_FACTOR = 3;
/** A repeat: same place, same value, within this many minutes. */
export const REPEAT_WINDOW_MINUTES = 10;

export interface Implausible {
  readonly productId: string;
  readonly valueOhmCm: number;
  readonly min: number;
  readonly max: number;
  readonly factor: number;
}

/** The resistivity a request carries (sheet × thickness for a sheet reading), if any. */
function resistivityOf(request: RecordRequest): number | undefined {
  const p = request.primary;
  if (!p) return undefined;
  if (p.kind === 'resistivity') return p.resistivityOhmCm;
  if (p.kind === 'map') return mapSummary(p)?.meanOhmCm;
  return p.sheetResistanceOhmPerSq * p.thicknessCm;
}

/** The product a record will be checked against: the one it names, else the lot's (undefined if none has a spec). */
export async function productOfRecord(lots: LotService, request: Pick<RecordRequest, 'lotId' | 'productId'>): Promise<Product | undefined> {
  let productId = request.productId;
  if (productId === undefined) {
    const lot = await lots.lot(request.lotId);
    productId = lot.ok ? lot.value.lot.productId : undefined;
  }
  return productId !== undefined ? lots.catalog.find(productId) : undefined;
}

/** Whether the reading is so far from its product's resistivity window that it needs confirming (`known`: the product, already looked up). */
export async function implausibleReading(lots: LotService, request: RecordRequest, factor: number, known?: { product: Product | undefined }): Promise<Implausible | undefined> {
  const rho = resistivityOf(request);
  if (rho === undefined || !(factor > 1)) return undefined;
  const product = known ? known.product : await productOfRecord(lots, request);
  const window = product?.resistivityOhmCm;
  if (!product || !window) return undefined;
  if (rho > window.max * factor || rho < window.min / factor) {
    return { productId: product.id, valueOhmCm: rho, min: window.min, max: window.max, factor };
  }
  return undefined;
}

export function implausibleQuestion(i: Implausible): string {
  const side = i.valueOhmCm > i.max ? `more than ${formatNumber(i.factor, { trim: true })}× above` : `more than ${formatNumber(i.factor, { trim: true })}× below`;
  return `${formatNumber(i.valueOhmCm)} Ω·cm is ${side} the ${i.productId} window (${formatNumber(i.min)}–${formatNumber(i.max)} Ω·cm): a typo or a wrong unit? Nothing was stored. Check the reading; to store it as typed, answer \`confirm\`.`;
}

function minutesBetween(a: string, b: Date): number {
  return Math.abs(b.getTime() - Date.parse(a)) / 60_000;
}

function ago(minutes: number): string {
  const m = Math.round(minutes);
  return m < 1 ? 'less than a minute ago' : m === 1 ? '1 minute ago' : `${m} minutes ago`;
}

/** Sentences about the wafer after a reading was stored: repeats, open flags, contradicting types. */
export async function afterRecordNotes(lots: LotService, stored: readonly { id: number }[], lotId: string, now: Date): Promise<string[]> {
  const view = await lots.lot(lotId);
  if (!view.ok || stored.length === 0) return [];
  const newIds = new Set(stored.map((s) => s.id));
  const all = view.value.readings;
  const mine = all.filter((r) => newIds.has(r.id));
  const notes: string[] = [];
  const current = all.filter((r) => r.supersededBy === undefined && !newIds.has(r.id));
  for (const r of mine) {
    const repeat = current.find(
      (o) =>
        o.wafer === r.wafer &&
        o.site === r.site &&
        o.quantity === r.quantity &&
        Math.abs(o.value - r.value) <= 1e-9 * Math.abs(r.value) &&
        minutesBetween(o.recordedAt, now) <= REPEAT_WINDOW_MINUTES,
    );
    if (repeat) {
      notes.push(
        `Same value as #${repeat.id} at the same place, ${ago(minutesBetween(repeat.recordedAt, now))}${repeat.actor.userName ? ` (${repeat.actor.userName})` : ''}; stored as a second reading #${r.id}. If it was entered twice by mistake, tell the shift lead: readings are never deleted, a correction replaces one.`,
      );
    }
  }
  const wafers = new Set(mine.map((r) => r.wafer).filter((w): w is number => w !== undefined));
  for (const w of wafers) {
    const flags = view.value.openFlags.filter((f) => f.wafer === w && !(f.raisedByReading !== undefined && newIds.has(f.raisedByReading)));
    if (flags.length > 0) {
      notes.push(`W${w} already has open flag${flags.length > 1 ? 's' : ''}: ${flags.map((f) => `${flagHandle(f.id)} ${FLAG_TITLES[f.code] ?? 'flag'}`).join(', ')}.`);
    }
    const types = all.filter((r): r is StoredReading & { carrierType: 'n' | 'p' } => r.supersededBy === undefined && r.wafer === w && (r.carrierType === 'n' || r.carrierType === 'p'));
    const kinds = new Set(types.map((t) => t.carrierType));
    if (kinds.size > 1) {
      notes.push(
        `W${w} has type readings that disagree: ${types.map((t) => `#${t.id} ${t.carrierType}-type (${t.asEntered})`).join(', ')}. Hold the wafer and confirm the type by the fab's procedure.`,
      );
    }
  }
  return notes;
}
