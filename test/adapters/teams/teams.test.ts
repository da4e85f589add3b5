/**
 * The Teams-style surface, fully offline: a fake connector and key endpoint on loopback
 * (fake-connector.ts), the real surface on loopback. Every kind of bad token is refused with
 * 401 before anything is done; messages and mentions are answered once per activity id as
 * Adaptive Cards; the card's buttons; the daily summary; every help example's card within the
 * limits we keep. Invented fab and people (Harrowgate Fab 3).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Secret } from '../../../src/adapters/secret.js';
import { openSqliteBackend } from '../../../src/adapters/storage/sqlite/backend.js';
import { teamsSurface, textFromTeams } from '../../../src/adapters/teams/index.js';
import type { TeamsConfig } from '../../../src/adapters/teams/config.js';
import { Application } from '../../../src/app/application.js';
import type { Surface } from '../../../src/app/surface.js';
import { handle } from '../../../src/commands/handle.js';
import { COMMANDS } from '../../../src/commands/registry.js';
import { checkCardLimits, renderTeamsCard } from '../../../src/render/teams-card.js';
import { FIXED_NOW, testContext } from '../../helpers/context.js';
import { demoLotsConfig } from '../../helpers/lots.js';
import { FakeConnector } from './fake-connector.js';

const APP_ID = '8f2b6c1e-0a4d-4b7e-9c3f-5d6e7f8a9b0c';
const PRIYA = { id: '29:1priya', name: 'Priya Okonkwo-Hale', aadObjectId: '4a1c7e2b-1111-4c3d-9e8f-0a1b2c3d4e5f' };
const CHANNEL = '19:etchbay-shift-a@thread.tacv2';

let fake: FakeConnector;
let app: Application;
let surface: Surface;
let url: string;
const errors: unknown[] = [];

beforeAll(async () => {
  fake = new FakeConnector();
  await fake.start();
  let n = 0;
  app = await Application.open(openSqliteBackend(':memory:', { now: () => FIXED_NOW }), {
    lots: { ...demoLotsConfig(), permissions: { recordUsers: new Set([`teams:${PRIYA.aadObjectId}`]), recordChannels: new Set(), clearUsers: new Set(), clearChannels: new Set() } },
    now: () => FIXED_NOW,
    newId: () => `r-${(0x700 + ++n).toString(16).padStart(6, '0')}`,
  });
  const config: TeamsConfig = {
    appId: APP_ID,
    appPassword: new Secret('client-secret-for-tests-only'),
    port: 0,
    digestConversation: CHANNEL,
    serviceUrl: fake.serviceUrl,
    openIdUrl: fake.openIdUrl,
    tokenUrl: fake.tokenUrl,
  };
  surface = teamsSurface(app, { config, host: '127.0.0.1', log: { error: (...a: unknown[]) => errors.push(a), warn: () => undefined } });
  const up = await surface.start();
  url = `http://127.0.0.1:${up.port}/api/messages`;
});

afterAll(async () => {
  await surface?.stop();
  await app?.close();
  await fake?.stop();
});

let seq = 0;
function activity(text: string, extra: Record<string, unknown> = {}): Record<string, unknown> {
  seq += 1;
  return {
    type: 'message',
    id: `1930000${seq}`,
    text,
    serviceUrl: fake.serviceUrl,
    from: PRIYA,
    recipient: { id: `28:${APP_ID}`, name: 'shiftprobe' },
    conversation: { id: `a:1personal-${PRIYA.id}`, conversationType: 'personal' },
    ...extra,
  };
}

async function send(body: Record<string, unknown>, token?: string): Promise<number> {
  const res = await fetch(url, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...(token !== undefined ? { authorization: `Bearer ${token}` } : {}) },
    body: JSON.stringify(body),
  });
  await res.text();
  return res.status;
}

const cardOf = (i: number) => ((fake.sent[i]!.body['attachments'] as { content: { body: { text?: string }[]; actions?: { title: string; data: Record<string, string> }[] } }[])[0]!.content);

describe('every bad token is refused before anything is done', () => {
  for (const wrong of ['expired', 'audience', 'key', 'issuer', 'serviceUrl'] as const) {
    it(`${wrong}: 401, nothing sent, nothing recorded`, async () => {
      const before = fake.sent.length;
      const readings = await app.lots!.repo.countReadings();
      expect(await send(activity('record LOT-A21 w2 rho 9.9 ohm-cm'), await fake.token(APP_ID, wrong))).toBe(401);
      expect(fake.sent.length).toBe(before);
      expect(await app.lots!.repo.countReadings()).toBe(readings);
    });
  }
  it('missing: 401', async () => {
    expect(await send(activity('ni 300K'))).toBe(401);
    expect(await send(activity('ni 300K'), 'not-a-jwt')).toBe(401);
  });
});

describe('answers', () => {
  it('a personal message is answered with an Adaptive Card in the conversation, sent with our app token', async () => {
    const before = fake.sent.length;
    const a = activity('rho 8.2 ohm-cm p');
    expect(await send(a, await fake.token(APP_ID))).toBe(200);
    expect(fake.sent.length).toBe(before + 1);
    const s = fake.sent[before]!;
    expect(s.conversationId).toBe(`a:1personal-${PRIYA.id}`);
    expect(s.replyToId).toBe(a['id']);
    expect(s.authorization).toBe('Bearer outbound-token-for-tests');
    expect(fake.tokenRequests.at(-1)?.get('client_id')).toBe(APP_ID);
    const card = cardOf(before);
    expect(JSON.stringify(card)).toContain('Boron density');
    expect(JSON.stringify(card)).toMatch(/controlled procedure/);
    expect(card.actions?.map((x) => x.title)).toEqual(['Show derivation']);
  });

  it('the same activity delivered three times is answered once and records once', async () => {
    const before = fake.sent.length;
    const readings = await app.lots!.repo.countReadings();
    const a = activity('record LOT-A21 w6 rho 9.4 ohm-cm');
    const token = await fake.token(APP_ID);
    for (let i = 0; i < 3; i++) expect(await send(a, token)).toBe(200);
    expect(fake.sent.length).toBe(before + 1);
    expect(await app.lots!.repo.countReadings()).toBe(readings + 1);
    const lot = await app.lots!.repo.getLot('LOT-A21');
    expect(lot!.readings.at(-1)!.actor).toMatchObject({ userId: `teams:${PRIYA.aadObjectId}`, userName: 'Priya Okonkwo-Hale', surface: 'teams' });
  });

  it('a mention in a channel is answered in the reply chain, with the mention removed; Show derivation and Post to channel work', async () => {
    const before = fake.sent.length;
    const mention = activity('<at>shiftprobe</at> ni&nbsp;85C', { conversation: { id: `${CHANNEL};messageid=1930000555`, conversationType: 'channel' } });
    expect(await send(mention, await fake.token(APP_ID))).toBe(200);
    const card = cardOf(before);
    expect(JSON.stringify(card)).toContain('Intrinsic');
    expect(card.actions?.map((x) => x.title)).toEqual(['Show derivation', 'Post to channel']);
    const resultId = card.actions![0]!.data['resultId']!;
    // Show derivation: the button's data comes back as a message activity.
    const why = activity('', { value: card.actions![0]!.data, conversation: { id: `${CHANNEL};messageid=1930000555`, conversationType: 'channel' } });
    expect(await send(why, await fake.token(APP_ID))).toBe(200);
    expect(JSON.stringify(cardOf(before + 1))).toContain(`How ${resultId} was worked out`);
    // Post to channel: a new thread at the channel, once, however often it is pressed.
    for (let i = 0; i < 2; i++) {
      const share = activity('', { value: card.actions![1]!.data, conversation: { id: `${CHANNEL};messageid=1930000555`, conversationType: 'channel' } });
      expect(await send(share, await fake.token(APP_ID))).toBe(200);
    }
    const shared = fake.sent.slice(before + 2);
    expect(shared).toHaveLength(1);
    expect(shared[0]!.conversationId).toBe(CHANNEL);
    expect(shared[0]!.replyToId).toBeUndefined();
    expect(JSON.stringify(shared[0]!.body)).toContain('shared by Priya Okonkwo-Hale');
  });

  it('a lone P is asked about with choices; choosing runs that reading', async () => {
    const before = fake.sent.length;
    expect(await send(activity('rho 8 ohm-cm P'), await fake.token(APP_ID))).toBe(200);
    const question = cardOf(before);
    expect(question.actions!.length).toBeGreaterThanOrEqual(2);
    const choice = question.actions!.find((x) => /boron|p-type/i.test(x.title))!;
    expect(await send(activity('', { value: choice.data }), await fake.token(APP_ID))).toBe(200);
    expect(JSON.stringify(cardOf(before + 1))).toContain('Boron density');
  });

  it('when the connector cannot take the answer: 502, and the redelivery is answered', async () => {
    const before = fake.sent.length;
    const a = activity('ni 300K');
    fake.failSends = 1;
    expect(await send(a, await fake.token(APP_ID))).toBe(502);
    expect(await send(a, await fake.token(APP_ID))).toBe(200);
    expect(fake.sent.length).toBe(before + 1);
  });

  it('the daily summary goes to the configured conversation through the notifier', async () => {
    const notifier = surface.summaryNotifier()!;
    expect(notifier.destination).toBe(`teams:${CHANNEL}`);
    const job = app.dailySummary([notifier])!;
    const runs = await job.runDue();
    job.stop();
    expect(runs[0]!.status).toBe('posted');
    const last = fake.sent.at(-1)!;
    expect(last.conversationId).toBe(CHANNEL);
    expect(JSON.stringify(last.body)).toMatch(/Daily summary/);
  });
});

describe('every help example through Teams', () => {
  it('each is answered with a card in the conversation (ok, or an error card with the right form)', async () => {
    const examples = COMMANDS.flatMap((c) => c.help.examples);
    const token = await fake.token(APP_ID);
    for (const text of examples) {
      const before = fake.sent.length;
      expect(await send(activity(text), token), text).toBe(200);
      expect(fake.sent.length, text).toBe(before + 1);
      const card = cardOf(before) as unknown as { type: string; version: string; body: unknown[] };
      expect(card.type).toBe('AdaptiveCard');
      expect(card.body.length, text).toBeGreaterThan(0);
    }
  }, 60_000);
});

describe('cards', () => {
  it('every help example renders within the limits we keep (size, actions)', async () => {
    const ctx = testContext();
    for (const text of COMMANDS.flatMap((c) => c.help.examples)) {
      const reply = await handle(text, ctx);
      const card = renderTeamsCard(reply, { actions: ['why', 'share'], helpHint: '@shiftprobe help' });
      expect(checkCardLimits(card), text).toEqual([]);
    }
  });

  it('a reply with a picture says where the picture is (a PNG does not fit a Teams message); one without says nothing', async () => {
    const trend = await handle('trend LOT-A17', testContext());
    const card = JSON.stringify(renderTeamsCard(trend));
    expect(card).toMatch(/trend chart picture is not sent to Teams/);
    expect(checkCardLimits(renderTeamsCard(trend))).toEqual([]);
    expect(JSON.stringify(renderTeamsCard(await handle('rho 8.2 ohm-cm p', testContext())))).not.toMatch(/picture/);
  });

  it('Teams message text is read as typed: mentions and HTML removed', () => {
    expect(textFromTeams('<at>shiftprobe</at>&nbsp;rho 8.2 ohm&#39;s… <b>p</b>')).toBe("rho 8.2 ohm's… p");
  });
});
