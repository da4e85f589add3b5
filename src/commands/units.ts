/**
 * Quantities people type, parsed once, here, with mathjs units. Everything after this file
 * works in canonical units: Ω·cm, Ω/□, cm⁻³, K, cm, V, A, cm³/C, 1/K.
 *
 * Spellings accepted (tested in test/commands/units.test.ts): Ω·cm, ohm-cm, ohm cm, ohm*cm,
 * mΩ·cm, Ω·m, ohm/sq, Ω/□, K, °C, degC, C (where a temperature is expected), µm, um, mm, mV, V,
 * mA, µA, cm^-3, cm-3, /cm3, cm⁻³, cm3/C, %/K; numbers 1.5e15, 1.5x10^15, 1.5×10¹⁵.
 */
import { createRequire } from 'node:module';
import type { Unit } from 'mathjs';
import { MATHJS_PREFIXES, MATHJS_UNIT_NAMES } from './unit-words.js';

// Only the unit machinery of mathjs (not its whole expression library), loaded and made on first
// use (required from node_modules, outside the bundle): an answer whose units are common ones
// (below) or that no word of could be a unit (mayBeOurUnit) never loads mathjs at all.
let unitFactory: ((...a: unknown[]) => Unit) | undefined;
function mathUnit(value: number | string, unit?: string): Unit {
  if (!unitFactory) {
    const { create, unitDependencies } = createRequire(import.meta.url)('mathjs') as typeof import('mathjs');
    unitFactory = create({ unitDependencies: unitDependencies! }).unit as unknown as (...a: unknown[]) => Unit;
  }
  return unit === undefined ? unitFactory(value) : unitFactory(value, unit);
}

/** Units people type every shift, read without mathjs (the same factors it would give). */
export const COMMON_UNITS: ReadonlyMap<string, { dimension: Dimension; factor: number; display: string }> = new Map([
  ['ohm cm', { dimension: 'resistivity', factor: 1, display: 'ohm cm' }],
  ['mohm cm', { dimension: 'resistivity', factor: 1e-3, display: 'mohm cm' }],
  ['kohm cm', { dimension: 'resistivity', factor: 1e3, display: 'kohm cm' }],
  ['ohm m', { dimension: 'resistivity', factor: 100, display: 'ohm m' }],
  ['um', { dimension: 'length', factor: 1e-4, display: 'um' }],
  ['mm', { dimension: 'length', factor: 0.1, display: 'mm' }],
  ['cm', { dimension: 'length', factor: 1, display: 'cm' }],
  ['nm', { dimension: 'length', factor: 1e-7, display: 'nm' }],
  ['mV', { dimension: 'voltage', factor: 1e-3, display: 'mV' }],
  ['V', { dimension: 'voltage', factor: 1, display: 'V' }],
  ['uV', { dimension: 'voltage', factor: 1e-6, display: 'uV' }],
  ['mA', { dimension: 'current', factor: 1e-3, display: 'mA' }],
  ['A', { dimension: 'current', factor: 1, display: 'A' }],
  ['uA', { dimension: 'current', factor: 1e-6, display: 'uA' }],
  ['cm^3/C', { dimension: 'hallCoefficient', factor: 1, display: 'cm^3/C' }],
]);

export type Dimension =
  | 'resistivity'
  | 'sheetResistance'
  | 'density'
  | 'temperature'
  | 'length'
  | 'voltage'
  | 'current'
  | 'hallCoefficient'
  | 'resistance'
  | 'magneticField'
  | 'temperatureCoefficient';

/** How each dimension is named to people, its canonical unit, and a typed example. */
export const DIMENSIONS: Readonly<
  Record<Dimension, { readonly name: string; readonly canonical: string; readonly example: string }>
