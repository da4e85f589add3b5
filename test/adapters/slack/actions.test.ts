import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { COMMANDS } from '../../../src/commands/registry.js';
import { SLACK_ACTION_IDS } from '../../../src/render/slack-blocks.js';
import { checkMessageLimits } from '../../../src/render/slack/limits.js';
import { THREAD_PICKER_CALLBACK } from '../../../src/adapters/slack/views/thread-picker.js';
import { FakeSlack } from './support/fake-slack.js';
import { startTestApp, TEST_SIGNING_SECRET, type TestApp, type TestAppOptions } from './support/harness.js';
import { FORM, interactionBody, sendToSlackEndpoint, slashCommandBody } from './support/signed.js';

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
  fake.responsePosts.length = 0;
  fake.answer('chat.postMessage', () => undefined as never);
  fake.answer('conversations.history', () => undefined as never);
});

async function start(options: Partial<TestAppOptions> = {}): Promise<TestApp> {
  const a = await startTestApp({ fake, ...options });
  apps.push(a);
  return a;
}

let n = 0;
const CHANNEL = 'C0ETCHBAY';

/** Runs a slash command and returns the private card's result id. */
async function cardFor(a: TestApp, text: string): Promise<string> {
  const trigger = `cmd-${++n}`;
  const res = await sendToSlackEndpoint(a.eventsUrl, slashCommandBody({ text, triggerId: trigger, responseUrl: fake.responseUrl(trigger) }), {
    secret: TEST_SIGNING_SECRET,
    contentType: FORM,
  });
  const body = (await res.json()) as { blocks: { type: string; elements?: { value?: string }[] }[] };
  const id = body.blocks.find((b) => b.type === 'actions')?.elements?.[0]?.value;
  if (!id) throw new Error('no buttons on the card');
  return id;
}

async function interact(a: TestApp, payload: Record<string, unknown>): Promise<{ status: number; body: string }> {
  const res = await sendToSlackEndpoint(a.eventsUrl, interactionBody(payload), { secret: TEST_SIGNING_SECRET, contentType: FORM });
  return { status: res.status, body: await res.text() };
}

/** A button press on the private card in #etch-bay, as Slack sends it (block_actions). */
async function press(a: TestApp, actionId: string, value: string, user = 'U0PRIYA', channel = CHANNEL): Promise<string> {
  const trigger = `act-${++n}`;
  const { status } = await interact(a, {
    type: 'block_actions',
    user: { id: user, username: 'priya.okonkwo-hale', team_id: 'T0HGF3' },
    api_app_id: 'A0SHIFTPROBE',
    token: 'deprecated-verification-token',
    container: { type: 'message', message_ts: '1930000300.000100', channel_id: channel, is_ephemeral: true },
    trigger_id: trigger,
    team: { id: 'T0HGF3', domain: 'harrowgate-fab3' },
    channel: { id: channel, name: 'etch-bay' },
    response_url: fake.responseUrl(trigger),
    actions: [{ action_id: actionId, block_id: 'shiftprobe_card_actions', value, type: 'button', action_ts: '1930000301.000200' }],
  });
  expect(status).toBe(200);
  return trigger;
}

/** Submitting the thread dialog (view_submission). */
async function submitPicker(a: TestApp, privateMetadata: string, values: { pick?: string; link?: string }): Promise<string> {
  const { body } = await interact(a, {
    type: 'view_submission',
    team: { id: 'T0HGF3', domain: 'harrowgate-fab3' },
    user: { id: 'U0PRIYA', username: 'priya.okonkwo-hale', team_id: 'T0HGF3' },
    api_app_id: 'A0SHIFTPROBE',
    token: 'deprecated-verification-token',
    trigger_id: `view-${++n}`,
    view: {
      id: 'V0PICKER',
      team_id: 'T0HGF3',
      type: 'modal',
      callback_id: THREAD_PICKER_CALLBACK,
      private_metadata: privateMetadata,
      hash: '1930000400.abcdef',
      state: {
        values: {
          ...(values.pick !== undefined ? { thread: { pick: { type: 'static_select', selected_option: { value: values.pick } } } } : {}),
          link: { url: { type: 'plain_text_input', value: values.link ?? null } },
        },
      },
    },
    response_urls: [],
  });
  return body;
}

