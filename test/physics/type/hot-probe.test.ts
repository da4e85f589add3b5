import { describe, expect, it } from 'vitest';
import { carrierTypeFromReading } from '../../../src/physics/type/classify.js';

function typeOf(req: Parameters<typeof carrierTypeFromReading>[0]) {
  const o = carrierTypeFromReading(req);
  if (!o.ok) throw new Error(o.refusal.code);
  return o.value;
}

describe('hot and cold probe', () => {
  // Source: B. Van Zeghbroeck, Principles of Semiconductor Devices (University of Colorado,
  // online textbook), §2.4.7.9 "The hot-probe experiment": hot probe on the meter's + terminal,
  // n-type gives a positive reading, p-type a negative one.
  it('hot probe on the + terminal: positive reads n-type, negative p-type (Van Zeghbroeck §2.4.7.9)', () => {
    expect(typeOf({ method: 'hot', reading: 2.1e-3 }).carrierType).toBe('n');
    expect(typeOf({ method: 'hot', reading: -1.4e-3 }).carrierType).toBe('p');
  });
  // Derived from the same physics: the cold contact gathers the majority carriers, so the sign
  // reverses with the cold probe on the + terminal.
  it('cold probe on the + terminal: the sign is reversed (derived from the same thermoelectric physics)', () => {
    expect(typeOf({ method: 'cold', reading: 2.1e-3 }).carrierType).toBe('p');
    expect(typeOf({ method: 'cold', reading: -2.1e-3 }).carrierType).toBe('n');
  });
  it('a reading inside the 0.1 mV default band is indeterminate, and says so', () => {
    const v = typeOf({ method: 'hot', reading: 5e-5 });
    expect(v.carrierType).toBe('indeterminate');
    expect(v.noiseBand).toBe(1e-4);
    expect(v.noiseBandUnit).toBe('V');
    expect(v.noiseBandBasis).toMatch(/common practice, no source/);
    expect(v.problems).toContainEqual(expect.objectContaining({ code: 'indeterminate_reading' }));
  });
  it('takes a configured noise band', () => {
    expect(typeOf({ method: 'hot', reading: 5e-4, noiseBandV: 1e-3 }).carrierType).toBe('indeterminate');
    expect(typeOf({ method: 'hot', reading: 5e-4, noiseBandV: 1e-5 }).carrierType).toBe('n');
  });
  // Source: ASTM F42 (SEMI MF42) scope: thermal EMF dependable up to 1000 Ω·cm in Si; cold probe
  // in Ge up to 20 Ω·cm. docs/references.md: near-intrinsic Si may read n on a thermal probe.
  it('cautions above 1000 Ω·cm in Si (ASTM F42) and that high-resistivity Si may read n', () => {
    const v = typeOf({ method: 'hot', reading: -3e-3, resistivityOhmCm: 2500 });
    expect(v.problems).toContainEqual(expect.objectContaining({ code: 'method_range', max: 1000, standard: expect.stringMatching(/F42/) }));
    expect(v.problems).toContainEqual({ code: 'mixed_conduction', method: 'hot' });
    expect(typeOf({ method: 'hot', reading: -3e-3, resistivityOhmCm: 500 }).problems).toEqual([]);
  });
  it('cautions a cold probe on Ge above 20 Ω·cm (ASTM F42)', () => {
    const v = typeOf({ method: 'cold', reading: 1e-3, resistivityOhmCm: 40, material: 'Ge' });
    expect(v.problems).toContainEqual(expect.objectContaining({ code: 'method_range', max: 20 }));
  });
  it('cautions on epitaxial layers (ASTM F42: not tested on epitaxial layers)', () => {
    expect(typeOf({ method: 'hot', reading: 1e-3, epitaxial: true }).problems).toContainEqual({ code: 'epitaxial_caution', method: 'hot' });
  });
  it('flags a reading that contradicts the expected type', () => {
    expect(typeOf({ method: 'hot', reading: 1e-3, expect: 'p' }).problems).toContainEqual({ code: 'type_mismatch', expected: 'p', found: 'n' });
    expect(typeOf({ method: 'hot', reading: 1e-3, expect: 'n' }).problems).toEqual([]);
  });
  it('refuses a non-finite reading, a negative band and a nonpositive resistivity', () => {
    expect(carrierTypeFromReading({ method: 'hot', reading: Number.NaN }).ok).toBe(false);
    expect(carrierTypeFromReading({ method: 'hot', reading: 1e-3, noiseBandV: -1 }).ok).toBe(false);
    expect(carrierTypeFromReading({ method: 'hot', reading: 1e-3, resistivityOhmCm: 0 }).ok).toBe(false);
  });
});