> = {
  resistivity: { name: 'a resistivity', canonical: 'Ω·cm', example: '8.2 ohm-cm' },
  sheetResistance: { name: 'a sheet resistance', canonical: 'Ω/□', example: '45 ohm/sq' },
  density: { name: 'a dopant density', canonical: 'cm⁻³', example: '2e15 cm-3' },
  temperature: { name: 'a temperature', canonical: 'K', example: '27C or 300K' },
  length: { name: 'a length', canonical: 'cm', example: '525um' },
  voltage: { name: 'a voltage', canonical: 'V', example: '-1.2mV' },
  current: { name: 'a current', canonical: 'A', example: '1mA' },
  hallCoefficient: { name: 'a Hall coefficient', canonical: 'cm³/C', example: '-1.3e3 cm3/C' },
  resistance: { name: 'a resistance', canonical: 'Ω', example: '12.4 ohm' },
  magneticField: { name: 'a magnetic field', canonical: 'T', example: '0.5T or 5kG' },
  temperatureCoefficient: { name: 'a temperature coefficient', canonical: '%/K', example: '0.75%/K' },
};

export interface Quantity {
  readonly dimension: Dimension;
  /** Value in the canonical unit of its dimension (temperature coefficient as a fraction per K). */
  readonly value: number;
  /** The unit as the person typed it, normalised for display. */
  readonly unitAsTyped: string;
  /** The whole text the person typed for it. */
  readonly raw: string;
  /** A sentence for the reply when the unit was assumed or converted. */
  readonly note?: string;
}

const SUPERSCRIPTS: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '⁻': '-', '⁺': '+',
};

/** Normalise a number's text: 1.5x10^15, 1.5×10¹⁵, 1.5*10^15, 1.5E15, −3 → 1.5e15, -3. */
export function normaliseNumberText(text: string): string {
  return text
    .replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺]+/g, (m) => '^' + [...m].map((c) => SUPERSCRIPTS[c]).join(''))
    .replace(/[−–]/g, '-')
    .replace(/\s*[x×*·]\s*10\s*\^\s*\(?([+-]?\d+)\)?/gi, 'e$1')
    .replace(/^10\^\(?([+-]?\d+)\)?/, '1e$1');
}

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?/i;

/** Split "8.2ohm-cm", "-1.2mV", "1.5×10¹⁵cm⁻³" into number text and unit text. */
export function splitNumber(text: string): { number: number; numberText: string; rest: string } | undefined {
  const norm = normaliseNumberText(text.trim());
  const m = NUMBER.exec(norm);
  if (!m) return undefined;
  const value = Number(m[0]);
  return { number: value, numberText: m[0], rest: norm.slice(m[0].length).trim() };
}

interface UnitReading {
  readonly dimension: Dimension;
  /** Multiply the typed number by this (or apply `convert`) to get the canonical value. */
  readonly convert: (n: number) => number;
  readonly display: string;
  /** Said in the reply when the unit was assumed or converted ("ohm read as Ω·cm"). */
  readonly note?: (n: number) => string;
}

type UnitProblem = { error: string; ambiguous?: boolean };

/**
 * All-capitals units ("OHM-CM", "KOHM-CM", "UM", "MV") are read in their usual case: prefixes
 * lower-case, V, A, C and K upper-case. "MOHM" stays ambiguous (milli or mega?) and is asked.
 */
function fromCapitals(text: string): string {
  if (/[a-zµ]/.test(text) || !/[A-Z]/.test(text)) return text;
  return text
    .toLowerCase()
    .replace(/\b([mun]?)v\b/g, '$1V')
    .replace(/\b([mun]?)a\b/g, '$1A')
    .replace(/\/\s*c\b/g, '/C')
    .replace(/^k$/, 'K')
    .replace(/^c$/, 'C');
}

/** Unit text → mathjs unit text, or a special reading (sheet, %/K, temperature words). */
function normaliseUnitText(text: string): string {
  return fromCapitals(text.replace(/[Ωω]/g, 'ohm'))
    .replace(/[µμ]/g, 'u')
    .replace(/\bohms\b/gi, 'ohm')
    .replace(/ohms(?=[^a-z]|$)/gi, 'ohm')
    .replace(/ohm(.*)$/i, (_m, rest: string) => `ohm${rest.replace(/[A-Z]/g, (c) => (c === 'C' && /\/\s*C$/.test(rest) ? c : c.toLowerCase()))}`)
    .replace(/\bK(?=ohm)/g, 'k')
    .replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺]+/g, (m) => '^' + [...m].map((c) => SUPERSCRIPTS[c]).join(''))
    .replace(/[−–]/g, '-')
    .replace(/ohm\s*[-·.*⋅]\s*/gi, 'ohm ')
    .replace(/ohm(?=[a-z])/gi, 'ohm ')
    .replace(/\bcm\s*-\s*3\b/g, 'cm-3')
    .trim();
}

