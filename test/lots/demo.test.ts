/**
 * The demo history (invented, fixtures/lots/harrowgate-fab3-history.yaml) loads through the same
 * plans as `record` and `clear`, gives the flags the fixture's comments describe, and loads once.
 */
import { describe, expect, it } from 'vitest';
import { corePhysics } from '../../src/lots/core-physics.js';
import { readDemoHistory, seedDemoHistory } from '../../src/lots/demo.js';
import { lotIdRule } from '../../src/lots/ids.js';
import { SqliteLotRepository } from '../../src/adapters/storage/sqlite/lots-repository.js';
import { demoCatalog } from './harness.js';

describe('demo history', () => {
  it('loads once, with the flags the scenario describes', async () => {
    const repo = SqliteLotRepository.open(':memory:');
    const deps = { repo, catalog: demoCatalog(), physics: corePhysics, lotIds: lotIdRule(), now: new Date('2026-11-30T14:05:00Z') };
    const history = readDemoHistory();
    const first = await seedDemoHistory(deps, history);
    expect(first).toEqual({ written: history.entries.length, skipped: 0 });
    expect(await seedDemoHistory(deps, history)).toEqual({ written: 0, skipped: history.entries.length });

    const open = await repo.listFlags({ openOnly: true });
    const byLot = (lot: string) => open.filter((f) => f.lotId === lot).map((f) => f.code).sort();
    expect(byLot('LOT-C31')).toEqual(['out_of_window']);
    expect(byLot('LOT-A18')).toEqual(['spread_over_limit']);
    expect(byLot('LOT-A17')).toEqual(['out_of_window', 'spread_over_limit']);
    expect(byLot('LOT-B204')).toEqual(['type_mismatch']);
    expect(byLot('LOT-D9')).toEqual(['no_spec']);
    // Corrected and cleared: nothing open, the history kept.
    expect(byLot('LOT-A21')).toEqual([]);
    expect(byLot('LOT-B205')).toEqual([]);
    const b205 = await repo.getLot('LOT-B205');
    expect(b205?.flags.map((f) => f.clearance?.kind).sort()).toEqual(['correction', 'person']);
    expect(byLot('LOT-F2')).toEqual([]);
    await repo.close();
  });
});
