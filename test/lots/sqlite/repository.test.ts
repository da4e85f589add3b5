/** The SQLite store: migrations at start-up (again is a no-op), data kept across reopening, append-only tables, claim rows. */
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { SqliteLotRepository } from '../../../src/adapters/storage/sqlite/lots-repository.js';
import { CONSOLE, makeHarness, rho, tempDir } from '../harness.js';

const tmp = tempDir();
afterAll(() => tmp.remove());

describe('SQLite lot store', () => {
  it('creates its schema on first start, keeps data across a reopen, and re-running migrations changes nothing', async () => {
    const path = join(tmp.dir, 'nested', 'lots.db');
    const h = makeHarness({ path });
    await h.service.record({ lotId: 'LOT-A17', wafer: 1, productId: 'HX-200P', primary: rho(9.6) }, { actor: CONSOLE, eventId: 'E1' });
    await h.close();
    const again = SqliteLotRepository.open(path);
    const migrations = again.database.prepare("SELECT id FROM schema_migrations WHERE id LIKE 'lots-%'").all();
    expect(migrations).toEqual([{ id: 'lots-001-create' }, { id: 'lots-002-map-sites' }]);
    expect(await again.countReadings()).toBe(1);
    expect(again.database.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(again.database.pragma('synchronous', { simple: true })).toBe(2); // FULL
    await again.close();
  });

  it('every history table refuses UPDATE and DELETE', async () => {
    const h = makeHarness();
    await h.service.record({ lotId: 'LOT-A17', wafer: 1, productId: 'HX-200P', primary: rho(19) }, { actor: CONSOLE, eventId: 'E1' });
    await h.service.clear({ lotId: 'LOT-A17', selector: { kind: 'all' }, reason: 'scrapped by engineering' }, { actor: CONSOLE, eventId: 'E2' });
    for (const table of ['lots', 'lot_products', 'lot_readings', 'lot_flags', 'lot_flag_clearances', 'lot_events']) {
      expect(() => h.repo.database.prepare(`DELETE FROM ${table}`).run(), table).toThrow(/append-only/);
      const col = table === 'lots' ? 'first_seen_at' : table === 'lot_events' ? 'at' : table === 'lot_flag_clearances' ? 'reason' : table === 'lot_products' ? 'set_by' : 'lot_id';
      expect(() => h.repo.database.prepare(`UPDATE ${table} SET ${col} = ${col}`).run(), table).toThrow(/append-only/);
    }
    await h.close();
  });

  it('a claim row is taken once; a failed one may be claimed again', async () => {
    const h = makeHarness();
    const claim = { channel: 'C0DIGEST1', localDate: '2026-11-30', slotAt: '2026-11-30T07:00:00.000Z', now: '2026-11-30T07:00:00.000Z', instanceId: 'a', late: false, leaseMs: 900_000 };
    expect(await h.repo.claimDigest(claim)).toBe(true);
    expect(await h.repo.claimDigest({ ...claim, instanceId: 'b' })).toBe(false);
    await h.repo.failDigest('C0DIGEST1', '2026-11-30', 'timeout');
    expect(await h.repo.claimDigest({ ...claim, instanceId: 'b' })).toBe(true);
    await h.repo.completeDigest('C0DIGEST1', '2026-11-30', { postedAt: claim.now, windowStart: '2026-11-29T07:00:00.000Z', windowEnd: claim.now });
    expect(await h.repo.claimDigest({ ...claim, instanceId: 'c', now: '2026-12-01T07:00:00.000Z' })).toBe(false);
    expect((await h.repo.lastPostedDigest('C0DIGEST1'))?.claimedBy).toBe('b');
    await h.close();
  });
});
