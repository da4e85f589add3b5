/** The mobility models the core knows. Issue 5 adds temperature-dependent ones here. */
import { arora1982 } from './arora-1982.js';
import { caugheyThomas1967 } from './caughey-thomas-1967.js';
import { klaassen1992 } from './klaassen-1992.js';
import { masetti1983 } from './masetti-1983.js';
import type { MobilityModel } from './mobility-model.js';

export const MOBILITY_MODELS: readonly MobilityModel[] = [masetti1983, caugheyThomas1967, klaassen1992, arora1982];

export function findMobilityModel(id: string): MobilityModel | undefined {
  return MOBILITY_MODELS.find((m) => m.id === id);
}
