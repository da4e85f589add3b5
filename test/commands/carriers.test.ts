import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { carriersAtTemperature } from '../../src/physics/carriers/carriers.js';
import { CONFIRM_PROCEDURE } from '../../src/reply/cautions.js';
import type { ReplyOk } from '../../src/reply/reply.js';
import { renderJson } from '../../src/render/json.js';
import { testContext } from '../helpers/context.js';

async function ok(text: string): Promise<ReplyOk> {
  const r = await handle(text, testContext());
  if (!r.ok) throw new Error(`expected ok for "${text}", got ${r.error.code}: ${r.error.message}`);
  return r;
}
const value = (r: ReplyOk, key: string) => r.values.find((v) => v.key === key)?.value;

describe('carriers command', () => {
  it('answers "carriers 1e15 boron at 150C" with the core’s numbers under the stable keys', async () => {
    const r = await ok('carriers 1e15 boron at 150C');
    const core = carriersAtTemperature({ dopants: [{ dopant: 'boron', densityPerCm3: 1e15 }], temperatureK: 423.15 });
    expect(core.ok).toBe(true);
    if (!core.ok) return;
    expect(value(r, 'holeDensityPerCm3')).toBe(core.value.holeDensityPerCm3);
    expect(value(r, 'electronDensityPerCm3')).toBe(core.value.electronDensityPerCm3);
    expect(value(r, 'fermiLevelEv')).toBe(core.value.fermiLevelEv);
    expect(value(r, 'ionizedFraction')).toBe(core.value.ionizedFraction);
    expect(value(r, 'resistivityOhmCm')).toBe(core.value.resistivityOhmCm);
    expect(value(r, 'temperatureK')).toBeWithinRelative(423.15, 1e-12);
    expect(r.values.find((v) => v.headline)?.key).toBe('holeDensityPerCm3');
    expect(r.cautions).toContain(CONFIRM_PROCEDURE);
  });

  it('reads two dopants with "and" in either order, and 300 K by default (said so)', async () => {
    const a = await ok('carriers 1e16 B and 3e15 P at 300K');
    const b = await ok('carriers 3e15 P and 1e16 B');
    expect(value(a, 'holeDensityPerCm3')).toBeWithinRelative(value(b, 'holeDensityPerCm3') as number, 1e-12);
    expect(b.assumptions.join(' ')).toMatch(/No temperature given: 300 K/);
    expect(a.sections?.[0]?.table?.rows).toHaveLength(2);
  });

  it('warns about heavy doping and degeneracy, and covers Ge without resistivity', async () => {
    const heavy = await ok('carriers 5e19 phos at 300K');
    const codes = heavy.warnings.map((w) => w.code);
    expect(codes).toEqual(expect.arrayContaining(['ionization_model_limit', 'degenerate']));
    const ge = await ok('carriers 5e15 phos at 250K Ge');
    expect(value(ge, 'resistivityOhmCm')).toBeUndefined();
    expect(ge.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['unverified_parameter', 'quantity_not_covered']));
  });

  it('gives a friendly error with the right form for GaAs, a missing dopant and a bare temperature', async () => {
    for (const [text, code] of [
      ['carriers 1e15 phos at 300K GaAs', 'not_covered'],
      ['carriers 1e15 at 300K', 'missing_dopant'],
      ['carriers 1e15 boron 300', 'missing_dopant'],
      ['carriers 1e15 boron and 2e15 at 300K', 'missing_dopant'],
    ] as const) {
      const r = await handle(text, testContext());
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.code).toBe(code);
    }
    const bare = await handle('carriers 1e15 boron 300', testContext());
    expect(bare.ok ? '' : bare.error.message).toMatch(/If 300 is a temperature, give its unit/);
  });

  it('renders --json with the stable keys and the mobility model named', async () => {
    const json = JSON.parse(renderJson(await ok('carriers 1e16 boron at 400K model arora')));
    expect(json.ok).toBe(true);
    for (const key of ['electronDensityPerCm3', 'holeDensityPerCm3', 'ionizedFraction', 'fermiLevelEv', 'resistivityOhmCm', 'temperatureK']) {
      expect(json.values[key]).toBeDefined();
    }
    expect(json.model.citation).toMatch(/Arora/);
  });
});
