import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { carriersAtTemperature, type CarriersResult } from '../../../src/physics/carriers/carriers.js';
import { f723BoronResistivityOhmCm } from '../../../src/physics/resistivity/astm-f723.js';
import type { Dopant } from '../../../src/physics/types.js';

/** k/q in eV/K, CODATA 2018 (exact ratio of exact constants), written here independently. */
const K_EV = 1.380649e-23 / 1.602176634e-19;
/** Nc, Nv of Si: M. A. Green, J. Appl. Phys. 67, 2944 (1990): 2.86e19·(T/300)^1.58, 3.10e19·(T/300)^1.85. */
const nc = (T: number) => 2.86e19 * Math.pow(T / 300, 1.58);
const nv = (T: number) => 3.1e19 * Math.pow(T / 300, 1.85);

function solved(req: Parameters<typeof carriersAtTemperature>[0]): CarriersResult {
  const r = carriersAtTemperature(req);
  if (!r.ok) throw new Error(`refused: ${JSON.stringify(r.refusal)}`);
  return r.value;
}
const codes = (r: CarriersResult) => r.problems.map((p) => p.code);

describe('carriers at temperature: charge neutrality with incomplete ionization', () => {
  // Closed form (textbook, e.g. Sze & Ng 2007 §1.5): uncompensated, non-degenerate, minority
  // carriers negligible: n = N_D⁺ = N_D/(1 + g·(n/Nc)·e^(ΔE/kT)), so with K = (Nc/g)·e^(−ΔE/kT),
  // n = (K/2)·(√(1 + 4N_D/K) − 1). Computed here from Green's Nc and CODATA k; the solver uses
  // the density-of-states n_i so that its band edge sits exactly at Nc (the default n_i model
  // moves it by ~kT·ln 1.1). Tolerance 1e-6: the neglected minority density is < 1e-20 of n.
  it('matches the closed-form ionized fraction for P in Si at 77, 100 and 150 K', () => {
    for (const T of [77, 100, 150]) {
      const nd = 1e15;
      const kT = K_EV * T;
      const K = (nc(T) / 2) * Math.exp(-0.045 / kT);
      const n = (K / 2) * (Math.sqrt(1 + (4 * nd) / K) - 1);
      const r = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: nd }], temperatureK: T, intrinsicModelId: 'density-of-states' });
      expect(r.electronDensityPerCm3).toBeWithinRelative(n, 1e-6);
      expect(r.ionizedFraction).toBeWithinRelative(n / nd, 1e-6);
    }
  });

  // Same closed form for an acceptor (g_A = 4, Nv, ΔE = 45 meV for B).
  it('matches the closed-form ionized fraction for B in Si at 100 K (g_A = 4)', () => {
    const T = 100;
    const na = 1e16;
    const K = (nv(T) / 4) * Math.exp(-0.045 / (K_EV * T));
    const p = (K / 2) * (Math.sqrt(1 + (4 * na) / K) - 1);
    const r = solved({ dopants: [{ dopant: 'boron', densityPerCm3: na }], temperatureK: T, intrinsicModelId: 'density-of-states' });
    expect(r.holeDensityPerCm3).toBeWithinRelative(p, 1e-6);
    expect(r.carrierType).toBe('p');
  });

  // Textbook limit: at high temperature n → n_i when N ≪ n_i (n = N/2 + √(N²/4 + n_i²)).
  // At 1000 K, N = 1e14: n/n_i − 1 ≈ N/(2n_i) < 1e-4. Tolerance 1e-3.
  it('tends to n = p = n_i at high temperature (1000 K, 1e14 cm⁻³) and says it is intrinsic', () => {
    const r = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e14 }], temperatureK: 1000 });
    expect(r.electronDensityPerCm3).toBeWithinRelative(r.intrinsicDensityPerCm3, 1e-3);
    expect(r.holeDensityPerCm3).toBeWithinRelative(r.intrinsicDensityPerCm3, 1e-3);
    expect(Math.abs(r.fermiLevelEv)).toBeLessThan(1e-3);
    expect(codes(r)).toContain('intrinsic_regime');
    expect(codes(r)).toContain('outside_validity'); // n_i and mobility fits are out of range there
  });

  // Textbook, full ionization at room temperature: E_F − E_i = kT·ln(N_D/n_i). At 300 K and
  // 1e16 P the ionized fraction is 99.6 % (closed form above), so the two differ by kT·ln(0.996)
  // ≈ 0.1 meV. Tolerance 0.5 meV.
  it('places E_F at kT·ln(N/n_i) above the intrinsic level at 300 K (1e16 P)', () => {
    const r = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e16 }], temperatureK: 300 });
    const expected = K_EV * 300 * Math.log(1e16 / r.intrinsicDensityPerCm3);
    expect(Math.abs(r.fermiLevelEv - expected)).toBeLessThan(5e-4);
    expect(r.fermiLevelEv).toBeGreaterThan(0);
    // band edges: (E_c − E_F) + (E_F − E_v) = kT·ln(Nc·Nv/n_i²), the gap the n_i model implies with
    // Green's Nc, Nv; within 6 meV of Eg(T) (√(Nc·Nv)·exp(−Eg/2kT) is about 11 % above the
    // Couderc n_i at 300 K: kT·ln(1.11²) ≈ 5.4 meV).
    const implied = K_EV * 300 * Math.log((nc(300) * 3.1e19) / r.intrinsicDensityPerCm3 ** 2);
    expect(r.fermiBelowConductionBandEv + r.fermiAboveValenceBandEv).toBeWithinRelative(implied, 1e-9);
    expect(Math.abs(implied - r.bandgapEv)).toBeLessThan(0.006);
    // with the density-of-states n_i the edge is exactly E_c − E_F = kT·ln(Nc/n)
    const d = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e16 }], temperatureK: 300, intrinsicModelId: 'density-of-states' });
    expect(d.fermiBelowConductionBandEv).toBeWithinRelative(K_EV * 300 * Math.log(nc(300) / d.electronDensityPerCm3), 1e-9);
  });

  // Compensation (textbook): at room temperature with full ionization the majority density is the
  // difference of the kinds. 1e16 B + 3e15 P: p ≈ 7e15; 1e16 P + 4e15 B: n ≈ 6e15. Tolerance 2 %:
  // the residual incomplete ionization of 1e16 B at 300 K is ~0.6 % of 1e16, ~1 % of the difference.
  it('handles compensation of both kinds at 300 K (p ≈ N_A − N_D, n ≈ N_D − N_A)', () => {
    const a = solved({ dopants: [{ dopant: 'boron', densityPerCm3: 1e16 }, { dopant: 'phosphorus', densityPerCm3: 3e15 }], temperatureK: 300 });
    expect(a.carrierType).toBe('p');
    expect(a.holeDensityPerCm3).toBeWithinRelative(7e15, 0.02);
    expect(a.netDonorDensityPerCm3).toBe(-7e15);
    const b = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e16 }, { dopant: 'boron', densityPerCm3: 4e15 }], temperatureK: 300 });
    expect(b.carrierType).toBe('n');
    expect(b.electronDensityPerCm3).toBeWithinRelative(6e15, 0.02);
    // the minority kind is fully ionized (its level is far from E_F): fraction > 0.9999
    expect(b.dopants.find((d) => d.dopant === 'boron')?.ionizedFraction).toBeGreaterThan(0.9999);
  });

  // Compensation at low temperature (textbook freeze-out with compensation): the compensating
  // acceptors take electrons from the donors, so the donor ionized fraction stays at least N_A/N_D.
  it('keeps at least N_A/N_D of the donors ionized in compensated material at 50 K', () => {
    const r = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e16 }, { dopant: 'boron', densityPerCm3: 2e15 }], temperatureK: 50 });
    const donor = r.dopants.find((d) => d.dopant === 'phosphorus');
    expect(donor?.ionizedFraction).toBeGreaterThanOrEqual(0.2);
    expect(donor?.ionizedFraction).toBeLessThan(0.3);
  });

  // Source: ASTM F723-99 (Thurber et al.), 23 °C: 1e15 B is 99.9 % ionized at 296 K, so ρ from
  // n, p and the Klaassen mobility should be F723's within the mobility's own 5 % agreement
  // with F723 below 1e17 (see klaassen-1992.test.ts) plus 1 %. Tolerance 6 %.
  it('gives a resistivity at 23 °C within 6 % of ASTM F723 for 1e15 and 1e16 boron', () => {
    for (const n of [1e15, 1e16]) {
      const r = solved({ dopants: [{ dopant: 'boron', densityPerCm3: n }], temperatureK: 296.15 });
      expect(r.resistivityOhmCm).toBeWithinRelative(f723BoronResistivityOhmCm(n), 0.06);
      expect(r.mobilityModel?.id).toBe('klaassen-1992');
    }
  });

  // docs/references.md: the simple model overstates freeze-out above ~1e18 cm⁻³; degenerate when E_F
  // is within 3 kT of a band edge (common practice, no source for the exact 3 kT).
  it('warns above 1e18 cm⁻³ and when degenerate (5e19 P at 300 K); not for 1e16', () => {
    const heavy = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 5e19 }], temperatureK: 300 });
    expect(codes(heavy)).toContain('ionization_model_limit');
    expect(codes(heavy)).toContain('degenerate');
    expect(heavy.fermiBelowConductionBandEv).toBeLessThan(3 * K_EV * 300);
    const heavyP = solved({ dopants: [{ dopant: 'boron', densityPerCm3: 5e19 }], temperatureK: 300 });
    expect(heavyP.problems).toContainEqual(expect.objectContaining({ code: 'degenerate', band: 'valence' }));
    const light = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e16 }], temperatureK: 300 });
    expect(codes(light)).not.toContain('ionization_model_limit');
    expect(codes(light)).not.toContain('degenerate');
  });

  it('warns where a fit is outside its range (45 K: mobility fit, Nc/Nv scaling); below the n_i fit’s range it uses the band edges and says so instead of extrapolating the fit', () => {
    const r = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e15 }], temperatureK: 45 });
    const models = r.problems.filter((p) => p.code === 'outside_validity').map((p) => (p as { model: string }).model);
    expect(models).toEqual(expect.arrayContaining(['klaassen-1992', 'density-of-states']));
    expect(models).not.toContain('couderc-2014');
    expect(r.assumptionCodes).toContain('freeze_out_band_edges');
  });

  it('covers Ge with unverified (from memory) levels and no resistivity; refuses GaAs', () => {
    const ge = solved({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e15 }], temperatureK: 300, material: 'Ge' });
    expect(codes(ge)).toContain('unverified_parameter');
    expect(ge.resistivityOhmCm).toBeUndefined();
    expect(ge.problems).toContainEqual(expect.objectContaining({ code: 'quantity_not_covered', quantity: 'resistivityOhmCm', covered: ['Si'] }));
    const gaas = carriersAtTemperature({ dopants: [{ dopant: 'phosphorus', densityPerCm3: 1e15 }], temperatureK: 300, material: 'GaAs' });
    expect(gaas.ok).toBe(false);
    if (!gaas.ok) expect(gaas.refusal).toMatchObject({ code: 'not_covered', material: 'GaAs', covered: ['Si', 'Ge'] });
  });

  it('refuses meaningless input with the reason as data', () => {
    const bad = (req: Parameters<typeof carriersAtTemperature>[0]) => {
      const r = carriersAtTemperature(req);
      return r.ok ? 'ok' : r.refusal.code;
    };
    expect(bad({ dopants: [], temperatureK: 300 })).toBe('missing_input');
    expect(bad({ dopants: [{ dopant: 'boron', densityPerCm3: -1 }], temperatureK: 300 })).toBe('nonpositive_input');
    expect(bad({ dopants: [{ dopant: 'boron', densityPerCm3: 1e15 }], temperatureK: 5 })).toBe('outside_domain');
    expect(bad({ dopants: [{ dopant: 'boron', densityPerCm3: 1e15 }], temperatureK: Number.NaN })).toBe('not_finite');
    expect(bad({ dopants: [{ dopant: 'boron', densityPerCm3: 1e15 }], temperatureK: 300, mobilityModelId: 'nope' })).toBe('unknown_model');
  });

  // The solver contract: from 77 to 800 K, any density 1e12–1e20, with or without a compensating
  // dopant, an answer that satisfies neutrality and n·p = n_i², never a NaN. Property test.
  it('solves 77–800 K for any doping and compensation, neutral and mass-action exact (property)', () => {
    const dopant = fc.constantFrom<Dopant>('boron', 'phosphorus', 'arsenic', 'antimony');
    fc.assert(
      fc.property(
        fc.double({ min: 77, max: 800, noNaN: true }),
        fc.double({ min: 12, max: 20, noNaN: true }),
        dopant,
        fc.option(fc.tuple(fc.double({ min: 12, max: 20, noNaN: true }), dopant)),
        (T, u, d, other) => {
          const dopants = [{ dopant: d, densityPerCm3: Math.pow(10, u) }];
          if (other) dopants.push({ dopant: other[1], densityPerCm3: Math.pow(10, other[0]) });
          const r = solved({ dopants, temperatureK: T });
          const n = r.electronDensityPerCm3;
          const p = r.holeDensityPerCm3;
          for (const v of [n, p, r.fermiLevelEv, r.ionizedFraction, r.resistivityOhmCm ?? 0]) expect(Number.isFinite(v)).toBe(true);
          expect(n * p).toBeWithinRelative(r.intrinsicDensityPerCm3 ** 2, 1e-9);
          const plus = r.dopants.filter((x) => x.kind === 'donor').reduce((s, x) => s + x.ionizedDensityPerCm3, 0);
          const minus = r.dopants.filter((x) => x.kind === 'acceptor').reduce((s, x) => s + x.ionizedDensityPerCm3, 0);
          const scale = n + p + plus + minus;
          expect(Math.abs(p + plus - n - minus) / scale).toBeLessThan(1e-9);
          for (const x of r.dopants) {
            expect(x.ionizedFraction).toBeGreaterThan(0);
            expect(x.ionizedFraction).toBeLessThanOrEqual(1);
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  // Physics: in an uncompensated, extrinsic crystal the ionized fraction rises with temperature
  // (freeze-out recedes). Not so near the intrinsic regime, where n ≈ n_i grows faster than the
  // level empties (un-ionized fraction ∝ e^(−(Eg/2 − ΔE)/kT)); hence 50–300 K, 1e14–1e18 cm⁻³.
  it('ionized fraction rises with temperature in uncompensated Si (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 50, max: 300, noNaN: true }), fc.double({ min: 14, max: 18, noNaN: true }), (T, u) => {
        const at = (t: number) => solved({ dopants: [{ dopant: 'arsenic', densityPerCm3: Math.pow(10, u) }], temperatureK: t }).ionizedFraction;
        expect(at(T * 1.05)).toBeGreaterThanOrEqual(at(T) - 1e-12); // rounding slack near full ionization
      }),
    );
  });
});