const SHEET = /^([mkM]?)ohm\s*(?:\/\s*(?:sq|square|□|sqr)|per\s+(?:sq|square)|_?sq|\s+sq)$|^\/\s*(?:sq|□)$/;
const DENSITY = /^(?:(?:atoms?|carriers?)\s*)?(?:\/\s*cm\^?3|per\s+cm\^?3|cm\s*\^?\s*-\s*3|cm\^-3)$/i;
const TC = /^(%|ppm)\s*(?:\/|per\s+)\s*(?:K|degC|°C|C)$/i;
const PER_K = /^(?:1\s*)?\/\s*K$/i;
const TEMPERATURE_WORDS: ReadonlyMap<string, string> = new Map([
  ['c', 'degC'], ['°c', 'degC'], ['° c', 'degC'], ['degc', 'degC'], ['deg c', 'degC'], ['deg. c', 'degC'], ['degrees c', 'degC'],
  ['degree c', 'degC'], ['deg celsius', 'degC'], ['degrees celsius', 'degC'], ['celsius', 'degC'], ['c°', 'degC'],
  ['k', 'K'], ['kelvin', 'K'], ['kelvins', 'K'],
  ['f', 'degF'], ['°f', 'degF'], ['degf', 'degF'], ['deg f', 'degF'], ['degrees f', 'degF'], ['fahrenheit', 'degF'],
]);
/** Lengths people write that mathjs spells otherwise (or not at all). */
const LENGTH_WORDS: ReadonlyMap<string, { cm: number; display: string; note?: string }> = new Map([
  ['micron', { cm: 1e-4, display: 'µm' }],
  ['microns', { cm: 1e-4, display: 'µm' }],
  ['micrometer', { cm: 1e-4, display: 'µm' }],
  ['micrometre', { cm: 1e-4, display: 'µm' }],
  ['mil', { cm: 2.54e-3, display: 'mil', note: 'mil' }],
  ['mils', { cm: 2.54e-3, display: 'mil', note: 'mil' }],
  ['thou', { cm: 2.54e-3, display: 'mil', note: 'mil' }],
]);

/**
 * Readings of unit texts, remembered: people type the same few units over and over, and a
 * mathjs parse costs tens of microseconds. Bounded so junk input cannot grow it without end.
 */
const UNIT_CACHE = new Map<string, UnitReading | UnitProblem>();
const UNIT_CACHE_LIMIT = 2000;

function readUnit(unitText: string, expected?: Dimension): UnitReading | UnitProblem {
  const key = `${expected ?? ''}\u0000${unitText}`;
  const hit = UNIT_CACHE.get(key);
  if (hit) return hit;
  const reading = readUnitUncached(unitText, expected);
  if (UNIT_CACHE.size >= UNIT_CACHE_LIMIT) UNIT_CACHE.clear();
  UNIT_CACHE.set(key, reading);
  return reading;
}

