/**
 * Kill test: a child process recording 1 000 readings is killed with SIGKILL at a random moment.
 * After reopening, every reading whose reply was sent is present, none twice, and the database
 * passes PRAGMA integrity_check. Then the same 1 000 events are delivered again (as a chat
 * platform retries after an outage): exactly 1 000 readings, one per event.
 */
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { SqliteLotRepository } from '../../src/adapters/storage/sqlite/lots-repository.js';
import { tempDir } from './harness.js';

const CHILD = fileURLToPath(new URL('./children/record-loop.ts', import.meta.url));
const COUNT = 1000;
const tmp = tempDir();
afterAll(() => tmp.remove());

interface ChildRun {
  readonly sent: string[];
  readonly signal: NodeJS.Signals | null;
  readonly code: number | null;
  readonly stderr: string;
}

/** Run the child; if `killAfter` is given, SIGKILL it as soon as that many replies were sent. */
function runChild(dbPath: string, killAfter?: number): Promise<ChildRun> {
  return new Promise((resolve) => {
    const p = spawn(process.execPath, ['--import', 'tsx', CHILD, dbPath, String(COUNT)], { stdio: ['ignore', 'pipe', 'pipe'] });
    const sent: string[] = [];
    let buffer = '';
    let stderr = '';
    p.stdout.on('data', (d: Buffer) => {
      buffer += d.toString();
      let nl: number;
      while ((nl = buffer.indexOf('\n')) >= 0) {
        const line = buffer.slice(0, nl);
        buffer = buffer.slice(nl + 1);
        if (line.startsWith('sent ')) sent.push(line.split(' ')[1]!);
        if (killAfter !== undefined && sent.length === killAfter) p.kill('SIGKILL');
      }
    });
    p.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    p.on('exit', (code, signal) => resolve({ sent, signal, code, stderr }));
  });
}

function eventCounts(dbPath: string): Map<string, number> {
  const db = new Database(dbPath, { readonly: true });
  try {
    const rows = db.prepare('SELECT event_id, count(*) AS n FROM lot_readings GROUP BY event_id').all() as { event_id: string; n: number }[];
    return new Map(rows.map((r) => [r.event_id, r.n]));
  } finally {
    db.close();
  }
}

describe('kill test', () => {
  it('SIGKILL at a random moment loses no reading whose reply was sent, duplicates none, leaves the file sound', async () => {
    const dbPath = join(tmp.dir, 'kill.db');
    // A random moment: after between 50 and 950 replies (printed on failure).
    const killAfter = 50 + Math.floor(Math.random() * 900);
    const killed = await runChild(dbPath, killAfter);
    expect(killed.signal, `child should die by SIGKILL (killAfter=${killAfter}); stderr: ${killed.stderr}`).toBe('SIGKILL');
    expect(killed.sent.length).toBeGreaterThanOrEqual(killAfter);
    expect(killed.sent.length).toBeLessThan(COUNT);

    // Reopen through the normal path (migrations run again, the WAL is recovered).
    const repo = SqliteLotRepository.open(dbPath);
    const check = repo.database.pragma('integrity_check') as { integrity_check: string }[];
    expect(check).toEqual([{ integrity_check: 'ok' }]);
    await repo.close();

    const counts = eventCounts(dbPath);
    const missing = killed.sent.filter((id) => counts.get(id) !== 1);
    expect(missing, `killAfter=${killAfter}`).toEqual([]);
    for (const [id, n] of counts) {
      expect(n, `event ${id}`).toBe(1);
      expect(id).toMatch(/^kill-\d+$/);
    }
    // At most the one reading in flight when the kill came was committed without its reply.
    expect(counts.size - killed.sent.length).toBeLessThanOrEqual(1);

    // Redeliver every event: the ones already stored are recognised, the rest recorded.
    const again = await runChild(dbPath);
    expect(again.code, again.stderr).toBe(0);
    expect(again.sent).toHaveLength(COUNT);
    const after = eventCounts(dbPath);
    expect(after.size).toBe(COUNT);
    expect([...after.values()].every((n) => n === 1)).toBe(true);
    const db = new Database(dbPath, { readonly: true });
    expect(db.pragma('integrity_check')).toEqual([{ integrity_check: 'ok' }]);
    expect((db.prepare('SELECT count(*) AS n FROM lot_events').get() as { n: number }).n).toBe(COUNT);
    db.close();
  }, 120_000);
});
