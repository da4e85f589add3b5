import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { openDatabase } from '../../../src/adapters/storage/sqlite/db.js';
import { ResultIdTakenError } from '../../../src/commands/context.js';
import { SqliteResultStore, resultStoreMigrations } from '../../../src/adapters/storage/sqlite/results.js';
import type { ReplyOk } from '../../../src/reply/reply.js';
import type { ResultStore } from '../../../src/commands/context.js';
import { freshPostgresBackend } from '../../support/postgres.js';

function reply(id: string, title = 'Resistivity → boron density'): ReplyOk {
  return {
    ok: true,
    id,
    command: 'rho',
    title,
    createdAt: '2031-03-04T05:06:07.000Z',
    values: [{ key: 'dopantDensityPerCm3', value: 1.6e15, unit: 'cm⁻³', label: 'Boron density', headline: true }],
    inputs: { resistivity: { value: 8.2, unit: 'Ω·cm', label: 'resistivity', asTyped: '8.2 ohm-cm' } },
    assumptions: ['23 °C'],
    warnings: [],
    cautions: ['Confirm against your controlled procedure.'],
    decision: true,
  };
}

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});
function tempDbPath(): string {
  const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-results-'));
  dirs.push(dir);
  return join(dir, 'nested', 'shiftprobe.db');
}

describe('SqliteResultStore', () => {
  it('gives back exactly what was saved, after the database is closed and reopened', async () => {
    const path = tempDbPath();
    const first = openDatabase(path, resultStoreMigrations);
    await new SqliteResultStore(first).save(reply('r-00a1b2'));
    first.close();

    const second = openDatabase(path, resultStoreMigrations);
    const store = new SqliteResultStore(second);
    expect(await store.get('r-00a1b2')).toEqual(reply('r-00a1b2'));
    expect(await store.get('r-ffffff')).toBeUndefined();
    second.close();
  });

});

const stores: [string, () => Promise<ResultStore>][] = [
  ['sqlite', async () => new SqliteResultStore(openDatabase(':memory:', resultStoreMigrations))],
  ['postgres', async () => (await freshPostgresBackend()).results],
];

describe.each(stores)('%s result store', (_name, make) => {
  it('saving the same reply twice is harmless (a retried event)', async () => {
    const store = await make();
    await store.save(reply('r-000001'));
    await expect(store.save(reply('r-000001'))).resolves.toBeUndefined();
  });

  it('refuses a different reply under an id already taken, keeping the first', async () => {
    const store = await make();
    await store.save(reply('r-000002'));
    await expect(store.save(reply('r-000002', 'Something else'))).rejects.toBeInstanceOf(ResultIdTakenError);
    expect((await store.get('r-000002'))?.title).toBe('Resistivity → boron density');
  });
});
