import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { openChatState } from '../../src/store/chat-state.js';
import { openDatabase } from '../../src/store/db.js';
import { eventLedgerMigrations } from '../../src/store/event-ledger-sqlite.js';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});
const now = () => new Date('2031-03-04T05:06:07Z');

describe('chat state', () => {
  it('on a file: its own connection with synchronous=NORMAL, the main one keeps FULL', () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-chat-'));
    dirs.push(dir);
    const path = join(dir, 'shiftprobe.db');
    const main = openDatabase(path, []);
    const chat = openChatState(path, main, now);
    // PRAGMA synchronous: 1 = NORMAL, 2 = FULL (SQLite documentation, "PRAGMA synchronous").
    expect(chat.db.pragma('synchronous', { simple: true })).toBe(1);
    expect(main.pragma('synchronous', { simple: true })).toBe(2);
    expect(chat.db).not.toBe(main);
    expect(chat.healthy()).toBe(true);
    chat.close();
    expect(chat.healthy()).toBe(false);
    main.close();
  });

  it('in memory: shares the one connection (a second would be another, empty database)', async () => {
    const main = openDatabase(':memory:', []);
    const chat = openChatState(':memory:', main, now);
    expect(chat.db).toBe(main);
    expect(await chat.ledger.claim('k')).toBe(true);
    expect(main.prepare('SELECT count(*) FROM chat_events').pluck().get()).toBe(1);
    chat.close();
    expect(main.open).toBe(true);
  });

  it('the ledger table rebuild (events-002) keeps the keys already recorded', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-chat-'));
    dirs.push(dir);
    const path = join(dir, 'old.db');
    const old = openDatabase(path, eventLedgerMigrations.slice(0, 1));
    const t = now().getTime() - 60_000; // recent: older keys are pruned after a day
    old.prepare(`INSERT INTO chat_events (event_key, state, claimed_ms, done_ms) VALUES ('slack:message:T:C:1', 'done', ?, ?)`).run(t, t + 5);
    old.close();
    const main = openDatabase(path, []);
    const chat = openChatState(path, main, now);
    expect(await chat.ledger.claim('slack:message:T:C:1')).toBe(false);
    expect(await chat.ledger.claim('slack:message:T:C:2')).toBe(true);
    chat.close();
    main.close();
  });
});