type Posted = { channel?: string; thread_ts?: string; text?: string; blocks?: unknown[] };

describe('Post in channel', () => {
  it('posts the result into the card’s channel, says who shared it, and updates the private card', async () => {
    const a = await start();
    const id = await cardFor(a, 'rho 8.2 ohm-cm p');
    const trigger = await press(a, SLACK_ACTION_IDS.shareChannel, id);
    await fake.until(() => fake.postsTo(trigger).length === 1);
    const posts = fake.callsTo('chat.postMessage');
    expect(posts).toHaveLength(1);
    const posted = posts[0]!.params as Posted;
    expect(posted.channel).toBe(CHANNEL);
    expect(posted.thread_ts).toBeUndefined();
    const text = JSON.stringify(posted.blocks);
    expect(text).toContain('shared by <@U0PRIYA>');
    expect(text).toContain(`\`${id}\``);
    expect(text).toContain(SLACK_ACTION_IDS.why);
    expect(text).not.toContain(SLACK_ACTION_IDS.shareChannel);
    expect(checkMessageLimits({ text: String(posted.text), blocks: posted.blocks as never })).toEqual([]);
    const update = fake.postsTo(trigger)[0]!.body;
    expect(update.replace_original).toBe(true);
    expect(JSON.stringify(update.blocks)).toContain('Posted in the channel.');
  });

  it('pressing it again posts nothing more', async () => {
    const a = await start();
    const id = await cardFor(a, 'doping 2e15 boron');
    const first = await press(a, SLACK_ACTION_IDS.shareChannel, id);
    await fake.until(() => fake.postsTo(first).length === 1);
    await press(a, SLACK_ACTION_IDS.shareChannel, id);
    await new Promise((r) => setTimeout(r, 100));
    expect(fake.callsTo('chat.postMessage')).toHaveLength(1);
  });

  it('when the bot is not in the channel: a friendly private note, and a later press still works', async () => {
    const a = await start();
    const id = await cardFor(a, 'ni 85C');
    fake.answer('chat.postMessage', () => ({ ok: false, error: 'not_in_channel' }));
    const first = await press(a, SLACK_ACTION_IDS.shareChannel, id);
    await fake.until(() => fake.postsTo(first).length === 1);
    const note = fake.postsTo(first)[0]!.body;
    expect(note.response_type).toBe('ephemeral');
    expect(note.replace_original).toBe(false);
    expect(JSON.stringify(note.blocks)).toContain('/invite @shiftprobe');
    fake.answer('chat.postMessage', () => undefined as never);
    const second = await press(a, SLACK_ACTION_IDS.shareChannel, id);
    await fake.until(() => fake.postsTo(second).length === 1);
    expect(JSON.stringify(fake.postsTo(second)[0]!.body.blocks)).toContain('Posted in the channel.');
  });

  it('a button for a result that is not kept says so instead of posting', async () => {
    const a = await start();
    const trigger = await press(a, SLACK_ACTION_IDS.shareChannel, 'r-abcdef');
    await fake.until(() => fake.postsTo(trigger).length === 1);
    expect(JSON.stringify(fake.postsTo(trigger)[0]!.body)).toContain('no longer have that result');
    expect(fake.callsTo('chat.postMessage')).toEqual([]);
  });
});

