/** The window check and its margins: definitions (docs/lots.md), checked by hand and by property. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { windowCheck } from '../../src/lots/checks/window.js';

describe('window check', () => {
  it('margins worked by hand on the 8–12 Ω·cm window', () => {
    expect(windowCheck('resistivityOhmCm', 9, { min: 8, max: 12 })).toMatchObject({ status: 'pass', limit: 'min', marginPercent: 12.5 });
    expect(windowCheck('resistivityOhmCm', 11.4, { min: 8, max: 12 }).limit).toBe('max');
    expect(windowCheck('resistivityOhmCm', 11.4, { min: 8, max: 12 }).marginPercent).toBeWithinRelative(5, 1e-12);
    expect(windowCheck('resistivityOhmCm', 12.9, { min: 8, max: 12 }).marginPercent).toBeWithinRelative(7.5, 1e-12);
    expect(windowCheck('resistivityOhmCm', 7.2, { min: 8, max: 12 })).toMatchObject({ status: 'fail', limit: 'min' });
    expect(windowCheck('resistivityOhmCm', 7.2, { min: 8, max: 12 }).marginPercent).toBeWithinRelative(10, 1e-12);
    // On the limit: inside, with no margin.
    expect(windowCheck('resistivityOhmCm', 12, { min: 8, max: 12 })).toMatchObject({ status: 'pass', marginPercent: 0 });
  });

  it('passes exactly inside the window; the margin is never negative and grows away from the limit outside', () => {
    const window = fc
      .tuple(fc.double({ min: 1e-4, max: 1e4, noNaN: true }), fc.double({ min: 1.001, max: 100, noNaN: true }))
      .map(([min, k]) => ({ min, max: min * k }));
    fc.assert(
      fc.property(window, fc.double({ min: 1e-6, max: 1e7, noNaN: true }), (w, v) => {
        const c = windowCheck('resistivityOhmCm', v, w);
        expect(c.status === 'pass').toBe(v >= w.min && v <= w.max);
        expect(c.marginPercent).toBeGreaterThanOrEqual(0);
        if (c.status === 'fail' && c.limit === 'max') {
          expect(windowCheck('resistivityOhmCm', v * 1.01, w).marginPercent).toBeGreaterThan(c.marginPercent);
        }
      }),
    );
  });
});
