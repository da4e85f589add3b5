/**
 * Temperature-dependent low-field mobility models for silicon: the descriptor extends the
 * shared MobilityModel (mobility-model.ts) with the full set of conditions a model may depend
 * on (donors, acceptors, electrons, holes, temperature), so that a carrier solver can ask for
 * majority and minority mobilities at any temperature.
 *
 * The 300 K models (Masetti 1983, Caughey–Thomas 1967) and the ASTM F723 conversion stay
 * fixed-temperature models (300 K and 23 °C). The models here carry a temperature law:
 * Arora–Hauser–Roulston 1982 (arora-1982.ts) and Klaassen 1992 (klaassen-1992.ts).
 * Shared code reads the descriptor and never switches on a model's id.
 */
import { DOPANT_TYPE, type Dopant } from '../types.js';
import type { MobilityModel } from './mobility-model.js';

/**
 * Everything a mobility model may depend on. Densities in cm⁻³, temperature in K.
 * Donor and acceptor densities are the densities that scatter: ionized impurities (for a fully
 * ionized crystal, the dopant densities). Models that ignore a field (Arora ignores carrier
 * densities) say so in their header.
 */
export interface MobilityConditions {
  readonly donorDensityPerCm3: number;
  readonly acceptorDensityPerCm3: number;
  readonly electronDensityPerCm3: number;
  readonly holeDensityPerCm3: number;
  readonly temperatureK: number;
  /** The donor species, where the model has species-specific parameters (Klaassen: P or As set). */
  readonly donor?: Dopant;
}

export interface TemperatureMobilityModel extends MobilityModel {
  /** The source's own statement of accuracy, as data for the reply. */
  readonly accuracy: string;
  /** Whether the model distinguishes majority from minority carriers. */
  readonly minorityCarriers: boolean;
  /** Electron mobility, cm²/(V·s). Kernel: returns a number, never throws (NaN for NaN input). */
  electronMobilityCm2PerVs(conditions: MobilityConditions): number;
  /** Hole mobility, cm²/(V·s). */
  holeMobilityCm2PerVs(conditions: MobilityConditions): number;
}

/** Conditions for a uniformly doped, fully ionized, uncompensated crystal (minority carriers neglected). */
export function majorityConditions(
  dopantDensityPerCm3: number,
  dopant: Dopant,
  temperatureK: number,
): MobilityConditions {
  const donor = DOPANT_TYPE[dopant] === 'n';
  return {
    donorDensityPerCm3: donor ? dopantDensityPerCm3 : 0,
    acceptorDensityPerCm3: donor ? 0 : dopantDensityPerCm3,
    electronDensityPerCm3: donor ? dopantDensityPerCm3 : 0,
    holeDensityPerCm3: donor ? 0 : dopantDensityPerCm3,
    temperatureK,
    ...(donor ? { donor: dopant } : {}),
  };
}

/** Majority-carrier mobility from a model for a uniformly doped, fully ionized crystal. */
export function majorityMobilityCm2PerVs(
  model: TemperatureMobilityModel,
  dopantDensityPerCm3: number,
  dopant: Dopant,
  temperatureK: number,
): number {
  const c = majorityConditions(dopantDensityPerCm3, dopant, temperatureK);
  return DOPANT_TYPE[dopant] === 'p' ? model.holeMobilityCm2PerVs(c) : model.electronMobilityCm2PerVs(c);
}

/** True when the descriptor carries the full temperature-dependent interface. */
export function isTemperatureMobilityModel(m: MobilityModel): m is TemperatureMobilityModel {
  const t = m as Partial<TemperatureMobilityModel>;
  return typeof t.electronMobilityCm2PerVs === 'function' && typeof t.holeMobilityCm2PerVs === 'function';
}

export interface MobilityPair {
  readonly electronCm2PerVs: number;
  readonly holeCm2PerVs: number;
}

/**
 * Electron and hole mobility from any registered model at the given conditions. A model with
 * the full interface gets the conditions as they are; a majority-carrier, fixed-temperature
 * model (Masetti, Caughey–Thomas) is asked at the total ionized impurity density N_D + N_A,
 * with the named donor (phosphorus if none, or if the model has no set for it) for electrons and boron for holes — the usual
 * way such curves are applied to compensated material and to minority carriers, and stated
 * as an assumption by the callers.
 */
export function mobilityPair(model: MobilityModel, c: MobilityConditions): MobilityPair {
  if (isTemperatureMobilityModel(model)) {
    return { electronCm2PerVs: model.electronMobilityCm2PerVs(c), holeCm2PerVs: model.holeMobilityCm2PerVs(c) };
  }
  const total = c.donorDensityPerCm3 + c.acceptorDensityPerCm3;
  // A donor the model has no set for (Masetti has none for Sb) takes the phosphorus set.
  const donor: Dopant = c.donor !== undefined && model.dopants.includes(c.donor) ? c.donor : 'phosphorus';
  return {
    electronCm2PerVs: model.mobilityCm2PerVs(total, donor, c.temperatureK),
    holeCm2PerVs: model.mobilityCm2PerVs(total, 'boron', c.temperatureK),
  };
}
