/**
 * Finite-diameter correction for a collinear, equally spaced four-point probe at the centre
 * of a thin circular slice, the probe line along a diameter.
 *
 *   Rs = C(d/s)·V/I,   C = π / (ln2 + ln(((d/s)² + 3)/((d/s)² − 3)))
 *
 * Source: F. M. Smits, "Measurement of sheet resistivities with the four-point probe",
 *   Bell Syst. Tech. J. 37, 711 (1958); values tabulated in NBS Technical Note 199
 *   (L. J. Swartzendruber, 1964). The formula is the exact image solution for a thin disc
 *   (the image of a source at distance a from the centre sits at (d/2)²/a with the same
 *   sign); docs/references.md [C]: it reproduces two values quoted from TN 199.
 *
 * Limits: C → π/ln2 ≈ 4.5324 as d/s → ∞ (infinite sheet). C is undefined for d/s ≤ √3
 * (the outer probes would sit on or beyond the edge): the kernel returns NaN there and the
 * public API refuses.
 * Combined with the thickness factor the two corrections are applied as a product, which
 * is exact only when one of them is ≈ 1 (thin slice, or a slice wide compared with s).
 */

export const THIN_SHEET_FACTOR = Math.PI / Math.LN2;
export const DIAMETER_RATIO_MIN = Math.sqrt(3);

/** C(d/s). Kernel: NaN for d/s ≤ √3 or NaN; π/ln2 for d/s = ∞. */
export function diameterCorrectionFactor(diameterOverSpacing: number): number {
  const r = diameterOverSpacing;
  if (Number.isNaN(r) || r <= DIAMETER_RATIO_MIN) return Number.NaN;
  if (r === Number.POSITIVE_INFINITY) return THIN_SHEET_FACTOR;
  // ln((r²+3)/(r²−3)) = log1p(6/(r²−3)), precise for large r
  return Math.PI / (Math.LN2 + Math.log1p(6 / (r * r - 3)));
}

export const DIAMETER_FACTOR_CITATION =
  'F. M. Smits, Bell Syst. Tech. J. 37, 711 (1958); tabulated in NBS Technical Note 199 (Swartzendruber, 1964)';

/** The equation as the reply's `why` should state it. */
export const DIAMETER_FACTOR_EQUATION = 'Rs = C·V/I, C(d/s) = π / (ln2 + ln(((d/s)² + 3)/((d/s)² − 3))); C → π/ln2 for d ≫ s';
