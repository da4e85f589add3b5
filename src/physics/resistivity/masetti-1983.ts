/**
 * Resistivity ↔ dopant density from the Masetti 1983 mobility model (see
 * src/physics/mobility/masetti-1983.ts for the citation, parameters and validity), and the
 * estimate for heavily antimony-doped silicon that borrows Masetti's arsenic parameters.
 */
import { masetti1983 as masettiMobility } from '../mobility/masetti-1983.js';
import type { Problem } from '../problems.js';
import { conversionFromMobility } from './mobility-conversion.js';

export const masetti1983Conversion = conversionFromMobility(masettiMobility, {
  id: 'masetti-1983',
  name: 'Masetti 1983 mobility, ρ = 1/(q·N·μ)',
  aliases: ['masetti', 'masetti83'],
});

/** Above this Sb density the F723 phosphorus conversion is not used (near solid solubility). */
export const ANTIMONY_P_CONVERSION_LIMIT_PER_CM3 = 1e19;

export const masettiArsenicForAntimony = conversionFromMobility(masettiMobility, {
  id: 'masetti-1983-as-for-sb',
  name: 'Masetti 1983 arsenic mobility applied to antimony (estimate)',
  aliases: ['masetti-sb'],
  dopants: ['antimony'],
  mobilityDopant: () => 'arsenic',
  validityDensityPerCm3: { antimony: { min: ANTIMONY_P_CONVERSION_LIMIT_PER_CM3, max: 1e21 } },
  extraNotes: [
    'No published Sb parameter set is used: the arsenic set stands in for antimony above 1e19 cm⁻³; treat the result as an estimate.',
  ],
  standingProblems: (dopant): readonly Problem[] => [
    {
      code: 'substitute_model',
      model: 'masetti-1983-as-for-sb',
      forDopant: dopant,
      reason: 'Masetti arsenic parameters used for antimony above 1e19 cm⁻³',
    },
    {
      code: 'estimate_only',
      model: 'masetti-1983-as-for-sb',
      reason: 'no antimony-specific conversion above 1e19 cm⁻³',
    },
  ],
});
