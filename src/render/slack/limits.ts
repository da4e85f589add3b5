/**
 * Block Kit limits a message must respect (Slack API reference, "Blocks" and "Block elements",
 * as of 2025) and a checker used by the renderer's tests and as a guard before sending.
 */
import type { KnownBlock } from './block-types.js';

export const SLACK_LIMITS = {
  blocksPerMessage: 50,
  /** Top-level `text`: Slack truncates long messages; 3000 keeps notifications readable. */
  fallbackText: 3000,
  sectionText: 3000,
  sectionFields: 10,
  fieldText: 2000,
  headerText: 150,
  contextElements: 10,
  contextText: 3000,
  actionsElements: 25,
  buttonText: 75,
  buttonValue: 2000,
  actionId: 255,
  blockId: 255,
  modalTitle: 24,
  modalButton: 24,
  privateMetadata: 3000,
  selectOptions: 100,
  optionText: 75,
  optionValue: 150,
  inputLabel: 2000,
  placeholder: 150,
} as const;

export interface SlackMessage {
  /** Fallback for notifications, screen readers and clients without blocks (mrkdwn-escaped). */
  readonly text: string;
  readonly blocks: KnownBlock[];
}

export interface LimitViolation {
  readonly where: string;
  readonly limit: number;
  readonly actual: number;
}

/** Every Block Kit limit the message breaks (empty when it fits). */
export function checkMessageLimits(message: SlackMessage): LimitViolation[] {
  const out: LimitViolation[] = [];
  const check = (where: string, actual: number, limit: number): void => {
    if (actual > limit) out.push({ where, limit, actual });
  };
  const emptyText = (where: string, text: string | undefined): void => {
    if (text !== undefined && text.trim() === '') out.push({ where: `${where} (empty text)`, limit: 1, actual: 0 });
  };
  check('text', message.text.length, SLACK_LIMITS.fallbackText);
  check('blocks', message.blocks.length, SLACK_LIMITS.blocksPerMessage);
  message.blocks.forEach((block, i) => {
    const at = `blocks[${i}] ${block.type}`;
    if (block.block_id !== undefined) check(`${at}.block_id`, block.block_id.length, SLACK_LIMITS.blockId);
    switch (block.type) {
      case 'header':
        check(`${at}.text`, block.text.text.length, SLACK_LIMITS.headerText);
        emptyText(at, block.text.text);
        break;
      case 'section':
        if (block.text) {
          check(`${at}.text`, block.text.text.length, SLACK_LIMITS.sectionText);
          emptyText(at, block.text.text);
        }
        if (block.fields) {
          check(`${at}.fields`, block.fields.length, SLACK_LIMITS.sectionFields);
          block.fields.forEach((f, j) => {
            check(`${at}.fields[${j}]`, f.text.length, SLACK_LIMITS.fieldText);
            emptyText(`${at}.fields[${j}]`, f.text);
          });
        }
        if (!block.text && !block.fields?.length) out.push({ where: `${at} (no text or fields)`, limit: 1, actual: 0 });
        break;
      case 'context':
        check(`${at}.elements`, block.elements.length, SLACK_LIMITS.contextElements);
        block.elements.forEach((e, j) => {
          if ('text' in e && typeof e.text === 'string') {
            check(`${at}.elements[${j}]`, e.text.length, SLACK_LIMITS.contextText);
            emptyText(`${at}.elements[${j}]`, e.text);
          }
        });
        break;
      case 'actions':
        check(`${at}.elements`, block.elements.length, SLACK_LIMITS.actionsElements);
        block.elements.forEach((e, j) => {
          if (e.type !== 'button') return;
          check(`${at}.elements[${j}].text`, e.text.text.length, SLACK_LIMITS.buttonText);
          if (e.value !== undefined) check(`${at}.elements[${j}].value`, e.value.length, SLACK_LIMITS.buttonValue);
          if (e.action_id !== undefined) check(`${at}.elements[${j}].action_id`, e.action_id.length, SLACK_LIMITS.actionId);
        });
        break;
      default:
        break;
    }
  });
  return out;
}
