/** `flags [today|24h|7d]`: flagged lots with reason and age (no period: every open flag). */
import { z } from 'zod';
import { flagHandle } from '../../lots/flags.js';
import { placeLabel } from '../../lots/ids.js';
import { FLAG_PERIODS, type FlagsResult } from '../../lots/service.js';
import { formatAge, formatLocal } from '../../lots/time.js';
import { errorReply, okReply, type ReplyIdentity } from '../../reply/build.js';
import type { ReplyOk } from '../../reply/reply.js';
import { ArgError } from '../args.js';
import { identity } from '../common.js';
import { defineCommand } from '../spec.js';
import { lotsOf, NOT_SET_UP } from './parse.js';
import { clearanceText, countValue, FLAG_TITLES, flagDetailText, LOT_FLAG_CAUTION } from './wording.js';

export const FlagsRequest = z.object({ period: z.enum(FLAG_PERIODS) });
export type FlagsRequest = z.infer<typeof FlagsRequest>;

const PERIOD_WORDS: Readonly<Record<string, FlagsRequest['period']>> = {
  open: 'open',
  today: 'today',
  '24h': '24h',
  day: '24h',
  '1d': '24h',
  '7d': '7d',
  week: '7d',
};

const USAGE = 'flags [today|24h|7d]';

export const flagsCommand = defineCommand<FlagsRequest>({
  verb: 'flags',
  aliases: ['flagged'],
  help: {
    summary: 'Flagged lots with the reason and age: every open flag, or the flags raised today, in the last 24 h or 7 days.',
    usage: USAGE,
    examples: ['flags', 'flags today', 'flags 24h', 'flags 7d'],
    options: ['today: since local midnight (DIGEST_TZ); 24h / 7d: rolling; no period: all open flags'],
    seeAlso: ['lot', 'clear', 'digest'],
  },
  schema: FlagsRequest,
  parse(args) {
    const hit = args.literal(PERIOD_WORDS);
    if (!hit) {
      const other = args.leftovers()[0];
      if (other !== undefined) throw new ArgError('bad_value', `"${other}" is not a period: say today, 24h or 7d (or nothing, for every open flag).`);
    }
    return { period: hit?.value ?? 'open' };
  },
  async run(req, ctx) {
    const lots = lotsOf(ctx);
    if (!lots) return errorReply('lots_unavailable', NOT_SET_UP);
    return flagsReply(identity(ctx), await lots.flags(req.period), lots.timeZone);
  },
});

export function flagsReply(id: ReplyIdentity, r: FlagsResult, timeZone: string): ReplyOk {
  const now = new Date(r.now);
  const lotCount = new Set(r.flags.map((f) => f.lotId)).size;
  const openCount = r.flags.filter((f) => !f.clearance).length;
  const span =
    r.period === 'open'
      ? 'Open flags'
      : r.period === 'today'
        ? `Flags raised today (since ${formatLocal(new Date(r.since!), timeZone)})`
        : `Flags raised in the last ${r.period === '24h' ? '24 hours' : '7 days'}`;
  const title = r.flags.length === 0 ? `${span}: none` : `${span}: ${r.flags.length} on ${lotCount} lot${lotCount === 1 ? '' : 's'}`;
  const rows = r.flags.map((f) => [
    flagHandle(f.id),
    f.lotId,
    f.lotProductId ?? f.productId ?? '—',
    placeLabel(f.wafer, f.site),
    formatAge(f.raisedAt, now),
    f.clearance ? 'cleared' : 'open',
    `${FLAG_TITLES[f.code] ?? f.code}: ${flagDetailText(f.detail)}`,
  ]);
  const cleared = r.flags.filter((f) => f.clearance);
  return okReply(id, {
    command: 'flags',
    title,
    values: [
      countValue('flagCount', r.flags.length, 'Flags', true),
      countValue('openFlagCount', openCount, 'Still open'),
      countValue('lotCount', lotCount, 'Lots'),
    ],
    inputs: { period: { value: r.period, label: 'Period' } },
    assumptions: [`Ages from ${formatLocal(now, timeZone)}.`],
    sections: [
      ...(rows.length > 0 ? [{ table: { columns: ['Flag', 'Lot', 'Product', 'Where', 'Age', 'Status', 'Reason'], rows } }] : [{ lines: ['No flagged lots.'] }]),
      ...(cleared.length > 0 ? [{ heading: 'Cleared', lines: cleared.map((f) => `${flagHandle(f.id)} ${f.lotId}: ${clearanceText(f)}`) }] : []),
      ...(r.olderOpenCount > 0 ? [{ lines: [`${r.olderOpenCount} older flag${r.olderOpenCount === 1 ? ' is' : 's are'} still open: "flags" lists every open flag.`] }] : []),
    ],
    cautions: openCount > 0 ? [LOT_FLAG_CAUTION] : [],
  });
}
