import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { convertResistivityToDensity } from '../../src/physics/resistivity/convert.js';
import { correctResistivityToReference } from '../../src/physics/resistivity/temperature-correction.js';
import type { ReplyOk } from '../../src/reply/reply.js';
import { testContext } from '../helpers/context.js';

async function ok(text: string): Promise<ReplyOk> {
  const r = await handle(text, testContext());
  if (!r.ok) throw new Error(`expected ok for "${text}", got ${r.error.code}: ${r.error.message}`);
  return r;
}
const value = (r: ReplyOk, key: string) => r.values.find((v) => v.key === key)?.value as number;

describe('rho and sheet with `at <T>` and `tc <x>%/K`', () => {
  it('rho … at 27C corrects to 23 °C with the model and converts the corrected value with F723', async () => {
    const r = await ok('rho 8.2 ohm-cm p at 27C');
    const c = correctResistivityToReference({ resistivityOhmCm: 8.2, temperatureK: 300.15, dopant: 'boron' });
    expect(c.ok).toBe(true);
    if (!c.ok) return;
    expect(value(r, 'resistivityOhmCm')).toBe(c.value.resistivityOhmCm);
    expect(value(r, 'resistivityAtTemperatureOhmCm')).toBe(8.2);
    expect(value(r, 'temperatureCoefficientPerK')).toBeWithinRelative(c.value.temperatureCoefficientPerK * 100, 1e-12);
    const conv = convertResistivityToDensity({ resistivityOhmCm: c.value.resistivityOhmCm, dopant: 'boron' });
    expect(conv.ok && value(r, 'dopantDensityPerCm3')).toBe(conv.ok && conv.value.dopantDensityPerCm3);
    expect(r.model?.id).toBe('f723');
    expect(r.warnings.find((w) => w.code === 'estimate_only')?.message).toMatch(/not the standard's \(ASTM F84\) table/);
  });

  it('rho … at 27C tc 0.75%/K applies the coefficient linearly', async () => {
    const r = await ok('rho 8.2 ohm-cm p at 27C tc 0.75%/K');
    expect(value(r, 'resistivityOhmCm')).toBeWithinRelative(8.2 / (1 + 0.0075 * 4), 1e-9);
    expect(value(r, 'temperatureCoefficientPerK')).toBeWithinRelative(0.75, 1e-12);
  });

  it('rho at 23 °C leaves the reading as it is; no `at` gives the plain answer', async () => {
    const a = await ok('rho 8.2 ohm-cm p at 23C');
    const b = await ok('rho 8.2 ohm-cm p');
    expect(value(a, 'dopantDensityPerCm3')).toBeWithinRelative(value(b, 'dopantDensityPerCm3'), 1e-9);
    expect(b.values.find((v) => v.key === 'temperatureCoefficientPerK')).toBeUndefined();
  });

  it('sheet … at 27C corrects the resistivity, not the sheet resistance as read', async () => {
    const warm = await ok('sheet 45 ohm/sq thick 525um n at 27C');
    const plain = await ok('sheet 45 ohm/sq thick 525um n');
    expect(value(warm, 'sheetResistanceOhmPerSq')).toBe(value(plain, 'sheetResistanceOhmPerSq'));
    expect(value(warm, 'resistivityOhmCm')).toBeLessThan(value(plain, 'resistivityOhmCm'));
    expect(value(warm, 'resistivityAtTemperatureOhmCm')).toBeWithinRelative(value(plain, 'resistivityOhmCm'), 1e-12);
  });

  it('says what is missing: tc without at, a unitless temperature, sheet without thickness or type', async () => {
    for (const [text, code] of [
      ['rho 8.2 ohm-cm p tc 0.75%/K', 'missing_value'],
      ['rho 8.2 ohm-cm p at 27', 'bad_unit'],
      ['sheet 45 ohm/sq n at 27C', 'missing_input'],
      ['sheet 45 ohm/sq thick 525um at 27C', 'missing_dopant'],
      ['rho 8.2 ohm-cm p at 27C model masetti', 'ok'],
    ] as const) {
      const r = await handle(text, testContext());
      expect(r.ok ? 'ok' : r.error.code, text).toBe(code);
    }
  });
});
