/**
 * Shared vocabulary of the physics core. Canonical units only: Ω·cm, cm⁻³, K, V, eV, cm²/(V·s).
 * Nothing here knows about chat, text or I/O.
 */
import type { Problem } from './problems.js';

export type Dopant = 'boron' | 'phosphorus' | 'arsenic' | 'antimony';
export type CarrierType = 'n' | 'p';
export type Material = 'Si' | 'Ge' | 'GaAs';

export const DOPANT_TYPE: Readonly<Record<Dopant, CarrierType>> = {
  boron: 'p',
  phosphorus: 'n',
  arsenic: 'n',
  antimony: 'n',
};

/** A closed interval in canonical units. */
export interface Range {
  readonly min: number;
  readonly max: number;
}

/** A named parameter with its value, unit and where it comes from (for `why`). */
export interface Parameter {
  readonly name: string;
  readonly value: number;
  readonly unit?: string;
  readonly source?: string;
}

/**
 * Descriptor of a published resistivity ↔ dopant-density conversion for silicon.
 * Shared code never switches on a model's id: it reads the descriptor.
 */
export interface ConversionModel {
  readonly id: string;
  readonly name: string;
  /** Primary source: authors, year, title/journal, DOI or standard number. */
  readonly citation: string;
  readonly dopants: readonly Dopant[];
  /** Temperature the model is defined at, K. */
  readonly referenceTemperatureK: number;
  /** Validity per dopant, in canonical units. */
  readonly validity: Readonly<
    Partial<Record<Dopant, { resistivityOhmCm?: Range; dopantDensityPerCm3?: Range }>>
  >;
  /** Human-readable equations, for `why`. */
  readonly equations: readonly string[];
  /** Parameter table for a dopant, for `why`. */
  parameters(dopant: Dopant): readonly Parameter[];
  /** ρ → N. Kernels return numbers and never throw; NaN only for meaningless input (ρ ≤ 0). */
  dopantDensityFromResistivity(resistivityOhmCm: number, dopant: Dopant): number;
  /** N → ρ. */
  resistivityFromDopantDensity(dopantDensityPerCm3: number, dopant: Dopant): number;
  /** Majority-carrier mobility at N, cm²/(V·s), where the model has one. */
  mobilityCm2PerVs?(dopantDensityPerCm3: number, dopant: Dopant): number;
}

/** Result of a checked conversion through the public API. */
export interface ConversionResult {
  readonly resistivityOhmCm: number;
  readonly dopantDensityPerCm3: number;
  /** Majority-carrier mobility implied by ρ and N: μ = 1/(q·N·ρ). */
  readonly mobilityCm2PerVs: number;
  readonly carrierType: CarrierType;
  readonly dopant: Dopant;
  readonly model: ConversionModel;
  readonly problems: readonly Problem[];
  /** Plain statements of what was assumed, as data for the reply. */
  readonly assumptionCodes: readonly string[];
}