describe('Post in a thread…', () => {
  async function openPicker(a: TestApp, id: string): Promise<{ view: Record<string, unknown>; metadata: string }> {
    await press(a, SLACK_ACTION_IDS.shareThread, id);
    await fake.until(() => fake.callsTo('views.open').length === 1);
    const call = fake.callsTo('views.open')[0]!;
    expect(String(call.params.trigger_id)).toMatch(/^act-/);
    const view = call.params.view as Record<string, unknown>;
    return { view, metadata: String(view.private_metadata) };
  }

  it('without channel history access: the dialog asks for a message link; the result goes into that thread', async () => {
    const a = await start();
    const id = await cardFor(a, 'rho 8.2 ohm-cm p');
    const { view, metadata } = await openPicker(a, id);
    expect(fake.callsTo('conversations.history')).toHaveLength(1); // tried, refused: missing_scope
    expect(JSON.stringify(view.blocks)).not.toContain('static_select');
    expect(JSON.stringify(view.blocks)).toContain('plain_text_input');
    // The metadata holds ids and the response URL, never the result itself.
    expect(metadata).not.toContain('cm⁻³');
    const reply = await submitPicker(a, metadata, { link: 'https://harrowgate-fab3.slack.com/archives/C0LITHO/p1930000500123456' });
    expect(reply).toBe('');
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    const posted = fake.callsTo('chat.postMessage')[0]!.params as Posted;
    expect(posted.channel).toBe('C0LITHO');
    expect(posted.thread_ts).toBe('1930000500.123456');
    expect(JSON.stringify(posted.blocks)).toContain('shared by <@U0PRIYA>');
  });

  it('a link to a reply inside a thread posts into that thread’s parent', async () => {
    const a = await start();
    const id = await cardFor(a, 'ni 85C');
    const { metadata } = await openPicker(a, id);
    await submitPicker(a, metadata, {
      link: 'https://harrowgate-fab3.slack.com/archives/C0LITHO/p1930000600654321?thread_ts=1930000590.000100&cid=C0LITHO',
    });
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    expect((fake.callsTo('chat.postMessage')[0]!.params as Posted).thread_ts).toBe('1930000590.000100');
  });

  it('something that is not a message link is refused in the dialog, nothing posted', async () => {
    const a = await start();
    const id = await cardFor(a, 'ni 85C');
    const { metadata } = await openPicker(a, id);
    const reply = JSON.parse(await submitPicker(a, metadata, { link: 'LOT-A17 thread please' })) as { response_action: string; errors: Record<string, string> };
    expect(reply.response_action).toBe('errors');
    expect(reply.errors.link).toContain('Copy link');
    const empty = JSON.parse(await submitPicker(a, metadata, {})) as { response_action: string };
    expect(empty.response_action).toBe('errors');
    expect(fake.callsTo('chat.postMessage')).toEqual([]);
  });

  it('with channel history: recent threads are offered, and picking one posts there', async () => {
    fake.answer('conversations.history', () => ({
      ok: true,
      messages: [
        { type: 'message', user: 'U0TOMASZ', text: 'LOT-B204 wafer 7 reads high, anyone?', ts: '1930000700.000100', reply_count: 4, thread_ts: '1930000700.000100' },
        { type: 'message', user: 'U0PRIYA', text: 'shift handover notes', ts: '1930000650.000100' },
      ],
      has_more: false,
    }));
    const a = await start();
    const id = await cardFor(a, 'rho 8.2 ohm-cm p');
    const { view, metadata } = await openPicker(a, id);
    const text = JSON.stringify(view.blocks);
    expect(text).toContain('LOT-B204 wafer 7 reads high');
    expect(text).not.toContain('shift handover notes'); // not a thread
    await submitPicker(a, metadata, { pick: `${CHANNEL}:1930000700.000100` });
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    const posted = fake.callsTo('chat.postMessage')[0]!.params as Posted;
    expect(posted.channel).toBe(CHANNEL);
    expect(posted.thread_ts).toBe('1930000700.000100');
  });

  it('threads where shiftprobe answered are remembered and offered even without history access', async () => {
    const a = await start();
    const id = await cardFor(a, 'rho 8.2 ohm-cm p');
    const first = await openPicker(a, id);
    await submitPicker(a, first.metadata, { link: 'https://harrowgate-fab3.slack.com/archives/C0ETCHBAY/p1930000800000100' });
    await fake.until(() => fake.callsTo('chat.postMessage').length === 1);
    fake.calls.length = 0;
    const next = await cardFor(a, 'ni 85C');
    const { view } = await openPicker(a, next);
    expect(JSON.stringify(view.blocks)).toContain('static_select');
    expect(JSON.stringify(view.blocks)).toContain(`${CHANNEL}:1930000800.000100`);
  });
});

