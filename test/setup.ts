import { expect } from 'vitest';

/**
 * Relative-tolerance matcher for quantities that span decades (dopant densities, resistivities).
 * The message prints actual, expected, the relative delta and the tolerance.
 */
expect.extend({
  toBeWithinRelative(received: number, expected: number, relTol: number) {
    const ok =
      Number.isFinite(received) &&
      Number.isFinite(expected) &&
      Math.abs(received - expected) <= relTol * Math.abs(expected);
    const delta = expected === 0 ? Number.NaN : (received - expected) / expected;
    return {
      pass: ok,
      message: () =>
        `expected ${received} ${ok ? 'not ' : ''}to be within ${(relTol * 100).toPrecision(3)} % of ${expected}` +
        ` (relative delta ${(delta * 100).toPrecision(4)} %)`,
    };
  },
});

interface RelativeMatchers<R = unknown> {
  toBeWithinRelative(expected: number, relTol: number): R;
}

declare module 'vitest' {
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type
  interface Matchers<T = any> extends RelativeMatchers<T> {}
}
