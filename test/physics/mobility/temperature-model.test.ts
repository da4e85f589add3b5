import { describe, expect, it } from 'vitest';
import { arora1982 } from '../../../src/physics/mobility/arora-1982.js';
import { klaassen1992 } from '../../../src/physics/mobility/klaassen-1992.js';
import { masetti1983 } from '../../../src/physics/mobility/masetti-1983.js';
import { MOBILITY_MODELS, findMobilityModel } from '../../../src/physics/mobility/registry.js';
import {
  isTemperatureMobilityModel,
  majorityConditions,
  majorityMobilityCm2PerVs,
  mobilityPair,
} from '../../../src/physics/mobility/temperature-model.js';

describe('temperature-dependent mobility descriptors', () => {
  it('registers Klaassen 1992 and Arora 1982 beside the 300 K models, which stay fixed-temperature', () => {
    expect(findMobilityModel('klaassen-1992')).toBe(klaassen1992);
    expect(findMobilityModel('arora-1982')).toBe(arora1982);
    for (const m of MOBILITY_MODELS) {
      const fixed = m.validityTemperatureK.max === m.validityTemperatureK.min;
      expect(isTemperatureMobilityModel(m)).toBe(!fixed);
    }
    expect(masetti1983.validityTemperatureK).toEqual({ min: 300, max: 300 });
  });

  it('majority conditions put the dopant on the right side and the carrier density equal to it', () => {
    expect(majorityConditions(1e16, 'boron', 300)).toMatchObject({ acceptorDensityPerCm3: 1e16, donorDensityPerCm3: 0, holeDensityPerCm3: 1e16 });
    expect(majorityConditions(1e16, 'arsenic', 300)).toMatchObject({ donorDensityPerCm3: 1e16, electronDensityPerCm3: 1e16, donor: 'arsenic' });
  });

  it('majorityMobilityCm2PerVs is the descriptor’s own majority branch (implementation check, exact)', () => {
    expect(majorityMobilityCm2PerVs(klaassen1992, 3e17, 'boron', 350)).toBe(klaassen1992.mobilityCm2PerVs(3e17, 'boron', 350));
  });

  // Stated assumption of mobilityPair: a single-curve 300 K model is read at the total ionized
  // impurity density, with the donor's electron curve and boron's hole curve.
  it('reads a 300 K model at N_D + N_A for both carriers; Sb falls back to the P set for Masetti', () => {
    const pair = mobilityPair(masetti1983, {
      donorDensityPerCm3: 2e16,
      acceptorDensityPerCm3: 1e16,
      electronDensityPerCm3: 1e16,
      holeDensityPerCm3: 1e4,
      temperatureK: 300,
      donor: 'antimony',
    });
    expect(pair.electronCm2PerVs).toBe(masetti1983.mobilityCm2PerVs(3e16, 'phosphorus'));
    expect(pair.holeCm2PerVs).toBe(masetti1983.mobilityCm2PerVs(3e16, 'boron'));
  });
});
