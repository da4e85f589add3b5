/**
 * Finite-thickness correction for a collinear, equally spaced four-point probe on a slice
 * with an insulating (non-conducting) bottom face.
 *
 *   ρ = (π/ln2)·t·(V/I)·F(t/s)
 *
 * Method: images of the current sources in the two faces (A. Uhlir Jr., "The potentials of
 *   infinite systems of sources and numerical solutions of problems in semiconductor
 *   engineering", Bell Syst. Tech. J. 34, 105 (1955); tabulated by F. M. Smits, Bell Syst.
 *   Tech. J. 37, 711 (1958)). With τ = t/s the exact sum is
 *
 *   F(τ) = ln2 / (τ·(1/2 + 2·Σₙ≥₁ [1/√(1 + (2nτ)²) − 1/√(4 + (2nτ)²)]))        (images)
 *        = ln2 / (ln2 + 2·Σₘ≥₁ [K0(mπ/τ) − K0(2mπ/τ)])                          (Bessel form)
 *
 * The two forms are the same potential summed two ways (Poisson summation); the Bessel form
 * converges fast for thin slices, the image form for thick ones, and the tests check that
 * they agree. Limits: F → 1 as τ → 0 (thin sheet); F·τ → 2·ln2 as τ → ∞, i.e. ρ → 2πs·V/I
 * (semi-infinite bulk, L. B. Valdes, Proc. IRE 42, 420 (1954)).
 *
 * The closed form F ≈ ln2/ln(sinh(τ)/sinh(τ/2)) that textbooks quote (docs/references.md) has the
 * same two limits but is NOT the image solution in between: at τ = 1 it gives 0.852 where the
 * image sum (and Smits's table, recalled from memory: 0.9214) give 0.9215; at τ = 0.725 (a
 * 725 µm wafer under a 1 mm head) 0.93 against 0.98. We use the exact sum, and keep the
 * closed form, clearly named, only for comparison. Accuracy of this file: |ΔF| < 1e-7
 * (Bessel K0 by Abramowitz & Stegun 9.8.6, |ε| < 1.9e-7 relative; image tail by the midpoint
 * integral).
 *
 * Validity: any τ > 0 for a uniform slice on an insulating base, probes far from edges
 * (edges: src/physics/four-point/smits-1958-diameter.ts). A conducting base (e.g. a layer on
 * a low-resistivity substrate of the same type) needs a different factor: not provided.
 */

/** K0(x) for x ≥ 2: Abramowitz & Stegun (1964), eq. 9.8.6, |ε| < 1.9e-7 on x^½·eˣ·K0(x). */
export function besselK0Large(x: number): number {
  const y = 2 / x;
  const poly =
    1.25331414 +
    y * (-0.07832358 + y * (0.02189568 + y * (-0.01062446 + y * (0.00587872 + y * (-0.0025154 + y * 0.00053208)))));
  return (Math.exp(-x) / Math.sqrt(x)) * poly;
}

/** Bessel form; needs π/τ ≥ 2 (τ ≤ π/2). */
export function thicknessFactorBesselSeries(thicknessOverSpacing: number): number {
  const tau = thicknessOverSpacing;
  let sum = 0;
  for (let m = 1; m < 200; m++) {
    const term = besselK0Large((m * Math.PI) / tau) - besselK0Large((2 * m * Math.PI) / tau);
    sum += term;
    if (Math.abs(term) < 1e-18) break;
  }
  return Math.LN2 / (Math.LN2 + 2 * sum);
}

/** Image form with `terms` explicit images and the midpoint-integral tail. */
export function thicknessFactorImageSeries(thicknessOverSpacing: number, terms?: number): number {
  const tau = thicknessOverSpacing;
  const n = terms ?? Math.ceil(40 / tau) + 40;
  let sum = 0;
  for (let k = 1; k <= n; k++) {
    const z = 2 * k * tau;
    sum += 1 / Math.sqrt(1 + z * z) - 1 / Math.sqrt(4 + z * z);
  }
  const m = n + 0.5;
  // ∫ₘ^∞ [1/√(1+(2xτ)²) − 1/√(4+(2xτ)²)] dx = (ln2 − asinh(2mτ) + asinh(mτ)) / (2τ)
  sum += (Math.LN2 - Math.asinh(2 * m * tau) + Math.asinh(m * tau)) / (2 * tau);
  return Math.LN2 / (tau * (0.5 + 2 * sum));
}

/** Switch between the forms; both are accurate far beyond it. */
const SWITCH_TAU = 1.5;

/**
 * F(t/s), insulating bottom. Kernel: 1 at t/s = 0 (limit); NaN for t/s < 0 or NaN;
 * 0 for t/s = ∞ (since F·τ → 2 ln2).
 */
export function thicknessCorrectionFactor(thicknessOverSpacing: number): number {
  const tau = thicknessOverSpacing;
  if (Number.isNaN(tau) || tau < 0) return Number.NaN;
  if (tau === 0) return 1;
  if (tau === Number.POSITIVE_INFINITY) return 0;
  return tau <= SWITCH_TAU ? thicknessFactorBesselSeries(tau) : thicknessFactorImageSeries(tau);
}

/**
 * The textbook closed form ln2/ln(sinh(τ)/sinh(τ/2)) = ln2/ln(2·cosh(τ/2)), written stably.
 * For comparison only: it does not reproduce the image solution between the limits.
 */
export function thicknessCorrectionFactorClosedForm(thicknessOverSpacing: number): number {
  const u = thicknessOverSpacing / 2;
  if (Number.isNaN(u) || u < 0) return Number.NaN;
  // ln(2·cosh u) = u + ln(1 + e^(−2u)), no overflow for large u
  return Math.LN2 / (u + Math.log1p(Math.exp(-2 * u)));
}

export const THICKNESS_FACTOR_CITATION =
  'A. Uhlir Jr., Bell Syst. Tech. J. 34, 105 (1955) (method of images); F. M. Smits, Bell Syst. Tech. J. 37, 711 (1958)';

/** The equations as the reply's `why` should state them. */
export const THICKNESS_FACTOR_EQUATIONS: readonly string[] = [
  'ρ = Rs·t·F(t/s); F = ln2 / (τ·(½ + 2·Σₙ [1/√(1 + (2nτ)²) − 1/√(4 + (2nτ)²)])), τ = t/s (images in both faces, insulating bottom)',
  'F → 1 for t ≪ s; F·(t/s) → 2·ln2 for t ≫ s (ρ → 2πs·V/I)',
];
