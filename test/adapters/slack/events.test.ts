import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { handle } from '../../../src/commands/handle.js';
import { COMMANDS } from '../../../src/commands/registry.js';
import type { Handler } from '../../../src/app/application.js';
import { checkMessageLimits } from '../../../src/render/slack/limits.js';
import { SLACK_ACTION_IDS } from '../../../src/render/slack-blocks.js';
import { FAKE_BOT_USER, FakeSlack } from './support/fake-slack.js';
import { startTestApp, TEST_SIGNING_SECRET, type TestApp } from './support/harness.js';
import { eventCallbackBody, JSON_TYPE, sendToSlackEndpoint } from './support/signed.js';

let fake: FakeSlack;
const apps: TestApp[] = [];
const dirs: string[] = [];
beforeAll(async () => {
  fake = new FakeSlack();
  await fake.start();
});
afterAll(() => fake.stop());
afterEach(async () => {
  for (const a of apps.splice(0)) await a.stop();
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
  fake.calls.length = 0;
});

/** Counts what reaches `handle`, so a test can wait until every delivery was processed. */
function counting(): { handler: Handler; texts: string[] } {
  const texts: string[] = [];
  return {
    texts,
    handler: (text, ctx) => {
      texts.push(text);
      return handle(text, ctx);
    },
  };
}

async function start(options: { handle?: Handler; databasePath?: string; firstId?: number } = {}): Promise<TestApp> {
  const a = await startTestApp({ fake, ...options });
  apps.push(a);
  return a;
}

async function deliver(a: TestApp, event: Record<string, unknown>, eventId: string, headers: Record<string, string> = {}): Promise<number> {
  const res = await sendToSlackEndpoint(a.eventsUrl, eventCallbackBody(event, eventId), { secret: TEST_SIGNING_SECRET, contentType: JSON_TYPE, headers });
  await res.text();
  return res.status;
}

const mention = (text: string, more: Record<string, unknown> = {}) => ({
  type: 'app_mention',
  user: 'U0TOMASZ',
  text: `<@${FAKE_BOT_USER}> ${text}`,
  ts: '1930000100.000200',
  channel: 'C0ETCHBAY',
  event_ts: '1930000100.000200',
  ...more,
});

const dm = (text: string, more: Record<string, unknown> = {}) => ({
  type: 'message',
  channel_type: 'im',
  user: 'U0PRIYA',
  text,
  ts: '1930000200.000300',
  channel: 'D0PRIYA',
  event_ts: '1930000200.000300',
  ...more,
});

type Posted = { channel?: string; thread_ts?: string; text?: string; blocks?: unknown[]; user?: string };

describe('@mention', () => {
  it('in a channel: answered publicly in a thread under the mention', async () => {
    const a = await start();
    expect(await deliver(a, mention('rho 8.2 ohm-cm p'), 'Ev01')).toBe(200);
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    const posted = fake.callsTo('chat.postMessage')[0]!.params as Posted;
    expect(posted.channel).toBe('C0ETCHBAY');
    expect(posted.thread_ts).toBe('1930000100.000200');
    expect(checkMessageLimits({ text: String(posted.text), blocks: posted.blocks as never })).toEqual([]);
    expect(JSON.stringify(posted.blocks)).toContain('×10¹⁵ cm⁻³');
    // Public answer: only the derivation button; sharing buttons belong on private cards.
    expect(JSON.stringify(posted.blocks)).toContain(SLACK_ACTION_IDS.why);
    expect(JSON.stringify(posted.blocks)).not.toContain(SLACK_ACTION_IDS.shareChannel);
    // Posted with the bot token.
    expect(fake.callsTo('chat.postMessage')[0]!.token).toMatch(/^xoxb-/);
  });

  it('inside a thread: answered in that same thread', async () => {
    const a = await start();
    await deliver(a, mention('ni 85C', { ts: '1930000150.000900', thread_ts: '1930000001.000100' }), 'Ev02');
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    const posted = fake.callsTo('chat.postMessage')[0]!.params as Posted;
    expect(posted.channel).toBe('C0ETCHBAY');
    expect(posted.thread_ts).toBe('1930000001.000100');
  });

  it('the mention itself is not part of the command', async () => {
    const c = counting();
    const a = await start({ handle: c.handler });
    await deliver(a, mention('doping 2e15 boron'), 'Ev03');
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    expect(c.texts).toEqual(['doping 2e15 boron']);
  });

  it('bad input: a private note to the person in the thread, nothing public', async () => {
    const a = await start();
    await deliver(a, mention('rho banana'), 'Ev04');
    await fake.until(() => fake.callsTo('chat.postEphemeral').length === 1);
    const note = fake.callsTo('chat.postEphemeral')[0]!.params as Posted;
    expect(note.user).toBe('U0TOMASZ');
    expect(note.channel).toBe('C0ETCHBAY');
    expect(note.thread_ts).toBe('1930000100.000200');
    expect(JSON.stringify(note.blocks)).toContain('*Example*');
    expect(fake.callsTo('chat.postMessage')).toEqual([]);
  });

  it('the same event delivered three times (X-Slack-Retry-Num 1 and 2) gives one reply', async () => {
    const c = counting();
    const a = await start({ handle: c.handler });
    const event = mention('rho 0.012 Ω·cm arsenic');
    expect(await deliver(a, event, 'Ev05')).toBe(200);
    expect(await deliver(a, event, 'Ev05', { 'x-slack-retry-num': '1', 'x-slack-retry-reason': 'http_timeout' })).toBe(200);
    expect(await deliver(a, event, 'Ev05', { 'x-slack-retry-num': '2', 'x-slack-retry-reason': 'http_timeout' })).toBe(200);
    await fake.until(() => fake.callsTo('chat.postMessage').length >= 1);
    // Let the retries run to the end before counting.
    await new Promise((r) => setTimeout(r, 150));
    expect(fake.callsTo('chat.postMessage')).toHaveLength(1);
    expect(c.texts).toHaveLength(1);
  });

  it('two instances on one database, each given the same event: one reply', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-two-'));
    dirs.push(dir);
    const databasePath = join(dir, 'shared.db');
    const one = await start({ databasePath, firstId: 0x100 });
    const two = await start({ databasePath, firstId: 0x900 });
    const event = mention('sheet 45 ohm/sq thick 525um n');
    await Promise.all([deliver(one, event, 'Ev06'), deliver(two, event, 'Ev06')]);
    await fake.until(() => fake.callsTo('chat.postMessage').length >= 1);
    await new Promise((r) => setTimeout(r, 150));
    expect(fake.callsTo('chat.postMessage')).toHaveLength(1);
  });
});

