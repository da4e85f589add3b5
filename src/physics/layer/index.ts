export * from './profiles.js';
export * from './irvin-1962.js';
