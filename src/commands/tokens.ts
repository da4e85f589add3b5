/**
 * Text → tokens. Words stay words; a number glues to the unit that follows it ("8.2 ohm cm",
 * "45 ohm per sq", "-1.2mV"); `key=value` is read as `key value`.
 */
import { looksLikeUnit, normaliseNumberText, splitNumber } from './units.js';

/**
 * `raw` is the token as typed without separators (shown back to people, parsed further);
 * `verbatim` keeps the separators next to it, for free text such as a reason.
 */
export type Token =
  | { readonly kind: 'number'; readonly value: number; readonly unitText: string; readonly raw: string; readonly verbatim: string }
  | { readonly kind: 'word'; readonly text: string; readonly raw: string; readonly verbatim: string };

/** Longest input we read; anything longer is refused before parsing (chat messages are short). */
export const MAX_INPUT_CHARS = 2000;

export function tokenize(text: string): Token[] {
  const prepared = text
    .replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺]+/g, (m) => normaliseNumberText(m))
    // "1.5 x 10^15", "1.5×10^15" → "1.5e15" (digit on the left, so words with an x are untouched)
    .replace(/(\d)\s*[x×*·]\s*10\s*\^\s*\(?([+-−]?\d+)\)?/gi, (_m, d: string, e: string) => `${d}e${e.replace('−', '-')}`)
    .replace(/[−–]/g, '-')
    .replace(/=/g, ' ');
  // Separators "8.2 ohm-cm, p" are read as spaces, but `raw` keeps them, so free text (the
  // reason after "because") comes back as typed.
  const raws = prepared.split(/\s+/).filter((p) => p.length > 0);
  const parts = raws.map((r) => r.replace(/^[,;]+|[,;]+$/g, ''));
  const tokens: Token[] = [];
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i]!;
    if (part === '') {
      if (tokens.length > 0) {
        const last = tokens[tokens.length - 1]!;
        tokens[tokens.length - 1] = { ...last, verbatim: `${last.verbatim} ${raws[i]!}` };
      }
      continue;
    }
    const split = splitNumber(part);
    if (!split) {
      tokens.push({ kind: 'word', text: part, raw: part, verbatim: raws[i]! });
      continue;
    }
    let unitText = split.rest;
    let raw = part;
    let verbatim = raws[i]!;
    // Glue the longest run of following words (up to 3) that reads as a unit.
    for (let n = 3; n >= 1; n--) {
      if (i + n >= parts.length) continue;
      const following = parts.slice(i + 1, i + 1 + n);
      if (following.some((w) => splitNumber(w) !== undefined)) continue;
      const candidate = [unitText, ...following].filter((s) => s !== '').join(' ');
      if (looksLikeUnit(candidate)) {
        unitText = candidate;
        raw = [part, ...following].join(' ');
        verbatim = raws.slice(i, i + 1 + n).join(' ');
        i += n;
        break;
      }
    }
    tokens.push({ kind: 'number', value: split.number, unitText, raw, verbatim });
  }
  return tokens;
}
