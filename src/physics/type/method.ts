/**
 * Descriptor of a conductivity-type method: what sign of reading means n-type, the reading's
 * canonical unit, the default noise band and where each comes from. Shared code
 * (classify.ts) reads descriptors and never switches on the method.
 */
import type { Problem } from '../problems.js';
import type { Material } from '../types.js';

export type ProbeMethod = 'hot' | 'cold' | 'hall' | 'point' | 'spv';

export interface CautionContext {
  readonly resistivityOhmCm?: number;
  readonly material: Material;
}

export interface TypeMethod {
  readonly method: ProbeMethod;
  readonly name: string;
  /** Canonical unit of the reading ('V', 'cm³/C', 'polarity'). */
  readonly unit: string;
  /** Sign of a reading above the noise band that means n-type (+1 or −1). */
  readonly nTypeSign: 1 | -1;
  readonly defaultNoiseBand: number;
  /** Why the default noise band is what it is. */
  readonly noiseBandBasis: string;
  /** The sign convention in words, for the reply and `why`. */
  readonly conventionText: string;
  /** Source of the sign convention. */
  readonly source: string;
  /** Range and material cautions (ASTM F42 and device physics). */
  cautions(ctx: CautionContext): Problem[];
}

/** ASTM F42 / SEMI MF42, "Standard Test Methods for Conductivity Type of Extrinsic Semiconducting Materials". */
export const F42 = 'ASTM F42 (SEMI MF42)';