describe('Show derivation', () => {
  it('shows the full derivation privately, without posting anything', async () => {
    const a = await start();
    const id = await cardFor(a, 'rho 8.2 ohm-cm p');
    const trigger = await press(a, SLACK_ACTION_IDS.why, id);
    await fake.until(() => fake.postsTo(trigger).length === 1);
    const shown = fake.postsTo(trigger)[0]!.body;
    expect(shown.response_type).toBe('ephemeral');
    expect(shown.replace_original).toBe(false);
    expect(JSON.stringify(shown.blocks)).toContain(id);
    expect(JSON.stringify(shown.blocks)).toContain('Inputs as understood');
    expect(checkMessageLimits({ text: String(shown.text), blocks: shown.blocks as never })).toEqual([]);
    expect(fake.callsTo('chat.postMessage')).toEqual([]);
  });

  it('still works, and so does sharing, after the result store is closed and reopened', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-restart-'));
    dirs.push(dir);
    const databasePath = join(dir, 'shiftprobe.db');
    const before = await start({ databasePath, firstId: 0x100 });
    const id = await cardFor(before, 'doping 3.1x10^16 cm^-3 phos');
    await before.stop();
    apps.splice(apps.indexOf(before), 1);

    const after = await start({ databasePath, firstId: 0x900 });
    const trigger = await press(after, SLACK_ACTION_IDS.why, id);
    await fake.until(() => fake.postsTo(trigger).length === 1);
    const shown = JSON.stringify(fake.postsTo(trigger)[0]!.body.blocks);
    expect(shown).toContain(`How ${id} was worked out`);
    expect(shown).toContain('Inputs as understood');
    const share = await press(after, SLACK_ACTION_IDS.shareChannel, id);
    await fake.until(() => fake.postsTo(share).length === 1);
    expect(fake.callsTo('chat.postMessage')).toHaveLength(1);
    expect(JSON.stringify(fake.callsTo('chat.postMessage')[0]!.params.blocks)).toContain(`\`${id}\``);
  });
});

describe('buttons for the whole vocabulary', () => {
  it('every help example whose card has buttons: Show derivation answers privately and Post in channel posts it', async () => {
    const a = await start();
    let cards = 0;
    for (const example of COMMANDS.flatMap((c) => c.help.examples)) {
      const trigger = `all-${++n}`;
      const res = await sendToSlackEndpoint(a.eventsUrl, slashCommandBody({ text: example, triggerId: trigger, responseUrl: fake.responseUrl(trigger) }), {
        secret: TEST_SIGNING_SECRET,
        contentType: FORM,
      });
      const body = (await res.json()) as { blocks: { type: string; elements?: { action_id?: string; value?: string }[] }[] };
      const buttons = body.blocks.find((b) => b.type === 'actions')?.elements ?? [];
      if (buttons.length === 0) continue;
      cards += 1;
      const id = buttons[0]!.value!;
      if (buttons.some((b) => b.action_id === SLACK_ACTION_IDS.why)) {
        const why = await press(a, SLACK_ACTION_IDS.why, id);
        await fake.until(() => fake.postsTo(why).length === 1);
        const shown = fake.postsTo(why)[0]!.body;
        expect(shown.response_type, example).toBe('ephemeral');
        expect(checkMessageLimits({ text: String(shown.text), blocks: shown.blocks as never }), example).toEqual([]);
      }
      const before = fake.callsTo('chat.postMessage').length;
      const share = await press(a, SLACK_ACTION_IDS.shareChannel, id);
      await fake.until(() => fake.postsTo(share).length === 1);
      expect(fake.callsTo('chat.postMessage'), example).toHaveLength(before + 1);
      const posted = fake.callsTo('chat.postMessage').at(-1)!.params as Posted;
      expect(JSON.stringify(posted.blocks), example).toContain(`\`${id}\``);
    }
    expect(cards).toBeGreaterThan(10);
  });
});
