/**
 * Number formatting shared by every renderer and by the wording of warnings: significant
 * figures (3 by default) and the trade's notation (1.33×10¹⁵ cm⁻³). Formatting only: no physics.
 */

const SUPER: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻', '+': '',
};

export interface FormatOptions {
  readonly sigFigs?: number;
  /** Drop trailing zeros of the mantissa (for published parameters: 54.56, not 54.5600). */
  readonly trim?: boolean;
  /** 'unicode': 1.33×10¹⁵ (console, Slack, Teams); 'ascii': 1.33e15 (logs, plain fallbacks). */
  readonly style?: 'unicode' | 'ascii';
}

/** 1330000000000000 → "1.33×10¹⁵"; 8.2 → "8.20"; 0.0123 → "0.0123"; 12345 → "1.23×10⁴". */
export function formatNumber(value: number, options: FormatOptions = {}): string {
  const sig = options.sigFigs ?? 3;
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  // Decide the notation on the rounded value: 9999.7 at 3 figures is 1.00×10⁴, not "10000".
  const rounded = Math.abs(Number(value.toPrecision(sig)));
  if (rounded >= 1e-3 && rounded < 1e4) {
    const s = value.toPrecision(sig);
    if (s.includes('e') || options.trim) return Number(s).toString();
    return s;
  }
  const [rawMantissa, exponent] = value.toExponential(sig - 1).split('e') as [string, string];
  const mantissa = options.trim ? String(Number(rawMantissa)) : rawMantissa;
  const exp = String(Number(exponent));
  if (options.style === 'ascii') return `${mantissa}e${exp}`;
  return `${mantissa}×10${[...exp].map((c) => SUPER[c] ?? c).join('')}`;
}

/** Value with its unit, with the thin conventions of the trade (no space before %). */
export function formatQuantity(value: number, unit: string, options: FormatOptions = {}): string {
  const n = formatNumber(value, options);
  if (unit === '') return n;
  if (unit === '%' || unit === '%/K') return `${n} ${unit}`;
  return `${n} ${unit}`;
}

/** A percentage from a fraction: 0.0123 → "1.23 %". */
export function formatPercent(fraction: number, sigFigs = 3): string {
  return `${formatNumber(fraction * 100, { sigFigs })} %`;
}

/** Celsius from kelvin for display beside K. */
export function formatTemperature(temperatureK: number): string {
  const k = Number(temperatureK.toFixed(2));
  const c = Number((temperatureK - 273.15).toFixed(2));
  return `${k} K (${c} °C)`;
}
