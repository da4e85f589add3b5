import { describe, expect, it } from 'vitest';
import {
  ACCEPTOR_DEGENERACY,
  DONOR_DEGENERACY,
  IONIZATION_MODEL_LIMIT_PER_CM3,
  ionizationLevel,
} from '../../../src/physics/carriers/ionization-energies.js';

describe('dopant ionization energies', () => {
  // Source: textbook values in Si (docs/references.md [V], e.g. Sze & Ng 2007 ch. 1):
  // P 45, As 54, Sb 39, B 45 meV. Exact (the table is these numbers).
  it('holds the textbook silicon levels: P 45, As 54, Sb 39, B 45 meV', () => {
    expect(ionizationLevel('Si', 'phosphorus')?.ionizationEnergyEv).toBe(0.045);
    expect(ionizationLevel('Si', 'arsenic')?.ionizationEnergyEv).toBe(0.054);
    expect(ionizationLevel('Si', 'antimony')?.ionizationEnergyEv).toBe(0.039);
    expect(ionizationLevel('Si', 'boron')?.ionizationEnergyEv).toBe(0.045);
    expect(ionizationLevel('Si', 'boron')?.fromMemory).toBe(false);
  });

  it('marks the germanium levels as from memory and has none for GaAs', () => {
    expect(ionizationLevel('Ge', 'phosphorus')?.fromMemory).toBe(true);
    expect(ionizationLevel('GaAs', 'phosphorus')).toBeUndefined();
  });

  // Source: docs/references.md [V]: g_D = 2, g_A = 4; the simple model overstates freeze-out above ~1e18.
  it('uses g_D = 2, g_A = 4 and warns above 1e18 cm⁻³', () => {
    expect(DONOR_DEGENERACY).toBe(2);
    expect(ACCEPTOR_DEGENERACY).toBe(4);
    expect(IONIZATION_MODEL_LIMIT_PER_CM3).toBe(1e18);
  });
});
