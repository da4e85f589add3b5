/**
 * What a checked reading carries: the checks made, the notes for the person and the evaluation
 * stored with it. Data only (the checks themselves are in evaluation.ts and checks/); the
 * commands layer words them.
 */
import type { Problem } from '../physics/problems.js';
import type { Dopant } from '../physics/types.js';
import type { FlagFinding } from './flags.js';
import type { ModelRef } from './physics.js';

/** Readings record one of these quantities. */
export type Quantity = 'resistivity' | 'sheet' | 'type';

export type Verdict = 'pass' | 'flagged' | 'no_verdict';

/** 23 °C, the temperature product windows (and ASTM F723) are defined at. */
export const SPEC_TEMPERATURE_K = 296.15;
/** A reading within this of 23 °C is taken as at 23 °C. */
export const TEMPERATURE_TOLERANCE_K = 0.5;

export type Check =
  | {
      readonly check: 'window';
      readonly quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3';
      readonly value: number;
      readonly min: number;
      readonly max: number;
      readonly status: 'pass' | 'fail';
      /** Inside: distance to the nearest limit in % of it. Outside: how far past the limit, in % of it. */
      readonly marginPercent: number;
      /** Which limit the margin is measured to. */
      readonly limit: 'min' | 'max';
      /** 'map_mean': a map's mean against the product's uniformity mean window. */
      readonly basis?: 'map_mean';
    }
  | { readonly check: 'validity'; readonly status: 'pass' | 'fail'; readonly model: string }
  | {
      readonly check: 'type';
      readonly expected: 'n' | 'p';
      readonly found: 'n' | 'p' | 'indeterminate';
      readonly method: string;
      readonly status: 'pass' | 'fail' | 'indeterminate';
    }
  | {
      /** A map's 1σ/mean non-uniformity against the product's uniformity limit. */
      readonly check: 'uniformity';
      readonly wafer: number;
      readonly nonUniformityPercent: number;
      readonly limitPercent: number;
      readonly count: number;
      readonly status: 'pass' | 'fail';
    }
  | {
      readonly check: 'site_spread';
      readonly wafer: number;
      readonly spreadPercent: number;
      readonly limitPercent: number;
      readonly count: number;
      readonly status: 'pass' | 'fail';
    }
  | {
      readonly check: 'wafer_spread';
      readonly spreadPercent: number;
      readonly limitPercent: number;
      readonly count: number;
      readonly status: 'pass' | 'fail';
    }
  | { readonly check: 'spec'; readonly status: 'fail'; readonly productId: string };

export type LotNote =
  | { readonly code: 'temperature_uncorrected'; readonly temperatureK: number }
  | {
      readonly code: 'temperature_corrected';
      readonly temperatureK: number;
      readonly measuredOhmCm: number;
      readonly correctedOhmCm: number;
      readonly coefficientPerK: number;
      readonly model: ModelRef;
    }
  | {
      readonly code: 'near_limit';
      readonly quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3';
      readonly marginPercent: number;
      readonly limit: 'min' | 'max';
      readonly thresholdPercent: number;
    }
  | { readonly code: 'problem'; readonly problem: Problem }
  | { readonly code: 'assumption'; readonly assumption: string }
  | { readonly code: 'type_not_checked'; readonly reason: 'indeterminate' }
  | { readonly code: 'window_not_checked'; readonly reason: 'conversion_refused' };

/** The statistics of a recorded map (over the sites inside the edge exclusion). */
export interface MapSummary {
  readonly fileName: string;
  readonly measured: 'sheet' | 'resistivity';
  /** Sites in the file, and those counted (a value, inside the edge exclusion). */
  readonly siteCount: number;
  readonly count: number;
  readonly diameterMm: number;
  readonly edgeExclusionMm: number;
  /** Resistivity statistics at the measured temperature, Ω·cm. */
  readonly meanOhmCm: number;
  readonly standardDeviationOhmCm: number;
  readonly minimumOhmCm: number;
  readonly maximumOhmCm: number;
  /** 1σ/mean × 100 and (max − min)/(2·mean) × 100, %. */
  readonly nonUniformityPercent: number;
  readonly rangeNonUniformityPercent: number;
}

/** Stored with each reading: what it was checked against and what was found. */
export interface ReadingEvaluation {
  readonly productId?: string;
  readonly specSource?: string;
  readonly specRevision?: string;
  readonly demoSpecs?: boolean;
  readonly dopant?: Dopant;
  readonly model?: ModelRef;
  readonly checks: readonly Check[];
  readonly notes: readonly LotNote[];
  readonly findings: readonly FlagFinding[];
  readonly verdict: Verdict;
  /** Set for a map reading (its sites are stored beside it, in their own table). */
  readonly map?: MapSummary;
}

export interface ReadingDraft {
  readonly wafer?: number;
  readonly site?: number;
  readonly quantity: Quantity;
  /** The text as entered ('8.4 ohm-cm', '45 ohm/sq thick 525um', 'hot -1.2mV'). */
  readonly asEntered: string;
  /** Canonical value: Ω·cm, Ω/□, or V / cm³/C / ±1 for type readings (0 for a stated type). */
  readonly value: number;
  readonly unit: string;
  readonly thicknessCm?: number;
  readonly spacingCm?: number;
  readonly typeMethod?: string;
  /** Resistivity used for the checks (as read, or from sheet × thickness). */
  readonly resistivityOhmCm?: number;
  readonly dopantDensityPerCm3?: number;
  readonly carrierType?: 'n' | 'p' | 'indeterminate';
  readonly temperatureK?: number;
  readonly verdict: Verdict;
  readonly evaluation: ReadingEvaluation;
  readonly note?: string;
}
