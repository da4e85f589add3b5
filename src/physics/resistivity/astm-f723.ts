/**
 * Resistivity ↔ dopant density in silicon at 23 °C: ASTM F723 (the Thurber equations).
 *
 * Standard: ASTM F723-99, "Standard Practice for Conversion Between Resistivity and Dopant
 *   Density for Boron-Doped, Phosphorus-Doped, and Arsenic-Doped Silicon" (now SEMI MF723).
 * Primary source: W. R. Thurber, R. L. Mattis, Y. M. Liu, J. J. Filliben, NBS Special
 *   Publication 400-64 (1981), and their papers in J. Electrochem. Soc. 127 (1980).
 *
 * Boron (ρ in Ω·cm, N in cm⁻³):
 *   ρ→N: N = 1.330e16/ρ + 1.082e17 / (ρ·(1 + (54.56·ρ)^1.105))
 *   N→ρ: ρ = 1.305e16/N + 1.133e17 / (N·(1 + (2.58e-19·N)^−0.737))
 * Phosphorus:
 *   ρ→N: N = (6.242e18/ρ)·10^Z, Z = (A0 + A1x + A2x² + A3x³)/(1 + B1x + B2x² + B3x³), x = log10 ρ
 *        A = −3.1083, −3.2626, −1.2196, −0.13923;  B = 1.0265, 0.38755, 0.041833
 *   N→ρ: ρ = (6.242e18/N)·10^Z, same form with y = log10 N − 16
 *        A = −3.0769, 2.2108, −0.62272, 0.057501;  B = −0.68157, 0.19833, −0.018376
 *
 * Validity [V]: the standard states self-consistency (ρ→N→ρ) within 3 % for B over
 * 1e-4–1e4 Ω·cm and within 4.5 % for P over 2e-4–4000 Ω·cm; the underlying data span
 * 1e14–1e20 cm⁻³ (B) and 3e13–1e20 cm⁻³ (P). The density validity we state is the image of the
 * resistivity range under the ρ→N equation, so both directions agree. Uncompensated material
 * only; 23 °C. The two directions are separate fits, not exact inverses.
 *
 * Checked (test/physics/resistivity/astm-f723.test.ts): with these coefficients the boron round
 * trip stays within 3 % (2.95 % worst, at 1e-4 Ω·cm); the phosphorus round trip within 4.5 %
 * over 2.05e-4–4000 Ω·cm but 4.74 % at 2.00e-4 Ω·cm, probably a rounded coefficient.
 *
 * Beyond ten times the range the public API refuses: the P ρ→N denominator has a pole near
 * ρ ≈ 3e-6 Ω·cm and the P N→ρ denominator one near N ≈ 2e22 cm⁻³.
 */
import { F723_REFERENCE_TEMPERATURE_K } from '../constants.js';
import type { Problem } from '../problems.js';
import type { Dopant, Parameter, Range } from '../types.js';
import { widen, type RegisteredConversionModel } from './conversion-model.js';

export const F723_BORON = {
  rhoToN: { a: 1.33e16, b: 1.082e17, c: 54.56, d: 1.105 },
  nToRho: { a: 1.305e16, b: 1.133e17, c: 2.58e-19, d: -0.737 },
} as const;

export const F723_PHOSPHORUS = {
  scale: 6.242e18,
  rhoToN: { a: [-3.1083, -3.2626, -1.2196, -0.13923], b: [1.0265, 0.38755, 0.041833] },
  nToRho: { a: [-3.0769, 2.2108, -0.62272, 0.057501], b: [-0.68157, 0.19833, -0.018376] },
} as const;

// The boron kernels write the coefficients as literals (the hot path of every boron reading);
// they equal F723_BORON above, which `why` shows, and a test checks that they agree. The power
// x^d is written exp(d·ln x): the same value to about 1e-15 relative, and half the time of
// Math.pow in V8 (bench: the batch path of a wafer map converts every site through it).

/** Kernel: boron, ρ → N (cm⁻³). */
export function f723BoronDensityPerCm3(resistivityOhmCm: number): number {
  const r = resistivityOhmCm;
  return 1.33e16 / r + 1.082e17 / (r * (1 + Math.exp(1.105 * Math.log(54.56 * r))));
}

