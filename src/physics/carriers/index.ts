export * from './ionization-energies.js';
export * from './neutrality.js';
export * from './carriers.js';
export * from './crossover.js';
