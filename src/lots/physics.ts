/**
 * What the lot domain needs from the physics core, as a narrow port. The default
 * implementation (core-physics.ts) calls src/physics; the domain only sees these shapes, so a
 * model change in the core never touches the lot code.
 */
import type { Refusal } from '../physics/outcome.js';
import type { Problem } from '../physics/problems.js';
import type { Dopant } from '../physics/types.js';

export interface ModelRef {
  readonly id: string;
  readonly name: string;
  readonly citation: string;
  readonly validity?: string;
}

export type PortResult<T> = ({ readonly ok: true } & T) | { readonly ok: false; readonly refusal: Refusal };

export interface DensityConversion {
  readonly dopantDensityPerCm3: number;
  readonly model: ModelRef;
  readonly problems: readonly Problem[];
}

export interface SheetConversion {
  readonly resistivityOhmCm: number;
  /** Geometry factors applied (1 when not applicable). */
  readonly thicknessFactor: number;
  readonly problems: readonly Problem[];
  /** The core's assumption codes (worded by src/reply/messages.ts). */
  readonly assumptionCodes: readonly string[];
}

export type TypeMethod = 'hot' | 'cold' | 'hall' | 'point' | 'spv';

export interface TypeFinding {
  readonly carrierType: 'n' | 'p' | 'indeterminate';
  readonly problems: readonly Problem[];
}

export interface TemperatureCorrection {
  /** The reading corrected to 23 °C, Ω·cm. */
  readonly resistivityOhmCm: number;
  /** The coefficient applied (per K), for the reply. */
  readonly coefficientPerK: number;
  readonly model: ModelRef;
  readonly problems: readonly Problem[];
  readonly assumptionCodes: readonly string[];
}

export interface LotPhysics {
  /** A resistivity read at `temperatureK`, corrected to 23 °C for the product's dopant (model estimate). */
  correctTo23C(resistivityOhmCm: number, temperatureK: number, dopant: Dopant): PortResult<TemperatureCorrection>;
  /** ρ (at 23 °C) → dopant density with the product's dopant and (optional) model. */
  densityFromResistivity(resistivityOhmCm: number, dopant: Dopant, modelId?: string): PortResult<DensityConversion>;
  /** Four-point-probe sheet resistance and thickness → resistivity (with spacing if known). */
  resistivityFromSheet(
    sheetResistanceOhmPerSq: number,
    thicknessCm: number,
    spacingCm?: number,
  ): PortResult<SheetConversion>;
  /** A probe reading (canonical unit: V, cm³/C, or ±1 for point-contact polarity) → type. */
  typeFromReading(method: TypeMethod, reading: number, resistivityOhmCm?: number): PortResult<TypeFinding>;
}
