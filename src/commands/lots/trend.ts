/**
 * `trend <lot>` and `trend product <id> [30d]`: the readings over time against the spec window
 * and the individuals-chart control limits from the product's history (Shewhart; σ from the
 * average moving range), with the Western Electric rule breaks marked on the chart and listed
 * in words on the card.
 */
import { z } from 'zod';
import { individualsLimits, INDIVIDUALS_CHART_CITATION } from '../../physics/statistics/shewhart-individuals.js';
import { WESTERN_ELECTRIC_CITATION, WESTERN_ELECTRIC_RULE_TEXT, westernElectricBreaks, type WesternElectricRule } from '../../physics/statistics/western-electric-1956.js';
import { placeLabel } from '../../lots/ids.js';
import type { StoredReading } from '../../lots/readings.js';
import type { Product } from '../../lots/spec/schema.js';
import { formatLocal } from '../../lots/time.js';
import { errorReply, okReply } from '../../reply/build.js';
import { formatNumber } from '../../reply/format.js';
import type { ReplySection, ReplyValue, TrendPicture } from '../../reply/reply.js';
import { ArgError } from '../args.js';
import { identity } from '../common.js';
import { defineCommand } from '../spec.js';
import { lotsOf, NOT_SET_UP } from './parse.js';
import { countValue, DEMO_SPECS_NOTE, lotErrorReply, windowText } from './wording.js';

export const TrendRequest = z.union([
  z.object({ lotId: z.string().min(1).max(64) }),
  z.object({ productId: z.string().min(1).max(32), days: z.number().int().min(1).max(3650) }),
]);
export type TrendRequest = z.infer<typeof TrendRequest>;

const USAGE = 'trend <lot> | trend product <id> [<n>d]';
const EXAMPLE = 'trend product HX-200P 30d';
const DEFAULT_DAYS = 30;
const DAY_MS = 86_400_000;
const MAX_LISTED = 12;

