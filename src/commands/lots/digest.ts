/**
 * `digest`: the daily summary of flagged lots, now, as a preview (nothing is posted or claimed).
 * `digestReply` is also what the scheduler posts at DIGEST_AT.
 */
import { z } from 'zod';
import type { Digest } from '../../lots/digest.js';
import { flagHandle } from '../../lots/flags.js';
import { placeLabel } from '../../lots/ids.js';
import { formatAge, formatLocal } from '../../lots/time.js';
import { errorReply, okReply, type ReplyIdentity } from '../../reply/build.js';
import type { ReplyOk, ReplySection } from '../../reply/reply.js';
import { identity } from '../common.js';
import { defineCommand } from '../spec.js';
import { lotsOf, NOT_SET_UP } from './parse.js';
import { countValue, DEMO_SPECS_NOTE, FLAG_TITLES, flagDetailText, LOT_FLAG_CAUTION } from './wording.js';

export const DigestRequest = z.object({});
export type DigestRequest = z.infer<typeof DigestRequest>;

export const digestCommand = defineCommand<DigestRequest>({
  verb: 'digest',
  aliases: ['summary'],
  help: {
    summary: 'The daily summary of flagged lots, now, as a preview (it is posted by itself at DIGEST_AT).',
    usage: 'digest',
    examples: ['digest'],
    options: ['lists lots flagged since the last posted summary and older flags still open, grouped by product'],
    seeAlso: ['flags', 'lot'],
  },
  schema: DigestRequest,
  parse() {
    return {};
  },
  async run(_req, ctx) {
    const lots = lotsOf(ctx);
    if (!lots) return errorReply('lots_unavailable', NOT_SET_UP);
    const digest = await lots.digest({ preview: true });
    return digestReply(identity(ctx), digest, { demo: lots.catalog.demo });
  },
});

const hours = (ms: number): string => `${Math.round(ms / 3600_000)} h`;

/** Flag rows listed in one summary; the rest are counted (a chat message has to stay readable). */
export const DIGEST_MAX_ROWS = 40;

export function digestReply(id: ReplyIdentity, d: Digest, o: { demo?: boolean } = {}): ReplyOk {
  const now = new Date(d.windowEnd);
  const lead = d.preview ? 'Summary preview' : `Daily summary ${d.localDate}`;
  const title =
    d.totals.lots === 0
      ? `${lead} · no flagged lots`
      : `${lead} · ${d.totals.lots} flagged lot${d.totals.lots === 1 ? '' : 's'} (${d.groups.map((g) => `${g.productId ?? 'no product'} ${g.lots.length}`).join(', ')})`;
  const windowLine = `New since ${formatLocal(new Date(d.windowStart), d.timeZone)} (${hours(Date.parse(d.windowEnd) - Date.parse(d.windowStart))}), plus older flags still open.`;
  const sections: ReplySection[] = [];
  if (d.late && d.dueAt) {
    sections.push({
      lines: [`Late: this summary was due at ${formatLocal(new Date(d.dueAt), d.timeZone)}; shiftprobe was not running then. It covers everything since the last summary.`],
    });
  }
  if (d.totals.lots === 0) {
    sections.push({ lines: [`No flagged lots. ${windowLine}`] });
  } else {
    sections.push({ lines: [windowLine] });
    let budget = DIGEST_MAX_ROWS;
    let unlistedFlags = 0;
    const unlistedLots = new Set<string>();
    for (const g of d.groups) {
      const heading = `${g.productId ?? 'No product'} — ${g.lots.length} lot${g.lots.length === 1 ? '' : 's'}, ${g.flagCount} flag${g.flagCount === 1 ? '' : 's'} (${g.newCount} new, ${g.openCount} open)`;
      const rows: string[][] = [];
      for (const l of g.lots) {
        for (const f of l.flags) {
          if (budget <= 0) {
            unlistedFlags += 1;
            unlistedLots.add(l.lotId);
            continue;
          }
          budget -= 1;
          rows.push([
            l.lotId,
            flagHandle(f.flag.id),
            placeLabel(f.flag.wafer, f.flag.site),
            formatAge(f.flag.raisedAt, now),
            f.open ? (f.isNew ? 'new, open' : 'open') : 'new, cleared',
            `${FLAG_TITLES[f.flag.code] ?? f.flag.code}: ${flagDetailText(f.flag.detail)}`,
          ]);
        }
      }
      sections.push(rows.length > 0 ? { heading, table: { columns: ['Lot', 'Flag', 'Where', 'Age', 'Status', 'Reason'], rows } } : { heading });
    }
    if (unlistedFlags > 0) {
      sections.push({
        lines: [`…and ${unlistedFlags} more flag${unlistedFlags === 1 ? '' : 's'} on ${unlistedLots.size} lot${unlistedLots.size === 1 ? '' : 's'} not listed here: "flags" lists every open flag, "lot <lot>" shows one lot.`],
      });
    }
  }
  const byCode = Object.entries(d.totals.byCode)
    .map(([code, n]) => `${FLAG_TITLES[code] ?? code} ${n}`)
    .join(' · ');
  return okReply(id, {
    command: 'digest',
    title,
    values: [
      countValue('flaggedLotCount', d.totals.lots, 'Flagged lots', true),
      countValue('newFlagCount', d.totals.newFlags, 'New flags'),
      countValue('openFlagCount', d.totals.openFlags, 'Open flags'),
    ],
    inputs: {},
    assumptions: [
      ...(d.preview ? ['Preview: nothing was posted; the daily summary goes out by itself at the configured time.'] : []),
      ...(byCode ? [`By kind: ${byCode}.`] : []),
      `Times are ${d.timeZone}.`,
      ...(o.demo ? [DEMO_SPECS_NOTE] : []),
    ],
    sections,
    cautions: d.totals.openFlags > 0 ? [LOT_FLAG_CAUTION] : [],
  });
}