/** Kernel: boron, N → ρ (Ω·cm). */
export function f723BoronResistivityOhmCm(dopantDensityPerCm3: number): number {
  const n = dopantDensityPerCm3;
  return 1.305e16 / n + 1.133e17 / (n * (1 + Math.exp(-0.737 * Math.log(2.58e-19 * n))));
}

function rational(
  x: number,
  a: readonly [number, number, number, number],
  b: readonly [number, number, number],
): number {
  const num = a[0] + x * (a[1] + x * (a[2] + x * a[3]));
  const den = 1 + x * (b[0] + x * (b[1] + x * b[2]));
  return num / den;
}

/** Kernel: phosphorus, ρ → N (cm⁻³). */
export function f723PhosphorusDensityPerCm3(resistivityOhmCm: number): number {
  const { a, b } = F723_PHOSPHORUS.rhoToN;
  const z = rational(Math.log10(resistivityOhmCm), a, b);
  return (F723_PHOSPHORUS.scale / resistivityOhmCm) * Math.pow(10, z);
}

/** Kernel: phosphorus, N → ρ (Ω·cm). */
export function f723PhosphorusResistivityOhmCm(dopantDensityPerCm3: number): number {
  const { a, b } = F723_PHOSPHORUS.nToRho;
  const z = rational(Math.log10(dopantDensityPerCm3) - 16, a, b);
  return (F723_PHOSPHORUS.scale / dopantDensityPerCm3) * Math.pow(10, z);
}

const NO_STANDING_PROBLEMS: readonly Problem[] = Object.freeze([]);

export const F723_CITATION =
  'ASTM F723-99 (SEMI MF723), after W. R. Thurber, R. L. Mattis, Y. M. Liu, J. J. Filliben, NBS SP 400-64 (1981) and J. Electrochem. Soc. 127 (1980)';

/** Self-consistency the standard states for each dopant (relative, ρ→N→ρ). */
export const F723_SELF_CONSISTENCY: Readonly<Record<'boron' | 'phosphorus', { tolerance: number; resistivityOhmCm: Range }>> = {
  boron: { tolerance: 0.03, resistivityOhmCm: { min: 1e-4, max: 1e4 } },
  phosphorus: { tolerance: 0.045, resistivityOhmCm: { min: 2e-4, max: 4000 } },
};

function densityRange(rho: Range, toN: (r: number) => number): Range {
  return { min: toN(rho.max), max: toN(rho.min) };
}

const B_RHO = F723_SELF_CONSISTENCY.boron.resistivityOhmCm;
const P_RHO = F723_SELF_CONSISTENCY.phosphorus.resistivityOhmCm;
const B_N = densityRange(B_RHO, f723BoronDensityPerCm3);
const P_N = densityRange(P_RHO, f723PhosphorusDensityPerCm3);

function coefficientParameters(prefix: string, values: readonly number[], first: number): Parameter[] {
  return values.map((value, i) => ({ name: `${prefix}${i + first}`, value, source: 'ASTM F723-99' }));
}

/** Parameter table of the F723 phosphorus fit (shared with the As/Sb substitute). */
export function f723PhosphorusParameters(): readonly Parameter[] {
  return [
    { name: 'scale', value: F723_PHOSPHORUS.scale, unit: 'cm⁻³·Ω·cm', source: 'ASTM F723-99' },
    ...coefficientParameters('A(ρ→N)', F723_PHOSPHORUS.rhoToN.a, 0),
    ...coefficientParameters('B(ρ→N)', F723_PHOSPHORUS.rhoToN.b, 1),
    ...coefficientParameters('A(N→ρ)', F723_PHOSPHORUS.nToRho.a, 0),
    ...coefficientParameters('B(N→ρ)', F723_PHOSPHORUS.nToRho.b, 1),
  ];
}

