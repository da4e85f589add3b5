/**
 * The four-point probe head: a spacing typed, else the fab's configured head (PROBE_SPACING_MM),
 * else a warning that says what the missing thickness factor would be — never a silent F = 1.
 * The factor itself is checked against Uhlir/Smits in test/physics/four-point/ (docs/references.md).
 */
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { fourPointProbe } from '../../src/physics/four-point/sheet.js';
import { thicknessCorrectionFactor } from '../../src/physics/four-point/uhlir-1955-thickness.js';
import type { ReplyOk } from '../../src/reply/reply.js';
import { testContext } from '../helpers/context.js';

const value = (r: ReplyOk, key: string) => r.values.find((v) => v.key === key)?.value;

describe('probe head spacing', () => {
  it('without any spacing: F = 1 is used and a warning says what F would be under a 1 mm head', async () => {
    const r = (await handle('sheet 45 ohm/sq thick 725um p', testContext())) as ReplyOk;
    expect(r.ok).toBe(true);
    const w = r.warnings.find((x) => x.code === 'thickness_factor_unknown');
    expect(w?.message).toContain(`F = ${thicknessCorrectionFactor(0.725).toFixed(4)}`);
  });

  it('the fab’s configured head is used when the command gives none, and the reply says so', async () => {
    const r = (await handle('sheet 45 ohm/sq thick 725um p', testContext({ probeSpacingCm: 0.1 }))) as ReplyOk;
    expect(value(r, 'thicknessCorrectionFactor')).toBeCloseTo(thicknessCorrectionFactor(0.725), 12);
    expect(r.assumptions.join(' ')).toContain("the fab's configured head (PROBE_SPACING_MM)");
    expect(r.warnings.some((x) => x.code === 'thickness_factor_unknown')).toBe(false);
    // A spacing typed wins over the configured head.
    const typed = (await handle('sheet 45 ohm/sq thick 725um spacing 1.59mm p', testContext({ probeSpacingCm: 0.1 }))) as ReplyOk;
    expect(value(typed, 'thicknessCorrectionFactor')).toBeCloseTo(thicknessCorrectionFactor(0.725 / 1.59), 12);
  });

  it('thickness and diameter corrections both large: a warning that their product is an approximation (5 % each, common practice, no source)', () => {
    const both = fourPointProbe({ sheetResistanceOhmPerSq: 45, thicknessCm: 0.3, spacingCm: 0.1, diameterCm: 0.5 });
    expect(both.ok && both.value.problems.map((p) => p.code)).toContain('combined_geometry');
    const one = fourPointProbe({ sheetResistanceOhmPerSq: 45, thicknessCm: 0.0725, spacingCm: 0.1, diameterCm: 20 });
    expect(one.ok && one.value.problems.map((p) => p.code)).not.toContain('combined_geometry');
  });
});
