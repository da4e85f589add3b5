/**
 * Reply → Slack Block Kit message: the shiftprobe result card.
 *
 * The card, top to bottom: the title; the headline values, large and first; the other values as
 * two-column fields; warnings; how the input was read, the assumptions, the model and its
 * source (small print); free sections (help, derivations, lot tables) as phone-width lines;
 * the cautions; the buttons; and a footer with the result id and the time in the reader's own
 * time zone. Numbers use the shared formatting (src/reply/format.ts), so they read exactly as on
 * the console. Everything echoed is escaped (src/render/slack/mrkdwn.ts), and the message is
 * kept within Block Kit limits (src/render/slack/limits.ts): long texts are cut at a line,
 * oversized field lists split, and sections beyond the block budget replaced by a notice.
 */
import type { Reply, ReplyError, ReplyInput, ReplyOk, ReplySection, ReplyValue } from '../reply/reply.js';
import { formatNumber } from '../reply/format.js';
import { valueText } from './text.js';
import type { Button, ContextBlock, KnownBlock, SectionBlock } from './slack/block-types.js';
import { SLACK_LIMITS, type SlackMessage } from './slack/limits.js';
import { bold, codeSpan, escapeMrkdwn, fitMrkdwn, fitPlain } from './slack/mrkdwn.js';

export type { SlackMessage } from './slack/limits.js';

/** Button action ids; each button's value is the result id and nothing else. */
export const SLACK_ACTION_IDS = {
  shareChannel: 'shiftprobe_share_channel',
  shareThread: 'shiftprobe_share_thread',
  why: 'shiftprobe_why',
} as const;

/** A question's answer buttons: action id prefix + index; each value is the whole command to run. */
export const SLACK_CHOICE_ACTION_PREFIX = 'shiftprobe_choice_';
export const SLACK_CHOICE_ACTION = /^shiftprobe_choice_\d+$/;
export type CardAction = keyof typeof SLACK_ACTION_IDS;

const BUTTON_TEXT: Readonly<Record<CardAction, string>> = {
  shareChannel: 'Post in channel',
  shareThread: 'Post in a thread…',
  why: 'Show derivation',
};

export interface SlackCardOptions {
  /** Buttons to show, in this order (none by default). */
  readonly actions?: readonly CardAction[];
  /** Slack user id of the person who shared the card, shown in the footer. */
  readonly sharedBy?: string;
  /** How help is asked for on this surface, e.g. '/shiftprobe help'; false: no help line on errors. */
  readonly helpHint?: string | false;
  /** A short status line above the buttons, e.g. 'Posted in the channel.' (plain text). */
  readonly notice?: string;
}

const USER_ID = /^[UW][A-Z0-9]{2,}$/;

export function renderSlackMessage(reply: Reply, options: SlackCardOptions = {}): SlackMessage {
  return reply.ok ? renderResult(reply, options) : renderError(reply, options);
}

// ---------- results ----------

function renderResult(reply: ReplyOk, options: SlackCardOptions): SlackMessage {
  const flagged = reply.values.filter((v) => v.headline);
  const headline = flagged.length > 0 ? flagged : reply.values.slice(0, 1);
  const others = reply.values.filter((v) => !headline.includes(v));

  const top: KnownBlock[] = [
    { type: 'header', text: { type: 'plain_text', text: fitPlain(reply.title || reply.command, SLACK_LIMITS.headerText), emoji: false } },
  ];
  if (headline.length > 0) top.push(textSection(headline.map((v) => `${escapeMrkdwn(v.label)}  ${bold(escapeMrkdwn(valueText(v)))}`)));
  top.push(...fieldSections(others.map((v) => `${escapeMrkdwn(v.label)}\n${bold(escapeMrkdwn(valueText(v)))}`)));
  if (reply.warnings.length > 0) top.push(...textSections(reply.warnings.map((w) => `:warning: ${escapeMrkdwn(w.message)}`)));

  const smallPrint: KnownBlock[] = [];
  const inputs = Object.values(reply.inputs);
  if (inputs.length > 0) smallPrint.push(context(`${bold('Read as')}  ${inputs.map(inputText).join('  ·  ')}`));
  if (reply.assumptions.length > 0) {
    smallPrint.push(context([bold('Assumed'), ...reply.assumptions.map((a) => `• ${escapeMrkdwn(a)}`)].join('\n')));
  }
  if (reply.model) {
    const m = reply.model;
    const lines = [`:book: ${bold(escapeMrkdwn(m.name))} — ${escapeMrkdwn(m.citation)}`];
    if (m.validity) lines.push(`Valid for ${escapeMrkdwn(m.validity)}`);
    smallPrint.push(context(lines.join('\n')));
  }

  const bottom: KnownBlock[] = [];
  if (reply.cautions.length > 0) bottom.push(context(reply.cautions.map((c) => `:clipboard: ${escapeMrkdwn(c)}`).join('\n')));
  if (options.notice) bottom.push(context(`:white_check_mark: ${escapeMrkdwn(options.notice)}`));
  const buttons = (options.actions ?? []).map((a) => button(a, reply.id));
  if (buttons.length > 0) bottom.push({ type: 'actions', block_id: 'shiftprobe_card_actions', elements: buttons });
  bottom.push(context(footerText(reply, options)));

  const budget = SLACK_LIMITS.blocksPerMessage - top.length - smallPrint.length - bottom.length;
  const free = budgeted((reply.sections ?? []).flatMap(sectionBlocks), budget);

  return { text: fallbackText(reply, headline), blocks: [...top, ...smallPrint, ...free, ...bottom] };
}

