export * from './brent.js';
export * from './invert-density.js';
export * from './pow.js';
