import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MemoryResultStore } from '../../src/adapters/storage/memory.js';
import { type HandleContext } from '../../src/commands/context.js';
import { handle } from '../../src/commands/handle.js';
import { COMMANDS } from '../../src/commands/registry.js';
import { renderSlackMessage, SLACK_ACTION_IDS, type CardAction } from '../../src/render/slack-blocks.js';
import { checkMessageLimits, SLACK_LIMITS, type SlackMessage } from '../../src/render/slack/limits.js';
import { escapeMrkdwn, fitMrkdwn } from '../../src/render/slack/mrkdwn.js';
import { valueText } from '../../src/render/text.js';
import type { ReplyOk } from '../../src/reply/reply.js';

function context(): HandleContext {
  let n = 0x500;
  return {
    surface: 'slack',
    caller: { userId: 'U0PRIYA', channelId: 'C0ETCHBAY' },
    now: () => new Date('2031-03-04T05:06:07Z'),
    newId: () => `r-${(n++).toString(16).padStart(6, '0')}`,
    results: new MemoryResultStore(),
    session: {},
  };
}

const ALL_ACTIONS: CardAction[] = ['shareChannel', 'shareThread', 'why'];
const EXAMPLES = COMMANDS.flatMap((c) => c.help.examples.map((e) => [c.verb, e] as const));

/** All the visible text of a message, blocks and fallback, as JSON (so escapes compare as sent). */
function allText(m: SlackMessage): string {
  return JSON.stringify(m);
}

/** A string as it appears inside the JSON of a message. */
function inJson(s: string): string {
  return JSON.stringify(s).slice(1, -1);
}

function sample(overrides: Partial<ReplyOk> = {}): ReplyOk {
  return {
    ok: true,
    id: 'r-0a1b2c',
    command: 'rho',
    title: 'Boron from 8.20 Ω·cm',
    createdAt: '2031-03-04T05:06:07.000Z',
    values: [
      { key: 'dopantDensityPerCm3', value: 1.64e15, unit: 'cm⁻³', label: 'Boron density', headline: true },
      { key: 'mobilityCm2PerVs', value: 465.2, unit: 'cm²/V·s', label: 'Hole mobility' },
    ],
    inputs: { resistivity: { value: 8.2, unit: 'Ω·cm', label: 'Resistivity', asTyped: '8.2 ohm-cm' } },
    assumptions: ['Resistivity at 23 °C.'],
    model: { id: 'astm-f723', name: 'ASTM F723', citation: 'ASTM F723-99', validity: 'B: 1e-4 to 1e4 Ω·cm' },
    warnings: [],
    cautions: ["Confirm against your fab's controlled procedure."],
    decision: true,
    ...overrides,
  };
}

describe('every help example as a Slack card', () => {
  it('there are help examples to check', () => {
    expect(EXAMPLES.length).toBeGreaterThan(10);
  });

  it.each(EXAMPLES)('%s: "%s" renders within Block Kit limits, with buttons or without', async (_verb, example) => {
    const reply = await handle(example, context());
    for (const actions of [[], ALL_ACTIONS]) {
      const message = renderSlackMessage(reply, { actions, helpHint: '/shiftprobe help', sharedBy: 'U0PRIYA' });
      expect(checkMessageLimits(message)).toEqual([]);
      expect(message.text.trim()).not.toBe('');
    }
  });

  it.each(EXAMPLES)('%s: "%s" shows its values exactly as the console does', async (_verb, example) => {
    const reply = await handle(example, context());
    if (!reply.ok) return;
    const text = allText(renderSlackMessage(reply));
    for (const v of reply.values) expect(text).toContain(inJson(escapeMrkdwn(valueText(v))));
  });

  it.each(EXAMPLES)('%s: "%s" carries every caution of the reply', async (_verb, example) => {
    const reply = await handle(example, context());
    if (!reply.ok) return;
    const text = allText(renderSlackMessage(reply, { actions: ALL_ACTIONS }));
    for (const c of reply.cautions) expect(text).toContain(inJson(escapeMrkdwn(c)));
  });
});

describe('escaping echoed input', () => {
  it('an unknown command echoed back has <, > and & escaped, so it cannot mention or link', async () => {
    const reply = await handle('frob<!channel>&<https://evil.example|x>', context());
    expect(reply.ok).toBe(false);
    const text = allText(renderSlackMessage(reply, { helpHint: '/shiftprobe help' }));
    expect(text).toContain('frob&lt;!channel&gt;&amp;&lt;https://evil.example|x&gt;');
    expect(text).not.toContain('<!channel>');
    expect(text).not.toContain('<https://evil.example');
  });

  it('inputs as typed, labels, warnings and sections are escaped', () => {
    const m = renderSlackMessage(
      sample({
        inputs: { lot: { value: 'LOT-A17', label: 'Lot <b>', asTyped: 'LOT-A17 <@U0TOMASZ> & <!here>' } },
        warnings: [{ code: 'other', message: 'Reading < 0 & > limit' }],
        sections: [{ heading: 'Notes <x>', lines: ['a & b'], table: { columns: ['k', 'v'], rows: [['<!everyone>', '&']] } }],
      }),
      { actions: ALL_ACTIONS },
    );
    const text = allText(m);
    for (const raw of ['<@U0TOMASZ>', '<!here>', '<!everyone>', '<b>', '<x>', 'Reading < 0']) expect(text).not.toContain(raw);
    expect(text).toContain('&lt;@U0TOMASZ&gt; &amp; &lt;!here&gt;');
    expect(text).toContain('Reading &lt; 0 &amp; &gt; limit');
  });

  it('the only mention a card makes is the person who shared it, and only a real user id', () => {
    expect(allText(renderSlackMessage(sample(), { sharedBy: 'U0PRIYA' }))).toContain('shared by <@U0PRIYA>');
    expect(allText(renderSlackMessage(sample(), { sharedBy: '!channel' }))).not.toContain('shared by');
  });
});

