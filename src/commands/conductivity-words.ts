/**
 * Conductivity-type words as the shift types them, read before any command sees its tokens.
 *
 * The safety rule: a word that names a conductivity type is never read as a dopant of the other
 * type, and a word with two readings a practitioner would use is asked about, never guessed.
 *
 *   "P type", "type P", "type=P", "P-type", "ptype", "p-typ", "P<100>", "p+", "n--"  → the type
 *   "P/B", "N/Ph", "N/As", "N/Sb" (wafer-label type/dopant)                          → that dopant
 *   a lone capital "P"                                                              → asked
 *       (p-type or phosphorus?), unless the command says which: another element symbol
 *       in the same command ("1e16 B and 3e15 P") makes it phosphorus, and a command
 *       can add its own rule (a layer on a p background can only be phosphorus).
 *   "<100>", "(111)" alone: a wafer orientation, noted and not used.
 *
 * Free text after "because" is never touched.
 */
import { AskError, ArgError } from './args.js';
import type { Token } from './tokens.js';

/** The words that end free text: nothing after them is read as a type or dopant. */
const FREE_TEXT_KEYS = new Set(['because', 'reason', 'note']);

const LETTER = /^[pn]$/i;
const TYPE_TAIL = /^-?(?:type|typ)\.?$/i;
const TYPE_HEAD = /^(?:type|typ|conductivity)$/i;
const ONE_WORD_TYPE = /^([pn])[-_]?(?:type|typ)\.?$/i;
const DOPING_LEVEL = /^([pn])(?:\+{1,2}|-{1,2})$/i;
const WITH_ORIENTATION = /^([pn])\s*[<([]\s*(100|110|111)\s*[>)\]]$/i;
const ORIENTATION = /^[<([]\s*(100|110|111)\s*[>)\]]$/;
const WAFER_LABEL = /^([pn])\/([a-z.]+)$/i;

const LABEL_DOPANTS: Readonly<Record<string, { dopant: string; type: 'p' | 'n' }>> = {
  b: { dopant: 'boron', type: 'p' },
  boron: { dopant: 'boron', type: 'p' },
  p: { dopant: 'phosphorus', type: 'n' },
  ph: { dopant: 'phosphorus', type: 'n' },
  phos: { dopant: 'phosphorus', type: 'n' },
  'phos.': { dopant: 'phosphorus', type: 'n' },
  phosphorus: { dopant: 'phosphorus', type: 'n' },
  as: { dopant: 'arsenic', type: 'n' },
  arsenic: { dopant: 'arsenic', type: 'n' },
  sb: { dopant: 'antimony', type: 'n' },
  antimony: { dopant: 'antimony', type: 'n' },
};

/** Element words that make a lone "P" the element: the person is naming dopants by element. */
const ELEMENT_WORDS = new Set(['B', 'As', 'Sb', 'boron', 'arsenic', 'antimony', 'phosphorus', 'phos', 'phos.']);

function typeToken(letter: string, from: readonly Token[]): Token {
  return {
    kind: 'word',
    text: `${letter.toLowerCase()}-type`,
    raw: from.map((t) => t.raw).join(' '),
    verbatim: from.map((t) => t.verbatim).join(' '),
  };
}

export interface TypeWordReading {
  readonly tokens: Token[];
  /** Sentences for the reply's assumptions ("<100> read as the wafer orientation; not used"). */
  readonly notes: string[];
}

/**
 * Merge the ways people write a conductivity type into one word token "p-type"/"n-type"
 * (raw: as typed), wafer labels into their dopant, and drop orientations with a note.
 */
