import { describe, expect, it } from 'vitest';
import { carrierTypeFromReading } from '../../../src/physics/type/classify.js';

describe('surface photovoltage sign', () => {
  // Derived (docs/references.md): illumination flattens the upward band bending of a depleted n-type
  // surface, so the surface potential moves positive on n-type.
  it('positive SPV reads n-type, negative p-type; 1 mV default band', () => {
    const n = carrierTypeFromReading({ method: 'spv', reading: 0.015 });
    const p = carrierTypeFromReading({ method: 'spv', reading: -0.015 });
    const z = carrierTypeFromReading({ method: 'spv', reading: 5e-4 });
    expect(n.ok && n.value.carrierType).toBe('n');
    expect(p.ok && p.value.carrierType).toBe('p');
    expect(z.ok && z.value.carrierType).toBe('indeterminate');
    expect(z.ok && z.value.noiseBand).toBe(1e-3);
  });
  it('names its convention and that it is not an ASTM F42 method', () => {
    const o = carrierTypeFromReading({ method: 'spv', reading: 0.01 });
    expect(o.ok && o.value.source).toMatch(/not an ASTM F42 method/);
    expect(o.ok && o.value.conventionText).toMatch(/n-type/);
  });
});
