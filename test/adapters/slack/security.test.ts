/**
 * Request verification (Slack API docs, "Verifying requests from Slack"): the v0 signature over
 * 'v0:<timestamp>:<raw body>' with the signing secret, and a timestamp no more than five minutes
 * from now (replay protection). Anything else is refused with 401 and does nothing.
 */
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { handle } from '../../../src/commands/handle.js';
import type { Handler } from '../../../src/app/application.js';
import { FAKE_BOT_USER, FakeSlack } from './support/fake-slack.js';
import { startTestApp, TEST_SIGNING_SECRET, type TestApp } from './support/harness.js';
import { eventCallbackBody, FORM, JSON_TYPE, sendToSlackEndpoint, signature, slashCommandBody, type SendOptions } from './support/signed.js';

let fake: FakeSlack;
let app: TestApp;
const handled: string[] = [];
const counting: Handler = (text, ctx) => {
  handled.push(text);
  return handle(text, ctx);
};

beforeAll(async () => {
  fake = new FakeSlack();
  await fake.start();
});
afterAll(() => fake.stop());
beforeEach(async () => {
  handled.length = 0;
  app = await startTestApp({ fake, handle: counting });
  fake.calls.length = 0; // auth.test at start-up is not part of what a request does
  fake.responsePosts.length = 0;
});
afterEach(() => app.stop());

const slash = slashCommandBody({ text: 'rho 8.2 ohm-cm p', triggerId: 'sec-1', responseUrl: 'http://127.0.0.1:9/never' });
const mention = eventCallbackBody(
  { type: 'app_mention', user: 'U0TOMASZ', text: `<@${FAKE_BOT_USER}> ni 85C`, ts: '1930000100.000200', channel: 'C0ETCHBAY' },
  'EvSec',
);

const cases: [string, string, string, Partial<SendOptions>][] = [
  ['a bad signature (signed with another secret)', slash, FORM, { secret: 'aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa' }],
  ['no signature at all', slash, FORM, { unsigned: true }],
  ['a stale timestamp (6 minutes old, correctly signed)', slash, FORM, { timestamp: Math.floor(Date.now() / 1000) - 6 * 60 }],
  ['a body altered after signing', slash, FORM, { sendBody: slash.replace('rho+8.2', 'rho+9.9') }],
  ['an event with a bad signature', mention, JSON_TYPE, { secret: 'bbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbb' }],
  ['an event altered after signing', mention, JSON_TYPE, { sendBody: mention.replace('ni 85C', 'ni 95C') }],
];

describe('request verification', () => {
  it.each(cases)('%s → 401 and nothing done', async (_name, body, contentType, options) => {
    if (options.sendBody !== undefined) expect(options.sendBody).not.toBe(body);
    const res = await sendToSlackEndpoint(app.eventsUrl, body, { secret: TEST_SIGNING_SECRET, contentType, ...options });
    expect(res.status).toBe(401);
    await res.text();
    await new Promise((r) => setTimeout(r, 50));
    expect(handled).toEqual([]);
    expect(fake.calls).toEqual([]);
    expect(fake.responsePosts).toEqual([]);
  });

  it('a signature header with the right timestamp but a signature for another timestamp → 401', async () => {
    const ts = Math.floor(Date.now() / 1000);
    const res = await sendToSlackEndpoint(app.eventsUrl, slash, {
      contentType: FORM,
      unsigned: true,
      headers: { 'x-slack-request-timestamp': String(ts), 'x-slack-signature': signature(TEST_SIGNING_SECRET, ts - 1, slash) },
    });
    expect(res.status).toBe(401);
    expect(handled).toEqual([]);
  });

  it('the same request correctly signed is answered (the checks above can pass)', async () => {
    const res = await sendToSlackEndpoint(app.eventsUrl, slash, { secret: TEST_SIGNING_SECRET, contentType: FORM });
    expect(res.status).toBe(200);
    expect(((await res.json()) as { response_type: string }).response_type).toBe('ephemeral');
    expect(handled).toEqual(['rho 8.2 ohm-cm p']);
  });
});
