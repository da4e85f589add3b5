import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { openSqliteBackend } from '../../../src/adapters/storage/sqlite/backend.js';
import { openDatabase } from '../../../src/adapters/storage/sqlite/db.js';
import { eventLedgerMigrations } from '../../../src/adapters/storage/sqlite/event-ledger.js';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});
const now = () => new Date('2031-03-04T05:06:07Z');

describe('the SQLite backend', () => {
  it('on a file: the chat state has its own connection with synchronous=NORMAL, lot records keep FULL', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-chat-'));
    dirs.push(dir);
    const backend = openSqliteBackend(join(dir, 'shiftprobe.db'), { now });
    // PRAGMA synchronous: 1 = NORMAL, 2 = FULL (SQLite documentation, "PRAGMA synchronous").
    expect(backend.chatDb.pragma('synchronous', { simple: true })).toBe(1);
    expect(backend.db.pragma('synchronous', { simple: true })).toBe(2);
    expect(backend.chatDb).not.toBe(backend.db);
    expect(await backend.healthy()).toBe(true);
    await backend.close();
    expect(await backend.healthy()).toBe(false);
  });

  it('in memory: shares the one connection (a second would be another, empty database)', async () => {
    const backend = openSqliteBackend(':memory:', { now });
    expect(backend.chatDb).toBe(backend.db);
    expect(await backend.ledger.claim('k')).toBe(true);
    expect(backend.db.prepare('SELECT count(*) FROM chat_events').pluck().get()).toBe(1);
    await backend.close();
  });

  it('the ledger table rebuild (events-002) keeps the keys already recorded', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-chat-'));
    dirs.push(dir);
    const path = join(dir, 'old.db');
    const old = openDatabase(path, eventLedgerMigrations.slice(0, 1));
    const t = now().getTime() - 60_000; // recent: older keys are pruned after a day
    old.prepare(`INSERT INTO chat_events (event_key, state, claimed_ms, done_ms) VALUES ('slack:message:T:C:1', 'done', ?, ?)`).run(t, t + 5);
    old.close();
    const backend = openSqliteBackend(path, { now });
    expect(await backend.ledger.claim('slack:message:T:C:1')).toBe(false);
    expect(await backend.ledger.claim('slack:message:T:C:2')).toBe(true);
    await backend.close();
  });
});