describe('the card', () => {
  it('puts headline values first, then the other values as fields, then small print, caution, buttons, footer', () => {
    const m = renderSlackMessage(sample(), { actions: ALL_ACTIONS });
    const types = m.blocks.map((b) => b.type);
    expect(types[0]).toBe('header');
    expect(JSON.stringify(m.blocks[1])).toContain(inJson('Boron density  *1.64×10¹⁵ cm⁻³*'));
    expect(JSON.stringify(m.blocks[2])).toContain(inJson('Hole mobility\n*465 cm²/V·s*'));
    expect(types.at(-2)).toBe('actions');
    const footer = JSON.stringify(m.blocks.at(-1));
    expect(footer).toContain('`r-0a1b2c`');
    // 2031-03-04T05:06:07Z is 1930367167 s after the Unix epoch; Slack shows it in the reader's zone.
    expect(footer).toContain('<!date^1930367167^');
    const buttons = (m.blocks.at(-2) as unknown as { elements: { action_id: string; value: string }[] }).elements;
    expect(buttons.map((b) => b.action_id)).toEqual(Object.values(SLACK_ACTION_IDS));
    expect(buttons.every((b) => b.value === 'r-0a1b2c')).toBe(true);
    expect(m.text).toBe('Boron from 8.20 Ω·cm: Boron density 1.64×10¹⁵ cm⁻³');
  });

  it('shows the model with its citation and validity, and how the input was read', () => {
    const text = allText(renderSlackMessage(sample()));
    expect(text).toContain('*ASTM F723* — ASTM F723-99');
    expect(text).toContain('Valid for B: 1e-4 to 1e4 Ω·cm');
    expect(text).toContain('Resistivity 8.200 Ω·cm (`8.2 ohm-cm`)');
  });

  it('an error card gives the message, the right form, an example and where help is', async () => {
    const reply = await handle('rho 8.2 ohm-cm', context());
    const text = allText(renderSlackMessage(reply, { helpHint: '/shiftprobe help' }));
    expect(reply.ok).toBe(false);
    expect(text).toContain('*Form*  `rho &lt;resistivity&gt;');
    expect(text).toContain('*Example*  `rho 8.2 ohm-cm p`');
    expect(text).toContain('`/shiftprobe help` lists every command');
  });

  it('an oversized reply is cut to fit, keeping the caution and the buttons', () => {
    const long = 'x'.repeat(5000);
    const m = renderSlackMessage(
      sample({
        title: 'T'.repeat(400),
        values: Array.from({ length: 35 }, (_, i) => ({ key: `k${i}`, value: i * 1e14 + 1, unit: 'cm⁻³', label: `Value ${i} ${long}` })),
        warnings: Array.from({ length: 120 }, (_, i) => ({ code: 'other', message: `Warning ${i} & more ${'y'.repeat(200)}` })),
        sections: Array.from({ length: 80 }, (_, i) => ({ heading: `Part ${i}`, lines: [long, 'short'] })),
        assumptions: [long],
      }),
      { actions: ALL_ACTIONS },
    );
    expect(checkMessageLimits(m)).toEqual([]);
    expect(m.blocks.length).toBeLessThanOrEqual(SLACK_LIMITS.blocksPerMessage);
    const text = allText(m);
    expect(text).toContain(inJson("Confirm against your fab's controlled procedure."));
    expect(text).toContain(SLACK_ACTION_IDS.why);
    expect(text).toContain('left out to fit one Slack message');
  });
});

describe('fitMrkdwn', () => {
  it('property: within the limit, never cuts an entity in half, closes a code span it cut', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 400 }), fc.integer({ min: 8, max: 300 }), (raw, max) => {
        const escaped = escapeMrkdwn(raw);
        const out = fitMrkdwn(escaped, max);
        expect(out.length).toBeLessThanOrEqual(max);
        if (escaped.length <= max) expect(out).toBe(escaped);
        expect(out.replace(/&(amp|lt|gt);/g, '')).not.toContain('&');
        if (out !== escaped) expect((out.match(/`/g)?.length ?? 0) % 2).toBe(0);
      }),
    );
  });
});
