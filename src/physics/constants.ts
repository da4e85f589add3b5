/**
 * Physical constants, CODATA 2018 (exact in the SI since 2019-05-20).
 * Source: E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, "CODATA recommended values of the
 * fundamental physical constants: 2018", Rev. Mod. Phys. 93, 025010 (2021).
 * Checked against mathjs's built-in constants in test/physics/constants.test.ts.
 */

/** Elementary charge q, C (exact). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** Boltzmann constant k, J/K (exact). */
export const BOLTZMANN_J_PER_K = 1.380649e-23;
/** Boltzmann constant k in eV/K (k/q, exact ratio of two exact constants). */
export const BOLTZMANN_EV_PER_K = BOLTZMANN_J_PER_K / ELEMENTARY_CHARGE_C;
/** Planck constant h, J·s (exact). */
export const PLANCK_J_S = 6.62607015e-34;
/** Electron rest mass m0, kg (CODATA 2018, not exact). */
export const ELECTRON_MASS_KG = 9.1093837015e-31;
/** 0 °C in kelvin (exact by definition). */
export const ZERO_CELSIUS_K = 273.15;
/** ASTM F723 reference temperature, 23 °C, in kelvin. */
export const F723_REFERENCE_TEMPERATURE_K = 296.15;