function readUnitUncached(unitText: string, expected?: Dimension): UnitReading | UnitProblem {
  if (/^\s*M\s*OHM/.test(unitText) && !/[a-z]/.test(unitText)) {
    return { error: `"${unitText}": milliohm or megaohm? Write mΩ (milli) or MΩ (mega), e.g. 3.3 mohm-cm`, ambiguous: true };
  }
  // Tesla before the capitals are normalised (a lone t would read as a tonne).
  const tesla = /^\s*(m|µ|u)?(?:T|tesla|teslas)\s*$/i.exec(unitText);
  if (tesla && /T|tesla/.test(unitText) && (expected === 'magneticField' || expected === undefined)) {
    const scale = tesla[1] ? (tesla[1] === 'm' ? 1e-3 : 1e-6) : 1;
    return { dimension: 'magneticField', convert: (n) => n * scale, display: `${tesla[1] === 'm' ? 'm' : tesla[1] ? 'µ' : ''}T` };
  }
  const u = normaliseUnitText(unitText);
  const sheet = SHEET.exec(u);
  if (sheet) {
    const prefix = sheet[1] ?? '';
    const scale = prefix === 'm' ? 1e-3 : prefix === 'k' ? 1e3 : prefix === 'M' ? 1e6 : 1;
    return { dimension: 'sheetResistance', convert: (n) => n * scale, display: `${prefix === 'k' ? 'k' : prefix}Ω/□` };
  }
  // A bare "ohm" is read by what the command expects, and the reply says so.
  if (/^ohm$/.test(u)) {
    if (expected === 'resistivity') {
      return { dimension: 'resistivity', convert: (n) => n, display: 'Ω·cm', note: (n) => `"${n} ${unitText}" read as ${n} Ω·cm (a resistivity); give the unit as ohm-cm to be exact.` };
    }
    if (expected === 'resistance') {
      return { dimension: 'resistance', convert: (n) => n, display: 'Ω' };
    }
    if (expected === 'sheetResistance') {
      return { dimension: 'sheetResistance', convert: (n) => n, display: 'Ω/□', note: (n) => `"${n} ${unitText}" read as ${n} Ω/□ (a sheet resistance); give the unit as ohm/sq to be exact.` };
    }
    return { error: `"${unitText}" alone could be a resistivity (ohm-cm) or a sheet resistance (ohm/sq)`, ambiguous: true };
  }
  if (DENSITY.test(u)) return { dimension: 'density', convert: (n) => n, display: 'cm⁻³' };
  // Gauss is not a mathjs unit; tesla is (T, mT).
  const gauss = /^(k|m)?(?:G|gauss)$/.exec(u);
  if (gauss && (expected === 'magneticField' || expected === undefined)) {
    const scale = gauss[1] === 'k' ? 1e-1 : gauss[1] === 'm' ? 1e-7 : 1e-4;
    return { dimension: 'magneticField', convert: (n) => n * scale, display: `${gauss[1] ?? ''}G` };
  }
  const tc = TC.exec(u);
  if (tc) {
    const scale = tc[1] === '%' ? 1e-2 : 1e-6;
    return { dimension: 'temperatureCoefficient', convert: (n) => n * scale, display: `${tc[1]}/K` };
  }
  if (PER_K.test(u)) return { dimension: 'temperatureCoefficient', convert: (n) => n, display: '1/K' };
  const tempWord = TEMPERATURE_WORDS.get(u.toLowerCase().replace(/\s+/g, ' '));
  // A bare "C" is a temperature only where one is expected (otherwise it would be coulombs).
  if (tempWord && (u.toLowerCase() !== 'c' || expected === 'temperature' || expected === undefined)) {
    // The definitions of the scales (exact, as mathjs has them): T/K = t/°C + 273.15 = (t/°F + 459.67)·5/9.
    const toK = (n: number) => (tempWord === 'degC' ? n + 273.15 : tempWord === 'degF' ? ((n + 459.67) * 5) / 9 : n);
    return {
      dimension: 'temperature',
      convert: toK,
      display: tempWord === 'degC' ? '°C' : tempWord === 'degF' ? '°F' : 'K',
      ...(tempWord === 'degF'
        ? { note: (n: number) => `${n} °F converted to ${Math.round((toK(n) - 273.15) * 10) / 10} °C.` }
        : {}),
    };
  }
  const length = LENGTH_WORDS.get(u.toLowerCase());
  if (length) {
    return {
      dimension: 'length',
      convert: (n) => n * length.cm,
      display: length.display,
      ...(length.note ? { note: (n: number) => `${n} mil (thousandths of an inch) converted to ${Math.round(n * 25.4 * 10) / 10} µm.` } : {}),
    };
  }
  const common = COMMON_UNITS.get(u.replace(/\bcm3\b/g, 'cm^3'));
  if (common) return { dimension: common.dimension, convert: (n) => n * common.factor, display: common.display };
  const mathText = u.replace(/\bcm(\d)\b/g, 'cm^$1').replace(/\bm(\d)\b/g, 'm^$1');
  if (!mayBeOurUnit(mathText)) return { error: `I don't know the unit "${unitText}"` };
  let parsed: Unit;
  try {
    parsed = mathUnit(`1 ${mathText}`);
  } catch {
    return { error: `I don't know the unit "${unitText}"` };
  }
  for (const [dimension, canonical] of CANONICAL_MATHJS) {
    if (parsed.equalBase(mathUnit(canonical))) {
      // These units are all proportional (no offset): one factor converts any value.
      const factor = parsed.toNumber(canonical);
      return { dimension, convert: (n) => n * factor, display: u };
    }
  }
  return { error: `"${unitText}" is not a unit I can use here` };
}

