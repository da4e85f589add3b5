import { describe, expect, it } from 'vitest';
import { commandTextFromSlack } from '../../../src/adapters/slack/incoming-text.js';

// Forms from the Slack API reference, "Formatting text for app surfaces".
describe('commandTextFromSlack', () => {
  it('drops the mention of the bot, wherever it is', () => {
    expect(commandTextFromSlack('<@U0SHIFTBOT> rho 8.2 ohm-cm p', 'U0SHIFTBOT')).toBe('rho 8.2 ohm-cm p');
    expect(commandTextFromSlack('hey <@U0SHIFTBOT|shiftprobe>  ni 85C', 'U0SHIFTBOT')).toBe('hey ni 85C');
  });

  it('decodes the three escaped characters once', () => {
    expect(commandTextFromSlack('sheet 4.1mV 1mA &lt;note&gt; &amp;amp;')).toBe('sheet 4.1mV 1mA <note> &amp;');
  });

  it('unwraps links, other mentions, channels and special mentions to what the person saw', () => {
    expect(commandTextFromSlack('record <mailto:a@b.example|a@b.example> <http://lot.example/A17|LOT-A17>')).toBe('record a@b.example LOT-A17');
    expect(commandTextFromSlack('ask <@U0TOMASZ> in <#C0ETCHBAY|etch-bay> <!here>', 'U0SHIFTBOT')).toBe('ask @U0TOMASZ in #etch-bay @here');
  });

  it('turns non-breaking spaces into spaces and trims', () => {
    expect(commandTextFromSlack('\u00a0rho\u00a08.2\u202fohm-cm p  ')).toBe('rho 8.2 ohm-cm p');
    expect(commandTextFromSlack(undefined)).toBe('');
  });
});

describe('the acknowledgement budget counts from the request’s arrival', () => {
  it('what is left of 2 s after the request waited for a busy process', async () => {
    const { ackBudgetMs } = await import('../../../src/adapters/slack/outbound.js');
    expect(ackBudgetMs(10_000, 10_000, 2000)).toBe(2000);
    expect(ackBudgetMs(10_000, 11_500, 2000)).toBe(500); // 1.5 s spent before the listener ran
    expect(ackBudgetMs(10_000, 19_900, 2000)).toBe(0); // starved: acknowledge at once ("working on it")
    expect(ackBudgetMs(undefined, 19_900, 2000)).toBe(2000); // arrival unknown: the whole budget
    expect(ackBudgetMs(20_000, 19_900, 2000)).toBe(2000); // a clock step backwards never adds time
  });
});