export const trendCommand = defineCommand<TrendRequest>({
  verb: 'trend',
  aliases: ['chart', 'trends'],
  help: {
    summary: 'A lot’s or a product’s readings over time as a chart: spec window, control limits (individuals chart) and Western Electric rule breaks.',
    usage: USAGE,
    examples: ['trend LOT-A17', 'trend product HX-200P', 'trend product HX-200P 90d'],
    options: [
      '<lot>: every current reading of the lot; limits from its product’s history',
      'product <id> [<n>d]: every lot of the product, the last n days (default 30)',
    ],
    seeAlso: ['lot', 'flags', 'map'],
  },
  schema: TrendRequest,
  parse(args) {
    if (args.flag(['product', 'prod'])) {
      const word = args.unusedWords()[0];
      const productId = word?.raw ?? args.leftovers()[0];
      if (!productId) throw new ArgError('missing_product', `Say which product, e.g. ${EXAMPLE}`);
      args.flag([productId]);
      // "30d": whatever kind of token it became, taken by its text as typed.
      const typed = args.leftovers().find((t) => /^\d{1,4}d$/i.test(t));
      const period = typed ? args.literal({ [typed]: Number.parseInt(typed, 10) }) : undefined;
      return { productId, days: period?.value ?? DEFAULT_DAYS };
    }
    const first = args.tokens[0];
    if (!first) throw new ArgError('missing_lot', `Give a lot or a product, e.g. trend LOT-A17 or ${EXAMPLE}`);
    args.flag([first.raw]);
    return { lotId: first.raw };
  },
  async run(req, ctx) {
    const lots = lotsOf(ctx);
    if (!lots) return errorReply('lots_unavailable', NOT_SET_UP);
    const now = ctx.now();
    const target = 'lotId' in req ? { lotId: req.lotId } : { productId: req.productId, sinceIso: new Date(now.getTime() - req.days * DAY_MS).toISOString() };
    const r = await lots.trendReadings(target);
    if (!r.ok) {
      if (r.error.code === 'unknown_lot') return errorReply('unknown_lot', `No readings have been recorded for ${r.error.lotId} yet.`, { usage: USAGE, example: 'trend LOT-A17' });
      return lotErrorReply(r.error, { usage: USAGE, example: EXAMPLE });
    }
    const { product, readings, history } = r.value;
    const what = 'lotId' in req ? req.lotId.toUpperCase() : `product ${product?.id ?? req.productId}, last ${req.days} days`;
    if (readings.length === 0) {
      return errorReply('no_readings', 'lotId' in req ? `${what} has no resistivity readings to chart.` : `No readings of ${what}${product ? '' : ' (no such product in the spec file either)'}.`, {
        usage: USAGE,
        example: EXAMPLE,
      });
    }
    const quantity = product?.dopantDensityPerCm3 ? 'dopantDensityPerCm3' : 'resistivityOhmCm';
    const valueOf = (x: StoredReading) => (quantity === 'dopantDensityPerCm3' ? x.dopantDensityPerCm3 : x.resistivityOhmCm);
    const points = readings.filter((x) => valueOf(x) !== undefined);
    const historyValues = history.map(valueOf).filter((v): v is number => v !== undefined);
    const limits = individualsLimits(historyValues);
    const values = points.map((x) => valueOf(x)!);
    const breaks = limits ? westernElectricBreaks(values, limits.centre, limits.sigma) : [];
    const rulesAt = new Map<number, WesternElectricRule[]>();
    for (const b of breaks) rulesAt.set(b.index, [...(rulesAt.get(b.index) ?? []), b.rule]);
    const unit = quantity === 'dopantDensityPerCm3' ? 'cm⁻³' : 'Ω·cm';
    const label = quantity === 'dopantDensityPerCm3' ? 'Dopant density' : 'Resistivity';
    const place = (x: StoredReading) => (x.wafer === undefined && x.site === undefined ? x.lotId : `${x.lotId} ${placeLabel(x.wafer, x.site)}`);
    const spec = specOf(product, quantity);

    const lotMeans = new Map<string, { sum: number; n: number; at: string }>();
    points.forEach((x, i) => {
      const m = lotMeans.get(x.lotId) ?? { sum: 0, n: 0, at: x.recordedAt };
      m.sum += values[i]!;
      m.n++;
      if (x.recordedAt > m.at) m.at = x.recordedAt;
      lotMeans.set(x.lotId, m);
    });
    const picture: TrendPicture = {
      kind: 'trend',
      title: `Trend: ${what}`,
      quantityLabel: label,
      unit,
      points: points.map((x, i) => ({ at: x.recordedAt, value: values[i]!, label: place(x), lot: x.lotId, flagged: x.verdict === 'flagged', rules: rulesAt.get(i) ?? [] })),
      lotMeans: [...lotMeans.entries()].map(([lot, m]) => ({ lot, at: m.at, value: m.sum / m.n })).sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : 0)),
      ...(spec ? { spec } : {}),
      ...(limits ? { control: { centre: limits.centre, lower: limits.lower, upper: limits.upper } } : {}),
    };

    const flagged = points.filter((x) => x.verdict === 'flagged').length;
    const fmt = (v: number) => formatNumber(v, { sigFigs: 4 });
    const replyValues: ReplyValue[] = [
      countValue('ruleBreakCount', breaks.length, 'Western Electric rule breaks', true),
      countValue('readingCount', points.length, 'Readings charted'),
      countValue('flaggedReadingCount', flagged, 'Flagged readings'),
      countValue('lotCount', lotMeans.size, 'Lots'),
    ];
    if (limits) {
      replyValues.push(
        { key: 'centreLine', value: limits.centre, unit, label: 'Centre line (history mean)', sigFigs: 4 },
        { key: 'upperControlLimit', value: limits.upper, unit, label: 'Upper control limit (+3σ)', sigFigs: 4 },
        { key: 'lowerControlLimit', value: limits.lower, unit, label: 'Lower control limit (−3σ)', sigFigs: 4 },
      );
    }
    const sections: ReplySection[] = [
      {
        heading: 'Rule breaks',
        lines:
          breaks.length === 0
            ? [limits ? 'None: every charted reading is inside the pattern rules.' : 'Too little history for control limits (two readings are needed).']
            : [
                ...breaks.slice(0, MAX_LISTED).map((b) => {
                  const x = points[b.index]!;
                  return `${place(x)} (reading #${x.id}, ${formatLocal(new Date(x.recordedAt), lots.timeZone)}): rule ${b.rule}, ${WESTERN_ELECTRIC_RULE_TEXT[b.rule]} (${b.side > 0 ? 'above' : 'below'}), at ${fmt(values[b.index]!)} ${unit}`;
                }),
                ...(breaks.length > MAX_LISTED ? [`and ${breaks.length - MAX_LISTED} more (ringed on the chart).`] : []),
              ],
      },
      {
        heading: 'Limits',
        lines: [
          product && spec ? `Spec window (${product.id}): ${windowText(quantity, spec.min, spec.max)} at 23 °C.` : 'No product spec: no spec window drawn.',
          limits
            ? `Control limits from ${limits.count} readings of ${product ? `product ${product.id}` : 'this lot'}: centre ${fmt(limits.centre)}, σ̂ = MR̄/1.128 = ${formatNumber(limits.sigma, { sigFigs: 3 })}, limits ${fmt(limits.lower)} … ${fmt(limits.upper)} ${unit}.`
            : 'No control limits: fewer than two readings of history.',
          'Control limits describe how the process has behaved; the spec window is what the product must meet. A point inside the spec but breaking a rule is a signal to look, not a reject.',
          ...(lots.catalog.demo ? [DEMO_SPECS_NOTE] : []),
        ],
      },
    ];
    return okReply(identity(ctx), {
      command: 'trend',
      title: `Trend ${what}: ${points.length} reading${points.length === 1 ? '' : 's'}, ${breaks.length === 0 ? 'no rule breaks' : `${breaks.length} rule break${breaks.length === 1 ? '' : 's'}`}${flagged ? `, ${flagged} flagged` : ''}`,
      values: replyValues,
      inputs: 'lotId' in req ? { lot: { value: req.lotId.toUpperCase(), label: 'Lot' } } : { product: { value: product?.id ?? req.productId, label: 'Product' }, period: { value: `${req.days} days`, label: 'Period' } },
      assumptions: [
        `Values: ${label.toLowerCase()} at 23 °C as recorded (corrected readings replaced by their corrections; type readings left out).`,
        'Control limits: individuals chart, centre ± 3σ with σ estimated from the average moving range (d₂ = 1.128), history in time order.',
      ],
      sections,
      picture,
      derivation: {
        equations: ['MR_i = |x_i − x_(i−1)|', 'σ̂ = MR̄ / d₂, d₂ = 1.128', 'UCL, LCL = x̄ ± 3σ̂', ...Object.entries(WESTERN_ELECTRIC_RULE_TEXT).map(([k, t]) => `rule ${k}: ${t}`)],
        parameters: [{ name: 'd₂ (n = 2)', value: 1.128, source: 'Montgomery 2009' }],
        steps: [`${history.length} readings of history → limits; ${points.length} readings charted; ${breaks.length} rule breaks`],
        sources: [INDIVIDUALS_CHART_CITATION, WESTERN_ELECTRIC_CITATION],
      },
    });
  },
});

function specOf(product: Product | undefined, quantity: 'resistivityOhmCm' | 'dopantDensityPerCm3'): { min: number; max: number } | undefined {
  const w = product?.[quantity];
  return w ? { min: w.min, max: w.max } : undefined;
}