/**
 * False when some word of `text` cannot be a mathjs unit of ours (a prefix and the name of a
 * length, resistance, voltage, current, charge, flux density or temperature unit,
 * src/commands/unit-words.ts): then mathjs would refuse it or give a quantity we do not read
 * ("at" would be atto-tonnes), and asking it would build its unit machinery (about 100 ms) for
 * nothing. The tokenizer asks this of every word run after a
 * number ("8.2 ohm-cm p": "ohm cm p"). Words with digits or other letters are left to mathjs.
 */
function mayBeOurUnit(text: string): boolean {
  for (const word of text.match(/[A-Za-z_][A-Za-z0-9_]*/g) ?? []) {
    if (/\d/.test(word) || MATHJS_UNIT_NAMES.has(word)) continue;
    if (!MATHJS_PREFIXES.some((p) => word.length > p.length && word.startsWith(p) && MATHJS_UNIT_NAMES.has(word.slice(p.length)))) return false;
  }
  return true;
}

const CANONICAL_MATHJS: readonly (readonly [Dimension, string])[] = [
  ['resistivity', 'ohm cm'],
  ['density', 'cm^-3'],
  ['length', 'cm'],
  ['voltage', 'V'],
  ['current', 'A'],
  ['hallCoefficient', 'cm^3/C'],
  ['resistance', 'ohm'],
  ['magneticField', 'T'],
];

export type QuantityParse =
  | { ok: true; quantity: Quantity }
  | { ok: false; reason: 'not_a_number' | 'unknown_unit' | 'not_finite' | 'ambiguous_unit'; message: string };

/**
 * Parse "8.2 ohm-cm", "1.5x10^15 cm^-3", "27C". A number with no unit takes `defaultDimension`
 * (the caller says so in the reply's assumptions).
 */
export function parseQuantity(text: string, expected?: Dimension): QuantityParse {
  const split = splitNumber(text);
  if (!split) return { ok: false, reason: 'not_a_number', message: `"${text}" is not a number` };
  if (!Number.isFinite(split.number)) {
    return { ok: false, reason: 'not_finite', message: `"${text}" is too large to be a measured value` };
  }
  if (split.rest === '') {
    if (!expected) return { ok: false, reason: 'unknown_unit', message: `"${text}" needs a unit` };
    return {
      ok: true,
      quantity: { dimension: expected, value: defaultUnitValue(expected, split.number), unitAsTyped: '', raw: text },
    };
  }
  const reading = readUnit(split.rest, expected);
  if ('error' in reading) return { ok: false, reason: reading.ambiguous ? 'ambiguous_unit' : 'unknown_unit', message: reading.error };
  const value = reading.convert(split.number);
  if (!Number.isFinite(value)) {
    return { ok: false, reason: 'not_finite', message: `"${text}" is too large to be a measured value` };
  }
  return {
    ok: true,
    quantity: {
      dimension: reading.dimension,
      value,
      unitAsTyped: reading.display,
      raw: text,
      ...(reading.note ? { note: reading.note(split.number) } : {}),
    },
  };
}

/** A bare number takes the canonical unit of the expected dimension (temperature: K; coefficient: %/K). */
function defaultUnitValue(dimension: Dimension, n: number): number {
  return dimension === 'temperatureCoefficient' ? n / 100 : n;
}

/** Whether `text` (one or more words) reads as a unit at all: used by the tokenizer to glue units to numbers. */
export function looksLikeUnit(text: string): boolean {
  const r = readUnit(text);
  return !('error' in r) || r.ambiguous === true;
}
