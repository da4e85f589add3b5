import { describe, expect, it } from 'vitest';
import { carrierTypeFromReading } from '../../../src/physics/type/classify.js';

describe('point-contact rectification', () => {
  // Derived (metal–semiconductor contact physics, e.g. Sze 1981 ch. 5): a metal point on n-type
  // conducts easily with the point positive.
  it('easy conduction with the point positive reads n-type; negative, p-type', () => {
    const n = carrierTypeFromReading({ method: 'point', reading: 1 });
    const p = carrierTypeFromReading({ method: 'point', reading: -1 });
    expect(n.ok && n.value.carrierType).toBe('n');
    expect(p.ok && p.value.carrierType).toBe('p');
    const z = carrierTypeFromReading({ method: 'point', reading: 0 });
    expect(z.ok && z.value.carrierType).toBe('indeterminate');
  });
  // Source: ASTM F42 (SEMI MF42) scope: rectification dependable 1–1000 Ω·cm in Si, not for Ge.
  it('cautions outside 1–1000 Ω·cm and on Ge (ASTM F42)', () => {
    const low = carrierTypeFromReading({ method: 'point', reading: 1, resistivityOhmCm: 0.5 });
    expect(low.ok && low.value.problems).toContainEqual(expect.objectContaining({ code: 'method_range', min: 1, max: 1000 }));
    const ok = carrierTypeFromReading({ method: 'point', reading: 1, resistivityOhmCm: 5 });
    expect(ok.ok && ok.value.problems).toEqual([]);
    const ge = carrierTypeFromReading({ method: 'point', reading: 1, material: 'Ge' });
    expect(ge.ok && ge.value.problems).toContainEqual(expect.objectContaining({ code: 'method_not_covered', material: 'Ge' }));
  });
});
