/**
 * The public API's answer: a value, or a refusal that says what was wrong with the input.
 * Refusals are data (wording lives in src/reply/messages.ts). Kernels never refuse: they
 * return numbers (NaN only for meaningless input) and the public functions check first.
 */
import type { Dopant, Material } from './types.js';

export type Refusal =
  | { code: 'nonpositive_input'; quantity: string; input: number }
  | { code: 'not_finite'; quantity: string }
  | { code: 'unknown_model'; model: string; known: string[] }
  | { code: 'model_dopant'; model: string; dopant: Dopant; supported: Dopant[] }
  | { code: 'model_material'; model: string; material: Material; supported: Material[] }
  /**
   * The input is a finite positive number but so far outside the model's range that the model
   * cannot be extrapolated to it (beyond ten times its validity range, beyond the root
   * finder's bracket, or beyond the melting point). A warning would not be honest there.
   */
  | { code: 'outside_domain'; quantity: string; input: number; min: number; max: number; model: string }
  /** Above the material's melting point: there is no crystal, so no n_i (Si 1687 K, Ge 1211 K, GaAs 1511 K). */
  | { code: 'above_melting_point'; material: Material; temperatureK: number; meltingPointK: number }
  /** A geometry for which a correction factor does not exist (e.g. d/s ≤ √3 for Smits's C). */
  | { code: 'geometry_invalid'; factor: string; ratio: number; min: number }
  /** A request that lacks the inputs the computation needs (e.g. neither V and I nor Rs). */
  | { code: 'missing_input'; quantity: string; needs: string[] }
  /** Issue 5: the computation has no parameters for this material (e.g. ionization in GaAs). */
  | { code: 'not_covered'; quantity: string; material: Material; covered: Material[] }
  /** Issue 5: a diffused layer needs Cs above the background density, or there is no junction. */
  | { code: 'no_junction'; surfaceConcentrationPerCm3: number; backgroundDensityPerCm3: number }
  /** Issue 5: a diffused layer and its background must be of opposite kinds (n on p, p on n). */
  | { code: 'dopant_pairing'; dopant: Dopant; background: Dopant }
  /** Issue 5: a bracketed solver did not converge (never a silent NaN). */
  | { code: 'no_solution'; quantity: string; model: string; status: string };

export type RefusalCode = Refusal['code'];

export type Outcome<T> = { ok: true; value: T } | { ok: false; refusal: Refusal };

export function ok<T>(value: T): Outcome<T> {
  return { ok: true, value };
}

export function refuse<T = never>(refusal: Refusal): Outcome<T> {
  return { ok: false, refusal };
}

/**
 * Check a quantity that must be a finite positive number. Returns the refusal, or undefined
 * when the value is fine.
 */
export function checkPositive(quantity: string, input: number): Refusal | undefined {
  if (typeof input !== 'number' || Number.isNaN(input) || !Number.isFinite(input)) {
    return { code: 'not_finite', quantity };
  }
  if (input <= 0) return { code: 'nonpositive_input', quantity, input };
  return undefined;
}

/** Check a quantity that must be finite (any sign). */
export function checkFinite(quantity: string, input: number): Refusal | undefined {
  if (typeof input !== 'number' || !Number.isFinite(input)) return { code: 'not_finite', quantity };
  return undefined;
}
