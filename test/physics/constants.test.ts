import { boltzmann, electronMass, elementaryCharge, planckConstant } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  BOLTZMANN_EV_PER_K,
  BOLTZMANN_J_PER_K,
  ELECTRON_MASS_KG,
  ELEMENTARY_CHARGE_C,
  PLANCK_J_S,
} from '../../src/physics/constants.js';

// Source: CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)) as carried by mathjs's
// physical constants. q, k, h are exact in the SI since 2019: tolerance 1e-15 relative (float
// rounding only). m0 is measured: 1e-12 relative, far below its 3e-10 CODATA uncertainty.
describe('CODATA 2018 constants agree with mathjs', () => {
  it('elementary charge q (exact)', () => {
    expect(ELEMENTARY_CHARGE_C).toBeWithinRelative(elementaryCharge.toNumber('C'), 1e-15);
  });
  it('Boltzmann constant k (exact)', () => {
    expect(BOLTZMANN_J_PER_K).toBeWithinRelative(boltzmann.toNumber('J/K'), 1e-15);
  });
  it('k in eV/K is k/q', () => {
    expect(BOLTZMANN_EV_PER_K).toBeWithinRelative(boltzmann.toNumber('J/K') / elementaryCharge.toNumber('C'), 1e-15);
  });
  it('Planck constant h (exact)', () => {
    expect(PLANCK_J_S).toBeWithinRelative(planckConstant.toNumber('J s'), 1e-15);
  });
  it('electron mass m0', () => {
    expect(ELECTRON_MASS_KG).toBeWithinRelative(electronMass.toNumber('kg'), 1e-12);
  });
});
