/**
 * The registry's descriptor: the shared ConversionModel (src/physics/types.ts) plus what the
 * public API needs to check inputs and state assumptions. Shared code reads these fields and
 * never switches on a model's id.
 */
import type { Problem } from '../problems.js';
import type { ConversionModel, Dopant, Range } from '../types.js';

export interface ConversionDomain {
  readonly resistivityOhmCm: Range;
  readonly dopantDensityPerCm3: Range;
}

export interface RegisteredConversionModel extends ConversionModel {
  /** Short names accepted by `model <id>` besides the id. */
  readonly aliases: readonly string[];
  /** Provenance and scope notes, for `why` and `models`. */
  readonly notes: readonly string[];
  /** Assumptions every result of this model carries ('uncompensated', 'temperature_23C'…). */
  readonly assumptionCodes: readonly string[];
  /**
   * Hard limits per dopant: beyond them the public API refuses ('outside_domain') instead of
   * warning. Ten times the validity range each way unless the equations break down sooner.
   */
  readonly domain: Readonly<Partial<Record<Dopant, ConversionDomain>>>;
  /**
   * Dopants this model hands to another registered model (by id) that applies it on the
   * standard's terms, e.g. F723 → its phosphorus conversion for As and Sb.
   */
  readonly delegates?: Readonly<Partial<Record<Dopant, string>>>;
  /** Problems every result for this dopant carries (e.g. a substitute model). */
  standingProblems(dopant: Dopant): readonly Problem[];
}

/** Widen a range by a factor on each side (for the extrapolation domain). */
export function widen(range: Range, factor: number): Range {
  return { min: range.min / factor, max: range.max * factor };
}
