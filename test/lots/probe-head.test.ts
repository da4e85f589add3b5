/** A product's own probe head (probeSpacingMm in the spec) is used for its sheet readings, and the record says so. */
import { describe, expect, it } from 'vitest';
import { parseSpecText } from '../../src/lots/spec/load.js';
import { thicknessCorrectionFactor } from '../../src/physics/four-point/uhlir-1955-thickness.js';
import { CONSOLE, makeHarness } from './harness.js';

describe('probe head from the product spec', () => {
  it('a sheet reading without a spacing takes the product’s probeSpacingMm', async () => {
    const load = parseSpecText('products:\n  HX-9P:\n    type: p\n    dopant: boron\n    probeSpacingMm: 1.0\n    resistivityOhmCm: { min: 8, max: 12 }\n', 'head-specs.yaml');
    if (!load.ok) throw new Error(JSON.stringify(load.problems));
    const h = makeHarness({ catalog: load.catalog });
    const r = await h.service.record(
      { lotId: 'LOT-H1', wafer: 1, productId: 'HX-9P', primary: { kind: 'sheet', sheetResistanceOhmPerSq: 130, thicknessCm: 0.0725, asEntered: '130 ohm/sq thick 725um' } },
      { actor: CONSOLE },
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const reading = r.value.outcome.readings[0]!;
    // ρ = Rs·t·F(t/s) with s = 1 mm (Uhlir/Smits factor; docs/references.md).
    expect(reading.resistivityOhmCm).toBeWithinRelative(130 * 0.0725 * thicknessCorrectionFactor(0.725), 1e-12);
    expect(JSON.stringify(reading.evaluation.notes)).toContain('Probe spacing 1 mm from the HX-9P spec (probeSpacingMm)');
    await h.close();
  });
});
