/**
 * The daily summary: exactly once per channel per local date (claim row before posting), also
 * with two schedulers on one database; a missed summary posted late once at the next start;
 * failures retried; windows over daylight-saving change days. Fixed clocks, temporary files.
 */
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { Digest } from '../../src/lots/digest.js';
import { DailySummaryJob, DigestScheduler, type Publish } from '../../src/app/daily-summary.js';
import { MemoryResultStore } from '../../src/adapters/storage/memory.js';
import { CONSOLE, makeHarness, rho, tempDir, type Harness } from './harness.js';

const CHANNEL = 'C0DIGEST1';

function schedulerFor(h: Harness, publish: Publish, instanceId = 'test-1', extra: Partial<ConstructorParameters<typeof DigestScheduler>[0]> = {}) {
  return new DigestScheduler({
    service: h.service,
    repo: h.repo,
    channel: CHANNEL,
    at: '07:00',
    timeZone: 'Europe/London',
    now: () => h.clock.now,
    instanceId,
    publish,
    ...extra,
  });
}

function collector() {
  const posted: Digest[] = [];
  const publish: Publish = async (d) => {
    posted.push(d);
  };
  return { posted, publish };
}

async function flagLot(h: Harness, lotId: string, at: string, value = 13) {
  h.clock.set(at);
  const r = await h.service.record({ lotId, wafer: 1, productId: 'HX-200P', primary: rho(value) }, { actor: CONSOLE });
  if (!r.ok) throw new Error(JSON.stringify(r.error));
}

let tmp: ReturnType<typeof tempDir>;
beforeEach(() => {
  tmp = tempDir();
});
afterEach(() => {
  tmp.remove();
});

describe('exactly once per channel per local date', () => {
  it('fires once at the slot; a second run the same date is refused by the claim row; the next day posts again', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { posted, publish } = collector();
    const s = schedulerFor(h, publish);
    await flagLot(h, 'LOT-A17', '2025-06-09T15:00:00Z');
    h.clock.set('2025-06-10T06:00:00Z'); // 07:00 BST
    expect((await s.runDue()).status).toBe('posted');
    expect((await s.runDue()).status).toBe('taken');
    expect(posted).toHaveLength(1);
    expect(posted[0]?.late).toBe(false);
    expect(posted[0]?.groups[0]?.lots.map((l) => l.lotId)).toEqual(['LOT-A17']);
    expect((await h.repo.getDigestRun(CHANNEL, '2025-06-10'))?.status).toBe('posted');

    // Next day: the window starts where the last one ended; LOT-A17's flag is now an older open one.
    await flagLot(h, 'LOT-A18', '2025-06-10T12:00:00Z');
    h.clock.set('2025-06-11T06:00:00Z');
    expect((await s.runDue()).status).toBe('posted');
    const second = posted[1]!;
    expect(second.windowStart).toBe('2025-06-10T06:00:00.000Z');
    const entries = second.groups.flatMap((g) => g.lots.flatMap((l) => l.flags.map((f) => [l.lotId, f.isNew])));
    expect(entries).toEqual([
      ['LOT-A18', true],
      ['LOT-A17', false],
    ]);
    await h.close();
  });

  it('two schedulers on one database file, firing together in-process → one summary', async () => {
    const path = join(tmp.dir, 'lots.db');
    const a = makeHarness({ path, channel: CHANNEL, start: '2025-06-10T06:00:00Z' });
    const b = makeHarness({ path, channel: CHANNEL, start: '2025-06-10T06:00:00Z' });
    const { posted, publish } = collector();
    const results = await Promise.all([schedulerFor(a, publish, 'a').runDue(), schedulerFor(b, publish, 'b').runDue()]);
    expect(results.map((r) => r.status).sort()).toEqual(['posted', 'taken']);
    expect(posted).toHaveLength(1);
    await a.close();
    await b.close();
  });

  it('two scheduler processes on one database file, firing in the same instant → one summary', async () => {
    const path = join(tmp.dir, 'race.db');
    // Create the schema first, so both children only race for the claim.
    (await makeHarness({ path }).close());
    const child = fileURLToPath(new URL('./children/digest-race.ts', import.meta.url));
    const startAt = Date.now() + 2500;
    const run = (id: string) =>
      new Promise<{ status: string; posts: number }>((resolve, reject) => {
        const p = spawn(process.execPath, ['--import', 'tsx', child, path, '2025-06-10T06:00:20Z', String(startAt), id], {
          stdio: ['ignore', 'pipe', 'pipe'],
        });
        let out = '';
        let err = '';
        p.stdout.on('data', (d: Buffer) => (out += d.toString()));
        p.stderr.on('data', (d: Buffer) => (err += d.toString()));
        p.on('exit', (code) => {
          const last = out.trim().split('\n').pop() ?? '';
          if (code !== 0) reject(new Error(`child ${id} exited ${code}: ${err}`));
          else resolve(JSON.parse(last) as { status: string; posts: number });
        });
      });
    const results = await Promise.all([run('proc-a'), run('proc-b')]);
    expect(results.map((r) => r.status).sort()).toEqual(['posted', 'taken']);
    expect(results.reduce((s, r) => s + r.posts, 0)).toBe(1);
  });
});

