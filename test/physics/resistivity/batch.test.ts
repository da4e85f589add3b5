/**
 * The batch path gives exactly what the single conversion gives, value by value (the single
 * conversion is checked against ASTM F723, Masetti 1983 and the others in their own tests), for
 * every dopant and every model, including values outside the validity range and the domain.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BATCH_OK, BATCH_OUTSIDE_VALIDITY, BATCH_REFUSED, convertDensityBatch, convertResistivityBatch } from '../../../src/physics/resistivity/batch.js';
import { convertDensityToResistivity, convertResistivityToDensity } from '../../../src/physics/resistivity/convert.js';
import type { Dopant } from '../../../src/physics/types.js';

const DOPANTS: Dopant[] = ['boron', 'phosphorus', 'arsenic', 'antimony'];
const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);

describe('batch conversions agree with the single conversion', () => {
  for (const dopant of DOPANTS) {
    for (const modelId of [undefined, 'masetti-1983', 'caughey-thomas-1967']) {
      it(`ρ → N, ${dopant}, ${modelId ?? 'default model'}`, () => {
        fc.assert(
          fc.property(fc.array(logUniform(1e-6, 1e7), { minLength: 1, maxLength: 40 }), (rhos) => {
            const b = convertResistivityBatch(Float64Array.from(rhos), dopant, modelId);
            const single = rhos.map((r) => convertResistivityToDensity({ resistivityOhmCm: r, dopant, ...(modelId ? { modelId } : {}) }));
            if (!b.ok) {
              expect(single.every((s) => !s.ok && (s.refusal.code === 'model_dopant' || s.refusal.code === 'unknown_model'))).toBe(true);
              return;
            }
            single.forEach((s, i) => {
              if (!s.ok) {
                expect(b.value.status[i]).toBe(BATCH_REFUSED);
                expect(b.value.out[i]).toBeNaN();
              } else {
                // Same kernel, same inputs: identical to the last bit.
                expect(b.value.out[i]).toBe(s.value.dopantDensityPerCm3);
                expect(b.value.status[i]).toBe(s.value.problems.some((p) => p.code === 'outside_validity') ? BATCH_OUTSIDE_VALIDITY : BATCH_OK);
              }
            });
          }),
          { numRuns: 60 },
        );
      });
    }
    it(`N → ρ, ${dopant}, default model`, () => {
      fc.assert(
        fc.property(fc.array(logUniform(1e10, 1e22), { minLength: 1, maxLength: 40 }), (ns) => {
          const b = convertDensityBatch(Float64Array.from(ns), dopant);
          expect(b.ok).toBe(true);
          if (!b.ok) return;
          ns.forEach((n, i) => {
            const s = convertDensityToResistivity({ dopantDensityPerCm3: n, dopant });
            if (s.ok) expect(b.value.out[i]).toBe(s.value.resistivityOhmCm);
            else expect(b.value.status[i]).toBe(BATCH_REFUSED);
          });
        }),
        { numRuns: 60 },
      );
    });
  }

  it('zero, negative, infinite and NaN readings are refused one by one, the rest converted', () => {
    const b = convertResistivityBatch(Float64Array.from([8.2, 0, -1, Infinity, NaN, 0.01]), 'boron');
    expect(b.ok && [...b.value.status]).toEqual([BATCH_OK, BATCH_REFUSED, BATCH_REFUSED, BATCH_REFUSED, BATCH_REFUSED, BATCH_OK]);
  });

  it('an unknown model is refused for the whole batch', () => {
    const b = convertResistivityBatch(Float64Array.from([8.2]), 'boron', 'astm-f732');
    expect(!b.ok && b.refusal.code).toBe('unknown_model');
  });
});
