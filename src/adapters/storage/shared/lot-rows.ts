/** Row ↔ domain mapping for the lot stores (SQLite and PostgreSQL share the column names). */
import type { FlagCode, FlagDetail, StoredFlag } from '../../../lots/flags.js';
import type { ReadingEvaluation } from '../../../lots/evaluation-types.js';
import type { Quantity, StoredReading, Verdict } from '../../../lots/readings.js';
import type { DigestRun, DigestStatus } from '../../../lots/repository.js';

export interface ReadingRow {
  id: number;
  lot_id: string;
  wafer: number | null;
  site: number | null;
  quantity: string;
  as_entered: string;
  value: number;
  unit: string;
  thickness_cm: number | null;
  spacing_cm: number | null;
  type_method: string | null;
  resistivity_ohm_cm: number | null;
  dopant_density_per_cm3: number | null;
  carrier_type: string | null;
  temperature_k: number | null;
  verdict: string;
  evaluation_json: string;
  supersedes: number | null;
  superseded_by?: number | null;
  user_id: string;
  user_name: string | null;
  surface: string;
  channel_id: string;
  event_id: string;
  event_seq: number;
  recorded_at: string;
  note: string | null;
}

export function readingFromRow(r: ReadingRow): StoredReading {
  return {
    id: r.id,
    lotId: r.lot_id,
    ...(r.wafer !== null ? { wafer: r.wafer } : {}),
    ...(r.site !== null ? { site: r.site } : {}),
    quantity: r.quantity as Quantity,
    asEntered: r.as_entered,
    value: r.value,
    unit: r.unit,
    ...(r.thickness_cm !== null ? { thicknessCm: r.thickness_cm } : {}),
    ...(r.spacing_cm !== null ? { spacingCm: r.spacing_cm } : {}),
    ...(r.type_method !== null ? { typeMethod: r.type_method } : {}),
    ...(r.resistivity_ohm_cm !== null ? { resistivityOhmCm: r.resistivity_ohm_cm } : {}),
    ...(r.dopant_density_per_cm3 !== null ? { dopantDensityPerCm3: r.dopant_density_per_cm3 } : {}),
    ...(r.carrier_type !== null ? { carrierType: r.carrier_type as 'n' | 'p' | 'indeterminate' } : {}),
    ...(r.temperature_k !== null ? { temperatureK: r.temperature_k } : {}),
    verdict: r.verdict as Verdict,
    evaluation: JSON.parse(r.evaluation_json) as ReadingEvaluation,
    ...(r.supersedes !== null ? { supersedes: r.supersedes } : {}),
    ...(r.superseded_by !== null && r.superseded_by !== undefined ? { supersededBy: r.superseded_by } : {}),
    actor: {
      userId: r.user_id,
      ...(r.user_name !== null ? { userName: r.user_name } : {}),
      surface: r.surface,
      channelId: r.channel_id,
    },
    eventId: r.event_id,
    recordedAt: r.recorded_at,
    ...(r.note !== null ? { note: r.note } : {}),
  };
}

export interface FlagRow {
  id: number;
  lot_id: string;
  code: string;
  scope: string;
  wafer: number | null;
  site: number | null;
  detail_json: string;
  product_id: string | null;
  raised_at: string;
  raised_by_reading: number | null;
  raised_by_user: string;
  raised_by_name: string | null;
  c_kind: string | null;
  c_at: string | null;
  c_by_user: string | null;
  c_by_name: string | null;
  c_reason: string | null;
  c_corrected_by: number | null;
  lot_product_id?: string | null;
}

export const FLAG_SELECT = `
SELECT f.id, f.lot_id, f.code, f.scope, f.wafer, f.site, f.detail_json, f.product_id, f.raised_at,
       f.raised_by_reading, f.raised_by_user, f.raised_by_name,
       c.kind AS c_kind, c.at AS c_at, c.by_user AS c_by_user, c.by_name AS c_by_name,
       c.reason AS c_reason, c.corrected_by AS c_corrected_by
FROM lot_flags f LEFT JOIN lot_flag_clearances c ON c.flag_id = f.id`;

export function flagFromRow(r: FlagRow): StoredFlag {
  return {
    id: r.id,
    lotId: r.lot_id,
    code: r.code as FlagCode,
    scope: r.scope,
    ...(r.wafer !== null ? { wafer: r.wafer } : {}),
    ...(r.site !== null ? { site: r.site } : {}),
    detail: JSON.parse(r.detail_json) as FlagDetail,
    ...(r.product_id !== null ? { productId: r.product_id } : {}),
    raisedAt: r.raised_at,
    ...(r.raised_by_reading !== null ? { raisedByReading: r.raised_by_reading } : {}),
    raisedBy: { userId: r.raised_by_user, ...(r.raised_by_name !== null ? { userName: r.raised_by_name } : {}) },
    ...(r.c_kind !== null
      ? {
          clearance: {
            kind: r.c_kind as 'person' | 'correction',
            at: r.c_at ?? '',
            byUserId: r.c_by_user ?? '',
            ...(r.c_by_name !== null ? { byUserName: r.c_by_name } : {}),
            reason: r.c_reason ?? '',
            ...(r.c_corrected_by !== null ? { correctedBy: r.c_corrected_by } : {}),
          },
        }
      : {}),
  };
}

export interface DigestRow {
  channel: string;
  local_date: string;
  slot_at: string;
  claimed_at: string;
  claimed_by: string;
  late: number;
  status: string;
  attempts: number;
  window_start: string | null;
  window_end: string | null;
  posted_at: string | null;
  error: string | null;
}

export function digestFromRow(r: DigestRow): DigestRun {
  return {
    channel: r.channel,
    localDate: r.local_date,
    slotAt: r.slot_at,
    claimedAt: r.claimed_at,
    claimedBy: r.claimed_by,
    late: r.late === 1,
    status: r.status as DigestStatus,
    attempts: r.attempts,
    ...(r.window_start !== null ? { windowStart: r.window_start } : {}),
    ...(r.window_end !== null ? { windowEnd: r.window_end } : {}),
    ...(r.posted_at !== null ? { postedAt: r.posted_at } : {}),
    ...(r.error !== null ? { error: r.error } : {}),
  };
}
