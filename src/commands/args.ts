/**
 * Order-free reading of a command's tokens. Each `take…` consumes what it found; whatever is
 * left at the end is reported back to the person as not understood.
 */
import { DIMENSIONS, parseQuantity, type Dimension, type Quantity } from './units.js';
import type { Token } from './tokens.js';

export class ArgError extends Error {
  constructor(
    readonly code: string,
    message: string,
    /** A corrected whole command to offer ("did you mean"), when one is known. */
    readonly suggestion?: string,
  ) {
    super(message);
  }
}

/** One answer to a question: what to show, the short answer a person types, and the token it replaces. */
export interface AskChoice {
  readonly label: string;
  readonly answer: string;
  /** Token replacements that turn the command into this reading ('' removes the token). */
  readonly edits: readonly { readonly token: Token; readonly replacement: string }[];
}

/**
 * A word with two readings a practitioner would use: the reply asks one short question, with
 * each reading's whole command ready to copy (or a button), and nothing is computed or stored.
 */
export class AskError extends ArgError {
  constructor(
    code: string,
    question: string,
    readonly choices: readonly AskChoice[],
  ) {
    super(code, question);
  }
}

export class Args {
  private readonly used: boolean[];
  /** Sentences for the reply: units that were assumed or converted while reading. */
  readonly notes: string[] = [];
  constructor(readonly tokens: readonly Token[]) {
    this.used = tokens.map(() => false);
  }

  /** The value after one of `keys` ("thick 525um", "thick=525um"), read as `dimension`. */
  keyed(keys: readonly string[], dimension: Dimension): Quantity | undefined {
    const i = this.findWord(keys);
    if (i < 0) return undefined;
    const next = this.tokens[i + 1];
    const key = (this.tokens[i] as { text: string }).text;
    if (!next || next.kind !== 'number' || this.used[i + 1]) {
      throw new ArgError(
        'missing_value',
        `"${key}" needs ${DIMENSIONS[dimension].name} after it, e.g. "${key} ${DIMENSIONS[dimension].example}"`,
      );
    }
    this.used[i] = true;
    this.used[i + 1] = true;
    return this.read(next, dimension, key);
  }

  /**
   * The value after one of `keys` and, when the token after that value is a word `map` knows,
   * that word too ("on 1e15 p" → 1e15 cm⁻³ and p). Issue 5 (layer backgrounds).
   */
  keyedWithWord<T>(
    keys: readonly string[],
    dimension: Dimension,
    map: Readonly<Record<string, T>>,
  ): { quantity: Quantity; word?: { value: T; raw: string } } | undefined {
    const i = this.findWord(keys);
    if (i < 0) return undefined;
    const quantity = this.keyed(keys, dimension);
    if (!quantity) return undefined;
    const after = this.tokens[i + 2];
    if (after && after.kind === 'word' && !this.used[i + 2]) {
      const hit = lookup(map, after.text);
      if (hit !== undefined) {
        this.used[i + 2] = true;
        return { quantity, word: { value: hit, raw: after.raw } };
      }
    }
    return { quantity };
  }

  /** The word after one of `keys` ("model masetti", "expect n"). */
  keyedWord(keys: readonly string[]): string | undefined {
    const i = this.findWord(keys);
    if (i < 0) return undefined;
    const next = this.tokens[i + 1];
    const key = (this.tokens[i] as { text: string }).text;
    if (!next || this.used[i + 1]) throw new ArgError('missing_value', `"${key}" needs a word after it`);
    this.used[i] = true;
    this.used[i + 1] = true;
    return next.raw;
  }

  /** Everything after one of `keys`, as typed, consuming it all ("because re-measured on the referee tool"). */
  rest(keys: readonly string[]): string | undefined {
    const i = this.findWord(keys);
    if (i < 0) return undefined;
    for (let j = i; j < this.tokens.length; j++) this.used[j] = true;
    return this.tokens
      .slice(i + 1)
      .map((t) => t.verbatim)
      .join(' ');
  }

  /** A flag word is present ("epi"). */
  flag(keys: readonly string[]): boolean {
    const i = this.findWord(keys);
    if (i < 0) return false;
    this.used[i] = true;
    return true;
  }

  /** The first unused word that `map` knows, mapped. */
  word<T>(map: Readonly<Record<string, T>>): { value: T; raw: string } | undefined {
    const [hit] = this.takeWords(map, 1);
    return hit ? { value: hit.value, raw: hit.raw } : undefined;
  }

  /** Every unused word that `map` knows, mapped and consumed, in the order typed. */
  allWords<T>(map: Readonly<Record<string, T>>): { value: T; raw: string; text: string; token: Token }[] {
    return this.takeWords(map, Infinity);
  }

