/**
 * The silicon default n_i(T): Couderc, Amara & Lemiti, J. Appl. Phys. 115, 093705 (2014), with
 * Pässler's gap. Checked against published values, not against itself.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { intrinsicCrossover } from '../../../src/physics/carriers/crossover.js';
import { coudercDensityPerCm3 } from '../../../src/physics/intrinsic/couderc-2014.js';
import { misiakosTsamakisDensityPerCm3 } from '../../../src/physics/intrinsic/misiakos-tsamakis-1993.js';
import { intrinsicDensity, intrinsicDensityPerCm3 } from '../../../src/physics/intrinsic/registry.js';

const K_EV = 8.617333262e-5; // eV/K, CODATA 2018 (exact k / exact e)

/**
 * K. Misiakos, D. Tsamakis, J. Appl. Phys. 74, 3293 (1993): measured n_i (cm⁻³) at 78–340 K, as
 * copied from the paper's table into an open-source implementation (the 300 K point, 9.7e9, is
 * the abstract's; the others are not re-checked against the paper: secondary source).
 */
const MISIAKOS_POINTS: ReadonlyArray<readonly [number, number]> = [
  [77.8, 5.0e-20], [100.0, 2.0e-11], [120.75, 3.4e-6], [137.5, 4.6e-3], [148.4, 0.21], [169.7, 84],
  [195.0, 1.78e4], [199.5, 4.3e4], [213.0, 4.16e5], [239.0, 1.92e7], [256.5, 1.45e8], [270.6, 6.7e8],
  [281.0, 1.79e9], [300.0, 9.7e9], [319.5, 4.51e10], [340.5, 1.89e11],
];

describe('Couderc–Amara–Lemiti 2014 n_i(T) for silicon (the default)', () => {
  // P. P. Altermatt et al., J. Appl. Phys. 93, 1598 (2003): 9.65e9 cm⁻³ at 300 K; the issue asks 1 %.
  it('is within 1 % of 9.65e9 cm⁻³ at 300 K (Altermatt et al. 2003)', () => {
    expect(coudercDensityPerCm3(300)).toBeWithinRelative(9.65e9, 0.01);
  });

  // Against the measured points, expressed as the band-gap-equivalent energy 2kT·|ln(model/data)|
  // (at 78 K a factor 1.2 in n_i is 2.6 meV). Tolerance 5 meV: the measured points themselves
  // scatter that much about any smooth curve (at 148 K and 239 K the authors' own fit is also
  // 3.5–4 meV off them).
  for (const [T, measured] of MISIAKOS_POINTS) {
    it(`${T} K: within 5 meV of Misiakos & Tsamakis's measured ${measured.toExponential(2)} cm⁻³`, () => {
      const gapEquivalentEv = 2 * K_EV * T * Math.abs(Math.log(coudercDensityPerCm3(T) / measured));
      expect(gapEquivalentEv).toBeLessThan(0.005);
    });
  }

  // Misiakos & Tsamakis's fit, where both cover (250–340 K): within the paper's stated ±0.1e9 at
  // 300 K, i.e. 1.03 %, which we apply over the overlap near room temperature.
  it('agrees with the Misiakos–Tsamakis fit within its stated 1 % over 250–340 K', () => {
    for (let T = 250; T <= 340; T += 5) {
      expect(coudercDensityPerCm3(T)).toBeWithinRelative(misiakosTsamakisDensityPerCm3(T), 0.0103);
    }
  });

  // Above the paper's 400 K the same form is an extrapolation. T. Wasserab's evaluation from the
  // band structure with temperature-dependent masses (Z. Naturforsch. 32a, 746 (1977)),
  // n_i = 5.71e19·(T/300)^2.365·exp(−6733/T) cm⁻³ as copied into an open-source implementation
  // (secondary source, docs/references.md), is an independent wide-range published value. At
  // 300 K it gives 1.02e10 (before the band-gap-narrowing reassessment: 5.6 % above); from 350 K
  // to 700 K the two agree within 4 % (measured worst 3.2 %; the tolerance leaves room for the
  // copy's rounding, not for a different curve).
  it('stays within 4 % of Wasserab’s 1977 evaluation from 350 K to 700 K, past its own range', () => {
    for (let T = 350; T <= 700; T += 25) {
      expect(coudercDensityPerCm3(T)).toBeWithinRelative(5.71e19 * Math.pow(T / 300, 2.365) * Math.exp(-6733 / T), 0.04);
    }
  });

  // Continuity (the rule): no step larger than 0.3 % between neighbouring kelvins beyond
  // the smooth trend, i.e. the change of ln n_i over one kelvin differs from the mean of its
  // neighbours' changes by less than ln(1.003). The old default, which switched fits at 340,
  // 375 and 500 K, failed this by +4.0 %, +6.5 % and −8.3 %.
  it('has no step larger than 0.3 % between neighbouring kelvins from 77 to 700 K (default, through the public API)', () => {
    const ln = (T: number) => Math.log(intrinsicDensityPerCm3('Si', T));
    for (let T = 77; T < 700; T++) {
      const step = ln(T + 1) - ln(T);
      const trend = (ln(T + 2) - ln(T - 1)) / 3;
      expect(Math.abs(step - trend)).toBeLessThan(Math.log(1.003));
    }
  });

  it('the same holds at any temperature, not only whole kelvins (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 77, max: 700, noNaN: true }), (T) => {
        const ln = (t: number) => Math.log(intrinsicDensityPerCm3('Si', t));
        const step = ln(T + 0.5) - ln(T);
        const trend = (ln(T + 1) - ln(T - 0.5)) / 3;
        return Math.abs(step - trend) < Math.log(1.003);
      }),
    );
  });

  // `crossover` and `ni` use the same default, so they agree by construction (solver tolerance).
  it('crossover and ni agree: n_i at the crossover temperature equals the net doping (1e-9)', () => {
    for (const n of [1e11, 1e13, 1e14, 1e15, 1e16, 1e17]) {
      const c = intrinsicCrossover({ netDopingPerCm3: n, material: 'Si' });
      if (!c.ok) throw new Error(c.refusal.code);
      expect(c.value.model.id).toBe('couderc-2014');
      const ni = intrinsicDensity({ temperatureK: c.value.temperatureK, material: 'Si' });
      if (!ni.ok) throw new Error(ni.refusal.code);
      expect(ni.value.intrinsicDensityPerCm3).toBeWithinRelative(n, 1e-9);
    }
  });

  // Melting point of Si 1687 K (from memory, the usual handbook value): no n_i above it.
  it('refuses above the melting point of silicon and warns far above its range', () => {
    const melt = intrinsicDensity({ temperatureK: 1700, material: 'Si' });
    expect(melt.ok).toBe(false);
    const far = intrinsicDensity({ temperatureK: 900, material: 'Si' });
    if (!far.ok) throw new Error(far.refusal.code);
    expect(far.value.problems).toContainEqual(expect.objectContaining({ code: 'outside_validity', model: 'couderc-2014' }));
    expect(far.value.problems).toContainEqual(expect.objectContaining({ code: 'outside_validity', model: 'passler-2002' }));
  });
});
