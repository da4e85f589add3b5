import { describe, expect, it } from 'vitest';
import { bandgapEv } from '../../../src/physics/bandgap/varshni-thurmond-1975.js';

describe('Varshni band gap with Thurmond 1975 parameters', () => {
  // Source: C. D. Thurmond, J. Electrochem. Soc. 122, 1133 (1975): Eg(Si, 300 K) = 1.124 eV.
  // Tolerance 0.001 eV absolute (1e-3 relative): the published value has three decimals.
  it('Si at 300 K is 1.124 eV (Thurmond 1975)', () => {
    expect(bandgapEv('Si', 300)).toBeWithinRelative(1.124, 1e-3);
  });
  // Source: Thurmond 1975, Eg0 = Eg(0 K) for each material (the fit's own constant): tight.
  it('at 0 K equals Eg0 for Si, Ge and GaAs (Thurmond 1975)', () => {
    expect(bandgapEv('Si', 0)).toBeWithinRelative(1.17, 1e-12);
    expect(bandgapEv('Ge', 0)).toBeWithinRelative(0.7437, 1e-12);
    expect(bandgapEv('GaAs', 0)).toBeWithinRelative(1.519, 1e-12);
  });
  // Source: textbook room-temperature gaps (Sze, Physics of Semiconductor Devices, 2nd ed.,
  // 1981: Ge 0.66 eV, GaAs 1.42 eV). Tolerance 1 %: two or three significant figures quoted.
  it('Ge and GaAs at 300 K match the textbook gaps 0.66 and 1.42 eV (Sze 1981)', () => {
    expect(bandgapEv('Ge', 300)).toBeWithinRelative(0.66, 0.01);
    expect(bandgapEv('GaAs', 300)).toBeWithinRelative(1.42, 0.01);
  });
});
