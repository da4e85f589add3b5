/** Pieces of parsing that several commands share: dopant, model, the id/time of a reply. */
import { z } from 'zod';
import type { Dopant } from '../physics/types.js';
import type { ReplyIdentity } from '../reply/build.js';
import { ArgError, AskError, type Args } from './args.js';
import type { HandleContext } from './context.js';
import { DOPANT_WORDS, TYPE_ONLY_WORDS, UNCOVERED_DOPANT_WORDS, UNCOVERED_MATERIAL_WORDS } from './words.js';

export const DopantSchema = z.enum(['boron', 'phosphorus', 'arsenic', 'antimony']);

export const DOPANT_HINT = 'p or n (the type), or boron (B), phosphorus (phos), arsenic (As) or antimony (Sb)';

export interface DopantReading {
  readonly dopant: Dopant;
  /** The person named only a type (p, n, P-type…): the dopant is the usual one for it. */
  readonly typeOnly: boolean;
  /** As typed, for the reply's "read as" line. */
  readonly raw: string;
}

const TYPE_OF: Readonly<Record<Dopant, 'p' | 'n'>> = { boron: 'p', phosphorus: 'n', arsenic: 'n', antimony: 'n' };

/**
 * The dopant of a single-dopant conversion. Every type and dopant word is read, so that words
 * that disagree ("n … boron", "p … n") are asked about instead of one being picked.
 */
export function readDopant(args: Args): DopantReading | undefined {
  const hits = args.allWords(DOPANT_WORDS);
  if (hits.length === 0) {
    refuseUncovered(args);
    return undefined;
  }
  const typeWords = hits.filter((h) => TYPE_ONLY_WORDS.has(h.text.toLowerCase()));
  const named = hits.filter((h) => !TYPE_ONLY_WORDS.has(h.text.toLowerCase()));
  const namedDopants = [...new Set(named.map((h) => h.value))];
  if (namedDopants.length > 1) {
    throw new ArgError(
      'two_dopants',
      `"${named[0]!.raw}" and "${named.find((h) => h.value !== named[0]!.value)!.raw}" name two dopants; this conversion takes one. For compensated material use carriers, e.g. carriers 1e16 B and 3e15 phos at 300K.`,
    );
  }
  const types = [...new Set(typeWords.map((h) => TYPE_OF[h.value]))];
  if (types.length > 1) {
    const p = typeWords.find((h) => TYPE_OF[h.value] === 'p')!;
    const n = typeWords.find((h) => TYPE_OF[h.value] === 'n')!;
    throw new AskError('conflicting_type', `"${p.raw}" and "${n.raw}" disagree: is the material p-type or n-type?`, [
      { label: 'p-type (boron)', answer: 'p', edits: [{ token: p.token, replacement: 'p' }, { token: n.token, replacement: '' }] },
      { label: 'n-type (phosphorus)', answer: 'n', edits: [{ token: n.token, replacement: 'n' }, { token: p.token, replacement: '' }] },
    ]);
  }
  const dopantHit = named[0];
  if (dopantHit && types.length === 1 && types[0] !== TYPE_OF[dopantHit.value]) {
    const t = typeWords[0]!;
    const dopantType = TYPE_OF[dopantHit.value];
    throw new AskError(
      'conflicting_type',
      `"${t.raw}" says ${types[0]}-type, but ${dopantHit.value} makes silicon ${dopantType}-type. Which is it?`,
      [
        { label: `${dopantHit.value} (${dopantType}-type)`, answer: dopantHit.value, edits: [{ token: t.token, replacement: '' }] },
        { label: `${types[0]}-type (${DEFAULT_DOPANT[types[0]!]})`, answer: types[0]!, edits: [{ token: dopantHit.token, replacement: '' }, { token: t.token, replacement: types[0]! }] },
      ],
    );
  }
  if (dopantHit) return { dopant: dopantHit.value, typeOnly: false, raw: dopantHit.raw };
  const t = typeWords[0]!;
  return { dopant: t.value, typeOnly: true, raw: t.raw };
}

const DEFAULT_DOPANT: Readonly<Record<'p' | 'n', Dopant>> = { p: 'boron', n: 'phosphorus' };

/** A dopant or material the conversions do not cover gets a clear answer, not "say which dopant". */
export function refuseUncovered(args: Args): void {
  for (const w of args.unusedWords()) {
    const dopant = lookupOwn(UNCOVERED_DOPANT_WORDS, w.text);
    if (dopant) {
      throw new ArgError(
        'dopant_not_covered',
        `${capitalise(dopant)} ("${w.raw}") is not covered: the resistivity ↔ density conversions cover boron, phosphorus, arsenic and antimony in silicon.`,
      );
    }
    const material = lookupOwn(UNCOVERED_MATERIAL_WORDS, w.text);
    if (material) {
      throw new ArgError(
        'material_not_covered',
        `Resistivity ↔ dopant density is covered for silicon only, not ${material} ("${w.raw}"). For germanium and gallium arsenide I can give n_i and the band gap, e.g. ni 300K Ge.`,
      );
    }
  }
}

function lookupOwn(map: Readonly<Record<string, string>>, text: string): string | undefined {
  return Object.hasOwn(map, text) ? map[text] : undefined;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

export function requireDopant(args: Args, example: string): DopantReading {
  args.flag(['type']);
  const d = readDopant(args);
  if (!d) {
    const unknown = args.unusedWords().map((w) => `"${w.raw}"`);
    const lead = unknown.length > 0 ? `I didn't understand ${unknown.join(', ')}. ` : '';
    throw new ArgError('missing_dopant', `${lead}Say which dopant or type: ${DOPANT_HINT}. For example: ${example}`);
  }
  return d;
}

export function readModelId(args: Args): string | undefined {
  return args.keyedWord(['model', 'using']);
}

export function identity(ctx: HandleContext): ReplyIdentity {
  return { id: ctx.newId(), createdAt: ctx.now().toISOString() };
}