describe('direct message', () => {
  it('answered in the DM, not in a thread', async () => {
    const a = await start();
    await deliver(a, dm('type hot +2.1mV'), 'Ev10');
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    const posted = fake.callsTo('chat.postMessage')[0]!.params as Posted;
    expect(posted.channel).toBe('D0PRIYA');
    expect(posted.thread_ts).toBeUndefined();
    const text = JSON.stringify(posted.blocks);
    expect(text).toContain(SLACK_ACTION_IDS.shareThread);
    expect(text).not.toContain(SLACK_ACTION_IDS.shareChannel);
  });

  it('errors in a DM are answered in the DM (it is private already)', async () => {
    const a = await start();
    await deliver(a, dm('frobnicate'), 'Ev11');
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    expect((fake.callsTo('chat.postMessage')[0]!.params as Posted).channel).toBe('D0PRIYA');
    expect(fake.callsTo('chat.postEphemeral')).toEqual([]);
  });

  it("ignores the bot's own messages, edits and other bots", async () => {
    const c = counting();
    const a = await start({ handle: c.handler });
    await deliver(a, dm('rho 8.2 ohm-cm p', { user: FAKE_BOT_USER, ts: '1930000201.000001' }), 'Ev12');
    await deliver(a, dm('rho 8.2 ohm-cm p', { bot_id: 'B0OTHER', ts: '1930000202.000001' }), 'Ev13');
    await deliver(a, dm('rho 8.2 ohm-cm p', { subtype: 'message_changed', ts: '1930000203.000001' }), 'Ev14');
    await deliver(a, dm('ni 300K', { ts: '1930000204.000001' }), 'Ev15');
    await fake.until(() => fake.callsTo('chat.postMessage').length >= 1);
    await new Promise((r) => setTimeout(r, 100));
    expect(c.texts).toEqual(['ni 300K']);
    expect(fake.callsTo('chat.postMessage')).toHaveLength(1);
  });
});

describe('the whole vocabulary', () => {
  const examples = COMMANDS.flatMap((c) => c.help.examples);

  it('every help example as a mention gets one answer in its thread (public card or private note), within limits', async () => {
    const a = await start();
    let i = 0;
    for (const example of examples) {
      i += 1;
      const ts = `19300${String(10000 + i)}.000100`;
      const before = fake.calls.length;
      await deliver(a, mention(example, { ts, event_ts: ts }), `EvAll${i}`);
      await fake.until(() => fake.calls.slice(before).some((c) => c.method === 'chat.postMessage' || c.method === 'chat.postEphemeral'));
      const answers = fake.calls.slice(before).filter((c) => c.method === 'chat.postMessage' || c.method === 'chat.postEphemeral');
      expect(answers, example).toHaveLength(1);
      const p = answers[0]!.params as Posted;
      expect(p.thread_ts, example).toBe(ts);
      expect(checkMessageLimits({ text: String(p.text), blocks: p.blocks as never }), example).toEqual([]);
    }
  });

  it('every help example in a DM gets one answer in the DM, within limits', async () => {
    const a = await start();
    let i = 0;
    for (const example of examples) {
      i += 1;
      const ts = `19300${String(20000 + i)}.000100`;
      const before = fake.callsTo('chat.postMessage').length;
      await deliver(a, dm(example, { ts, event_ts: ts }), `EvDm${i}`);
      await fake.until(() => fake.callsTo('chat.postMessage').length === before + 1);
      const p = fake.callsTo('chat.postMessage').at(-1)!.params as Posted;
      expect(p.channel, example).toBe('D0PRIYA');
      expect(checkMessageLimits({ text: String(p.text), blocks: p.blocks as never }), example).toEqual([]);
    }
  });
});
