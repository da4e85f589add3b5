import { describe, expect, it } from 'vitest';
import { parseQuantity, type Dimension } from '../../src/commands/units.js';
import { tokenize } from '../../src/commands/tokens.js';

/**
 * Unit spellings the trade uses. Expected canonical values are unit definitions (SI, exact),
 * not outputs of this code: 1 Ω·m = 100 Ω·cm, 1 µm = 1e-4 cm, 0 °C = 273.15 K (ITS-90 / SI
 * Brochure, 9th ed., 2019). Tolerance 1e-12 relative: pure unit arithmetic, only float rounding.
 */
const CASES: readonly [string, Dimension, number][] = [
  ['8.2 Ω·cm', 'resistivity', 8.2],
  ['8.2 ohm-cm', 'resistivity', 8.2],
  ['8.2 ohm cm', 'resistivity', 8.2],
  ['8.2 ohm*cm', 'resistivity', 8.2],
  ['8.2ohm-cm', 'resistivity', 8.2],
  ['8.2 ohms-cm', 'resistivity', 8.2],
  ['3.3 mΩ·cm', 'resistivity', 3.3e-3],
  ['3.3 mohm-cm', 'resistivity', 3.3e-3],
  ['0.082 Ω·m', 'resistivity', 8.2],
  ['45 ohm/sq', 'sheetResistance', 45],
  ['45 Ω/□', 'sheetResistance', 45],
  ['45 ohms/sq', 'sheetResistance', 45],
  ['45 ohm per square', 'sheetResistance', 45],
  ['300 K', 'temperature', 300],
  ['27 °C', 'temperature', 300.15],
  ['27°C', 'temperature', 300.15],
  ['27 degC', 'temperature', 300.15],
  ['27C', 'temperature', 300.15],
  ['525 µm', 'length', 0.0525],
  ['525 μm', 'length', 0.0525],
  ['525um', 'length', 0.0525],
  ['1 mm', 'length', 0.1],
  ['200mm', 'length', 20],
  ['4.1 mV', 'voltage', 4.1e-3],
  ['-1.2mV', 'voltage', -1.2e-3],
  ['+2.1mV', 'voltage', 2.1e-3],
  ['0.5 V', 'voltage', 0.5],
  ['1 mA', 'current', 1e-3],
  ['10 µA', 'current', 1e-5],
  ['10uA', 'current', 1e-5],
  ['1.5e15 cm^-3', 'density', 1.5e15],
  ['1.5e15 cm-3', 'density', 1.5e15],
  ['1.5e15 /cm3', 'density', 1.5e15],
  ['1.5e15 cm⁻³', 'density', 1.5e15],
  ['1.5x10^15 cm^-3', 'density', 1.5e15],
  ['1.5×10¹⁵ cm⁻³', 'density', 1.5e15],
  ['-1.3e3 cm3/C', 'hallCoefficient', -1.3e3],
  ['-1.3e3 cm^3/C', 'hallCoefficient', -1.3e3],
  ['-1.3e-3 m3/C', 'hallCoefficient', -1.3e3],
  ['0.75 %/K', 'temperatureCoefficient', 0.0075],
];

describe('unit spellings', () => {
  for (const [text, dim, value] of CASES) {
    it(`"${text}" reads as ${dim} ${value} (canonical unit)`, () => {
      const tokens = tokenize(text);
      expect(tokens).toHaveLength(1);
      const t = tokens[0]!;
      expect(t.kind).toBe('number');
      const q = parseQuantity(t.kind === 'number' ? `${t.value} ${t.unitText}` : '', dim);
      expect(q.ok).toBe(true);
      if (!q.ok) return;
      expect(q.quantity.dimension).toBe(dim);
      expect(q.quantity.value).toBeWithinRelative(value, 1e-12);
    });
  }

  it('a bare C is coulombs in a Hall unit but a temperature where one is expected', () => {
    const t = parseQuantity('25 C', 'temperature');
    expect(t.ok && t.quantity.dimension).toBe('temperature');
  });

  it('numbers in 1.5x10^15 and 1.5×10¹⁵ forms', () => {
    expect(tokenize('doping 1.5x10^15 B')[1]).toMatchObject({ kind: 'number', value: 1.5e15 });
    expect(tokenize('doping 1.5×10¹⁵ B')[1]).toMatchObject({ kind: 'number', value: 1.5e15 });
    expect(tokenize('doping 1.5 x 10^15 B')[1]).toMatchObject({ kind: 'number', value: 1.5e15 });
  });

  it('key=value reads as key value', () => {
    const t = tokenize('sheet 45 ohm/sq thick=525um');
    expect(t.map((x) => x.raw)).toEqual(['sheet', '45 ohm/sq', 'thick', '525um']);
  });

  it('an unknown unit is refused with its name', () => {
    const q = parseQuantity('8.2 furlongs', 'resistivity');
    expect(q.ok).toBe(false);
    if (!q.ok) expect(q.message).toContain('furlongs');
  });

  it('huge exponents are refused, not turned into Infinity', () => {
    const q = parseQuantity('1e400 ohm-cm', 'resistivity');
    expect(q.ok).toBe(false);
  });
});

describe('the fast path for common units', () => {
  it('gives the factor mathjs gives for every unit in it (the table is a shortcut, not a second source)', async () => {
    const { COMMON_UNITS } = await import('../../src/commands/units.js');
    const { create, unitDependencies } = await import('mathjs');
    const { unit } = create({ unitDependencies: unitDependencies! });
    const canonical: Record<string, string> = { resistivity: 'ohm cm', length: 'cm', voltage: 'V', current: 'A', hallCoefficient: 'cm^3/C' };
    for (const [text, entry] of COMMON_UNITS) {
      expect(entry.factor, text).toBeWithinRelative(unit(`1 ${text}`).toNumber(canonical[entry.dimension]!), 1e-12);
    }
  });
});