describe('a summary missed while the bot was down', () => {
  it('is posted once at the next start, marked late, covering since the last posted summary', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { posted, publish } = collector();
    // Posted normally on the 9th.
    h.clock.set('2025-06-09T06:00:00Z');
    expect((await schedulerFor(h, publish).runDue()).status).toBe('posted');
    // Down from the evening of the 9th to 09:30 on the 10th; a flag was raised meanwhile (by another tool's import, say).
    await flagLot(h, 'LOT-B204', '2025-06-09T20:00:00Z');
    h.clock.set('2025-06-10T08:30:00Z'); // 09:30 BST, the 07:00 summary was missed
    const s = schedulerFor(h, publish);
    const caught = await s.catchUp();
    expect(caught?.status).toBe('posted');
    const late = posted[1]!;
    expect(late.late).toBe(true);
    expect(late.dueAt).toBe('2025-06-10T06:00:00.000Z');
    expect(late.windowStart).toBe('2025-06-09T06:00:00.000Z');
    expect(late.groups[0]?.lots[0]?.lotId).toBe('LOT-B204');
    // Starting again the same day posts nothing more.
    expect(await schedulerFor(h, publish).catchUp()).toBeUndefined();
    expect(posted).toHaveLength(2);
    await h.close();
  });

  it('the very first start on a channel has missed nothing: no late summary', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { posted, publish } = collector();
    h.clock.set('2025-06-10T08:30:00Z');
    expect(await schedulerFor(h, publish).catchUp()).toBeUndefined();
    expect(posted).toHaveLength(0);
    await h.close();
  });

  it('a claim abandoned by a crashed instance is taken over after the lease, not before', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { posted, publish } = collector();
    await h.repo.claimDigest({ channel: CHANNEL, localDate: '2025-06-10', slotAt: '2025-06-10T06:00:00.000Z', now: '2025-06-10T06:00:01.000Z', instanceId: 'crashed', late: false, leaseMs: 15 * 60_000 });
    h.clock.set('2025-06-10T06:10:00Z');
    expect((await schedulerFor(h, publish).catchUp())?.status).toBe('taken');
    h.clock.set('2025-06-10T06:20:00Z');
    expect((await schedulerFor(h, publish).catchUp())?.status).toBe('posted');
    expect(posted).toHaveLength(1);
    expect((await h.repo.getDigestRun(CHANNEL, '2025-06-10'))?.attempts).toBe(2);
    await h.close();
  });

  it('a failed post is marked failed and posted by the next attempt, once', async () => {
    const h = makeHarness({ channel: CHANNEL });
    let calls = 0;
    const errors: string[] = [];
    const publish: Publish = async () => {
      calls += 1;
      if (calls === 1) throw new Error('chat API unavailable');
    };
    h.clock.set('2025-06-10T06:00:00Z');
    const s = schedulerFor(h, publish, 'x', { onError: (e) => errors.push(String(e)) });
    const first = await s.runDue();
    expect(first).toMatchObject({ status: 'failed', error: 'chat API unavailable' });
    expect(errors).toHaveLength(1);
    expect((await h.repo.getDigestRun(CHANNEL, '2025-06-10'))?.status).toBe('failed');
    h.clock.set('2025-06-10T06:05:00Z');
    expect((await s.runDue()).status).toBe('posted');
    expect((await s.runDue()).status).toBe('taken');
    expect(calls).toBe(2);
    await h.close();
  });
});

