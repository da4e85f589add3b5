export * from './uhlir-1955-thickness.js';
export * from './smits-1958-diameter.js';
export * from './sheet.js';
