import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { afterEach, describe, expect, it } from 'vitest';
import { openDatabase } from '../../../src/adapters/storage/sqlite/db.js';
import { MemoryEventLedger } from '../../../src/adapters/storage/memory.js';
import type { EventLedger } from '../../../src/app/ports.js';
import { freshPostgresBackend } from '../../support/postgres.js';
import { SqliteEventLedger, eventLedgerMigrations } from '../../../src/adapters/storage/sqlite/event-ledger.js';

const run = promisify(execFile);

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});
function tempDir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-ledger-'));
  dirs.push(dir);
  return dir;
}

/** A clock the test moves by hand. */
function manualClock(start = Date.parse('2031-03-04T05:00:00Z')) {
  let t = start;
  return { now: () => new Date(t), advance: (ms: number) => (t += ms) };
}

const kinds: [string, (now: () => Date) => Promise<EventLedger>][] = [
  ['memory', async (now) => new MemoryEventLedger({ now })],
  ['sqlite', async (now) => new SqliteEventLedger(openDatabase(':memory:', eventLedgerMigrations), { now })],
  ['postgres', async (now) => (await freshPostgresBackend({ now })).ledger],
];

describe.each(kinds)('%s event ledger', (_name, make) => {
  it('lets the first delivery through and stops the duplicates', async () => {
    const ledger = await make(manualClock().now);
    expect(await ledger.claim('slack:ev:Ev01')).toBe(true);
    expect(await ledger.claim('slack:ev:Ev01')).toBe(false);
    expect(await ledger.claim('slack:ev:Ev01')).toBe(false);
    expect(await ledger.claim('slack:ev:Ev02')).toBe(true);
  });

  it('lets a later delivery take over a claim whose holder never finished (lease 30 s)', async () => {
    const clock = manualClock();
    const ledger = await make(clock.now);
    expect(await ledger.claim('k')).toBe(true);
    clock.advance(29_000);
    expect(await ledger.claim('k')).toBe(false);
    clock.advance(2_000);
    expect(await ledger.claim('k')).toBe(true);
  });

  it('never hands out a completed event again', async () => {
    const clock = manualClock();
    const ledger = await make(clock.now);
    expect(await ledger.claim('k')).toBe(true);
    await ledger.complete('k');
    clock.advance(10 * 60_000);
    expect(await ledger.claim('k')).toBe(false);
  });
});

describe('SqliteEventLedger across processes', () => {
  it('remembers completed events after the database is reopened', async () => {
    const path = join(tempDir(), 'ledger.db');
    const clock = manualClock();
    const a = openDatabase(path, eventLedgerMigrations);
    const first = new SqliteEventLedger(a, { now: clock.now });
    expect(await first.claim('slack:msg:C1:1700000000.000100')).toBe(true);
    await first.complete('slack:msg:C1:1700000000.000100');
    a.close();
    const b = openDatabase(path, eventLedgerMigrations);
    expect(await new SqliteEventLedger(b, { now: clock.now }).claim('slack:msg:C1:1700000000.000100')).toBe(false);
    b.close();
  });

  it('three processes racing for the same 150 events: each event is won exactly once', async () => {
    const dir = tempDir();
    const path = join(dir, 'shared.db');
    openDatabase(path, eventLedgerMigrations).close();
    const ledgerModule = resolve('src/adapters/storage/sqlite/event-ledger.ts');
    const dbModule = resolve('src/adapters/storage/sqlite/db.ts');
    const script = join(dir, 'racer.mts');
    writeFileSync(
      script,
      `import { openDatabase } from ${JSON.stringify(dbModule)};
       import { SqliteEventLedger, eventLedgerMigrations } from ${JSON.stringify(ledgerModule)};
       const ledger = new SqliteEventLedger(openDatabase(process.argv[2], eventLedgerMigrations), { now: () => new Date() });
       const won = [];
       for (let i = 0; i < 150; i++) if (await ledger.claim('ev-' + i)) won.push(i);
       process.stdout.write(JSON.stringify(won));`,
    );
    const outputs = await Promise.all(
      [0, 1, 2].map(() => run(process.execPath, ['--import', 'tsx', script, path], { cwd: process.cwd() })),
    );
    const wins = outputs.flatMap((o) => JSON.parse(o.stdout) as number[]);
    expect(wins.length).toBe(150);
    expect(new Set(wins).size).toBe(150);
  });
});

describe.each(kinds)('%s event ledger release', (_name, make) => {
  it('a released claim can be taken again at once, a completed one cannot be released', async () => {
    const ledger = await make(manualClock().now);
    expect(await ledger.claim('share:r-000001:C1:-')).toBe(true);
    await ledger.release('share:r-000001:C1:-');
    expect(await ledger.claim('share:r-000001:C1:-')).toBe(true);
    await ledger.complete('share:r-000001:C1:-');
    await ledger.release('share:r-000001:C1:-');
    expect(await ledger.claim('share:r-000001:C1:-')).toBe(false);
  });
});
