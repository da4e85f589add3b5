import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { checkMessageLimits } from '../../../src/render/slack/limits.js';
import { SLACK_ACTION_IDS } from '../../../src/render/slack-blocks.js';
import { FakeSlack } from './support/fake-slack.js';
import { startTestApp, TEST_SIGNING_SECRET, type TestApp } from './support/harness.js';
import { FORM, sendToSlackEndpoint, slashCommandBody } from './support/signed.js';

let fake: FakeSlack;
let app: TestApp;
beforeAll(async () => {
  fake = new FakeSlack();
  await fake.start();
});
afterAll(() => fake.stop());
beforeEach(async () => {
  app = await startTestApp({ fake });
});
afterEach(() => app.stop());

async function slash(text: string, trigger = 'trig-1'): Promise<{ status: number; body: Record<string, unknown> }> {
  const body = slashCommandBody({ text, triggerId: trigger, responseUrl: fake.responseUrl(trigger) });
  const res = await sendToSlackEndpoint(app.eventsUrl, body, { secret: TEST_SIGNING_SECRET, contentType: FORM });
  const raw = await res.text();
  return { status: res.status, body: raw ? (JSON.parse(raw) as Record<string, unknown>) : {} };
}

describe('slash command', () => {
  it('answers privately with the result card in the acknowledgement itself', async () => {
    const { status, body } = await slash('rho 8.2 ohm-cm p');
    expect(status).toBe(200);
    expect(body.response_type).toBe('ephemeral');
    const blocks = body.blocks as { type: string; elements?: { action_id?: string; value?: string }[] }[];
    expect(checkMessageLimits({ text: String(body.text), blocks: blocks as never })).toEqual([]);
    expect(JSON.stringify(blocks)).toContain('×10¹⁵ cm⁻³');
    const buttons = blocks.find((b) => b.type === 'actions')?.elements ?? [];
    expect(buttons.map((b) => b.action_id)).toEqual([SLACK_ACTION_IDS.shareChannel, SLACK_ACTION_IDS.shareThread, SLACK_ACTION_IDS.why]);
    // Button values carry the result id only, and the result is kept.
    const id = buttons[0]!.value!;
    expect(id).toMatch(/^r-[0-9a-f]{6}$/);
    expect(buttons.every((b) => b.value === id)).toBe(true);
    expect((await app.services.results.get(id))?.command).toBe('rho');
    // Nothing was posted publicly.
    expect(fake.callsTo('chat.postMessage')).toEqual([]);
  });
});