describe('resistivity at heavy doping agrees with the `doping` conversion', () => {
  it('at 23 °C `carriers` gives the ASTM F723 resistivity for 1e19 P and 1e20 B (as `doping` does); elsewhere the mobility model gives only the change with temperature', async () => {
    const { convertDensityToResistivity } = await import('../../../src/physics/resistivity/convert.js');
    for (const [dopant, n] of [['phosphorus', 1e19], ['boron', 1e20], ['boron', 1e15]] as const) {
      const c = carriersAtTemperature({ dopants: [{ dopant, densityPerCm3: n }], temperatureK: 296.15 });
      const d = convertDensityToResistivity({ dopantDensityPerCm3: n, dopant });
      // ASTM F723-99 is the source of `doping` (docs/references.md); 1e-9: the same number, floating point only.
      expect(c.ok && c.value.resistivityOhmCm).toBeWithinRelative(d.ok ? d.value.resistivityOhmCm : NaN, 1e-9);
    }
    // Lightly doped Si at 100 °C: higher than at 23 °C (lattice scattering; docs/references.md).
    const hot = carriersAtTemperature({ dopants: [{ dopant: 'boron', densityPerCm3: 1e15 }], temperatureK: 373.15 });
    const room = carriersAtTemperature({ dopants: [{ dopant: 'boron', densityPerCm3: 1e15 }], temperatureK: 296.15 });
    expect(hot.ok && room.ok && hot.value.resistivityOhmCm! > room.value.resistivityOhmCm!).toBe(true);
  });
});
