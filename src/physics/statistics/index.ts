export * from './uniformity.js';
export * from './quantiles-hyndman-fan-1996.js';
export * from './tukey-fences-1977.js';
export * from './shewhart-individuals.js';
export * from './western-electric-1956.js';
