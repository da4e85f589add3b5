import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { intrinsicDensity, intrinsicDensityPerCm3, INTRINSIC_MODELS } from '../../../src/physics/intrinsic/registry.js';

describe('intrinsicDensity (public API)', () => {
  // Source: Altermatt et al., J. Appl. Phys. 93, 1598 (2003): 9.65e9 cm⁻³; issue 2: within 1 %.
  it('defaults for Si to a model within 1 % of 9.65e9 cm⁻³ at 300 K (Altermatt et al. 2003)', () => {
    const o = intrinsicDensity({ temperatureK: 300, material: 'Si' });
    if (!o.ok) throw new Error(o.refusal.code);
    expect(o.value.intrinsicDensityPerCm3).toBeWithinRelative(9.65e9, 0.01);
    expect(o.value.model.id).toBe('couderc-2014');
  });
  // The default's own gap (Pässler 2002) is reported; Green 1990's table gives 1.1242 eV at 300 K
  // (0.1 % tolerance: the table's last digit).
  it('reports the band gap (Green 1990 table: 1.1242 eV at 300 K) and n·p = n_i²', () => {
    const o = intrinsicDensity({ temperatureK: 300, material: 'Si' });
    if (!o.ok) throw new Error(o.refusal.code);
    expect(o.value.bandgapEv).toBeWithinRelative(1.1242, 1e-3);
    expect(o.value.massActionProductPerCm6).toBeWithinRelative(o.value.intrinsicDensityPerCm3 ** 2, 1e-12);
    // Green 1990: Nc(300 K) = 2.86e19, Nv(300 K) = 3.10e19 cm⁻³.
    expect(o.value.conductionBandDensityPerCm3).toBeWithinRelative(2.86e19, 1e-12);
    expect(o.value.valenceBandDensityPerCm3).toBeWithinRelative(3.1e19, 1e-12);
  });
  it('says 1.45e10 is outdated when asked at 300 K (±1 K) for Si, and not at 310 K', () => {
    for (const t of [299, 300, 301]) {
      const o = intrinsicDensity({ temperatureK: t, material: 'Si' });
      if (!o.ok) throw new Error(o.refusal.code);
      expect(o.value.problems).toContainEqual(
        expect.objectContaining({ code: 'outdated_value', outdated: 1.45e10, current: 9.65e9 }),
      );
    }
    const far = intrinsicDensity({ temperatureK: 310, material: 'Si' });
    if (!far.ok) throw new Error(far.refusal.code);
    expect(far.value.problems.map((p) => p.code)).not.toContain('outdated_value');
  });
  it('warns outside each fit’s range (Misiakos 78–340 K; Sproul–Green 275–375 K)', () => {
    const a = intrinsicDensity({ temperatureK: 358.15, material: 'Si', modelId: 'misiakos' });
    if (!a.ok) throw new Error(a.refusal.code);
    expect(a.value.problems).toContainEqual(expect.objectContaining({ code: 'outside_validity', quantity: 'temperatureK', max: 340 }));
    // The default is one continuous model: 85 °C is inside Couderc's 50–400 K, 500 K is not (warned).
    const d = intrinsicDensity({ temperatureK: 358.15, material: 'Si' });
    if (!d.ok) throw new Error(d.refusal.code);
    expect(d.value.model.id).toBe('couderc-2014');
    expect(d.value.problems.map((p) => p.code)).not.toContain('outside_validity');
    const hot = intrinsicDensity({ temperatureK: 500, material: 'Si' });
    if (!hot.ok) throw new Error(hot.refusal.code);
    expect(hot.value.model.id).toBe('couderc-2014');
    expect(hot.value.problems).toContainEqual(expect.objectContaining({ code: 'outside_validity', model: 'couderc-2014', max: 400 }));
    const b = intrinsicDensity({ temperatureK: 250, material: 'Si', modelId: 'sproul-green' });
    if (!b.ok) throw new Error(b.refusal.code);
    expect(b.value.problems).toContainEqual(expect.objectContaining({ code: 'outside_validity', min: 275 }));
    const c = intrinsicDensity({ temperatureK: 300, material: 'Si', modelId: 'misiakos' });
    if (!c.ok) throw new Error(c.refusal.code);
    expect(c.value.problems.map((p) => p.code)).not.toContain('outside_validity');
  });
  it('uses the density-of-states form for Ge and GaAs, and refuses a Si-only fit for them', () => {
    const ge = intrinsicDensity({ temperatureK: 300, material: 'Ge' });
    if (!ge.ok) throw new Error(ge.refusal.code);
    expect(ge.value.model.id).toBe('density-of-states');
    const bad = intrinsicDensity({ temperatureK: 300, material: 'GaAs', modelId: 'misiakos-tsamakis-1993' });
    expect(bad).toEqual({
      ok: false,
      refusal: { code: 'model_material', model: 'misiakos-tsamakis-1993', material: 'GaAs', supported: ['Si'] },
    });
  });
  it('refuses T ≤ 0, non-finite T, unknown models and T beyond the melting point', () => {
    expect(intrinsicDensity({ temperatureK: 0, material: 'Si' }).ok).toBe(false);
    expect(intrinsicDensity({ temperatureK: -5, material: 'Si' }).ok).toBe(false);
    expect(intrinsicDensity({ temperatureK: Number.NaN, material: 'Si' }).ok).toBe(false);
    const u = intrinsicDensity({ temperatureK: 300, material: 'Si', modelId: 'old-book' });
    expect(u.ok).toBe(false);
    if (!u.ok) expect(u.refusal.code).toBe('unknown_model');
    const hot = intrinsicDensity({ temperatureK: 5000, material: 'Si' });
    expect(hot.ok).toBe(false);
    if (!hot.ok) expect(hot.refusal.code).toBe('above_melting_point');
  });
  it('kernel intrinsicDensityPerCm3 matches the public API and never throws', () => {
    const o = intrinsicDensity({ temperatureK: 350, material: 'Si' });
    if (!o.ok) throw new Error(o.refusal.code);
    expect(intrinsicDensityPerCm3('Si', 350)).toBe(o.value.intrinsicDensityPerCm3);
    expect(Number.isNaN(intrinsicDensityPerCm3('Si', -1))).toBe(true);
    expect(Number.isNaN(intrinsicDensityPerCm3('Ge', 300, 'misiakos'))).toBe(true);
  });
  it('never returns NaN for any finite positive temperature: a value or a refusal (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: Number.MIN_VALUE, max: Number.MAX_VALUE, noNaN: true }),
        fc.constantFrom('Si', 'Ge', 'GaAs' as const),
        fc.option(fc.constantFrom(...INTRINSIC_MODELS.map((m) => m.id)), { nil: undefined }),
        (t, material, modelId) => {
          const o = intrinsicDensity(modelId === undefined ? { temperatureK: t, material } : { temperatureK: t, material, modelId });
          if (!o.ok) return true;
          const v = o.value;
          return [v.intrinsicDensityPerCm3, v.bandgapEv, v.massActionProductPerCm6].every(Number.isFinite);
        },
      ),
      { numRuns: 2000 },
    );
  });
});

describe('above the melting point there is no n_i', () => {
  it('Si above 1687 K, Ge above 1211 K, GaAs above 1511 K are refused (melting points: handbook values, from memory); just below, an answer', async () => {
    const { intrinsicDensity } = await import('../../../src/physics/intrinsic/registry.js');
    for (const [material, melt] of [['Si', 1687], ['Ge', 1211], ['GaAs', 1511]] as const) {
      const above = intrinsicDensity({ material, temperatureK: melt + 1 });
      expect(!above.ok && above.refusal.code).toBe('above_melting_point');
      expect(intrinsicDensity({ material, temperatureK: melt - 1 }).ok).toBe(true);
    }
  });
});
