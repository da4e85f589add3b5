export * from './geometry.js';
export * from './site-conversion.js';
