export * from './intrinsic-model.js';
export * from './couderc-2014.js';
export * from './misiakos-tsamakis-1993.js';
export * from './sproul-green-1991.js';
export * from './density-of-states.js';
export * from './registry.js';
