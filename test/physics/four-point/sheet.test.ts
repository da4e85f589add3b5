import { describe, expect, it } from 'vitest';
import { fourPointProbe } from '../../../src/physics/four-point/sheet.js';
import { diameterCorrectionFactor } from '../../../src/physics/four-point/smits-1958-diameter.js';
import { thicknessCorrectionFactor } from '../../../src/physics/four-point/uhlir-1955-thickness.js';

function run(req: Parameters<typeof fourPointProbe>[0]) {
  const o = fourPointProbe(req);
  if (!o.ok) throw new Error(JSON.stringify(o.refusal));
  return o.value;
}

describe('fourPointProbe (public API)', () => {
  // Thin infinite sheet: Rs = (π/ln2)·V/I (Smits 1958). Tight.
  it('Rs = (π/ln2)·V/I with no geometry, and says it assumed an infinite sheet', () => {
    const v = run({ voltageV: 1e-3, currentA: 1e-3 });
    expect(v.sheetResistanceOhmPerSq).toBeWithinRelative(Math.PI / Math.LN2, 1e-14);
    expect(v.assumptionCodes).toContain('infinite_sheet');
    expect(v.resistivityOhmCm).toBeUndefined();
  });
  it('ρ = Rs·t·F(t/s) with each factor reported (Uhlir 1955, Smits 1958)', () => {
    const v = run({ voltageV: 4.1e-3, currentA: 1e-3, thicknessCm: 0.0725, spacingCm: 0.1, diameterCm: 20 });
    const c = diameterCorrectionFactor(200);
    const f = thicknessCorrectionFactor(0.725);
    expect(v.diameterFactor).toBe(c);
    expect(v.thicknessFactor).toBe(f);
    expect(v.sheetResistanceOhmPerSq).toBeWithinRelative((c * 4.1e-3) / 1e-3, 1e-14);
    expect(v.resistivityOhmCm).toBeWithinRelative(v.sheetResistanceOhmPerSq * 0.0725 * f, 1e-14);
    expect(v.assumptionCodes).toEqual(expect.arrayContaining(['insulating_bottom', 'probe_centred', 'separable_corrections']));
  });
  // Thick slab: ρ → 2πs·V/I (Valdes, Proc. IRE 42, 420 (1954)). Tolerance 1e-4 at t/s = 1000.
  it('a thick slab gives the semi-infinite ρ = 2πs·V/I (Valdes 1954)', () => {
    const v = run({ voltageV: 2e-3, currentA: 1e-3, thicknessCm: 100, spacingCm: 0.1 });
    expect(v.resistivityOhmCm).toBeWithinRelative(2 * Math.PI * 0.1 * 2, 1e-4);
  });
  it('assumes F = 1 and says so when the spacing is unknown', () => {
    const v = run({ sheetResistanceOhmPerSq: 45, thicknessCm: 0.0525 });
    expect(v.thicknessFactor).toBe(1);
    expect(v.resistivityOhmCm).toBeWithinRelative(45 * 0.0525, 1e-14);
    expect(v.assumptionCodes).toEqual(expect.arrayContaining(['thickness_factor_assumed_1', 'sheet_resistance_as_read_thin_sheet']));
  });
  it('rescales an Rs read as a thin infinite sheet by C(d/s)/(π/ln2)', () => {
    const v = run({ sheetResistanceOhmPerSq: 100, spacingCm: 0.1, diameterCm: 0.8 });
    expect(v.sheetResistanceOhmPerSq).toBeWithinRelative((100 * diameterCorrectionFactor(8)) / (Math.PI / Math.LN2), 1e-14);
    expect(v.problems).toContainEqual(expect.objectContaining({ code: 'geometry_limit', factor: 'diameter' }));
  });
  it('converts ρ to a dopant density when a dopant is given', () => {
    const v = run({ voltageV: 4.1e-3, currentA: 1e-3, thicknessCm: 0.0725, spacingCm: 0.1, dopant: 'boron' });
    expect(v.conversion?.model.id).toBe('f723');
    expect(v.conversion?.resistivityOhmCm).toBe(v.resistivityOhmCm);
  });
  it('refuses d/s ≤ √3, missing inputs and nonpositive values', () => {
    const g = fourPointProbe({ voltageV: 1, currentA: 1, spacingCm: 0.1, diameterCm: 0.15 });
    expect(g.ok).toBe(false);
    if (!g.ok) expect(g.refusal.code).toBe('geometry_invalid');
    const m = fourPointProbe({ voltageV: 1 });
    expect(m.ok).toBe(false);
    if (!m.ok) expect(m.refusal.code).toBe('missing_input');
    const n = fourPointProbe({ voltageV: 1, currentA: -1 });
    expect(n.ok).toBe(false);
    if (!n.ok) expect(n.refusal.code).toBe('nonpositive_input');
  });
});
