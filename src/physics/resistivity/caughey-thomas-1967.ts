/**
 * Resistivity ↔ dopant density from the Caughey–Thomas 1967 mobility model (see
 * src/physics/mobility/caughey-thomas-1967.ts: parameters from memory, form confirmed).
 */
import { caugheyThomas1967 as ctMobility } from '../mobility/caughey-thomas-1967.js';
import { conversionFromMobility } from './mobility-conversion.js';

export const caugheyThomas1967Conversion = conversionFromMobility(ctMobility, {
  id: 'caughey-thomas-1967',
  name: 'Caughey–Thomas 1967 mobility, ρ = 1/(q·N·μ)',
  aliases: ['caughey-thomas', 'caughey', 'ct'],
  extraNotes: ['The parameters are from memory: prefer F723 or Masetti for decisions.'],
});
