export * from './method.js';
export * from './hot-probe.js';
export * from './hall.js';
export * from './rectification.js';
export * from './photovoltage.js';
export * from './classify.js';
