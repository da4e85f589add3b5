/** Public API of the physics core (re-exports only). */
export * from './constants.js';
export * from './types.js';
export * from './problems.js';
export * from './outcome.js';
export * from './materials.js';
export * from './bandgap/varshni-thurmond-1975.js';
export * from './numeric/index.js';
export * from './mobility/index.js';
export * from './resistivity/index.js';
export * from './intrinsic/index.js';
export * from './type/index.js';
export * from './four-point/index.js';
export * from './carriers/index.js';
export * from './layer/index.js';
export * from './statistics/index.js';
export * from './wafer/index.js';
