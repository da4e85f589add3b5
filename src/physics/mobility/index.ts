export * from './mobility-model.js';
export * from './masetti-1983.js';
export * from './caughey-thomas-1967.js';
export * from './registry.js';
export * from './temperature-model.js';
export * from './arora-1982.js';
export * from './klaassen-1992.js';