export const F723_PHOSPHORUS_EQUATIONS: readonly string[] = [
  'phosphorus ρ→N: N = (6.242e18/ρ)·10^Z, Z = (A0 + A1x + A2x² + A3x³)/(1 + B1x + B2x² + B3x³), x = log10 ρ',
  'phosphorus N→ρ: ρ = (6.242e18/N)·10^Z, same form with y = log10 N − 16',
];

export const f723: RegisteredConversionModel = {
  id: 'f723',
  name: 'ASTM F723 (Thurber et al.)',
  citation: F723_CITATION,
  aliases: ['astm-f723', 'thurber', 'astm'],
  dopants: ['boron', 'phosphorus'],
  referenceTemperatureK: F723_REFERENCE_TEMPERATURE_K,
  validity: {
    boron: { resistivityOhmCm: B_RHO, dopantDensityPerCm3: B_N },
    phosphorus: { resistivityOhmCm: P_RHO, dopantDensityPerCm3: P_N },
  },
  domain: {
    boron: { resistivityOhmCm: widen(B_RHO, 10), dopantDensityPerCm3: widen(B_N, 10) },
    phosphorus: { resistivityOhmCm: widen(P_RHO, 10), dopantDensityPerCm3: widen(P_N, 10) },
  },
  equations: [
    'boron ρ→N: N = 1.330e16/ρ + 1.082e17/(ρ·(1 + (54.56·ρ)^1.105))',
    'boron N→ρ: ρ = 1.305e16/N + 1.133e17/(N·(1 + (2.58e-19·N)^−0.737))',
    ...F723_PHOSPHORUS_EQUATIONS,
  ],
  notes: [
    'Defined at 23 °C for uncompensated silicon.',
    'Stated self-consistency: 3 % for boron over 1e-4–1e4 Ω·cm, 4.5 % for phosphorus over 2e-4–4000 Ω·cm.',
    'Data behind the fits: boron 1e14–1e20 cm⁻³, phosphorus 3e13–1e20 cm⁻³.',
    'ρ→N and N→ρ are separate fits, not exact inverses.',
  ],
  assumptionCodes: ['uncompensated', 'full_ionization', 'temperature_23C'],
  // The standard's own allowance: its phosphorus conversion serves As and Sb (below 1e19 cm⁻³).
  delegates: { arsenic: 'f723-phosphorus-for-as-sb', antimony: 'f723-phosphorus-for-as-sb' },
  parameters(dopant: Dopant): readonly Parameter[] {
    if (dopant === 'boron') {
      const s = 'ASTM F723-99';
      const r = F723_BORON.rhoToN;
      const n = F723_BORON.nToRho;
      return [
        { name: 'a(ρ→N)', value: r.a, source: s },
        { name: 'b(ρ→N)', value: r.b, source: s },
        { name: 'c(ρ→N)', value: r.c, unit: '1/(Ω·cm)', source: s },
        { name: 'd(ρ→N)', value: r.d, source: s },
        { name: 'a(N→ρ)', value: n.a, source: s },
        { name: 'b(N→ρ)', value: n.b, source: s },
        { name: 'c(N→ρ)', value: n.c, unit: 'cm³', source: s },
        { name: 'd(N→ρ)', value: n.d, source: s },
      ];
    }
    if (dopant === 'phosphorus') return f723PhosphorusParameters();
    return [];
  },
  dopantDensityFromResistivity(resistivityOhmCm: number, dopant: Dopant): number {
    if (!(resistivityOhmCm > 0)) return Number.NaN;
    if (dopant === 'boron') return f723BoronDensityPerCm3(resistivityOhmCm);
    if (dopant === 'phosphorus') return f723PhosphorusDensityPerCm3(resistivityOhmCm);
    return Number.NaN;
  },
  resistivityFromDopantDensity(dopantDensityPerCm3: number, dopant: Dopant): number {
    if (!(dopantDensityPerCm3 > 0)) return Number.NaN;
    if (dopant === 'boron') return f723BoronResistivityOhmCm(dopantDensityPerCm3);
    if (dopant === 'phosphorus') return f723PhosphorusResistivityOhmCm(dopantDensityPerCm3);
    return Number.NaN;
  },
  standingProblems(): readonly Problem[] {
    return NO_STANDING_PROBLEMS;
  },
};
