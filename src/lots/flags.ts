/**
 * Flags: what a check found wrong with a lot, as data. A flag stays open until a person clears
 * it with a reason, or until the reading that raised it is corrected (then the system closes
 * it and says so). Flags and their clearances are never edited or deleted.
 */
import type { Refusal } from '../physics/outcome.js';
import type { SpreadDefinition } from './spec/schema.js';

export const FLAG_CODES = [
  'out_of_window',
  'type_mismatch',
  'spread_over_limit',
  'uniformity_over_limit',
  'outside_model_validity',
  'no_spec',
] as const;
export type FlagCode = (typeof FLAG_CODES)[number];

/** The short word people type in `clear <lot> <word>` for each flag code. */
export const FLAG_WORDS: Readonly<Record<FlagCode, string>> = {
  out_of_window: 'window',
  type_mismatch: 'type',
  spread_over_limit: 'spread',
  uniformity_over_limit: 'uniformity',
  outside_model_validity: 'model',
  no_spec: 'spec',
};

export function flagCodeFromWord(word: string): FlagCode | undefined {
  const w = word.toLowerCase();
  for (const code of FLAG_CODES) if (FLAG_WORDS[code] === w || code === w) return code;
  return undefined;
}

export type FlagDetail =
  | {
      readonly code: 'out_of_window';
      readonly quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3';
      readonly value: number;
      readonly min: number;
      readonly max: number;
      readonly side: 'above' | 'below';
      /** How far outside, in % of the limit crossed. */
      readonly marginPercent: number;
      /** 'map_mean': a map's mean against the product's uniformity mean window. */
      readonly basis?: 'map_mean';
    }
  | {
      readonly code: 'uniformity_over_limit';
      readonly wafer: number;
      /** 1σ/mean × 100 of the map's site resistivities. */
      readonly nonUniformityPercent: number;
      readonly limitPercent: number;
      readonly count: number;
    }
  | {
      readonly code: 'type_mismatch';
      readonly expected: 'n' | 'p';
      readonly found: 'n' | 'p';
      readonly method: string;
    }
  | {
      readonly code: 'spread_over_limit';
      readonly across: 'sites' | 'wafers';
      readonly wafer?: number;
      readonly spreadPercent: number;
      readonly limitPercent: number;
      readonly definition: SpreadDefinition;
      readonly minOhmCm: number;
      readonly maxOhmCm: number;
      readonly count: number;
    }
  | {
      readonly code: 'outside_model_validity';
      readonly model: string;
      readonly quantity: string;
      readonly input: number;
      readonly min?: number;
      readonly max?: number;
      readonly refusal?: Refusal;
    }
  | {
      readonly code: 'no_spec';
      readonly reason: 'unknown_product';
      readonly productId: string;
      readonly suggestion?: string;
    };

/** A flag a check wants raised. `scope` keys it: one open flag per (lot, code, scope). */
export interface FlagFinding {
  readonly code: FlagCode;
  readonly scope: string;
  readonly wafer?: number;
  readonly site?: number;
  readonly detail: FlagDetail;
}

export interface FlagClearance {
  readonly at: string;
  readonly byUserId: string;
  readonly byUserName?: string;
  readonly reason: string;
  /** 'person' for `clear`, 'correction' when the raising reading was corrected. */
  readonly kind: 'person' | 'correction';
  readonly correctedBy?: number;
}

export interface StoredFlag {
  readonly id: number;
  readonly lotId: string;
  readonly code: FlagCode;
  readonly scope: string;
  readonly wafer?: number;
  readonly site?: number;
  readonly detail: FlagDetail;
  /** Product of the lot when the flag was raised. */
  readonly productId?: string;
  readonly raisedAt: string;
  readonly raisedByReading?: number;
  readonly raisedBy: { readonly userId: string; readonly userName?: string };
  readonly clearance?: FlagClearance;
}

export function isOpen(flag: StoredFlag): boolean {
  return flag.clearance === undefined;
}

/** 'F12' — how flags are named to people. */
export function flagHandle(id: number): string {
  return `F${id}`;
}

export function parseFlagHandle(text: string): number | undefined {
  const m = /^#?F(\d{1,12})$/i.exec(text.trim());
  return m ? Number(m[1]) : undefined;
}

/** Scope keys. */
export function placeScope(wafer: number | undefined, site: number | undefined): string {
  if (wafer === undefined) return 'lot';
  return site === undefined ? `w${wafer}` : `w${wafer}/s${site}`;
}
export const siteSpreadScope = (wafer: number): string => `w${wafer}:sites`;
export const mapUniformityScope = (wafer: number): string => `w${wafer}:map`;
export const WAFER_SPREAD_SCOPE = 'lot:wafers';
