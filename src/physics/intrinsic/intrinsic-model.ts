/** Descriptor of a published intrinsic-carrier-density model. */
import type { Material, Parameter, Range } from '../types.js';

export interface IntrinsicModel {
  readonly id: string;
  readonly name: string;
  readonly citation: string;
  readonly materials: Material[];
  /** Temperatures the fit covers (for a multi-material model: the silicon range). */
  readonly validityTemperatureK: Range;
  /** Per-material temperature validity (falls back to validityTemperatureK). */
  validityTemperatureKFor?(material: Material): Range;
  readonly equations: string[];
  /** Provenance notes (values recalled from memory, etc.), for `why`. */
  readonly notes?: readonly string[];
  /** Short names accepted by `model <id>` besides the id. */
  readonly aliases?: readonly string[];
  parameters(material: Material): Parameter[];
  /** The band gap the model itself uses, eV (when it has its own; else the Varshni–Thurmond gap). */
  bandgapEv?(material: Material, temperatureK: number): number;
  /** Kernel: n_i in cm⁻³; a number, never throws. */
  intrinsicDensityPerCm3(material: Material, temperatureK: number): number;
}
