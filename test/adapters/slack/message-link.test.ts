import { describe, expect, it } from 'vitest';
import { parseMessageLink } from '../../../src/adapters/slack/message-link.js';

// Slack's "Copy link" form: /archives/<channel>/p<ts without the dot>[?thread_ts=…&cid=…].
describe('parseMessageLink', () => {
  it('a top-level message: reply in its own thread', () => {
    expect(parseMessageLink('https://harrowgate-fab3.slack.com/archives/C0ETCHBAY/p1930000500123456')).toEqual({
      channelId: 'C0ETCHBAY',
      messageTs: '1930000500.123456',
      threadTs: '1930000500.123456',
    });
  });

  it('a reply inside a thread: reply in the parent thread', () => {
    const link = parseMessageLink('https://harrowgate-fab3.slack.com/archives/C0ETCHBAY/p1930000600654321?thread_ts=1930000590.000100&cid=C0ETCHBAY');
    expect(link?.threadTs).toBe('1930000590.000100');
    expect(link?.messageTs).toBe('1930000600.654321');
  });

  it('accepts Enterprise Grid hosts, angle brackets from mrkdwn and surrounding spaces', () => {
    expect(parseMessageLink('  <https://harrowgate.enterprise.slack.com/archives/G0PRIVATE/p1930000500123456>  ')?.channelId).toBe('G0PRIVATE');
  });

  it('refuses what is not a Slack message link', () => {
    for (const bad of ['LOT-A17', 'https://example.com/archives/C0ETCHBAY/p1930000500123456', 'https://x.slack.com/archives/C0ETCHBAY', 'http://x.slack.com/archives/C0ETCHBAY/p1930000500123456']) {
      expect(parseMessageLink(bad)).toBeUndefined();
    }
  });
});
