/**
 * Every problem, refusal and assumption code the core can produce has its wording: a person never
 * sees a code, an identifier or an object's fields. The sample objects are typed by code, so a new
 * code that is not listed here fails the type check before it can reach a person.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { refusalMessage } from '../../src/commands/describe.js';
import type { Refusal, RefusalCode } from '../../src/physics/outcome.js';
import type { Problem, ProblemCode } from '../../src/physics/problems.js';
import { assumptionText, hasAssumptionWording, problemMessage } from '../../src/reply/messages.js';

const PROBLEMS: { [C in ProblemCode]: Extract<Problem, { code: C }> } = {
  outside_validity: { code: 'outside_validity', quantity: 'resistivityOhmCm', input: 2e4, min: 1e-4, max: 1e4, model: 'f723' },
  near_boundary: { code: 'near_boundary', quantity: 'dopantDensityPerCm3', input: 1e21, boundary: 1.2e21, model: 'f723' },
  estimate_only: { code: 'estimate_only', model: 'masetti-1983-as-for-sb', reason: 'the arsenic form is used for antimony.' },
  substitute_model: { code: 'substitute_model', model: 'f723', forDopant: 'arsenic', reason: 'the standard allows it below 1e19 cm⁻³.' },
  indeterminate_reading: { code: 'indeterminate_reading', method: 'hot', input: 0.04, noiseBand: 0.1, unit: 'mV' },
  method_range: { code: 'method_range', method: 'hot', resistivityOhmCm: 2500, min: 0.1, max: 1000, standard: 'ASTM F42' },
  type_mismatch: { code: 'type_mismatch', expected: 'n', found: 'p' },
  epitaxial_caution: { code: 'epitaxial_caution', method: 'hot' },
  mixed_conduction: { code: 'mixed_conduction', method: 'hall' },
  outdated_value: { code: 'outdated_value', quantity: 'intrinsicDensityPerCm3', outdated: 1.45e10, current: 9.65e9, source: 'Altermatt 2003' },
  geometry_limit: { code: 'geometry_limit', factor: 'diameter', ratio: 1.9, min: 3 },
  contact_asymmetry: { code: 'contact_asymmetry', ratio: 4.2, limit: 3 },
  thickness_factor_unknown: { code: 'thickness_factor_unknown', thicknessCm: 0.0725, factorAtOneMm: 0.98 },
  combined_geometry: { code: 'combined_geometry', thicknessFactor: 0.9, diameterFactor: 0.9 },
  large_temperature_correction: { code: 'large_temperature_correction', temperatureK: 373.15, referenceK: 296.15, changePercent: -38, model: 'Klaassen 1992', trustedWithinK: 10 },
  method_not_covered: { code: 'method_not_covered', method: 'point', material: 'Ge', standard: 'ASTM F42' },
  ionization_model_limit: { code: 'ionization_model_limit', dopantDensityPerCm3: 5e18, limitPerCm3: 1e18 },
  degenerate: { code: 'degenerate', band: 'conduction', separationKT: 1.2, limitKT: 3 },
  unverified_parameter: { code: 'unverified_parameter', parameter: 'Ge boron level', value: 0.0104, unit: 'eV', source: 'from memory' },
  intrinsic_regime: { code: 'intrinsic_regime', intrinsicDensityPerCm3: 1e14, netDopingPerCm3: 1e14 },
  quantity_not_covered: { code: 'quantity_not_covered', quantity: 'resistivityOhmCm', material: 'Ge', covered: ['Si'] },
  other: { code: 'other', message: 'A plain sentence that the core wrote for people.' },
};

const REFUSALS: { [C in RefusalCode]: Extract<Refusal, { code: C }> } = {
  above_melting_point: { code: 'above_melting_point', material: 'Si', temperatureK: 2000, meltingPointK: 1687 },
  nonpositive_input: { code: 'nonpositive_input', quantity: 'resistivityOhmCm', input: -1 },
  not_finite: { code: 'not_finite', quantity: 'dopantDensityPerCm3' },
  unknown_model: { code: 'unknown_model', model: 'foo', known: ['f723', 'masetti-1983'] },
  model_dopant: { code: 'model_dopant', model: 'f723', dopant: 'antimony', supported: ['boron', 'phosphorus'] },
  model_material: { code: 'model_material', model: 'misiakos-tsamakis-1993', material: 'Ge', supported: ['Si'] },
  outside_domain: { code: 'outside_domain', quantity: 'resistivityOhmCm', input: 1e9, min: 1e-4, max: 1e4, model: 'f723' },
  geometry_invalid: { code: 'geometry_invalid', factor: 'diameter', ratio: 1.2, min: 1.732 },
  missing_input: { code: 'missing_input', quantity: 'sheetResistanceOhmPerSq', needs: ['the voltage and current', 'or the sheet resistance'] },
  not_covered: { code: 'not_covered', quantity: 'ionizationEnergyEv', material: 'GaAs', covered: ['Si', 'Ge'] },
  no_junction: { code: 'no_junction', surfaceConcentrationPerCm3: 1e14, backgroundDensityPerCm3: 1e15 },
  dopant_pairing: { code: 'dopant_pairing', dopant: 'boron', background: 'boron' },
  no_solution: { code: 'no_solution', quantity: 'temperatureK', model: 'misiakos-tsamakis-1993', status: 'max_iterations' },
};

/** An identifier or code: snake_case, or camelCase with a unit suffix. */
const CODE_LIKE = /\b(?!n_i\b)[a-z]+_[a-z0-9_]+\b|\b[a-z]+(?:OhmCm|PerCm3|OhmPerSq|Ev|K)\b|\[object|undefined|NaN/;

describe('every code has wording', () => {
  it.each(Object.values(PROBLEMS))('problem $code reads as a sentence', (p) => {
    const m = problemMessage(p);
    expect(m.length).toBeGreaterThan(20);
    expect(m).not.toMatch(CODE_LIKE);
    if (p.code.includes('_')) expect(m).not.toContain(p.code);
  });

  it.each(Object.values(REFUSALS))('refusal $code reads as a sentence', (r) => {
    const m = refusalMessage(r);
    expect(m.length).toBeGreaterThan(20);
    expect(m).not.toMatch(CODE_LIKE);
    expect(m).not.toContain(r.code);
  });

  it('every assumption code the core uses has its own wording', () => {
    const codes = new Set<string>();
    const walk = (dir: string): void => {
      for (const f of readdirSync(dir)) {
        const path = join(dir, f);
        if (statSync(path).isDirectory()) walk(path);
        else if (path.endsWith('.ts')) {
          const src = readFileSync(path, 'utf8');
          // Assumption codes are pushed or listed next to the word "assumption" in the core.
          for (const line of src.split('\n')) {
            if (!/assumption/i.test(line) || /^\s*(\*|\/\/)/.test(line)) continue;
            for (const m of line.matchAll(/'([a-z0-9]+(?:_[a-z0-9]+)+)'/g)) codes.add(m[1]!);
          }
        }
      }
    };
    walk(new URL('../../src/physics', import.meta.url).pathname);
    expect(codes.size).toBeGreaterThan(10);
    for (const c of codes) {
      expect(hasAssumptionWording(c), c).toBe(true);
      expect(assumptionText(c)).not.toMatch(CODE_LIKE);
    }
  });
});
