/**
 * Why a lot write or read was refused: data, worded by the commands layer
 * (src/commands/lots/wording.ts).
 */
import type { Refusal } from '../physics/outcome.js';

export type LotError =
  | { readonly code: 'invalid_request'; readonly issues: readonly { readonly path: string; readonly message: string }[] }
  | { readonly code: 'bad_lot_id'; readonly input: string; readonly pattern: string; readonly example: string }
  | { readonly code: 'no_product'; readonly lotId: string; readonly products: readonly string[] }
  | { readonly code: 'unknown_reading'; readonly readingId: number }
  | { readonly code: 'correction_other_lot'; readonly readingId: number; readonly readingLot: string; readonly lotId: string }
  | { readonly code: 'already_corrected'; readonly readingId: number; readonly by: number }
  | { readonly code: 'measurement_refused'; readonly what: 'sheet' | 'type'; readonly refusal: Refusal }
  | { readonly code: 'not_permitted'; readonly action: 'record' | 'clear'; readonly userId: string; readonly channelId: string }
  | { readonly code: 'unknown_lot'; readonly lotId: string }
  | { readonly code: 'no_map'; readonly lotId: string; readonly wafer: number; readonly wafersWithMaps: readonly number[] }
  | { readonly code: 'no_such_flag'; readonly lotId: string; readonly what: string; readonly open: readonly { id: number; code: string; scope: string }[] }
  | { readonly code: 'ambiguous_flag'; readonly lotId: string; readonly what: string; readonly candidates: readonly { id: number; code: string; scope: string }[] }
  | { readonly code: 'flag_already_cleared'; readonly flagId: number; readonly at: string; readonly by: string }
  | { readonly code: 'flag_other_lot'; readonly flagId: number; readonly flagLot: string; readonly lotId: string };
