import { describe, expect, it } from 'vitest';
import { SLACK_LIMITS } from '../../../src/render/slack/limits.js';
import {
  decodePickerState,
  encodePickerState,
  parseChoiceValue,
  threadPickerView,
} from '../../../src/adapters/slack/views/thread-picker.js';

describe('the thread dialog', () => {
  const choices = Array.from({ length: 140 }, (_, i) => ({
    channelId: 'C0ETCHBAY',
    threadTs: `${1930000000 + i}.000100`,
    label: `LOT-B${i} wafer ${i} <reads> & high — ${'very long thread text '.repeat(10)}`,
  }));
  const view = threadPickerView({ resultId: 'r-0a1b2c', channelId: 'C0ETCHBAY', responseUrl: 'https://hooks.slack.com/actions/T0/1/abc' }, 'T'.repeat(500), choices, 'note & <x>');

  it('stays within the limits of a modal (title, buttons, options, metadata)', () => {
    expect(view.title.text.length).toBeLessThanOrEqual(SLACK_LIMITS.modalTitle);
    expect(view.submit!.text.length).toBeLessThanOrEqual(SLACK_LIMITS.modalButton);
    expect(view.close!.text.length).toBeLessThanOrEqual(SLACK_LIMITS.modalButton);
    expect(view.private_metadata!.length).toBeLessThanOrEqual(SLACK_LIMITS.privateMetadata);
    const select = JSON.parse(JSON.stringify(view.blocks)).find((b: { block_id?: string }) => b.block_id === 'thread');
    expect(select.element.options.length).toBeLessThanOrEqual(SLACK_LIMITS.selectOptions);
    for (const o of select.element.options) {
      expect(o.text.text.length).toBeLessThanOrEqual(SLACK_LIMITS.optionText);
      expect(o.value.length).toBeLessThanOrEqual(SLACK_LIMITS.optionValue);
    }
  });

  it('escapes what it echoes in mrkdwn and carries ids only in its metadata', () => {
    const text = JSON.stringify(view.blocks);
    expect(text).toContain('note &amp; &lt;x&gt;');
    expect(decodePickerState(view.private_metadata)).toEqual({ resultId: 'r-0a1b2c', channelId: 'C0ETCHBAY', responseUrl: 'https://hooks.slack.com/actions/T0/1/abc' });
  });

  it('without choices it asks only for a link, which is then required', () => {
    const bare = threadPickerView({ resultId: 'r-0a1b2c', channelId: 'C0ETCHBAY' }, 'Boron from 8.20 Ω·cm', []);
    const blocks = JSON.parse(JSON.stringify(bare.blocks)) as { block_id?: string; optional?: boolean }[];
    expect(blocks.find((b) => b.block_id === 'thread')).toBeUndefined();
    expect(blocks.find((b) => b.block_id === 'link')?.optional).toBe(false);
  });

  it('metadata that is not ours, and choice values out of shape, are refused', () => {
    expect(decodePickerState('{"r":1}')).toBeUndefined();
    expect(decodePickerState('not json')).toBeUndefined();
    expect(parseChoiceValue('C0ETCHBAY:1930000700.000100')).toEqual({ channelId: 'C0ETCHBAY', threadTs: '1930000700.000100' });
    expect(parseChoiceValue('C0ETCHBAY:now')).toBeUndefined();
    expect(encodePickerState({ resultId: 'r-1', channelId: 'C1', responseUrl: 'x'.repeat(4000) })).toBe('{"r":"r-1","c":"C1"}');
  });
});
