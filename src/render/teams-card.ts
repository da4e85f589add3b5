/**
 * Reply → an Adaptive Card (schema 1.5) for the Teams-style surface: the same content as the
 * Slack card — title, headline values, the other values as facts, warnings, how the input was
 * read, assumptions, the model and its source, free sections, cautions, the result id — in our
 * own plain look (semantic colours only: warnings in "attention", the caution in "warning").
 *
 * Adaptive Cards render text as a small Markdown subset; everything echoed is escaped. The card
 * is kept under TEAMS_CARD_MAX_BYTES (Teams refuses larger messages: about 28 KB, from memory —
 * we keep a margin): sections beyond it are replaced by a notice to ask `why <id>` on the console
 * or the API.
 */
import { formatNumber } from '../reply/format.js';
import type { Reply, ReplyError, ReplyInput, ReplyOk, ReplySection } from '../reply/reply.js';
import { valueText } from './text.js';

/** Our budget for one card's JSON, below Teams' message limit (about 28 KB, from memory). */
export const TEAMS_CARD_MAX_BYTES = 24_000;

export type CardElement = Readonly<Record<string, unknown>>;
export interface AdaptiveCard {
  readonly type: 'AdaptiveCard';
  readonly $schema: string;
  readonly version: '1.5';
  readonly body: readonly CardElement[];
  readonly actions?: readonly CardElement[];
  readonly fallbackText: string;
}

/** What a card's buttons send back (Action.Submit data). */
export type TeamsCardData =
  | { readonly shiftprobe: 'why'; readonly resultId: string }
  | { readonly shiftprobe: 'share'; readonly resultId: string }
  | { readonly shiftprobe: 'choice'; readonly command: string };

export type TeamsCardAction = 'why' | 'share';

export interface TeamsCardOptions {
  readonly actions?: readonly TeamsCardAction[];
  /** A short status line, e.g. 'Posted in the channel.' */
  readonly notice?: string;
  /** Who shared the card (a display name). */
  readonly sharedBy?: string;
  /** How help is asked for here, e.g. '@shiftprobe help'. */
  readonly helpHint?: string | false;
}

