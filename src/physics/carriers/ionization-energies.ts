/**
 * Dopant ionization energies (energy below the conduction band edge for donors, above the
 * valence band edge for acceptors) and ground-state degeneracy factors.
 *
 * Silicon [V across several textbooks; see docs/references.md], as charted e.g. in S. M. Sze,
 *   K. K. Ng, Physics of Semiconductor Devices, 3rd ed. (Wiley, 2007), ch. 1:
 *   P 45 meV, As 54 meV (49 in some), Sb 39 meV, B 45 meV.
 * Germanium: FROM MEMORY, not confirmed against a retrieved source (Sze's chart of impurity
 *   levels in Ge): P 12.0 meV, As 12.7 meV, Sb 9.6 meV, B 10.4 meV. Replies say so.
 * GaAs: none. B, P, As and Sb are not dopants of GaAs (P and As are on its own lattice
 *   sites), so the carrier solver refuses GaAs rather than invent levels.
 *
 * Degeneracy: g_D = 2 (spin of the donor's bound electron), g_A = 4 (spin and the two-fold
 * degenerate valence band top in Si and Ge) [V]:
 *   N_D⁺ = N_D/(1 + g_D·exp((E_F − E_D)/kT)),  N_A⁻ = N_A/(1 + g_A·exp((E_A − E_F)/kT)).
 *
 * Limit: the simple model overstates freeze-out above ~1e18 cm⁻³: the ionization energy falls
 * with density and the levels merge into an impurity band (Mott transition ~3.7e18 cm⁻³ for
 * P in Si, from memory). The solver warns there.
 */
import type { Dopant, Material } from '../types.js';

export interface IonizationLevel {
  readonly ionizationEnergyEv: number;
  /** true when the value is recalled, not confirmed (reported as 'unverified_parameter'). */
  readonly fromMemory: boolean;
  readonly source: string;
}

const SI_SOURCE = 'textbook value (e.g. Sze & Ng 2007, ch. 1)';
const GE_SOURCE = 'Sze, impurity levels in Ge (from memory)';

export const IONIZATION_ENERGIES: Readonly<Partial<Record<Material, Readonly<Record<Dopant, IonizationLevel>>>>> = {
  Si: {
    phosphorus: { ionizationEnergyEv: 0.045, fromMemory: false, source: SI_SOURCE },
    arsenic: { ionizationEnergyEv: 0.054, fromMemory: false, source: SI_SOURCE },
    antimony: { ionizationEnergyEv: 0.039, fromMemory: false, source: SI_SOURCE },
    boron: { ionizationEnergyEv: 0.045, fromMemory: false, source: SI_SOURCE },
  },
  Ge: {
    phosphorus: { ionizationEnergyEv: 0.012, fromMemory: true, source: GE_SOURCE },
    arsenic: { ionizationEnergyEv: 0.0127, fromMemory: true, source: GE_SOURCE },
    antimony: { ionizationEnergyEv: 0.0096, fromMemory: true, source: GE_SOURCE },
    boron: { ionizationEnergyEv: 0.0104, fromMemory: true, source: GE_SOURCE },
  },
};

/** Materials the ionization table covers. */
export const IONIZATION_MATERIALS: readonly Material[] = ['Si', 'Ge'];

export const DONOR_DEGENERACY = 2;
export const ACCEPTOR_DEGENERACY = 4;

/** Above this density the simple ionization model overstates freeze-out (docs/references.md). */
export const IONIZATION_MODEL_LIMIT_PER_CM3 = 1e18;

export function ionizationLevel(material: Material, dopant: Dopant): IonizationLevel | undefined {
  return IONIZATION_ENERGIES[material]?.[dopant];
}
