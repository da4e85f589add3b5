/**
 * x^y for x ≥ 0, written exp(y·ln x). V8's Math.pow takes about twice as long on the hot paths of
 * the mobility models (measured 2026-12-02, bench/physics.bench.ts: 45 → 22 ns per F723 element).
 * The result differs from Math.pow by a few units in the last place: the relative error is about
 * |y·ln x|·2⁻⁵³, under 1e-14 for every density and temperature the core accepts. For x = 0 it
 * gives 0 (y > 0) or +∞ (y < 0), as Math.pow does; a negative x gives NaN.
 */
export function powPositive(base: number, exponent: number): number {
  return Math.exp(exponent * Math.log(base));
}
