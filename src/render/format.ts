/**
 * Number and quantity formatting shared by every renderer (console text, Slack blocks, Teams
 * cards), so a value reads the same on every surface. JSON output carries raw numbers instead.
 *
 * Conventions (the trade's usual notation):
 * - `sigFigs` significant figures, trailing zeros kept (they are significant): 8.20, 1.00×10¹⁶.
 * - Plain decimals for 1e-3 ≤ |x| < 1e5 (0.0123, 8.20, 45300); outside that range, scientific
 *   notation with a superscript exponent: 1.33×10¹⁵, 4.70×10⁻⁴. ASCII style gives 1.33e15.
 * - Negative numbers use the minus sign U+2212 in unicode style (−1.40), '-' in ASCII style.
 * - A unit follows after a space ('8.20 Ω·cm', '85 °C', '42 %': the SI Brochure, 9th ed. (BIPM
 *   2019) §5.4.3, puts a space before every unit symbol, % and °C included); '' is a pure number.
 * - Non-finite numbers are shown as 'n/a' (a renderer should never print NaN or Infinity).
 */
import type { ReplyInput, ReplyValue } from '../reply/reply.js';

export type NumberStyle = 'unicode' | 'ascii';

export interface FormatOptions {
  /** Significant figures, 1–15; 3 when absent. */
  readonly sigFigs?: number;
  readonly style?: NumberStyle;
}

const SUPERSCRIPT: Readonly<Record<string, string>> = {
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
  '-': '⁻',
};

export const DEFAULT_SIG_FIGS = 3;
/** Smallest and largest-exclusive magnitudes written as plain decimals. */
export const PLAIN_MIN = 1e-3;
export const PLAIN_MAX = 1e5;

export function superscript(digits: string): string {
  return [...digits].map((c) => SUPERSCRIPT[c] ?? c).join('');
}

function clampSigFigs(sigFigs: number | undefined): number {
  const s = Math.round(sigFigs ?? DEFAULT_SIG_FIGS);
  return Number.isFinite(s) ? Math.min(15, Math.max(1, s)) : DEFAULT_SIG_FIGS;
}

/** Mantissa digits and decimal exponent after rounding to `sigFigs` (rounding may carry: 9.996 → 1.00, e+1). */
function decompose(abs: number, sigFigs: number): { mantissa: string; exponent: number } {
  const [m, e] = abs.toExponential(sigFigs - 1).split('e');
  return { mantissa: m ?? '0', exponent: Number(e) };
}

/** A number to `sigFigs` significant figures in the trade's notation. */
export function formatNumber(value: number, options: FormatOptions = {}): string {
  if (!Number.isFinite(value)) return 'n/a';
  const sigFigs = clampSigFigs(options.sigFigs);
  const style = options.style ?? 'unicode';
  const minus = style === 'unicode' ? '\u2212' : '-';
  if (value === 0) return '0';
  const sign = value < 0 ? minus : '';
  const { mantissa, exponent } = decompose(Math.abs(value), sigFigs);
  // Decide plain vs scientific on the rounded value, so 99999.7 (→ 1.00e5) goes scientific.
  const rounded = Number(`${mantissa}e${exponent}`);
  if (rounded >= PLAIN_MIN && rounded < PLAIN_MAX) {
    return sign + plainDecimal(mantissa, exponent);
  }
  if (style === 'ascii') return `${sign}${mantissa}e${exponent}`;
  return `${sign}${mantissa}×10${superscript(String(exponent))}`;
}

/** '1.23' with exponent 2 → '123'; exponent −2 → '0.0123'; exponent 4, '1.20' → '12000'. */
function plainDecimal(mantissa: string, exponent: number): string {
  const digits = mantissa.replace('.', '');
  const pointAt = 1 + exponent; // position of the decimal point within `digits`
  if (pointAt <= 0) return '0.' + '0'.repeat(-pointAt) + digits;
  if (pointAt >= digits.length) return digits + '0'.repeat(pointAt - digits.length);
  return digits.slice(0, pointAt) + '.' + digits.slice(pointAt);
}

/** '8.20 Ω·cm', '1.33×10¹⁵ cm⁻³', '42.0 %', '85.0 °C'; unit '' gives the number alone. */
export function formatQuantity(value: number | string, unit: string | undefined, options: FormatOptions = {}): string {
  const number = typeof value === 'number' ? formatNumber(value, options) : value;
  if (!unit) return number;
  return `${number} ${unit}`;
}

export function formatValue(value: ReplyValue, style: NumberStyle = 'unicode'): string {
  return formatQuantity(value.value, value.unit, { sigFigs: value.sigFigs, style });
}

/**
 * An input as understood. Numbers people typed are shown with enough figures not to look
 * rounded (up to 6 significant figures, trailing zeros of the float dropped).
 */
export function formatInput(input: ReplyInput, style: NumberStyle = 'unicode'): string {
  if (typeof input.value === 'string') return formatQuantity(input.value, input.unit);
  return formatQuantity(trimmedNumber(input.value, style), input.unit);
}

/** The shortest of 1–6 significant figures that gives the number back: 8.2 → '8.2', 2e15 → '2×10¹⁵'. */
export function trimmedNumber(value: number, style: NumberStyle = 'unicode'): string {
  if (!Number.isFinite(value) || value === 0) return formatNumber(value, { style });
  for (let s = 1; s <= 6; s += 1) {
    const { mantissa, exponent } = decompose(Math.abs(value), s);
    // 1e-12 relative: a float's representation error (0.1 + 0.2) is not a typed digit.
    const back = Number(`${mantissa}e${exponent}`);
    if (Math.abs(back - Math.abs(value)) <= 1e-12 * Math.abs(value)) return formatNumber(value, { sigFigs: s, style });
  }
  return formatNumber(value, { sigFigs: 6, style });
}
