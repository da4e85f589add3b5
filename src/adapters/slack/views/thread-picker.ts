/**
 * The "Post in a thread…" dialog: a short list of recent threads in the channel, or a pasted
 * message link. Its private metadata carries the result id, the channel the card is in and the
 * card's response URL (to tell the person how it went); no result data.
 */
import type { InputBlock, KnownBlock, ModalView, PlainTextOption } from '../../../render/slack/block-types.js';
import { SLACK_LIMITS } from '../../../render/slack/limits.js';
import { codeSpan, escapeMrkdwn, fitPlain } from '../../../render/slack/mrkdwn.js';

export const THREAD_PICKER_CALLBACK = 'shiftprobe_thread_picker';
export const PICK_BLOCK = 'thread';
export const PICK_ACTION = 'pick';
export const LINK_BLOCK = 'link';
export const LINK_ACTION = 'url';

export interface ThreadChoice {
  readonly channelId: string;
  readonly threadTs: string;
  readonly label: string;
}

export interface PickerState {
  readonly resultId: string;
  readonly channelId: string;
  readonly responseUrl?: string;
}

export function threadPickerView(state: PickerState, resultTitle: string, choices: readonly ThreadChoice[], note?: string): ModalView {
  const blocks: KnownBlock[] = [
    {
      type: 'section',
      text: { type: 'mrkdwn', text: `Post *${escapeMrkdwn(fitPlain(resultTitle, 200))}* ${codeSpan(state.resultId)} as a reply in a thread.` },
    },
  ];
  const options: PlainTextOption[] = choices.slice(0, SLACK_LIMITS.selectOptions).map((c) => ({
    text: { type: 'plain_text', text: fitPlain(c.label, SLACK_LIMITS.optionText), emoji: false },
    value: `${c.channelId}:${c.threadTs}`,
  }));
  if (options.length > 0) {
    const pick: InputBlock = {
      type: 'input',
      block_id: PICK_BLOCK,
      optional: true,
      label: { type: 'plain_text', text: 'Recent threads in this channel' },
      element: {
        type: 'static_select',
        action_id: PICK_ACTION,
        placeholder: { type: 'plain_text', text: 'Choose a thread' },
        options,
      },
    };
    blocks.push(pick);
  }
  blocks.push({
    type: 'input',
    block_id: LINK_BLOCK,
    optional: options.length > 0,
    label: { type: 'plain_text', text: options.length > 0 ? 'Or paste a message link' : 'Paste a message link' },
    hint: { type: 'plain_text', text: 'On the message: ⋯ → Copy link. The result goes into that message’s thread.' },
    element: {
      type: 'plain_text_input',
      action_id: LINK_ACTION,
      max_length: 500,
      placeholder: { type: 'plain_text', text: 'https://your-workspace.slack.com/archives/C…/p…' },
    },
  });
  if (note) blocks.push({ type: 'context', elements: [{ type: 'mrkdwn', text: escapeMrkdwn(note) }] });
  return {
    type: 'modal',
    callback_id: THREAD_PICKER_CALLBACK,
    title: { type: 'plain_text', text: 'Post in a thread' },
    submit: { type: 'plain_text', text: 'Post' },
    close: { type: 'plain_text', text: 'Cancel' },
    private_metadata: encodePickerState(state),
    blocks,
  };
}

export function encodePickerState(state: PickerState): string {
  const json = JSON.stringify({ r: state.resultId, c: state.channelId, ...(state.responseUrl ? { u: state.responseUrl } : {}) });
  // A response URL is ~100 characters; drop it rather than exceed the limit.
  return json.length <= SLACK_LIMITS.privateMetadata ? json : JSON.stringify({ r: state.resultId, c: state.channelId });
}

export function decodePickerState(metadata: string | undefined): PickerState | undefined {
  try {
    const v = JSON.parse(metadata ?? '') as { r?: unknown; c?: unknown; u?: unknown };
    if (typeof v.r !== 'string' || typeof v.c !== 'string') return undefined;
    return { resultId: v.r, channelId: v.c, ...(typeof v.u === 'string' ? { responseUrl: v.u } : {}) };
  } catch {
    return undefined;
  }
}

/** The picked "C…:ts" option value. */
export function parseChoiceValue(value: string | undefined | null): { channelId: string; threadTs: string } | undefined {
  const m = /^([CGD][A-Z0-9]{2,}):(\d{10}\.\d{6})$/.exec(value ?? '');
  return m ? { channelId: m[1]!, threadTs: m[2]! } : undefined;
}
