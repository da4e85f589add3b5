import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { handle } from '../../../src/commands/handle.js';
import { COMMANDS } from '../../../src/commands/registry.js';
import { checkMessageLimits } from '../../../src/render/slack/limits.js';
import { SLACK_ACTION_IDS } from '../../../src/render/slack-blocks.js';
import type { Handler } from '../../../src/app/application.js';
import { FakeSlack } from './support/fake-slack.js';
import { startTestApp, TEST_SIGNING_SECRET, type TestApp, type TestAppOptions } from './support/harness.js';
import { FORM, sendToSlackEndpoint, slashCommandBody } from './support/signed.js';

let fake: FakeSlack;
let app: TestApp | undefined;
beforeAll(async () => {
  fake = new FakeSlack();
  await fake.start();
});
afterAll(() => fake.stop());
afterEach(async () => {
  await app?.stop();
  app = undefined;
});

async function start(options: Partial<TestAppOptions> = {}): Promise<TestApp> {
  app = await startTestApp({ fake, ...options });
  return app;
}

let triggers = 0;
async function slash(
  a: TestApp,
  text: string,
  more: { trigger?: string; command?: string } = {},
): Promise<{ status: number; body: Record<string, unknown>; trigger: string }> {
  const trigger = more.trigger ?? `trig-${++triggers}`;
  const body = slashCommandBody({ text, triggerId: trigger, responseUrl: fake.responseUrl(trigger), ...(more.command ? { command: more.command } : {}) });
  const res = await sendToSlackEndpoint(a.eventsUrl, body, { secret: TEST_SIGNING_SECRET, contentType: FORM });
  const raw = await res.text();
  return { status: res.status, body: raw ? (JSON.parse(raw) as Record<string, unknown>) : {}, trigger };
}

type Blocks = { type: string; elements?: { action_id?: string; value?: string }[] }[];

describe('slash command', () => {
  it('answers privately with the result card in the acknowledgement itself', async () => {
    const a = await start();
    const { status, body } = await slash(a, 'rho 8.2 ohm-cm p');
    expect(status).toBe(200);
    expect(body.response_type).toBe('ephemeral');
    const blocks = body.blocks as Blocks;
    expect(checkMessageLimits({ text: String(body.text), blocks: blocks as never })).toEqual([]);
    expect(JSON.stringify(blocks)).toContain('×10¹⁵ cm⁻³');
    const buttons = blocks.find((b) => b.type === 'actions')?.elements ?? [];
    expect(buttons.map((b) => b.action_id)).toEqual([SLACK_ACTION_IDS.shareChannel, SLACK_ACTION_IDS.shareThread, SLACK_ACTION_IDS.why]);
    // Button values carry the result id only, and the result is kept for them.
    const id = buttons[0]!.value!;
    expect(id).toMatch(/^r-[0-9a-f]{6}$/);
    expect(buttons.every((b) => b.value === id)).toBe(true);
    expect((await a.app.results.get(id))?.command).toBe('rho');
    expect(fake.callsTo('chat.postMessage')).toEqual([]);
  });

  it('bad input gets a private, friendly card with the right form and an example', async () => {
    const a = await start();
    const { body } = await slash(a, 'rho 8.2 ohm-cm');
    expect(body.response_type).toBe('ephemeral');
    const text = JSON.stringify(body.blocks);
    expect(text).toContain('*Form*  `rho &lt;resistivity&gt;');
    expect(text).toContain('*Example*  `rho 8.2 ohm-cm p`');
    expect(text).toContain('`/shiftprobe help`');
    expect(text).not.toContain('actions');
  });

  it('echoed input comes back escaped (Slack sends &, <, > escaped; they are decoded once and escaped again)', async () => {
    const a = await start();
    const { body } = await slash(a, 'frob&lt;!channel&gt;&amp;');
    const text = JSON.stringify(body);
    expect(text).toContain('frob&lt;!channel&gt;&amp;');
    expect(text).not.toContain('<!channel>');
  });

  it('answers every example of the help through the slash command, within Block Kit limits', async () => {
    const a = await start();
    const examples = COMMANDS.flatMap((c) => c.help.examples);
    for (const example of examples) {
      const { status, body } = await slash(a, example);
      expect(status, example).toBe(200);
      expect(body.response_type, example).toBe('ephemeral');
      expect(checkMessageLimits({ text: String(body.text), blocks: body.blocks as never }), example).toEqual([]);
    }
  });

  it('the same delivery twice (a Socket Mode redelivery) gives one card: the second is acknowledged empty', async () => {
    const calls: string[] = [];
    const counting: Handler = (text, ctx) => {
      calls.push(text);
      return handle(text, ctx);
    };
    const a = await start({ handle: counting });
    const first = await slash(a, 'ni 85C', { trigger: 'trig-same' });
    const second = await slash(a, 'ni 85C', { trigger: 'trig-same' });
    expect(first.body.response_type).toBe('ephemeral');
    expect(second.status).toBe(200);
    expect(second.body).toEqual({});
    expect(calls).toEqual(['ni 85C']);
  });

  it('a slow answer is acknowledged at once and delivered through the response URL', async () => {
    let release: () => void = () => undefined;
    const gate = new Promise<void>((r) => (release = r));
    const slow: Handler = async (text, ctx) => {
      await gate;
      return handle(text, ctx);
    };
    const a = await start({ handle: slow, ackDeadlineMs: 20 });
    const { body, trigger } = await slash(a, 'doping 2e15 boron');
    expect(body.response_type).toBe('ephemeral');
    expect(String(body.text)).toContain('Working on it');
    release();
    await fake.until(() => fake.postsTo(trigger).length === 1);
    const late = fake.postsTo(trigger)[0]!.body;
    expect(late.response_type).toBe('ephemeral');
    expect(late.replace_original).toBe(true);
    expect(JSON.stringify(late.blocks)).toContain('Ω·cm');
  });

  it('uses the configured command name (SLACK_SLASH_COMMAND)', async () => {
    const a = await start({ env: { SLACK_SLASH_COMMAND: '/probe' } });
    const { body } = await slash(a, 'ni 300K', { command: '/probe' });
    expect(body.response_type).toBe('ephemeral');
    expect(JSON.stringify(body.blocks)).toContain('cm⁻³');
  });
});

describe('when something fails on our side', () => {
  it('before the acknowledgement: the private note is the acknowledgement, nothing else is sent', async () => {
    const broken: Handler = async () => {
      throw new Error('the physics module fell over');
    };
    const a = await start({ handle: broken });
    const { status, body, trigger } = await slash(a, 'rho 8.2 ohm-cm p');
    expect(status).toBe(200);
    expect(body.response_type).toBe('ephemeral');
    expect(JSON.stringify(body.blocks)).toContain('Something went wrong on our side');
    await new Promise((r) => setTimeout(r, 100));
    expect(fake.postsTo(trigger)).toEqual([]);
    expect(a.logs.join('\n')).toContain('the physics module fell over');
  });

  it('after the answer is out (bookkeeping fails): the card stands, the failure is only logged', async () => {
    const a = await start();
    a.app.conversations.setLastResult = async () => {
      throw new Error('disk full while remembering the last result');
    };
    const { body, trigger } = await slash(a, 'ni 85C');
    expect(JSON.stringify(body.blocks)).toContain('cm⁻³');
    await fake.until(() => a.logs.some((l) => l.includes('disk full while remembering')));
    expect(fake.postsTo(trigger)).toEqual([]);
  });
});
