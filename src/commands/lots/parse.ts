/** Parsing shared by the lot commands: the lot id, wafer and site, and the lot service. */
import type { LotService } from '../../lots/service.js';
import type { Actor } from '../../lots/readings.js';
import { WAFER_MAX, WAFER_MIN, SITE_MAX, SITE_MIN } from '../../lots/ids.js';
import { ArgError, type Args } from '../args.js';
import type { HandleContext } from '../context.js';

/** Words the lot commands use as keys: never a lot id. */
const KEYWORDS = new Set([
  'rho', 'resistivity', 'res', 'sheet', 'rs', 'type', 'thick', 'thickness', 'spacing', 'at', 'temp', 'product', 'corrects', 'map', 'edge', 'diam',
  'correcting', 'replaces', 'site', 'wafer', 'because', 'all', 'today', '24h', '7d', 'open',
]);

/** 'w1'…'w50', 'W01'…: the wafer words `Args.word` can look up. */
const WAFER_WORDS: Readonly<Record<string, number>> = Object.fromEntries(
  Array.from({ length: WAFER_MAX - WAFER_MIN + 1 }, (_, i) => i + WAFER_MIN).flatMap((n) => [
    [`w${n}`, n],
    ...(n < 10 ? [[`w0${n}`, n] as const] : []),
  ]),
);

/** The first token, as the lot id (word or number, as typed). */
export function takeLotId(args: Args, example: string): string {
  const first = args.tokens[0];
  const raw = first?.raw ?? '';
  if (!first || KEYWORDS.has(raw.toLowerCase())) {
    throw new ArgError('missing_lot', `Start with the lot id, e.g. ${example}`);
  }
  // Consume it through the public API: it is the first unused word (or number) of its kind.
  if (first.kind === 'word') {
    args.flag([first.text]);
  } else {
    // A lot id typed as a bare number ("2345678").
    if (first.unitText !== '') throw new ArgError('missing_lot', `Start with the lot id, e.g. ${example}`);
    args.quantity(['resistivity']);
  }
  return raw;
}

export function takeWafer(args: Args): number | undefined {
  const hit = args.word(WAFER_WORDS);
  const keyed = hit ? undefined : args.keyedWord(['wafer', 'w']);
  if (hit) return hit.value;
  if (keyed === undefined) return undefined;
  const n = Number(keyed);
  if (!Number.isInteger(n) || n < WAFER_MIN || n > WAFER_MAX) {
    throw new ArgError('bad_wafer', `"wafer ${keyed}": wafers are numbered ${WAFER_MIN} to ${WAFER_MAX}, e.g. w3`);
  }
  return n;
}

export function takeSite(args: Args): number | undefined {
  const keyed = args.keyedWord(['site', 's']);
  if (keyed === undefined) return undefined;
  const n = Number(keyed);
  if (!Number.isInteger(n) || n < SITE_MIN || n > SITE_MAX) {
    throw new ArgError('bad_site', `"site ${keyed}": sites are numbered ${SITE_MIN} to ${SITE_MAX}, e.g. site 2`);
  }
  return n;
}

export function lotsOf(ctx: HandleContext): LotService | undefined {
  return ctx.lots;
}

export function actorOf(ctx: HandleContext): Actor {
  return {
    userId: ctx.caller.userId,
    ...(ctx.caller.displayName !== undefined ? { userName: ctx.caller.displayName } : {}),
    surface: ctx.surface,
    channelId: ctx.caller.channelId,
  };
}

export const NOT_SET_UP =
  'Lot records are not set up in this session (no lot store). Start shiftprobe with its database (npm start) to record and look up lots.';
