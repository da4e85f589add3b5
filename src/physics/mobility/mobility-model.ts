/**
 * Descriptor of a published low-field mobility model for silicon. A resistivity conversion
 * can be built from any of them (src/physics/resistivity/mobility-conversion.ts), and shared
 * code reads the descriptor, never the model's id.
 */
import type { CarrierType, Dopant, Parameter, Range } from '../types.js';

export interface MobilityModel {
  readonly id: string;
  readonly name: string;
  /** Primary source: authors, year, journal, DOI. */
  readonly citation: string;
  readonly dopants: readonly Dopant[];
  /** Temperature the parameters belong to, K (models with a temperature law state a range). */
  readonly referenceTemperatureK: number;
  /** Temperatures the model may be used at; a 300 K-only model has min = max = 300. */
  readonly validityTemperatureK: Range;
  /** Dopant densities the fit covers, per dopant, cm⁻³. */
  readonly validityDensityPerCm3: Readonly<Partial<Record<Dopant, Range>>>;
  /** Human-readable equations, for `why`. */
  readonly equations: readonly string[];
  /** Provenance notes (e.g. parameters recalled from memory), for `why` and the reply. */
  readonly notes: readonly string[];
  parameters(dopant: Dopant): readonly Parameter[];
  /** Majority carrier the dopant gives. */
  carrier(dopant: Dopant): CarrierType;
  /**
   * Majority-carrier mobility, cm²/(V·s), at dopant density N (taken equal to the carrier
   * density: full ionization). Kernel: returns a number, never throws.
   */
  mobilityCm2PerVs(dopantDensityPerCm3: number, dopant: Dopant, temperatureK?: number): number;
}
