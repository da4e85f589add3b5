/**
 * Slack: a measurement file attached to a mention or a DM goes to `map`, and the wafer-map
 * picture is uploaded (files.uploadV2) into the same thread as the card.
 */
import { readFileSync } from 'node:fs';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { FAKE_BOT_USER, FakeSlack } from './support/fake-slack.js';
import { startTestApp, TEST_BOT_TOKEN, TEST_SIGNING_SECRET, type TestApp } from './support/harness.js';
import { eventCallbackBody, JSON_TYPE, sendToSlackEndpoint } from './support/signed.js';

const DEMO = readFileSync('examples/maps/LOT-A17-w03-rs.csv', 'utf8');
let fake: FakeSlack;
const apps: TestApp[] = [];
beforeAll(async () => {
  fake = new FakeSlack();
  await fake.start();
});
afterAll(() => fake.stop());
afterEach(async () => {
  for (const a of apps.splice(0)) await a.stop();
  fake.calls.length = 0;
  fake.uploads.length = 0;
  fake.downloads.length = 0;
});

async function start(env: Record<string, string> = {}): Promise<TestApp> {
  const a = await startTestApp({ fake, env });
  apps.push(a);
  return a;
}

async function deliver(a: TestApp, event: Record<string, unknown>, eventId: string): Promise<number> {
  const res = await sendToSlackEndpoint(a.eventsUrl, eventCallbackBody(event, eventId), { secret: TEST_SIGNING_SECRET, contentType: JSON_TYPE });
  await res.text();
  return res.status;
}

type Posted = { channel?: string; thread_ts?: string; text?: string; blocks?: unknown[] };

