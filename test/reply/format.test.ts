import { describe, expect, it } from 'vitest';
import { formatNumber } from '../../src/reply/format.js';

describe('formatNumber: significant figures in the trade notation', () => {
  it('3 significant figures by default, trailing zeros kept', () => {
    expect(formatNumber(8.2)).toBe('8.20');
    expect(formatNumber(0.0123)).toBe('0.0123');
    expect(formatNumber(1330)).toBe('1330');
  });
  it('powers of ten outside 1e-3…1e4, with superscripts', () => {
    expect(formatNumber(1.33e15)).toBe('1.33×10¹⁵');
    expect(formatNumber(-2.5e-5)).toBe('-2.50×10⁻⁵');
    expect(formatNumber(1.33e15, { style: 'ascii' })).toBe('1.33e15');
  });
  it('decides the notation after rounding: 9999.7 is 1.00×10⁴, not five figures', () => {
    expect(formatNumber(9999.7)).toBe('1.00×10⁴');
    expect(formatNumber(0.00099996)).toBe('0.00100');
  });
  it('trims published parameters when asked', () => {
    expect(formatNumber(54.56, { sigFigs: 6, trim: true })).toBe('54.56');
    expect(formatNumber(1.33e16, { sigFigs: 6, trim: true })).toBe('1.33×10¹⁶');
  });
});
