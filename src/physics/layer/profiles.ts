/**
 * Dopant profiles of a diffused layer, fixed by the surface concentration Cs, the background
 * density N_B of the opposite kind and the metallurgical junction depth xj (where the diffused
 * density falls to N_B).
 *
 * - erfc (constant-source, "predeposition" diffusion): N(x) = Cs·erfc(x/L), L = 2·√(D·t).
 *   From N(xj) = N_B: L = xj / erfc⁻¹(N_B/Cs).
 * - Gaussian (limited-source, "drive-in" diffusion or an implant's half-profile with its peak
 *   at the surface): N(x) = Cs·exp(−(x/L)²), L = 2·√(D·t). From N(xj) = N_B: L = xj/√(ln(Cs/N_B)).
 * Source of both forms: the solutions of Fick's second law for these boundary conditions, as
 * used for the diffused-layer curves of J. C. Irvin, "Resistivity of bulk silicon and of
 * diffused layers in silicon", Bell Syst. Tech. J. 41, 387–410 (1962); textbook, e.g.
 * S. M. Sze, VLSI Technology, 2nd ed. (1988), ch. 7.
 * Kernels: never throw; NaN when Cs ≤ N_B (no junction) or for NaN input.
 */
import { erfc, erfcInverse } from '../numeric/erfc.js';

export type ProfileShape = 'erfc' | 'gaussian';

export interface ProfileDescriptor {
  readonly shape: ProfileShape;
  readonly name: string;
  readonly equation: string;
  /** Characteristic length L (cm) that puts the junction at xj. */
  lengthCm(surfaceConcentrationPerCm3: number, backgroundDensityPerCm3: number, junctionDepthCm: number): number;
  /** Diffused-dopant density at depth x (cm), for Cs and L. */
  densityPerCm3(surfaceConcentrationPerCm3: number, lengthCm: number, depthCm: number): number;
}

export const ERFC_PROFILE: ProfileDescriptor = {
  shape: 'erfc',
  name: 'complementary error function (constant-source diffusion)',
  equation: 'N(x) = Cs·erfc(x/L), L = xj / erfc⁻¹(N_B/Cs)',
  lengthCm(cs, nb, xj) {
    if (!(cs > nb) || !(nb > 0)) return Number.NaN;
    return xj / erfcInverse(nb / cs);
  },
  densityPerCm3(cs, l, x) {
    return cs * erfc(x / l);
  },
};

export const GAUSSIAN_PROFILE: ProfileDescriptor = {
  shape: 'gaussian',
  name: 'Gaussian (limited-source diffusion, peak at the surface)',
  equation: 'N(x) = Cs·exp(−(x/L)²), L = xj / √(ln(Cs/N_B))',
  lengthCm(cs, nb, xj) {
    if (!(cs > nb) || !(nb > 0)) return Number.NaN;
    return xj / Math.sqrt(Math.log(cs / nb));
  },
  densityPerCm3(cs, l, x) {
    const u = x / l;
    return cs * Math.exp(-u * u);
  },
};

export const PROFILES: Readonly<Record<ProfileShape, ProfileDescriptor>> = {
  erfc: ERFC_PROFILE,
  gaussian: GAUSSIAN_PROFILE,
};
