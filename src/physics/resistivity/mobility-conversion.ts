/**
 * A resistivity conversion built from a mobility model: ρ = 1/(q·N·μ(N)) forward; ρ → N by a
 * tabulated guess and Newton steps (src/physics/numeric/newton-inversion.ts), with the bracketed
 * root finder (src/physics/numeric/invert-density.ts) as the fallback.
 *
 * Assumes one carrier type (the majority carrier), full ionization (carrier density = N) and
 * no compensation; the mobility model's temperature (300 K for Masetti and Caughey–Thomas).
 */
import { ELEMENTARY_CHARGE_C } from '../constants.js';
import type { MobilityModel } from '../mobility/mobility-model.js';
import { invertResistivityForDensity, DENSITY_BRACKET_LOG10_PER_CM3 } from '../numeric/invert-density.js';
import { buildInversionTable, invertWithTable, type InversionTable } from '../numeric/newton-inversion.js';
import type { Problem } from '../problems.js';
import type { Dopant, Parameter, Range } from '../types.js';
import { widen, type ConversionDomain, type RegisteredConversionModel } from './conversion-model.js';

const BRACKET: Range = {
  min: Math.pow(10, DENSITY_BRACKET_LOG10_PER_CM3.min),
  max: Math.pow(10, DENSITY_BRACKET_LOG10_PER_CM3.max),
};

/** Kernel: ρ = 1/(q·N·μ), Ω·cm, from N in cm⁻³ and μ in cm²/(V·s). */
export function resistivityFromMobilityOhmCm(dopantDensityPerCm3: number, mobilityCm2PerVs: number): number {
  return 1 / (ELEMENTARY_CHARGE_C * dopantDensityPerCm3 * mobilityCm2PerVs);
}

export interface MobilityConversionOptions {
  readonly id: string;
  readonly name: string;
  readonly aliases: readonly string[];
  /** Dopants the conversion accepts (default: the mobility model's). */
  readonly dopants?: readonly Dopant[];
  /** Which of the mobility model's parameter sets serves a dopant (default: itself). */
  readonly mobilityDopant?: (dopant: Dopant) => Dopant;
  /** Validity in density per dopant (default: the mobility model's). */
  readonly validityDensityPerCm3?: Readonly<Partial<Record<Dopant, Range>>>;
  readonly extraNotes?: readonly string[];
  readonly standingProblems?: (dopant: Dopant) => readonly Problem[];
}

const NONE: readonly Problem[] = Object.freeze([]);

function intersect(a: Range, b: Range): Range {
  return { min: Math.max(a.min, b.min), max: Math.min(a.max, b.max) };
}

export function conversionFromMobility(
  mobility: MobilityModel,
  options: MobilityConversionOptions,
): RegisteredConversionModel {
  const dopants = options.dopants ?? mobility.dopants;
  const mapDopant = options.mobilityDopant ?? ((d: Dopant) => d);
  const mu = (n: number, d: Dopant) => mobility.mobilityCm2PerVs(n, mapDopant(d));
  const rhoOf = (n: number, d: Dopant) => resistivityFromMobilityOhmCm(n, mu(n, d));

  // Standing problems per dopant, computed once (results share them, read-only).
  const standing: Partial<Record<Dopant, readonly Problem[]>> = {};
  for (const d of dopants) standing[d] = Object.freeze([...(options.standingProblems?.(d) ?? [])]);

  // Newton tables per dopant, built on the first ρ → N of that dopant (null: not invertible that
  // way, use Brent). The table spans the bracket, so every domain value is inside it.
  const tables = new Map<Dopant, InversionTable | null>();
  const tableFor = (d: Dopant): InversionTable | null => {
    let t = tables.get(d);
    if (t === undefined) {
      t = buildInversionTable((n) => rhoOf(n, d), DENSITY_BRACKET_LOG10_PER_CM3) ?? null;
      tables.set(d, t);
    }
    return t;
  };

  const validity: Partial<Record<Dopant, { resistivityOhmCm: Range; dopantDensityPerCm3: Range }>> = {};
  const domain: Partial<Record<Dopant, ConversionDomain>> = {};
  for (const d of dopants) {
    const nRange = options.validityDensityPerCm3?.[d] ?? mobility.validityDensityPerCm3[mapDopant(d)];
    if (!nRange) continue;
    validity[d] = {
      dopantDensityPerCm3: nRange,
      resistivityOhmCm: { min: rhoOf(nRange.max, d), max: rhoOf(nRange.min, d) },
    };
    const nDomain = intersect(widen(nRange, 10), BRACKET);
    domain[d] = {
      dopantDensityPerCm3: nDomain,
      resistivityOhmCm: { min: rhoOf(nDomain.max, d), max: rhoOf(nDomain.min, d) },
    };
  }

  return {
    id: options.id,
    name: options.name,
    citation: mobility.citation,
    aliases: options.aliases,
    dopants,
    referenceTemperatureK: mobility.referenceTemperatureK,
    validity,
    domain,
    equations: [
      'ρ = 1/(q·N·μ(N)); ρ → N by Newton steps in ln N from a tabulated guess (Brent root finding over 1e10–1e22 cm⁻³ as fallback)',
      ...mobility.equations,
    ],
    notes: [...mobility.notes, ...(options.extraNotes ?? [])],
    assumptionCodes: ['uncompensated', 'full_ionization', 'majority_carriers_only', 'temperature_300K'],
    parameters(dopant: Dopant): readonly Parameter[] {
      return [
        { name: 'q', value: ELEMENTARY_CHARGE_C, unit: 'C', source: 'CODATA 2018 (exact)' },
        ...mobility.parameters(mapDopant(dopant)),
      ];
    },
    dopantDensityFromResistivity(resistivityOhmCm: number, dopant: Dopant): number {
      if (!(resistivityOhmCm > 0)) return Number.NaN;
      const f = (n: number) => rhoOf(n, dopant);
      const table = tableFor(dopant);
      if (table) {
        const fast = invertWithTable(table, f, resistivityOhmCm);
        if (fast.converged) return fast.dopantDensityPerCm3;
      }
      // Fallback (a target the table cannot settle): Brent over the whole bracket.
      const r = invertResistivityForDensity(f, resistivityOhmCm);
      return r.converged ? r.dopantDensityPerCm3 : Number.NaN;
    },
    resistivityFromDopantDensity(dopantDensityPerCm3: number, dopant: Dopant): number {
      if (!(dopantDensityPerCm3 > 0)) return Number.NaN;
      return rhoOf(dopantDensityPerCm3, dopant);
    },
    mobilityCm2PerVs(dopantDensityPerCm3: number, dopant: Dopant): number {
      return mu(dopantDensityPerCm3, dopant);
    },
    standingProblems(dopant: Dopant): readonly Problem[] {
      return standing[dopant] ?? NONE;
    },
  };
}
