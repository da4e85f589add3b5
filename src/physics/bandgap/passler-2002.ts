/**
 * Band gap of silicon against temperature, Pässler's dispersion-related form.
 *
 * Source: R. Pässler, "Dispersion-related description of temperature dependencies of band gaps
 *   in semiconductors", Phys. Rev. B 66, 085201 (2002).
 *
 *   Eg(T) = Eg(0) − α·Θ·[ (1 − 3Δ²) / (exp(Θ/T) − 1)
 *                        + (3Δ²/2)·( (1 + π²/(3(1+Δ²))·x² + (3Δ²−1)/4·x³ + (8/3)·x⁴ + x⁶)^(1/6) − 1 ) ],
 *   x = 2T/Θ.
 *
 * | parameter | value    | unit |
 * |-----------|----------|------|
 * | Eg(0)     | 1.170    | eV   |
 * | α         | 3.23e-4  | eV/K |
 * | Θ         | 446      | K    |
 * | Δ         | 0.51     |      |
 *
 * The silicon parameters are those of the paper as used by independent public implementations
 * (see docs/references.md: verified via secondary sources). The form reproduces M. A. Green's
 * table of the silicon gap (J. Appl. Phys. 67, 2944 (1990), after Bludau et al. 1974) to
 * 0.3 meV from 4 K to 400 K, 1.0 meV at 450 K and 2.1 meV at 500 K (checked in the tests).
 * Validity we state: 0–500 K, the range checked; beyond it the value is an extrapolation.
 *
 * Used by the Couderc–Amara–Lemiti intrinsic density (couderc-2014.ts); the Varshni–Thurmond
 * gap (varshni-thurmond-1975.ts) stays the gap of the other models and materials.
 */
import type { Parameter, Range } from '../types.js';

export const PASSLER_2002_SILICON = { gapAtZeroEv: 1.17, alphaEvPerK: 3.23e-4, thetaK: 446, delta: 0.51 } as const;

export const PASSLER_VALIDITY_TEMPERATURE_K: Range = { min: 0, max: 500 };

export const PASSLER_CITATION =
  'R. Pässler, "Dispersion-related description of temperature dependencies of band gaps in semiconductors", Phys. Rev. B 66, 085201 (2002)';

/** Eg(T) of silicon in eV; Eg(0) at T ≤ 0. */
export function passlerSiliconBandgapEv(temperatureK: number): number {
  const { gapAtZeroEv, alphaEvPerK, thetaK, delta } = PASSLER_2002_SILICON;
  if (!(temperatureK > 0)) return gapAtZeroEv;
  const d2 = delta * delta;
  const x = (2 * temperatureK) / thetaK;
  const x2 = x * x;
  const x3 = x2 * x;
  const x4 = x2 * x2;
  const x6 = x4 * x2;
  const bose = (1 - 3 * d2) / Math.expm1(thetaK / temperatureK);
  const inner = 1 + (Math.PI * Math.PI) / (3 * (1 + d2)) * x2 + ((3 * d2 - 1) / 4) * x3 + (8 / 3) * x4 + x6;
  const dispersion = 1.5 * d2 * (Math.pow(inner, 1 / 6) - 1);
  return gapAtZeroEv - alphaEvPerK * thetaK * (bose + dispersion);
}

export function passlerParameters(): readonly Parameter[] {
  const source = 'Pässler 2002 (silicon set)';
  const p = PASSLER_2002_SILICON;
  return [
    { name: 'Eg(0)', value: p.gapAtZeroEv, unit: 'eV', source },
    { name: 'α', value: p.alphaEvPerK, unit: 'eV/K', source },
    { name: 'Θ', value: p.thetaK, unit: 'K', source },
    { name: 'Δ', value: p.delta, source },
  ];
}