describe('a measurement file on Slack', () => {
  it('with a mention: the map card in the thread, its picture uploaded there too', async () => {
    const a = await start();
    const file = fake.shareFile('LOT-A17-w03-rs.csv', DEMO);
    const event = { type: 'app_mention', user: 'U0TOMASZ', text: `<@${FAKE_BOT_USER}> map thick 525um p`, ts: '1930000500.000100', channel: 'C0ETCHBAY', event_ts: '1930000500.000100', files: [file] };
    expect(await deliver(a, event, 'EvF1')).toBe(200);
    await fake.until(() => fake.callsTo('files.completeUploadExternal').length === 1);
    const card = fake.callsTo('chat.postMessage')[0]!.params as Posted;
    expect(card.thread_ts).toBe('1930000500.000100');
    expect(card.text).toMatch(/Wafer map W03/);
    expect(fake.downloads[0]!.authorization).toBe(`Bearer ${TEST_BOT_TOKEN}`);
    const done = fake.callsTo('files.completeUploadExternal')[0]!.params as { channel_id?: string; thread_ts?: string };
    expect(done.channel_id).toBe('C0ETCHBAY');
    expect(done.thread_ts).toBe('1930000500.000100');
    // The upload is a multipart body holding the PNG (its 8-byte signature).
    expect(fake.uploads[0]!.bytes.includes(Buffer.from('89504e470d0a1a0a', 'hex'))).toBe(true);
  });

  it('in a DM (a file share with the command as its text): card and picture in the DM', async () => {
    const a = await start();
    const file = fake.shareFile('w05.csv', readFileSync('examples/maps/LOT-A17-w05-vi.csv', 'utf8'));
    const event = { type: 'message', subtype: 'file_share', channel_type: 'im', user: 'U0PRIYA', text: 'map thick 525um n show density', ts: '1930000600.000100', channel: 'D0PRIYA', event_ts: '1930000600.000100', files: [file] };
    expect(await deliver(a, event, 'EvF2')).toBe(200);
    await fake.until(() => fake.callsTo('files.completeUploadExternal').length === 1);
    expect((fake.callsTo('chat.postMessage')[0]!.params as Posted).text).toMatch(/dopant density/);
    expect((fake.callsTo('files.completeUploadExternal')[0]!.params as { channel_id?: string }).channel_id).toBe('D0PRIYA');
  });

  it('record … map with the file: one reading with every site stored, the card and the map picture in the thread', async () => {
    const a = await start({ RECORD_USERS: 'U0PRIYA' });
    const lots = a.app.lots!;
    const before = await lots.repo.countReadings();
    const file = fake.shareFile('LOT-A17-w06-rs.csv', readFileSync('examples/maps/LOT-A17-w06-rs.csv', 'utf8'));
    const event = { type: 'app_mention', user: 'U0PRIYA', text: `<@${FAKE_BOT_USER}> record LOT-A17 w6 map thick 725um`, ts: '1930000550.000100', channel: 'C0ETCHBAY', event_ts: '1930000550.000100', files: [file] };
    expect(await deliver(a, event, 'EvF1M')).toBe(200);
    await fake.until(() => fake.callsTo('files.completeUploadExternal').length === 1);
    const card = fake.callsTo('chat.postMessage')[0]!.params as Posted;
    expect(card.thread_ts).toBe('1930000550.000100');
    expect(card.text).toMatch(/LOT-A17 w6 · FLAGGED: non-uniform map/);
    expect(await lots.repo.countReadings()).toBe(before + 1);
    const view = await lots.service.lot('LOT-A17');
    if (!view.ok) throw new Error('lot');
    const reading = view.value.readings.find((r) => r.evaluation.map !== undefined)!;
    expect((await lots.repo.mapSites(reading.id)).length).toBe(49);
  });

  it('a bad file gets the line and the problem, and nothing is uploaded', async () => {
    const a = await start();
    const file = fake.shareFile('bad.csv', 'x,y,rs\n0,0,40\n1,1\n');
    const event = { type: 'app_mention', user: 'U0TOMASZ', text: `<@${FAKE_BOT_USER}> map`, ts: '1930000700.000100', channel: 'C0ETCHBAY', event_ts: '1930000700.000100', files: [file] };
    await deliver(a, event, 'EvF3');
    await fake.until(() => fake.callsTo('chat.postEphemeral').length === 1);
    expect(JSON.stringify(fake.callsTo('chat.postEphemeral')[0]!.params)).toMatch(/line 3: this row has a different number of fields/);
    expect(fake.callsTo('files.getUploadURLExternal')).toHaveLength(0);
  });

  it('a file Slack will not give (no files:read) is explained, not parsed', async () => {
    const a = await start();
    const file = { ...fake.shareFile('w.csv', DEMO), url_private_download: 'http://127.0.0.1:1/unreachable' };
    const event = { type: 'app_mention', user: 'U0TOMASZ', text: `<@${FAKE_BOT_USER}> map`, ts: '1930000800.000100', channel: 'C0ETCHBAY', event_ts: '1930000800.000100', files: [file] };
    await deliver(a, event, 'EvF4');
    await fake.until(() => fake.callsTo('chat.postEphemeral').length === 1);
    expect(JSON.stringify(fake.callsTo('chat.postEphemeral')[0]!.params)).toMatch(/could not fetch w\.csv/);
  });

  it('a failed upload leaves the card and tells the person about files:write', async () => {
    const a = await start();
    fake.answer('files.getUploadURLExternal', () => ({ ok: false, error: 'missing_scope', needed: 'files:write' }));
    const file = fake.shareFile('w03.csv', DEMO);
    const event = { type: 'app_mention', user: 'U0TOMASZ', text: `<@${FAKE_BOT_USER}> map`, ts: '1930000900.000100', channel: 'C0ETCHBAY', event_ts: '1930000900.000100', files: [file] };
    await deliver(a, event, 'EvF5');
    await fake.until(() => fake.callsTo('chat.postEphemeral').length === 1);
    expect(fake.callsTo('chat.postMessage')).toHaveLength(1);
    expect(JSON.stringify(fake.callsTo('chat.postEphemeral')[0]!.params)).toMatch(/files:write/);
    fake.answer('files.getUploadURLExternal', () => undefined as never);
  });
});
