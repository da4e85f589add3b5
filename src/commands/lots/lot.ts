/** `lot <lot>`: product, readings latest first, per-wafer values, spread, margins, open flags, who. */
import { z } from 'zod';
import { placeLabel } from '../../lots/ids.js';
import type { LotView } from '../../lots/lot-view.js';
import { formatLocal } from '../../lots/time.js';
import { errorReply, okReply, type ReplyIdentity } from '../../reply/build.js';
import { formatNumber } from '../../reply/format.js';
import type { ReplySection, ReplyValue } from '../../reply/reply.js';
import { identity } from '../common.js';
import { defineCommand } from '../spec.js';
import { lotsOf, NOT_SET_UP, takeLotId } from './parse.js';
import { ago, clearanceText, countValue, DEMO_SPECS_NOTE, flagLine, LOT_FLAG_CAUTION, lotErrorReply, readingLabel, readingResult, windowText } from './wording.js';

export const LotRequest = z.object({ lotId: z.string().min(1).max(64) });
export type LotRequest = z.infer<typeof LotRequest>;

const USAGE = 'lot <lot>';
const EXAMPLE = 'lot LOT-A17';
/** Readings shown in the reply; all are kept. */
const READINGS_SHOWN = 20;

export const lotCommand = defineCommand<LotRequest>({
  verb: 'lot',
  aliases: ['lots', 'history'],
  help: {
    summary: 'A lot’s record: product and spec, readings (latest first), per-wafer values, spread, margins, open flags and who recorded what.',
    usage: USAGE,
    examples: ['lot LOT-A17', 'lot LOT-B204'],
    seeAlso: ['record', 'flags', 'clear'],
  },
  schema: LotRequest,
  parse(args) {
    return { lotId: takeLotId(args, EXAMPLE) };
  },
  async run(req, ctx) {
    const lots = lotsOf(ctx);
    if (!lots) return errorReply('lots_unavailable', NOT_SET_UP);
    const r = await lots.lot(req.lotId);
    if (!r.ok) {
      if (r.error.code === 'unknown_lot') {
        const similar = await lots.similarLots(r.error.lotId);
        return errorReply('unknown_lot', `No readings have been recorded for ${r.error.lotId} yet.`, {
          usage: USAGE,
          example: `record ${r.error.lotId} w1 rho 9.6 ohm-cm product HX-200P`,
          ...(similar[0] ? { suggestion: `lot ${similar[0]}` } : {}),
        });
      }
      return lotErrorReply(r.error, { usage: USAGE, example: EXAMPLE });
    }
    return lotReply(identity(ctx), r.value, { timeZone: lots.timeZone, now: ctx.now(), demo: lots.catalog.demo });
  },
});

