/** Pieces of parsing that several commands share: dopant, model, the id/time of a reply. */
import { z } from 'zod';
import type { Dopant } from '../physics/types.js';
import type { ReplyIdentity } from '../reply/build.js';
import { ArgError, type Args } from './args.js';
import type { HandleContext } from './context.js';
import { DOPANT_WORDS, TYPE_ONLY_WORDS } from './words.js';

export const DopantSchema = z.enum(['boron', 'phosphorus', 'arsenic', 'antimony']);

export const DOPANT_HINT = 'p, n, boron (B), phosphorus (P), arsenic (As) or antimony (Sb)';

export function readDopant(args: Args): { dopant: Dopant; typeOnly: boolean; raw: string } | undefined {
  const hit = args.word(DOPANT_WORDS);
  if (!hit) return undefined;
  // "type p", "type=n" read the same as "p" / "n".
  return { dopant: hit.value, typeOnly: TYPE_ONLY_WORDS.has(hit.raw.toLowerCase()), raw: hit.raw };
}

export function requireDopant(args: Args, example: string): { dopant: Dopant; typeOnly: boolean; raw: string } {
  args.flag(['type']);
  const d = readDopant(args);
  if (!d) throw new ArgError('missing_dopant', `Say which dopant or type: ${DOPANT_HINT}. For example: ${example}`);
  return d;
}

export function readModelId(args: Args): string | undefined {
  return args.keyedWord(['model', 'using']);
}

export function identity(ctx: HandleContext): ReplyIdentity {
  return { id: ctx.newId(), createdAt: ctx.now().toISOString() };
}
