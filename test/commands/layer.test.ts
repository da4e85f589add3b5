import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { layerSheetResistance } from '../../src/physics/layer/irvin-1962.js';
import type { ReplyOk } from '../../src/reply/reply.js';
import { testContext } from '../helpers/context.js';

async function ok(text: string): Promise<ReplyOk> {
  const r = await handle(text, testContext());
  if (!r.ok) throw new Error(`expected ok for "${text}", got ${r.error.code}: ${r.error.message}`);
  return r;
}
const value = (r: ReplyOk, key: string) => r.values.find((v) => v.key === key)?.value as number;

describe('layer command', () => {
  it('inverts "layer 45 ohm/sq xj 0.8um erfc on 1e15 p" to a phosphorus Cs that gives 45 Ω/□ back', async () => {
    const r = await ok('layer 45 ohm/sq xj 0.8um erfc on 1e15 p');
    expect(r.values.find((v) => v.headline)?.key).toBe('surfaceConcentrationPerCm3');
    const cs = value(r, 'surfaceConcentrationPerCm3');
    const back = layerSheetResistance({ profile: 'erfc', dopant: 'phosphorus', backgroundDopant: 'boron', backgroundDensityPerCm3: 1e15, junctionDepthCm: 0.8e-4, surfaceConcentrationPerCm3: cs });
    expect(back.ok && back.value.sheetResistanceOhmPerSq).toBeWithinRelative(45, 1e-6);
    expect(value(r, 'averageResistivityOhmCm')).toBeWithinRelative(45 * 0.8e-4, 1e-9);
    expect(r.assumptions.join(' ')).toMatch(/No layer dopant named: phosphorus/);
  });

  it('goes forward from Cs ("layer Cs 1e19 xj 0.8um gaussian on 1e15 p") with the sheet resistance as headline', async () => {
    const r = await ok('layer Cs 1e19 xj 0.8um gaussian on 1e15 p');
    expect(r.values.find((v) => v.headline)?.key).toBe('sheetResistanceOhmPerSq');
    expect(value(r, 'averageConductivitySPerCm')).toBeWithinRelative(1 / (value(r, 'sheetResistanceOhmPerSq') * 0.8e-4), 1e-9);
    expect(r.model?.citation).toMatch(/Irvin/);
  });

  it('tells the background from the layer dopant by position ("P … on 1e15 p")', async () => {
    const r = await ok('layer 45 ohm/sq P xj 0.8um erfc on 1e15 p');
    expect(r.inputs['dopant']?.value).toBe('phosphorus');
    expect(r.inputs['background']?.label).toMatch(/boron/);
  });

  it('explains what is missing or wrong', async () => {
    for (const [text, code] of [
      ['layer 45 ohm/sq erfc on 1e15 p', 'missing_value'],
      ['layer 45 ohm/sq xj 0.8um erfc', 'missing_value'],
      ['layer 45 ohm/sq xj 0.8um erfc on 1e15', 'missing_dopant'],
      ['layer 45 ohm/sq xj 0.8um erfc arsenic on 1e15 n', 'dopant_pairing'],
      ['layer Cs 1e14 xj 0.8um erfc on 1e15 p', 'no_junction'],
    ] as const) {
      const r = await handle(text, testContext());
      expect(r.ok, text).toBe(false);
      if (!r.ok) expect(r.error.code, text).toBe(code);
    }
  });
});
