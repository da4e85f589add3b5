/**
 * Trade words people type, mapped to the core's vocabulary. A lone capital "P" never reaches
 * these tables: src/commands/conductivity-words.ts reads it as a type, as phosphorus, or asks.
 */
import type { CarrierType, Dopant, Material } from '../physics/types.js';

export const DOPANT_WORDS: Readonly<Record<string, Dopant>> = {
  p: 'boron',
  'p-type': 'boron',
  ptype: 'boron',
  n: 'phosphorus',
  'n-type': 'phosphorus',
  ntype: 'phosphorus',
  b: 'boron',
  boron: 'boron',
  B: 'boron',
  phosphorus: 'phosphorus',
  phosphorous: 'phosphorus',
  phos: 'phosphorus',
  'phos.': 'phosphorus',
  arsenic: 'arsenic',
  As: 'arsenic',
  antimony: 'antimony',
  Sb: 'antimony',
};

/** Whether the word named only a type (then the dopant is the default for that type). */
export const TYPE_ONLY_WORDS = new Set(['p', 'p-type', 'ptype', 'n', 'n-type', 'ntype']);

/** Dopants people name that the resistivity conversions do not cover, for a clear answer. */
export const UNCOVERED_DOPANT_WORDS: Readonly<Record<string, string>> = {
  Ga: 'gallium',
  gallium: 'gallium',
  In: 'indium',
  indium: 'indium',
  Al: 'aluminium',
  aluminium: 'aluminium',
  aluminum: 'aluminium',
  Bi: 'bismuth',
  bismuth: 'bismuth',
  Li: 'lithium',
  lithium: 'lithium',
};

/** Materials people name that the resistivity conversions do not cover. */
export const UNCOVERED_MATERIAL_WORDS: Readonly<Record<string, string>> = {
  Ge: 'germanium',
  germanium: 'germanium',
  GaAs: 'gallium arsenide',
  SiC: 'silicon carbide',
  GaN: 'gallium nitride',
  InP: 'indium phosphide',
};

export const MATERIAL_WORDS: Readonly<Record<string, Material>> = {
  Si: 'Si',
  silicon: 'Si',
  Ge: 'Ge',
  germanium: 'Ge',
  GaAs: 'GaAs',
  'gallium-arsenide': 'GaAs',
};

export const CARRIER_TYPE_WORDS: Readonly<Record<string, CarrierType>> = {
  n: 'n',
  'n-type': 'n',
  p: 'p',
  'p-type': 'p',
};

export const DOPANT_LABEL: Readonly<Record<Dopant, string>> = {
  boron: 'boron (p-type)',
  phosphorus: 'phosphorus (n-type)',
  arsenic: 'arsenic (n-type)',
  antimony: 'antimony (n-type)',
};

export const MATERIAL_LABEL: Readonly<Record<Material, string>> = {
  Si: 'silicon',
  Ge: 'germanium',
  GaAs: 'gallium arsenide',
};

/** Probe methods for a conductivity-type reading, as people name them. */
export const PROBE_METHOD_WORDS = {
  hot: 'hot',
  'hot-probe': 'hot',
  thermal: 'hot',
  cold: 'cold',
  'cold-probe': 'cold',
  hall: 'hall',
  point: 'point',
  'point-contact': 'point',
  rectification: 'point',
  rect: 'point',
  spv: 'spv',
  photovoltage: 'spv',
} as const;
export type ProbeMethodWord = (typeof PROBE_METHOD_WORDS)[keyof typeof PROBE_METHOD_WORDS];

/** The polarity of a point contact at easy conduction. */
export const POLARITY_WORDS = { '+': 1, positive: 1, pos: 1, plus: 1, '-': -1, negative: -1, neg: -1, minus: -1 } as const;
