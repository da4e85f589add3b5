import { describe, expect, it } from 'vitest';
import { ELEMENTARY_CHARGE_C } from '../../../src/physics/constants.js';
import { HALL_DEFAULT_NOISE_BAND_CM3_PER_C, intrinsicResistivityOhmCm } from '../../../src/physics/type/hall.js';
import { carrierTypeFromReading } from '../../../src/physics/type/classify.js';

describe('Hall coefficient sign', () => {
  // Source: the Hall effect, R_H = −1/(qn) for electrons (e.g. S. M. Sze, Physics of Semiconductor
  // Devices, 2nd ed., 1981, ch. 1): negative means n-type.
  it('negative R_H reads n-type, positive p-type (Sze 1981)', () => {
    const n = carrierTypeFromReading({ method: 'hall', reading: -1.3e3 });
    const p = carrierTypeFromReading({ method: 'hall', reading: 4.2e2 });
    expect(n.ok && n.value.carrierType).toBe('n');
    expect(p.ok && p.value.carrierType).toBe('p');
  });
  it('default band is 1/(q·1e22 cm⁻³) in cm³/C', () => {
    expect(HALL_DEFAULT_NOISE_BAND_CM3_PER_C).toBeWithinRelative(1 / (ELEMENTARY_CHARGE_C * 1e22), 1e-12);
    const o = carrierTypeFromReading({ method: 'hall', reading: 1e-4 });
    expect(o.ok && o.value.carrierType).toBe('indeterminate');
    expect(o.ok && o.value.noiseBandUnit).toBe('cm³/C');
  });
  // Intrinsic Si at 300 K: ρ_i ≈ 3e5 Ω·cm (textbook order, e.g. Sze 1981 quotes 2.3e5, from memory, with the
  // older n_i 1.45e10; with n_i = 9.7e9 it scales to about 3.4e5). Tolerance 20 %: n_i and the
  // lattice mobilities differ between sources.
  it('intrinsic resistivity of Si is about 3.4e5 Ω·cm (Sze 1981 rescaled to the current n_i)', () => {
    expect(intrinsicResistivityOhmCm('Si')).toBeWithinRelative(2.3e5 * (1.45e10 / 9.7e9), 0.2);
  });
  it('cautions mixed conduction in near-intrinsic material only', () => {
    const hi = carrierTypeFromReading({ method: 'hall', reading: 5e4, resistivityOhmCm: 1e5 });
    expect(hi.ok && hi.value.problems).toContainEqual({ code: 'mixed_conduction', method: 'hall' });
    const lo = carrierTypeFromReading({ method: 'hall', reading: 5e4, resistivityOhmCm: 10 });
    expect(lo.ok && lo.value.problems).toEqual([]);
  });
});