/** Inputs as understood, with the same figures the console shows (src/render/text.ts: 4). */
const INPUT_SIG_FIGS = 4;

function inputText(input: ReplyInput): string {
  const shown = typeof input.value === 'number' ? formatNumber(input.value, { sigFigs: INPUT_SIG_FIGS }) : input.value;
  const withUnit = input.unit ? `${shown} ${input.unit}` : shown;
  const typed = input.asTyped?.trim();
  const echo = typed && typed !== withUnit && typed !== input.value ? ` (${codeSpan(typed)})` : '';
  return `${escapeMrkdwn(input.label)} ${escapeMrkdwn(withUnit)}${echo}`;
}

function footerText(reply: ReplyOk, options: SlackCardOptions): string {
  const parts = [codeSpan(reply.id)];
  const when = Date.parse(reply.createdAt);
  if (Number.isFinite(when)) {
    const unix = Math.floor(when / 1000);
    const fallback = new Date(unix * 1000).toISOString().replace('T', ' ').slice(0, 16) + ' UTC';
    parts.push(`<!date^${unix}^{date_short_pretty} {time}|${fallback}>`);
  }
  if (options.sharedBy && USER_ID.test(options.sharedBy)) parts.push(`shared by <@${options.sharedBy}>`);
  parts.push('shiftprobe');
  return parts.join('  ·  ');
}

function fallbackText(reply: ReplyOk, headline: readonly ReplyValue[]): string {
  const values = headline.map((v) => `${v.label} ${valueText(v)}`).join('; ');
  const warn = reply.warnings.length > 0 ? ` (${reply.warnings.length} warning${reply.warnings.length > 1 ? 's' : ''})` : '';
  const text = `${reply.title}${values ? ': ' + values : ''}${warn}`;
  return fitMrkdwn(escapeMrkdwn(text.replace(/\s+/g, ' ').trim()), SLACK_LIMITS.fallbackText);
}

function button(action: CardAction, resultId: string): Button {
  return {
    type: 'button',
    action_id: SLACK_ACTION_IDS[action],
    text: { type: 'plain_text', text: fitPlain(BUTTON_TEXT[action], SLACK_LIMITS.buttonText), emoji: false },
    value: resultId,
  };
}

// ---------- free sections (help, derivations, tables) ----------

/** Columns whose cells are commands people can type: shown as code. */
const CODE_COLUMNS = new Set(['example', 'examples', 'form', 'usage', 'command']);

function sectionBlocks(section: ReplySection): KnownBlock[] {
  const lines: string[] = [];
  if (section.heading) lines.push(bold(escapeMrkdwn(section.heading)));
  for (const line of section.lines ?? []) lines.push(escapeMrkdwn(line));
  if (section.table) {
    const code = section.table.columns.map((c) => CODE_COLUMNS.has(c.toLowerCase()));
    for (const row of section.table.rows) {
      const cells = row
        .map((cell, i) => (cell.trim() === '' ? '' : code[i] ? codeSpan(cell) : escapeMrkdwn(cell)))
        .filter((c, i) => c !== '' || i === 0);
      const [first = '', ...rest] = cells;
      const lead = code[0] ? first : bold(first);
      lines.push(`• ${lead}${rest.length ? ' — ' + rest.join('  ·  ') : ''}`);
    }
  }
  return lines.length > 0 ? textSections(lines) : [];
}

