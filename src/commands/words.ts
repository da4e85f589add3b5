/** Trade words people type, mapped to the core's vocabulary. Case-sensitive first: "P" is phosphorus, "p" is p-type. */
import type { CarrierType, Dopant, Material } from '../physics/types.js';

export const DOPANT_WORDS: Readonly<Record<string, Dopant>> = {
  p: 'boron',
  'p-type': 'boron',
  ptype: 'boron',
  n: 'phosphorus',
  'n-type': 'phosphorus',
  ntype: 'phosphorus',
  boron: 'boron',
  B: 'boron',
  phosphorus: 'phosphorus',
  phos: 'phosphorus',
  P: 'phosphorus',
  arsenic: 'arsenic',
  As: 'arsenic',
  antimony: 'antimony',
  Sb: 'antimony',
};

/** Whether the word named only a type (then the dopant is the default for that type). */
export const TYPE_ONLY_WORDS = new Set(['p', 'p-type', 'ptype', 'n', 'n-type', 'ntype']);

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
