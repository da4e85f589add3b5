/**
 * Lot records in Slack, end to end over loopback: a real Bolt app (HTTP receiver), signed
 * requests, the fake Web API. Recording from the slash command and a mention, permissions, the
 * same event three times, and the daily summary posted once to DIGEST_CHANNEL by two schedulers.
 * Invented demo lots and people (Harrowgate Fab 3).
 */
import { webApi } from '@slack/bolt';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { slackSummaryNotifier } from '../../../src/adapters/slack/digest.js';
import { DailySummaryJob } from '../../../src/app/daily-summary.js';
import { checkMessageLimits } from '../../../src/render/slack/limits.js';
import { MemoryResultStore } from '../../../src/adapters/storage/memory.js';
import { demoLots } from '../../helpers/lots.js';
import { FakeSlack, FAKE_BOT_USER } from './support/fake-slack.js';
import { FIXED_NOW, startTestApp, TEST_BOT_TOKEN, TEST_SIGNING_SECRET, type TestApp } from './support/harness.js';
import { eventCallbackBody, FORM, JSON_TYPE, sendToSlackEndpoint, slashCommandBody } from './support/signed.js';

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

async function start() {
  app = await startTestApp({ fake, env: { RECORD_USERS: 'U0PRIYA', CLEAR_USERS: 'U0PRIYA' } });
  return { a: app, lots: app.app.lots! };
}

let triggers = 0;
async function slash(a: TestApp, text: string, userId = 'U0PRIYA'): Promise<Record<string, unknown>> {
  const trigger = `lots-trig-${++triggers}`;
  const body = slashCommandBody({ text, userId, triggerId: trigger, responseUrl: fake.responseUrl(trigger) });
  const res = await sendToSlackEndpoint(a.eventsUrl, body, { secret: TEST_SIGNING_SECRET, contentType: FORM });
  const raw = await res.text();
  return raw ? (JSON.parse(raw) as Record<string, unknown>) : {};
}

describe('lot commands in Slack', () => {
  it('a listed user records from the slash command: a private card that says pass, within Block Kit limits', async () => {
    const { a, lots } = await start();
    const before = await lots.repo.countReadings();
    const body = await slash(a, 'record LOT-A21 w4 rho 9.8 ohm-cm');
    expect(body.response_type).toBe('ephemeral');
    expect(String(body.text)).toContain('LOT-A21 w4 · pass');
    expect(checkMessageLimits({ text: String(body.text), blocks: body.blocks as never })).toEqual([]);
    expect(await lots.repo.countReadings()).toBe(before + 1);
  });

  it('someone not listed gets the polite refusal and nothing is written', async () => {
    const { a, lots } = await start();
    const before = await lots.repo.countReadings();
    const body = await slash(a, 'record LOT-A21 w4 rho 9.8 ohm-cm', 'U0VISITOR');
    expect(JSON.stringify(body)).toContain('not on the list of people who may record readings');
    expect(await lots.repo.countReadings()).toBe(before);
  });

  it('lot, flags and digest cards stay within Block Kit limits', async () => {
    const { a } = await start();
    for (const text of ['lot LOT-A17', 'flags', 'flags 7d', 'digest']) {
      const body = await slash(a, text, 'U0VISITOR');
      expect(body.response_type, text).toBe('ephemeral');
      expect(checkMessageLimits({ text: String(body.text), blocks: body.blocks as never }), text).toEqual([]);
    }
  });

  it('a mention delivered three times (Slack retries) records one reading', async () => {
    const { a, lots } = await start();
    const before = await lots.repo.countReadings();
    const event = {
      type: 'app_mention',
      user: 'U0PRIYA',
      text: `<@${FAKE_BOT_USER}> record LOT-A21 w7 rho 10.1 ohm-cm`,
      ts: '1930000200.000300',
      channel: 'C0ETCHBAY',
      event_ts: '1930000200.000300',
    };
    const posts = fake.callsTo('chat.postMessage').length;
    for (const retry of [undefined, '1', '2']) {
      const res = await sendToSlackEndpoint(a.eventsUrl, eventCallbackBody(event, 'Ev0LOTS3X'), {
        secret: TEST_SIGNING_SECRET,
        contentType: JSON_TYPE,
        headers: retry ? { 'x-slack-retry-num': retry, 'x-slack-retry-reason': 'http_timeout' } : {},
      });
      await res.text();
    }
    await fake.until(() => fake.callsTo('chat.postMessage').length > posts);
    await new Promise((r) => setTimeout(r, 150));
    expect(await lots.repo.countReadings()).toBe(before + 1);
    expect(fake.callsTo('chat.postMessage').length).toBe(posts + 1);
  });
});

describe('the daily summary in Slack', () => {
  it('two schedulers firing together post one summary card to DIGEST_CHANNEL', async () => {
    const lots = demoLots(() => new Date('2026-11-30T07:00:00Z'));
    const client = new webApi.WebClient(TEST_BOT_TOKEN, { slackApiUrl: fake.apiUrl });
    const results = new MemoryResultStore();
    const make = (id: string) =>
      new DailySummaryJob({
        service: lots.service,
        repo: lots.repo,
        results,
        at: '07:00',
        timeZone: 'Europe/London',
        now: () => new Date('2026-11-30T07:00:00Z'),
        newId: () => `r-d1ge${id.length}`,
        demo: true,
        instanceId: id,
        notifiers: [slackSummaryNotifier(client, 'C0DIGEST1')],
      });
    const before = fake.callsTo('chat.postMessage').filter((c) => c.params['channel'] === 'C0DIGEST1').length;
    const runs = (await Promise.all([make('one').runDue(), make('two').runDue()])).flat();
    expect(runs.map((r) => r.status).sort()).toEqual(['posted', 'taken']);
    const posts = fake.callsTo('chat.postMessage').filter((c) => c.params['channel'] === 'C0DIGEST1');
    expect(posts.length - before).toBe(1);
    const post = posts[posts.length - 1]!;
    expect(String(post.params['text'])).toContain('Daily summary 2026-11-30');
    const blocks = typeof post.params['blocks'] === 'string' ? JSON.parse(post.params['blocks'] as string) : post.params['blocks'];
    expect(checkMessageLimits({ text: String(post.params['text']), blocks })).toEqual([]);
  });
});
