import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatInput, formatNumber, formatQuantity, superscript, trimmedNumber } from '../../src/render/format.js';

/** Reads '1.33×10¹⁵', '−4.70×10⁻⁴', '8.20' or '1.33e15' back into a number. */
function parseFormatted(text: string): number {
  const normal = text
    .replace(/\u2212/g, '-')
    .replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻]/g, (c) => '0123456789-'['⁰¹²³⁴⁵⁶⁷⁸⁹⁻'.indexOf(c)] ?? c)
    .replace('×10', 'e');
  return Number(normal);
}

function significantDigits(text: string): number {
  const mantissa = text.replace(/\u2212|-/, '').split(/×|e/)[0] ?? '';
  return mantissa.replace('.', '').replace(/^0+/, '').length;
}

describe('formatNumber', () => {
  it('writes densities in trade notation with superscript exponents', () => {
    expect(formatNumber(1.33e15)).toBe('1.33×10¹⁵');
    expect(formatNumber(4.7e-4)).toBe('4.70×10⁻⁴');
    expect(formatNumber(2e15, { sigFigs: 1 })).toBe('2×10¹⁵');
  });

  it('keeps trailing zeros, because they are significant figures', () => {
    expect(formatNumber(8.2)).toBe('8.20');
    expect(formatNumber(1e16)).toBe('1.00×10¹⁶');
  });

  it('writes everyday magnitudes as plain decimals', () => {
    expect(formatNumber(0.0123)).toBe('0.0123');
    expect(formatNumber(45.3)).toBe('45.3');
    expect(formatNumber(12345)).toBe('12300');
    expect(formatNumber(0.001)).toBe('0.00100');
  });

  it('carries a rounding into the exponent (9.9996e15 → 1.00×10¹⁶, 99999.7 → 1.00×10⁵)', () => {
    expect(formatNumber(9.9996e15)).toBe('1.00×10¹⁶');
    expect(formatNumber(99999.7)).toBe('1.00×10⁵');
  });

  it('uses the minus sign in unicode style and ASCII e-notation on request', () => {
    expect(formatNumber(-1.4)).toBe('\u22121.40');
    expect(formatNumber(-1.4, { style: 'ascii' })).toBe('-1.40');
    expect(formatNumber(1.33e15, { style: 'ascii' })).toBe('1.33e15');
    expect(formatNumber(-4.7e-4, { style: 'ascii', sigFigs: 2 })).toBe('-4.7e-4');
  });

  it('never prints NaN or Infinity', () => {
    expect(formatNumber(Number.NaN)).toBe('n/a');
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe('n/a');
    expect(formatNumber(0)).toBe('0');
  });

  it('property: the text reads back within half a unit in the last shown place', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e30, max: 1e30, noNaN: true }).filter((x) => x !== 0 && Math.abs(x) > 1e-30),
        fc.integer({ min: 1, max: 8 }),
        fc.constantFrom('unicode' as const, 'ascii' as const),
        (x, sigFigs, style) => {
          const text = formatNumber(x, { sigFigs, style });
          const back = parseFormatted(text);
          // Rounding to s figures moves a value by at most 0.5 in the s-th digit: 5×10^-s relative.
          expect(Math.abs(back - x)).toBeLessThanOrEqual(5 * 10 ** -sigFigs * Math.abs(x) * (1 + 1e-9));
          expect(Math.sign(back)).toBe(Math.sign(x));
        },
      ),
    );
  });

  it('property: scientific notation shows exactly the requested significant figures', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e5, max: 1e25, noNaN: true }), fc.integer({ min: 1, max: 8 }), (x, sigFigs) => {
        expect(significantDigits(formatNumber(x, { sigFigs }))).toBe(sigFigs);
      }),
    );
  });
});

describe('formatQuantity and inputs', () => {
  it('puts a space between number and unit (SI Brochure, 9th ed., BIPM 2019, §5.4.3)', () => {
    expect(formatQuantity(8.2, 'Ω·cm')).toBe('8.20 Ω·cm');
    expect(formatQuantity(85, '°C')).toBe('85.0 °C');
    expect(formatQuantity(0.5, '')).toBe('0.500');
    expect(formatQuantity('p', '')).toBe('p');
  });

  it('shows typed numbers as typed, without padding figures', () => {
    expect(trimmedNumber(8.2)).toBe('8.2');
    expect(trimmedNumber(0.1 + 0.2)).toBe('0.3');
    expect(trimmedNumber(2e15)).toBe('2×10¹⁵');
    expect(formatInput({ value: 525, unit: 'µm', label: 'thickness' })).toBe('525 µm');
    expect(formatInput({ value: 'boron', label: 'dopant' })).toBe('boron');
  });

  it('superscript maps digits and the minus sign', () => {
    expect(superscript('-19')).toBe('⁻¹⁹');
  });
});