export function lotReply(id: ReplyIdentity, v: LotView, o: { timeZone: string; now: Date; demo: boolean }): ReturnType<typeof okReply> {
  const productId = v.lot.productId;
  const title = `${v.lot.lotId} · ${productId ?? 'no product'} · ${v.openFlags.length === 0 ? 'no open flags' : `${v.openFlags.length} open flag${v.openFlags.length === 1 ? '' : 's'}`}`;
  const values: ReplyValue[] = [
    countValue('openFlagCount', v.openFlags.length, 'Open flags', true),
    countValue('readingCount', v.readings.length, 'Readings'),
  ];
  if (v.readings.length !== v.currentCount) values.push(countValue('currentReadingCount', v.currentCount, 'Readings that count (not corrected)'));
  if (v.waferSpread) {
    values.push({ key: 'waferSpreadPercent', value: v.waferSpread.spreadPercent, unit: '%', label: `Wafer-to-wafer spread${v.waferLimitPercent !== undefined ? ` (limit ${v.waferLimitPercent} %)` : ''}`, sigFigs: 2 });
  }
  const sections: ReplySection[] = [];
  const p = v.product;
  if (p) {
    const window = p.resistivityOhmCm
      ? windowText('resistivityOhmCm', p.resistivityOhmCm.min, p.resistivityOhmCm.max)
      : p.dopantDensityPerCm3
        ? windowText('dopantDensityPerCm3', p.dopantDensityPerCm3.min, p.dopantDensityPerCm3.max)
        : '—';
    const spread = [
      p.spread?.siteToSitePercent !== undefined ? `site-to-site ≤ ${p.spread.siteToSitePercent} %` : undefined,
      p.spread?.waferToWaferPercent !== undefined ? `wafer-to-wafer ≤ ${p.spread.waferToWaferPercent} %` : undefined,
    ].filter(Boolean);
    sections.push({
      heading: `Product ${p.id}`,
      lines: [
        `${p.type}-type, ${p.dopant}; window ${window} at 23 °C${spread.length ? `; spread ${spread.join(', ')}` : ''}.`,
        ...(p.notes ? [p.notes] : []),
      ],
    });
  } else {
    sections.push({ heading: `Product ${productId ?? '—'}`, lines: [productId ? `${productId} is not in the spec file: readings are kept but cannot be checked.` : 'No product named yet.'] });
  }
  if (v.wafers.length > 0) {
    sections.push({
      heading: 'Wafers',
      table: {
        columns: ['Wafer', 'Mean ρ', 'Sites', 'Site spread', 'Closest to limit', 'Type'],
        rows: v.wafers.map((w) => [
          `w${w.wafer}`,
          Number.isFinite(w.meanOhmCm) ? `${formatNumber(w.meanOhmCm)} Ω·cm` : '—',
          // A wafer with a map: its sites, and its non-uniformity (1σ/mean) as the spread.
          w.map ? `${w.map.count} (map #${w.map.readingId})` : String(w.placeCount),
          w.map
            ? `1σ/mean ${formatNumber(w.map.nonUniformityPercent, { sigFigs: 2 })} %${w.map.limitPercent !== undefined && w.map.nonUniformityPercent > w.map.limitPercent ? ' (over)' : ''}`
            : w.siteSpread ? `${formatNumber(w.siteSpread.spreadPercent, { sigFigs: 2 })} %${w.siteLimitPercent !== undefined && w.siteSpread.spreadPercent > w.siteLimitPercent ? ' (over)' : ''}` : '—',
          w.worstMargin
            ? w.worstMargin.status === 'pass'
              ? `${formatNumber(w.worstMargin.marginPercent, { sigFigs: 2 })} % inside ${w.worstMargin.limit}`
              : `${formatNumber(w.worstMargin.marginPercent, { sigFigs: 2 })} % past ${w.worstMargin.limit}`
            : '—',
          w.types.length ? w.types.join(', ') : '—',
        ]),
      },
    });
  }
  if (v.openFlags.length > 0) {
    sections.push({
      heading: 'Open flags',
      lines: v.openFlags.map((f) => `${flagLine(f)} · ${ago(f.raisedAt, o.now)}, ${f.raisedBy.userName ?? f.raisedBy.userId}`),
    });
  }
  if (v.readings.length > 0) {
    const shown = v.readings.slice(0, READINGS_SHOWN);
    sections.push({
      heading: `Readings, latest first${v.readings.length > READINGS_SHOWN ? ` (${READINGS_SHOWN} of ${v.readings.length}; all are kept)` : ''}`,
      table: {
        columns: ['#', 'When', 'Where', 'Reading', 'Result', 'By'],
        rows: shown.map((r) => [
          String(r.id),
          formatLocal(new Date(r.recordedAt), o.timeZone),
          placeLabel(r.wafer, r.site),
          readingLabel(r),
          readingResult(r),
          r.actor.userName ?? r.actor.userId,
        ]),
      },
    });
  }
  if (v.closedFlags.length > 0) {
    sections.push({ heading: 'Cleared flags (latest 5)', lines: v.closedFlags.slice(0, 5).map((f) => `${flagLine(f)} — ${clearanceText(f)}`) });
  }
  if (v.contributors.length > 0) {
    sections.push({
      heading: 'Recorded by',
      lines: [v.contributors.map((c) => `${c.name}: ${c.readings} reading${c.readings === 1 ? '' : 's'}, last ${ago(c.lastAt, o.now)}`).join(' · ')],
    });
  }
  return okReply(id, {
    command: 'lot',
    title,
    values,
    inputs: { lot: { value: v.lot.lotId, label: 'Lot' } },
    assumptions: [
      'Margins and spread are against the current spec, from the latest current reading at each place; corrected readings do not count.',
      `Times are ${o.timeZone}.`,
      ...(o.demo ? [DEMO_SPECS_NOTE] : []),
    ],
    cautions: v.openFlags.length > 0 ? [LOT_FLAG_CAUTION] : [],
    sections,
  });
}