  private takeWords<T>(map: Readonly<Record<string, T>>, most: number): { value: T; raw: string; text: string; token: Token }[] {
    const out: { value: T; raw: string; text: string; token: Token }[] = [];
    for (let i = 0; i < this.tokens.length && out.length < most; i++) {
      const t = this.tokens[i]!;
      if (this.used[i] || t.kind !== 'word') continue;
      const hit = lookup(map, t.text);
      if (hit !== undefined) {
        this.used[i] = true;
        out.push({ value: hit, raw: t.raw, text: t.text, token: t });
      }
    }
    return out;
  }

  /** Unused word tokens (for "did you mean" and uncovered-word answers); nothing is consumed. */
  unusedWords(): (Token & { kind: 'word' })[] {
    return this.tokens.filter((t, i): t is Token & { kind: 'word' } => !this.used[i] && t.kind === 'word');
  }

  /** The first unused token of any kind whose text as typed `map` knows ("24h", "7d"), mapped. */
  literal<T>(map: Readonly<Record<string, T>>): { value: T; raw: string } | undefined {
    for (let i = 0; i < this.tokens.length; i++) {
      const t = this.tokens[i]!;
      if (this.used[i]) continue;
      const hit = lookup(map, t.raw);
      if (hit !== undefined) {
        this.used[i] = true;
        return { value: hit, raw: t.raw };
      }
    }
    return undefined;
  }

  /**
   * The first unused number whose unit reads as one of `dimensions`; a bare number takes the
   * first of them (`bareNumber` tells the caller, to say so in the assumptions).
   */
  quantity(dimensions: readonly Dimension[]): (Quantity & { bareNumber: boolean }) | undefined {
    for (let i = 0; i < this.tokens.length; i++) {
      const t = this.tokens[i]!;
      if (this.used[i] || t.kind !== 'number') continue;
      if (!Number.isFinite(t.value)) {
        throw new ArgError('not_finite', `"${t.raw}" is too large to be a measured value; check the exponent.`);
      }
      if (t.unitText === '') {
        this.used[i] = true;
        return { ...this.read(t, dimensions[0]!, undefined), bareNumber: true };
      }
      const q = parseQuantity(`${t.value} ${t.unitText}`, dimensions[0]);
      if (!q.ok && q.reason === 'ambiguous_unit') throw new ArgError('ambiguous_unit', q.message);
      if (q.ok && dimensions.includes(q.quantity.dimension)) {
        this.used[i] = true;
        if (q.quantity.note) this.notes.push(q.quantity.note);
        return { ...q.quantity, raw: t.raw, bareNumber: false };
      }
    }
    return undefined;
  }

  /** The first unused number token, whatever its unit (to explain a wrong dimension). */
  anyNumber(): Token | undefined {
    return this.tokens.find((t, i) => !this.used[i] && t.kind === 'number');
  }

  leftovers(): string[] {
    return this.tokens.filter((_t, i) => !this.used[i]).map((t) => t.raw);
  }

  private findWord(keys: readonly string[]): number {
    const lower = keys.map((k) => k.toLowerCase());
    return this.tokens.findIndex(
      (t, i) => !this.used[i] && t.kind === 'word' && lower.includes(t.text.toLowerCase()),
    );
  }

  private read(t: Token, dimension: Dimension, key: string | undefined): Quantity {
    if (t.kind === 'number' && !Number.isFinite(t.value)) {
      throw new ArgError('not_finite', `"${t.raw}" is too large to be a measured value; check the exponent.`);
    }
    const q = parseQuantity(t.kind === 'number' ? `${t.value} ${t.unitText}` : t.raw, dimension);
    const what = key ? `"${key}"` : 'the value';
    if (!q.ok) {
      throw new ArgError(q.reason === 'not_finite' ? 'not_finite' : q.reason === 'ambiguous_unit' ? 'ambiguous_unit' : 'bad_unit', `${q.message}; ${what} takes ${DIMENSIONS[dimension].name}, e.g. ${DIMENSIONS[dimension].example}`);
    }
    if (q.quantity.dimension !== dimension) {
      throw new ArgError(
        'wrong_dimension',
        `"${t.raw}" is ${DIMENSIONS[q.quantity.dimension].name}, but ${what} takes ${DIMENSIONS[dimension].name} (e.g. ${DIMENSIONS[dimension].example})`,
      );
    }
    if (q.quantity.note) this.notes.push(q.quantity.note);
    return { ...q.quantity, raw: t.raw };
  }
}

/**
 * Case-sensitive hit first (so "As" and "as" can differ), then case-insensitive. Only the map's
 * own keys count: "constructor" or "__proto__" typed by a person is just an unknown word.
 */
export function lookup<T>(map: Readonly<Record<string, T>>, text: string): T | undefined {
  if (Object.hasOwn(map, text)) return map[text];
  const lower = text.toLowerCase();
  for (const k of Object.keys(map)) if (k.toLowerCase() === lower) return map[k];
  return undefined;
}
