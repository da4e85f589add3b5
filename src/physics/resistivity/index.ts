export * from './conversion-model.js';
export * from './astm-f723.js';
export * from './f723-phosphorus-for-as-sb.js';
export * from './mobility-conversion.js';
export * from './masetti-1983.js';
export * from './caughey-thomas-1967.js';
export * from './registry.js';
export * from './convert.js';