export function mergeTypePhrases(tokens: readonly Token[]): TypeWordReading {
  const out: Token[] = [];
  const notes: string[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i]!;
    if (t.kind === 'word' && FREE_TEXT_KEYS.has(t.text.toLowerCase())) {
      out.push(...tokens.slice(i));
      break;
    }
    const next = tokens[i + 1];
    if (t.kind !== 'word') {
      out.push(t);
      continue;
    }
    if (LETTER.test(t.text) && next?.kind === 'word' && TYPE_TAIL.test(next.text)) {
      out.push(typeToken(t.text, [t, next]));
      i++;
      continue;
    }
    if (TYPE_HEAD.test(t.text) && next?.kind === 'word' && (LETTER.test(next.text) || ONE_WORD_TYPE.test(next.text))) {
      out.push(typeToken(next.text.charAt(0), [t, next]));
      i++;
      continue;
    }
    const one = ONE_WORD_TYPE.exec(t.text) ?? DOPING_LEVEL.exec(t.text);
    if (one) {
      out.push(typeToken(one[1]!, [t]));
      continue;
    }
    const oriented = WITH_ORIENTATION.exec(t.text);
    if (oriented) {
      out.push(typeToken(oriented[1]!, [t]));
      notes.push(`<${oriented[2]}> read as the wafer orientation; it does not change the conversion.`);
      continue;
    }
    const orientation = ORIENTATION.exec(t.text);
    if (orientation) {
      notes.push(`"${t.raw}" read as the wafer orientation <${orientation[1]}>; it does not change the conversion.`);
      continue;
    }
    const label = WAFER_LABEL.exec(t.text);
    if (label) {
      const letter = label[1]!.toLowerCase();
      const d = Object.hasOwn(LABEL_DOPANTS, label[2]!.toLowerCase()) ? LABEL_DOPANTS[label[2]!.toLowerCase()] : undefined;
      if (d) {
        if (d.type !== letter) {
          throw new ArgError(
            'conflicting_type',
            `"${t.raw}" says ${letter}-type doped with ${d.dopant}, but ${d.dopant} makes silicon ${d.type}-type. Check the label and give the type or the dopant alone, e.g. "${letter}" or "${d.dopant}".`,
          );
        }
        out.push({ kind: 'word', text: d.dopant, raw: t.raw, verbatim: t.verbatim });
        continue;
      }
    }
    out.push(t);
  }
  return { tokens: out, notes };
}

/** How a command reads a lone capital "P" when the other words decide it. */
export type LonePRule = (tokens: readonly Token[]) => 'phosphorus' | 'p-type' | undefined;

/**
 * A lone capital "P": phosphorus where the command names dopants by element or its own rule
 * decides, otherwise a question. `skip` tokens (a lot id) are left as they are.
 */
export function resolveLoneP(tokens: readonly Token[], rule: LonePRule | undefined, skip: ReadonlySet<Token> = new Set()): Token[] {
  const loneP = (t: Token) => t.kind === 'word' && t.text === 'P' && !skip.has(t);
  const end = tokens.findIndex((t) => t.kind === 'word' && FREE_TEXT_KEYS.has(t.text.toLowerCase()));
  const scope = end < 0 ? tokens : tokens.slice(0, end);
  const target = scope.find(loneP);
  if (!target) return [...tokens];
  const elements = scope.some((t) => t.kind === 'word' && !loneP(t) && ELEMENT_WORDS.has(t.text));
  const decided = rule?.(tokens) ?? (elements ? 'phosphorus' : undefined);
  if (!decided) {
    throw new AskError(
      'ambiguous_p',
      `"P": p-type (boron) or phosphorus (n-type)? Answer \`p\` or \`phos\`.`,
      [
        { label: 'p-type (boron)', answer: 'p', edits: [{ token: target, replacement: 'p' }] },
        { label: 'phosphorus (n-type)', answer: 'phos', edits: [{ token: target, replacement: 'phos' }] },
      ],
    );
  }
  return tokens.map((t) =>
    loneP(t) && scope.includes(t)
      ? decided === 'phosphorus'
        ? { kind: 'word', text: 'phosphorus', raw: t.raw, verbatim: t.verbatim }
        : { kind: 'word', text: 'p-type', raw: t.raw, verbatim: t.verbatim }
      : t,
  );
}
