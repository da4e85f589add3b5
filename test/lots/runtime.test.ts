/**
 * Start-up of the lot records: the spec file is loaded once (a bad one stops start-up with its
 * line), the demo history goes into an empty store only, and the real entry point (bin/
 * shiftprobe.mjs, the console and the one-shot CLI) records, shows and summarises lots on a
 * temporary database.
 */
import { spawn } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { cli, CLI_BASE_ENV } from '../support/cli.js';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_SPEC_FILE } from '../../src/lots/config.js';
import { lotIdRule } from '../../src/lots/ids.js';
import { NO_CHAT_WRITERS } from '../../src/lots/permissions.js';
import { startLots } from '../../src/lots/runtime.js';
import { openSqliteBackend } from '../../src/adapters/storage/sqlite/backend.js';
import { tempDir } from './harness.js';

const tmp = tempDir();
afterAll(() => tmp.remove());
const NOW = new Date('2026-11-30T14:05:00Z');

const config = (specFile = DEMO_SPEC_FILE, demoSpecs = true) => ({
  specFile,
  demoSpecs,
  digest: { at: '07:00', timeZone: 'Europe/London' },
  permissions: NO_CHAT_WRITERS,
  lotIds: lotIdRule(),
});

describe('startLots', () => {
  it('a bad spec file stops start-up with the line and field', async () => {
    const bad = join(tmp.dir, 'bad-specs.yaml');
    writeFileSync(bad, 'products:\n  HX-200P:\n    type: p\n    dopant: boron\n    resistivityOhmCm: { min: 12, max: 8 }\n');
    const r = await startLots(openSqliteBackend(':memory:').lots, config(bad, false));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain('bad-specs.yaml line 5, column 39 products.HX-200P.resistivityOhmCm.max: min must be below max');
  });

  it('loads the demo history into an empty store once, and never into a store that has lots', async () => {
    const path = join(tmp.dir, 'demo.db');
    const first = await startLots(openSqliteBackend(path).lots, config(), { now: () => NOW });
    expect(first.ok && first.lots.demoEntriesWritten).toBeGreaterThan(20);
    if (!first.ok) return;
    const readings = await first.lots.repo.countReadings();
    await first.lots.repo.close();
    const again = await startLots(openSqliteBackend(path).lots, config(), { now: () => NOW });
    expect(again.ok && again.lots.demoEntriesWritten).toBe(0);
    if (again.ok) {
      expect(await again.lots.repo.countReadings()).toBe(readings);
      await again.lots.repo.close();
    }
    // Not with the fab's own specs.
    const own = join(tmp.dir, 'own-specs.yaml');
    writeFileSync(own, 'products:\n  HX-200P:\n    type: p\n    dopant: boron\n    resistivityOhmCm: { min: 8, max: 12 }\n');
    const real = await startLots(openSqliteBackend(join(tmp.dir, 'real.db')).lots, config(own, false), { now: () => NOW });
    expect(real.ok && (await real.lots.repo.countReadings())).toBe(0);
  });
});


describe('the entry point', () => {
  it('one-shot: record on a demo lot (LOT-A21, clean), then lot shows it; --json carries the verdict', async () => {
    const env = { DATABASE_PATH: join(tmp.dir, 'cli.db') };
    const rec = await cli(env, '--json', 'record LOT-A21 w2 rho 9.9 ohm-cm');
    expect(rec.code, rec.stderr).toBe(0);
    const j = JSON.parse(rec.stdout);
    expect(j).toMatchObject({ ok: true, command: 'record' });
    expect(j.values.verdict.value).toBe('pass');
    expect(j.cautions.some((c: string) => /controlled procedure/.test(c))).toBe(true);
    const lot = await cli(env, 'lot LOT-A21');
    expect(lot.code).toBe(0);
    expect(lot.stdout).toContain('rho 9.9 ohm-cm');
    const bad = await cli(env, 'record LOT-A21 w2 rho -9.9 ohm-cm');
    expect(bad.code).toBe(2);
  }, 60_000);

  it('a bad SPEC_FILE stops start-up with exit status 78 and the line', async () => {
    const bad = join(tmp.dir, 'broken.yaml');
    writeFileSync(bad, 'products:\n  HX-200P:\n    type: q\n');
    const r = await cli({ DATABASE_PATH: join(tmp.dir, 'x.db'), SPEC_FILE: bad }, 'lot LOT-A17');
    expect(r.code).toBe(78);
    expect(r.stderr).toContain('broken.yaml line 3');
    expect(r.stderr).not.toMatch(/\n\s+at /);
  }, 60_000);

  it('the console: a new user records for a demo lot, sees the flags and the summary', async () => {
    const out = await new Promise<string>((resolve, reject) => {
      const p = spawn(process.execPath, ['bin/shiftprobe.mjs'], { env: { ...CLI_BASE_ENV, DIGEST_TZ: 'Europe/London', DATABASE_PATH: join(tmp.dir, 'console.db') } });
      let stdout = '';
      p.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
      p.on('error', reject);
      p.on('exit', () => resolve(stdout));
      p.stdin.end('record LOT-B204 w6 rho 9.2 ohm-cm\nflags\ndigest\nexit\n');
    });
    expect(out).toContain('LOT-B204 w6 · pass');
    expect(out).toMatch(/Open flags: \d+ on \d+ lots/);
    expect(out).toContain('Summary preview');
    expect(out).toContain('bye');
  }, 60_000);
});

describe('backup', () => {
  it('--backup copies the database while it is in use; the copy opens and holds the readings', async () => {
    const db = join(tmp.dir, 'live.db');
    expect((await cli({ DATABASE_PATH: db }, 'record LOT-A21 w5 rho 9.8 ohm-cm')).code).toBe(0);
    const copy = join(tmp.dir, 'backups', 'copy.db');
    const b = await cli({ DATABASE_PATH: db }, '--backup', copy);
    expect(b.code, b.stderr).toBe(0);
    expect(b.stdout).toMatch(/Backed up .* \(\d+ pages\)/);
    const lot = await cli({ DATABASE_PATH: copy }, 'lot LOT-A21');
    expect(lot.stdout).toContain('rho 9.8 ohm-cm');
    const again = await cli({ DATABASE_PATH: db }, '--backup', copy);
    expect(again.code).toBe(2);
    expect(again.stderr).toContain('exists already');
  }, 60_000);
});