describe('windows on daylight-saving change days', () => {
  it('spring forward: the 07:00 summary on 2025-03-30 covers the 23 hours since 07:00 the day before', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { posted, publish } = collector();
    await flagLot(h, 'LOT-A17', '2025-03-29T06:30:00Z'); // 06:30 GMT on the 29th: before the window
    await flagLot(h, 'LOT-A18', '2025-03-29T07:30:00Z'); // inside
    await flagLot(h, 'LOT-A19', '2025-03-30T05:59:00Z'); // 06:59 BST on the 30th: inside
    h.clock.set('2025-03-30T06:00:00Z'); // 07:00 BST
    const r = await schedulerFor(h, publish).runDue();
    expect(r).toMatchObject({ status: 'posted', localDate: '2025-03-30' });
    const d = posted[0]!;
    expect(d.windowStart).toBe('2025-03-29T07:00:00.000Z');
    expect(Date.parse(d.windowEnd) - Date.parse(d.windowStart)).toBe(23 * 3600_000);
    const isNew = Object.fromEntries(d.groups.flatMap((g) => g.lots.map((l) => [l.lotId, l.flags[0]?.isNew])));
    expect(isNew).toEqual({ 'LOT-A17': false, 'LOT-A18': true, 'LOT-A19': true });
    await h.close();
  });

  it('fall back: the 07:00 summary on 2025-10-26 covers 25 hours and is claimed under the local date', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { posted, publish } = collector();
    h.clock.set('2025-10-26T07:00:00Z'); // 07:00 GMT
    const r = await schedulerFor(h, publish).runDue();
    expect(r).toMatchObject({ status: 'posted', localDate: '2025-10-26' });
    expect(Date.parse(posted[0]!.windowEnd) - Date.parse(posted[0]!.windowStart)).toBe(25 * 3600_000);
    await h.close();
  });

  it('a clean day gives an empty summary (the reply says "no flagged lots")', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { posted, publish } = collector();
    h.clock.set('2025-06-10T06:00:00Z');
    await schedulerFor(h, publish).runDue();
    expect(posted[0]?.groups).toEqual([]);
    expect(posted[0]?.totals.flags).toBe(0);
    await h.close();
  });
});

describe('croner drives the job', () => {
  it('start() schedules the next local 07:00 and stop() cancels it', async () => {
    const h = makeHarness({ channel: CHANNEL });
    const { publish } = collector();
    h.clock.set('2025-06-10T06:00:00Z');
    void publish;
    const s = new DailySummaryJob({
      service: h.service,
      repo: h.repo,
      results: new MemoryResultStore(),
      at: '07:00',
      timeZone: 'Europe/London',
      now: () => h.clock.now,
      newId: () => 'r-000001',
      demo: false,
      instanceId: 'test-1',
      notifiers: [{ surface: 'test', destination: CHANNEL, notify: async () => undefined }],
    });
    await s.start();
    const next = s.nextRun();
    expect(next).toBeDefined();
    // Whatever the wall clock, the next run is at 07:00 London time.
    expect(new Intl.DateTimeFormat('en-GB', { timeZone: 'Europe/London', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(next!)).toBe('07:00');
    s.stop();
    expect(s.nextRun()).toBeUndefined();
    await h.close();
  });
});
