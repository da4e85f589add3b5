/**
 * The application's daily job: one summary built once per firing, kept as a result (so `why`
 * and the share buttons find it, on the console too), handed to every surface's notifier, and
 * claimed per destination. Fixed clock, in-memory SQLite, invented demo lots.
 */
import { describe, expect, it } from 'vitest';
import { openSqliteBackend } from '../../src/adapters/storage/sqlite/backend.js';
import { Application } from '../../src/app/application.js';
import type { SummaryNotifier } from '../../src/app/daily-summary.js';
import type { ReplyOk } from '../../src/reply/reply.js';
import { demoLotsConfig } from '../helpers/lots.js';

const NOW = new Date('2026-11-30T07:00:00Z'); // 07:00 in London: the slot

async function demoApp(): Promise<Application> {
  let n = 0;
  return Application.open(openSqliteBackend(':memory:', { now: () => NOW }), {
    lots: { ...demoLotsConfig(), digest: { at: '07:00', timeZone: 'Europe/London' } },
    now: () => NOW,
    newId: () => `r-${(++n).toString(16).padStart(6, '0')}`,
  });
}

function collecting(surface: string, destination: string): SummaryNotifier & { got: ReplyOk[] } {
  const got: ReplyOk[] = [];
  return { surface, destination, got, notify: async (reply) => void got.push(reply) };
}

describe('the daily summary job', () => {
  it('builds the summary once and hands the same kept reply to every surface', async () => {
    const app = await demoApp();
    let builds = 0;
    const service = app.lots!.service;
    const original = service.digest.bind(service);
    service.digest = async (...args) => {
      builds += 1;
      return original(...args);
    };
    const chat = collecting('slack', 'C0DIGEST1');
    const desk = collecting('console', 'console');
    const job = app.dailySummary([chat, desk])!;
    const runs = await job.runDue();
    expect(runs.map((r) => r.status)).toEqual(['posted', 'posted']);
    expect(builds).toBe(1);
    expect(chat.got[0]!.id).toBe(desk.got[0]!.id);
    expect(chat.got[0]!.title).toMatch(/Daily summary 2026-11-30/);
    // Kept: `why` on the summary works from the console as from any surface.
    expect((await app.results.get(desk.got[0]!.id))?.command).toBe('digest');
    const asked = await app.ask({ text: `why ${desk.got[0]!.id}`, surface: 'console', caller: { userId: 'priya', channelId: 'console' } });
    expect(!asked.duplicate && asked.reply.ok).toBe(true);
    await app.close();
  });

  it('a second run the same day is refused per destination by its claim row; a failing surface does not stop the others', async () => {
    const app = await demoApp();
    const chat = collecting('slack', 'C0DIGEST1');
    const broken: SummaryNotifier = { surface: 'teams', destination: 'teams:shift-a', notify: async () => Promise.reject(new Error('the Teams service said 503')) };
    const errors: string[] = [];
    const job = app.dailySummary([chat, broken], { onError: (_e, context) => errors.push(context) })!;
    const first = await job.runDue();
    expect(first.map((r) => r.status)).toEqual(['posted', 'failed']);
    expect(errors.some((c) => c.includes('teams teams:shift-a'))).toBe(true);
    const again = await job.runDue();
    expect(again[0]!.status).toBe('taken');
    expect(chat.got).toHaveLength(1);
    job.stop();
    await app.close();
  });

  it('no notifiers, or no lot records: no job', async () => {
    const app = await demoApp();
    expect(app.dailySummary([])).toBeUndefined();
    const bare = await Application.open(openSqliteBackend(':memory:'));
    expect(bare.dailySummary([collecting('slack', 'C1')])).toBeUndefined();
    await app.close();
    await bare.close();
  });
});

describe('ask', () => {
  it('a duplicate event key is answered once; a `why` answer is kept so its card can be shared', async () => {
    const app = await demoApp();
    const caller = { userId: 'U0PRIYA', channelId: 'C0ETCHBAY' };
    const first = await app.ask({ text: 'rho 8.2 ohm-cm p', surface: 'slack', caller, eventKey: 'slack:command:T1:trig-1', conversationKey: 'slack:T1:C0ETCHBAY:U0PRIYA' });
    expect(first.duplicate).toBe(false);
    expect((await app.ask({ text: 'rho 8.2 ohm-cm p', surface: 'slack', caller, eventKey: 'slack:command:T1:trig-1' })).duplicate).toBe(true);
    if (first.duplicate) return;
    await first.settle();
    // The conversation remembers the last result: a bare `why` on another instance finds it.
    const why = await app.ask({ text: 'why', surface: 'slack', caller, eventKey: 'slack:command:T1:trig-2', conversationKey: 'slack:T1:C0ETCHBAY:U0PRIYA' });
    expect(!why.duplicate && why.reply.ok && why.reply.command).toBe('why');
    if (!why.duplicate && why.reply.ok) expect(await app.results.get(why.reply.id)).toBeDefined();
    await app.close();
  });
});