/** Adaptive Card Markdown: escape what could be read as markup. */
export function escapeCardText(s: string): string {
  return s.replace(/([\\*_`[\]#>~|])/g, '\\$1').replace(/^(\s*)([-+]|\d+\.)\s/gm, '$1\\$2 ');
}

const text = (t: string, extra: Record<string, unknown> = {}): CardElement => ({ type: 'TextBlock', text: t, wrap: true, ...extra });
const small = (t: string, extra: Record<string, unknown> = {}): CardElement => text(t, { size: 'Small', isSubtle: true, spacing: 'Small', ...extra });

function inputText(input: ReplyInput): string {
  const shown = typeof input.value === 'number' ? formatNumber(input.value, { sigFigs: 4 }) : input.value;
  const withUnit = input.unit ? `${shown} ${input.unit}` : shown;
  const typed = input.asTyped?.trim();
  return `${input.label} ${withUnit}${typed && typed !== withUnit && typed !== input.value ? ` (“${typed}”)` : ''}`;
}

function sectionElements(s: ReplySection): CardElement[] {
  const out: CardElement[] = [];
  if (s.heading) out.push(text(`**${escapeCardText(s.heading)}**`, { spacing: 'Medium' }));
  if (s.lines && s.lines.length > 0) out.push(text(s.lines.map(escapeCardText).join('\n\n'), { size: 'Small', spacing: 'Small' }));
  if (s.table) {
    out.push({
      type: 'Table',
      spacing: 'Small',
      firstRowAsHeaders: true,
      gridStyle: 'default',
      columns: s.table.columns.map(() => ({ width: 1 })),
      rows: [s.table.columns, ...s.table.rows].map((cells) => ({
        type: 'TableRow',
        cells: cells.map((c) => ({ type: 'TableCell', items: [text(escapeCardText(c), { size: 'Small' })] })),
      })),
    });
  }
  return out;
}

const bytes = (x: unknown): number => Buffer.byteLength(JSON.stringify(x), 'utf8');

function card(body: CardElement[], actions: CardElement[], fallbackText: string): AdaptiveCard {
  return {
    type: 'AdaptiveCard',
    $schema: 'http://adaptivecards.io/schemas/adaptive-card.json',
    version: '1.5',
    body,
    ...(actions.length > 0 ? { actions } : {}),
    fallbackText,
  };
}

function renderResult(reply: ReplyOk, options: TeamsCardOptions): AdaptiveCard {
  const flagged = reply.values.filter((v) => v.headline);
  const headline = flagged.length > 0 ? flagged : reply.values.slice(0, 1);
  const others = reply.values.filter((v) => !headline.includes(v));
  const top: CardElement[] = [text(escapeCardText(reply.title || reply.command), { size: 'Medium', weight: 'Bolder' })];
  for (const v of headline) {
    top.push({
      type: 'ColumnSet',
      spacing: 'Small',
      columns: [
        { type: 'Column', width: 'stretch', items: [text(escapeCardText(v.label), { isSubtle: true })] },
        { type: 'Column', width: 'auto', items: [text(escapeCardText(valueText(v)), { size: 'Large', weight: 'Bolder', color: 'Accent' })] },
      ],
    });
  }
  if (others.length > 0) top.push({ type: 'FactSet', spacing: 'Small', facts: others.map((v) => ({ title: v.label, value: valueText(v) })) });
  for (const w of reply.warnings) top.push(text(`⚠ ${escapeCardText(w.message)}`, { color: 'Attention', spacing: 'Small' }));

  const smallPrint: CardElement[] = [];
  const inputs = Object.values(reply.inputs);
  if (inputs.length > 0) smallPrint.push(small(`**Read as** ${escapeCardText(inputs.map(inputText).join(' · '))}`, { spacing: 'Medium' }));
  if (reply.assumptions.length > 0) smallPrint.push(small(`**Assumed** ${escapeCardText(reply.assumptions.join(' '))}`));
  if (reply.model) smallPrint.push(small(`**${escapeCardText(reply.model.name)}** — ${escapeCardText(reply.model.citation)}${reply.model.validity ? `. Valid for ${escapeCardText(reply.model.validity)}` : ''}`));
  // A PNG does not fit a Teams message (the budget above): say where the picture is.
  if (reply.picture) {
    smallPrint.push(small(`The ${reply.picture.kind === 'waferMap' ? 'wafer map' : 'trend chart'} picture is not sent to Teams (a message holds about 28 KB): on Slack it comes under the card; on the command line \`--png <file>\` writes it.`));
  }

  const bottom: CardElement[] = [];
  for (const c of reply.cautions) bottom.push(text(escapeCardText(c), { color: 'Warning', size: 'Small', spacing: 'Medium' }));
  if (options.notice) bottom.push(small(`✓ ${escapeCardText(options.notice)}`, { color: 'Good' }));
  const footer = [reply.id, reply.createdAt.replace('T', ' ').slice(0, 16) + ' UTC', ...(options.sharedBy ? [`shared by ${options.sharedBy}`] : []), 'shiftprobe'];
  bottom.push(small(escapeCardText(footer.join(' · '))));

  const actions: CardElement[] = (options.actions ?? []).map((a) =>
    a === 'why'
      ? { type: 'Action.Submit', title: 'Show derivation', data: { shiftprobe: 'why', resultId: reply.id } satisfies TeamsCardData }
      : { type: 'Action.Submit', title: 'Post to channel', data: { shiftprobe: 'share', resultId: reply.id } satisfies TeamsCardData },
  );
  const fallback = `${reply.title}: ${headline.map((v) => `${v.label} ${valueText(v)}`).join(', ')}`;

  // Free sections while they fit; then a notice instead of the rest.
  const fixed = bytes(card([...top, ...smallPrint, ...bottom], actions, fallback));
  const free: CardElement[] = [];
  let used = fixed;
  const sections = (reply.sections ?? []).flatMap(sectionElements);
  for (const [i, el] of sections.entries()) {
    const size = bytes(el) + 1;
    if (used + size > TEAMS_CARD_MAX_BYTES - 400) {
      free.push(small(`… ${sections.length - i} more part${sections.length - i === 1 ? '' : 's'} left out to fit a Teams message: ask “why ${reply.id}” on the console or the HTTP API for all of it.`));
      break;
    }
    free.push(el);
    used += size;
  }
  return card([...top, ...smallPrint, ...free, ...bottom], actions, fallback);
}

function renderError(reply: ReplyError, options: TeamsCardOptions): AdaptiveCard {
  const e = reply.error;
  const body: CardElement[] = [text(escapeCardText(e.message), { wrap: true })];
  if (e.usage) body.push(small(`Right form: ${escapeCardText(e.usage)}`));
  if (e.example) body.push(small(`For example: ${escapeCardText(e.example)}`));
  if (e.suggestion) body.push(small(`Did you mean: ${escapeCardText(e.suggestion)}`));
  if (options.helpHint) body.push(small(`“${escapeCardText(options.helpHint)}” lists every command.`));
  const actions: CardElement[] = (e.choices ?? []).slice(0, 5).map((c) => ({ type: 'Action.Submit', title: c.label.slice(0, 60), data: { shiftprobe: 'choice', command: c.command } satisfies TeamsCardData }));
  return card(body, actions, e.message);
}

export function renderTeamsCard(reply: Reply, options: TeamsCardOptions = {}): AdaptiveCard {
  return reply.ok ? renderResult(reply, options) : renderError(reply, options);
}

/** Problems with a card against the limits we keep (empty when it fits). */
export function checkCardLimits(c: AdaptiveCard): string[] {
  const problems: string[] = [];
  const size = bytes(c);
  if (size > TEAMS_CARD_MAX_BYTES) problems.push(`card is ${size} bytes, over ${TEAMS_CARD_MAX_BYTES}`);
  if ((c.actions ?? []).length > 6) problems.push(`${(c.actions ?? []).length} actions, over 6`);
  if (c.body.length === 0) problems.push('empty body');
  return problems;
}
