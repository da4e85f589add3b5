import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ELEMENTARY_CHARGE_C } from '../../../src/physics/constants.js';
import { convertDensityToResistivity, convertResistivityToDensity } from '../../../src/physics/resistivity/convert.js';
import { CONVERSION_MODELS } from '../../../src/physics/resistivity/registry.js';
import type { Dopant } from '../../../src/physics/types.js';

const DOPANTS: Dopant[] = ['boron', 'phosphorus', 'arsenic', 'antimony'];

describe('convertResistivityToDensity / convertDensityToResistivity', () => {
  it('refuses zero, negative and non-finite resistivity with a reason', () => {
    for (const bad of [0, -1]) {
      const o = convertResistivityToDensity({ resistivityOhmCm: bad, dopant: 'boron' });
      expect(o).toEqual({ ok: false, refusal: { code: 'nonpositive_input', quantity: 'resistivityOhmCm', input: bad } });
    }
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY]) {
      const o = convertResistivityToDensity({ resistivityOhmCm: bad, dopant: 'boron' });
      expect(o.ok).toBe(false);
      if (!o.ok) expect(o.refusal.code).toBe('not_finite');
    }
  });
  it('refuses an unknown model and lists the known ones', () => {
    const o = convertResistivityToDensity({ resistivityOhmCm: 1, dopant: 'boron', modelId: 'irvin-2099' });
    expect(o.ok).toBe(false);
    if (!o.ok && o.refusal.code === 'unknown_model') expect(o.refusal.known).toContain('f723');
    else throw new Error('expected unknown_model');
  });
  it('refuses a model that lacks the dopant (Masetti has no antimony set)', () => {
    const o = convertResistivityToDensity({ resistivityOhmCm: 0.01, dopant: 'antimony', modelId: 'masetti' });
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.refusal).toMatchObject({ code: 'model_dopant', dopant: 'antimony' });
  });
  it('uses F723 for boron and phosphorus and Masetti for arsenic by default (issue 2)', () => {
    const pick = (d: Dopant) => {
      const o = convertResistivityToDensity({ resistivityOhmCm: 1, dopant: d });
      if (!o.ok) throw new Error(o.refusal.code);
      return o.value.model.id;
    };
    expect(pick('boron')).toBe('f723');
    expect(pick('phosphorus')).toBe('f723');
    expect(pick('arsenic')).toBe('masetti-1983');
  });
  // ASTM F723-99 allows its phosphorus conversion for Sb except near solid solubility.
  it('antimony below 1e19 uses the F723 phosphorus conversion with a substitute_model note', () => {
    const o = convertResistivityToDensity({ resistivityOhmCm: 0.05, dopant: 'antimony' });
    if (!o.ok) throw new Error(o.refusal.code);
    expect(o.value.model.id).toBe('f723-phosphorus-for-as-sb');
    expect(o.value.dopantDensityPerCm3).toBeLessThan(1e19);
    expect(o.value.problems.map((p) => p.code)).toContain('substitute_model');
  });
  it('antimony above 1e19 uses the Masetti arsenic form with an estimate_only warning', () => {
    const o = convertResistivityToDensity({ resistivityOhmCm: 0.001, dopant: 'antimony' });
    if (!o.ok) throw new Error(o.refusal.code);
    expect(o.value.model.id).toBe('masetti-1983-as-for-sb');
    expect(o.value.dopantDensityPerCm3).toBeGreaterThan(1e19);
    expect(o.value.problems.map((p) => p.code)).toEqual(expect.arrayContaining(['substitute_model', 'estimate_only']));
    const d = convertDensityToResistivity({ dopantDensityPerCm3: 5e19, dopant: 'antimony' });
    if (!d.ok) throw new Error(d.refusal.code);
    expect(d.value.model.id).toBe('masetti-1983-as-for-sb');
  });
  it('`model f723` with arsenic follows the standard to its phosphorus conversion', () => {
    const o = convertResistivityToDensity({ resistivityOhmCm: 0.1, dopant: 'arsenic', modelId: 'f723' });
    if (!o.ok) throw new Error(o.refusal.code);
    expect(o.value.model.id).toBe('f723-phosphorus-for-as-sb');
  });
  it('warns outside the validity range and near its edges, refuses far beyond', () => {
    const out = convertResistivityToDensity({ resistivityOhmCm: 2e4, dopant: 'boron' });
    if (!out.ok) throw new Error(out.refusal.code);
    expect(out.value.problems).toContainEqual(expect.objectContaining({ code: 'outside_validity', quantity: 'resistivityOhmCm', max: 1e4 }));
    const near = convertResistivityToDensity({ resistivityOhmCm: 9.5e3, dopant: 'boron' });
    if (!near.ok) throw new Error(near.refusal.code);
    expect(near.value.problems).toContainEqual(expect.objectContaining({ code: 'near_boundary', boundary: 1e4 }));
    const far = convertResistivityToDensity({ resistivityOhmCm: 1e8, dopant: 'boron' });
    expect(far.ok).toBe(false);
    if (!far.ok) expect(far.refusal.code).toBe('outside_domain');
  });
  it('states its assumptions: uncompensated, full ionization, and the temperature of the model', () => {
    const f = convertResistivityToDensity({ resistivityOhmCm: 1, dopant: 'boron' });
    const m = convertResistivityToDensity({ resistivityOhmCm: 1, dopant: 'boron', modelId: 'masetti' });
    if (!f.ok || !m.ok) throw new Error('refused');
    expect(f.value.assumptionCodes).toEqual(expect.arrayContaining(['uncompensated', 'full_ionization', 'temperature_23C']));
    expect(m.value.assumptionCodes).toEqual(expect.arrayContaining(['uncompensated', 'full_ionization', 'temperature_300K']));
  });
  it('reports μ = 1/(qNρ) and the carrier type of the dopant', () => {
    const o = convertResistivityToDensity({ resistivityOhmCm: 8.2, dopant: 'boron' });
    if (!o.ok) throw new Error(o.refusal.code);
    const v = o.value;
    expect(v.mobilityCm2PerVs).toBeWithinRelative(1 / (ELEMENTARY_CHARGE_C * v.dopantDensityPerCm3 * v.resistivityOhmCm), 1e-12);
    expect(v.carrierType).toBe('p');
  });
  // Round trips within each model's own consistency: F723's stated 3 % (B) and 4.5 % (P)
  // (ASTM F723-99; 5 % for P to cover the 4.74 % found at the bottom edge, see
  // astm-f723.test.ts); the mobility models are exact inverses up to the root finder's 1e-9.
  it('ρ→N→ρ round trips within each model’s stated consistency, every model and dopant (property)', () => {
    for (const model of CONVERSION_MODELS) {
      for (const dopant of model.dopants) {
        const valid = model.validity[dopant]?.resistivityOhmCm;
        const dom = model.domain[dopant]?.resistivityOhmCm;
        if (!valid || !dom) continue;
        // Where the model is both valid and computable (a validity edge may be open, e.g. N ≥ 0).
        const range = { min: Math.max(valid.min, dom.min) * (1 + 1e-9), max: Math.min(valid.max, dom.max) * (1 - 1e-9) };
        const tol = model.id === 'f723' ? (dopant === 'boron' ? 0.03 : 0.05) : model.id.startsWith('f723') ? 0.05 : 1e-9;
        fc.assert(
          fc.property(fc.double({ min: Math.log10(range.min), max: Math.log10(range.max), noNaN: true }), (x) => {
            const rho = Math.pow(10, x);
            const a = convertResistivityToDensity({ resistivityOhmCm: rho, dopant, modelId: model.id });
            if (!a.ok) return false;
            const b = convertDensityToResistivity({ dopantDensityPerCm3: a.value.dopantDensityPerCm3, dopant, modelId: model.id });
            return b.ok && Math.abs(b.value.resistivityOhmCm / rho - 1) <= tol;
          }),
          { numRuns: 200 },
        );
      }
    }
  });
  it('N decreases as ρ increases through the public API, every model and dopant (property)', () => {
    for (const model of CONVERSION_MODELS) {
      for (const dopant of model.dopants) {
        const edge = model.domain[dopant]?.resistivityOhmCm;
        if (!edge) continue;
        const dom = { min: edge.min * (1 + 1e-9), max: edge.max * (1 - 1e-9) };
        fc.assert(
          fc.property(
            fc.double({ min: Math.log10(dom.min), max: Math.log10(dom.max), noNaN: true }),
            fc.double({ min: Math.log10(dom.min), max: Math.log10(dom.max), noNaN: true }),
            (x1, x2) => {
              if (Math.abs(x1 - x2) < 1e-6) return true;
              const [lo, hi] = x1 < x2 ? [x1, x2] : [x2, x1];
              const a = convertResistivityToDensity({ resistivityOhmCm: Math.pow(10, lo), dopant, modelId: model.id });
              const b = convertResistivityToDensity({ resistivityOhmCm: Math.pow(10, hi), dopant, modelId: model.id });
              return a.ok && b.ok && b.value.dopantDensityPerCm3 < a.value.dopantDensityPerCm3;
            },
          ),
          { numRuns: 200 },
        );
      }
    }
  });
  it('never returns NaN for any finite positive input: a value or a refusal (property)', () => {
    const positive = fc.double({ min: Number.MIN_VALUE, max: Number.MAX_VALUE, noNaN: true });
    const modelId = fc.option(fc.constantFrom(...CONVERSION_MODELS.map((m) => m.id)), { nil: undefined });
    fc.assert(
      fc.property(positive, fc.constantFrom(...DOPANTS), modelId, (x, dopant, id) => {
        for (const o of [
          convertResistivityToDensity(id === undefined ? { resistivityOhmCm: x, dopant } : { resistivityOhmCm: x, dopant, modelId: id }),
          convertDensityToResistivity(id === undefined ? { dopantDensityPerCm3: x, dopant } : { dopantDensityPerCm3: x, dopant, modelId: id }),
        ]) {
          if (o.ok) {
            const v = o.value;
            if (![v.resistivityOhmCm, v.dopantDensityPerCm3, v.mobilityCm2PerVs].every((n) => Number.isFinite(n) && n > 0)) return false;
          } else if (typeof o.refusal.code !== 'string') return false;
        }
        return true;
      }),
      { numRuns: 3000 },
    );
  });
});
