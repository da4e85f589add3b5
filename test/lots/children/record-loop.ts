/**
 * Child process for the kill test: records readings one by one into the given database and,
 * after each commit, writes "sent <eventId> <readingId>" to stdout — the stand-in for the chat
 * reply, which is only sent once the reading is durable.
 *   tsx record-loop.ts <dbPath> <count>
 * Event ids are fixed ("kill-<i>"), so running it again re-delivers the same events.
 */
import { writeSync } from 'node:fs';
import { corePhysics } from '../../../src/lots/core-physics.js';
import { lotIdRule } from '../../../src/lots/ids.js';
import { NO_CHAT_WRITERS } from '../../../src/lots/permissions.js';
import { LotService } from '../../../src/lots/service.js';
import { SqliteLotRepository } from '../../../src/adapters/storage/sqlite/lots-repository.js';
import { demoCatalog } from '../harness.js';

const [dbPath, countText] = process.argv.slice(2) as [string, string];
const count = Number(countText);
const repo = SqliteLotRepository.open(dbPath);
const catalog = demoCatalog();
let clock = Date.parse('2025-06-10T06:00:00Z');
const service = new LotService({
  repo,
  specs: () => catalog,
  physics: corePhysics,
  now: () => new Date(clock),
  timeZone: 'Europe/London',
  permissions: NO_CHAT_WRITERS,
  lotIds: lotIdRule(),
  newEventId: () => {
    throw new Error('every record here carries its event id');
  },
  digest: { channel: 'console', at: '07:00' },
});

for (let i = 0; i < count; i++) {
  clock += 1000;
  const eventId = `kill-${i}`;
  const r = await service.record(
    {
      lotId: `LOT-K${(i % 20) + 1}`,
      wafer: (Math.floor(i / 20) % 25) + 1,
      site: (i % 5) + 1,
      productId: 'HX-200P',
      primary: { kind: 'resistivity', resistivityOhmCm: 8 + ((i * 7) % 50) / 10, asEntered: `${8 + ((i * 7) % 50) / 10} ohm-cm` },
    },
    { actor: { userId: 'U0KILL001', userName: 'Tomasz Reyes', surface: 'console', channelId: 'console' }, eventId },
  );
  if (!r.ok) {
    writeSync(2, `record ${eventId} failed: ${JSON.stringify(r.error)}\n`);
    process.exit(3);
  }
  writeSync(1, `sent ${eventId} ${r.value.outcome.readings[0]?.id ?? 0}\n`);
}
await repo.close();