/** At most `budget` blocks; when cut, the last place says how much was left out. */
function budgeted(blocks: KnownBlock[], budget: number): KnownBlock[] {
  if (blocks.length <= budget) return blocks;
  const keep = Math.max(0, budget - 1);
  const left = blocks.length - keep;
  return [
    ...blocks.slice(0, keep),
    context(`_…${left} more part${left > 1 ? 's' : ''} left out to fit one Slack message; the console or \`--json\` shows it all._`),
  ];
}

// ---------- errors ----------

function renderError(reply: ReplyError, options: SlackCardOptions): SlackMessage {
  const e = reply.error;
  const blocks: KnownBlock[] = [textSection([`:grey_question: ${escapeMrkdwn(e.message)}`])];
  const lines: string[] = [];
  if (e.suggestion) lines.push(`${bold('Did you mean')}  ${codeSpan(e.suggestion)}?`);
  if (e.usage) lines.push(`${bold('Form')}  ${codeSpan(e.usage)}`);
  if (e.example) lines.push(`${bold('Example')}  ${codeSpan(e.example)}`);
  if (lines.length > 0) blocks.push(textSection(lines));
  if (e.choices && e.choices.length > 0) {
    blocks.push({
      type: 'actions',
      block_id: 'shiftprobe_choices',
      elements: e.choices.slice(0, 5).map((c, i) => ({
        type: 'button',
        action_id: `${SLACK_CHOICE_ACTION_PREFIX}${i}`,
        text: { type: 'plain_text', text: fitPlain(c.label, SLACK_LIMITS.buttonText), emoji: false },
        value: c.command.slice(0, SLACK_LIMITS.buttonValue),
      })),
    });
    blocks.push(context(e.choices.map((c) => `${escapeMrkdwn(c.label)}: ${codeSpan(c.command)}`).join('\n')));
    return { text: fitMrkdwn(escapeMrkdwn(e.message), SLACK_LIMITS.fallbackText), blocks };
  }
  if (options.helpHint !== false) {
    const help = options.helpHint ? codeSpan(options.helpHint) : '`help`';
    blocks.push(context(`${help} lists every command and its examples.`));
  }
  return { text: fitMrkdwn(escapeMrkdwn(e.message), SLACK_LIMITS.fallbackText), blocks };
}

// ---------- block builders ----------

function textSection(lines: readonly string[]): SectionBlock {
  return { type: 'section', text: { type: 'mrkdwn', text: fitMrkdwn(lines.join('\n'), SLACK_LIMITS.sectionText) } };
}

/** Lines packed into as few sections as the 3000-character limit allows, never splitting a line. */
function textSections(lines: readonly string[]): SectionBlock[] {
  const out: SectionBlock[] = [];
  let current: string[] = [];
  let size = 0;
  for (const line of lines) {
    const fitted = fitMrkdwn(line, SLACK_LIMITS.sectionText);
    if (current.length > 0 && size + 1 + fitted.length > SLACK_LIMITS.sectionText) {
      out.push(textSection(current));
      current = [];
      size = 0;
    }
    current.push(fitted);
    size += (current.length > 1 ? 1 : 0) + fitted.length;
  }
  if (current.length > 0) out.push(textSection(current));
  return out;
}

function fieldSections(fields: readonly string[]): SectionBlock[] {
  const out: SectionBlock[] = [];
  for (let i = 0; i < fields.length; i += SLACK_LIMITS.sectionFields) {
    out.push({
      type: 'section',
      fields: fields.slice(i, i + SLACK_LIMITS.sectionFields).map((f) => ({ type: 'mrkdwn', text: fitMrkdwn(f, SLACK_LIMITS.fieldText) })),
    });
  }
  return out;
}

function context(text: string): ContextBlock {
  return { type: 'context', elements: [{ type: 'mrkdwn', text: fitMrkdwn(text, SLACK_LIMITS.contextText) }] };
}
