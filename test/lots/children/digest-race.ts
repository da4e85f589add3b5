/**
 * Child process for the two-instances test: opens the given database, waits until the shared
 * start instant (so both fire in the same moment), runs the due summary once and prints the
 * result. The clock the scheduler sees is fixed by the parent.
 *   tsx digest-race.ts <dbPath> <clockIso> <startAtEpochMs> <instanceId>
 */
import { corePhysics } from '../../../src/lots/core-physics.js';
import { lotIdRule } from '../../../src/lots/ids.js';
import { NO_CHAT_WRITERS } from '../../../src/lots/permissions.js';
import { DigestScheduler } from '../../../src/app/daily-summary.js';
import { LotService } from '../../../src/lots/service.js';
import { SqliteLotRepository } from '../../../src/adapters/storage/sqlite/lots-repository.js';
import { demoCatalog } from '../harness.js';

const [dbPath, clockIso, startAt, instanceId] = process.argv.slice(2) as [string, string, string, string];
const now = () => new Date(clockIso);
const repo = SqliteLotRepository.open(dbPath);
const catalog = demoCatalog();
const service = new LotService({
  repo,
  specs: () => catalog,
  physics: corePhysics,
  now,
  timeZone: 'Europe/London',
  permissions: NO_CHAT_WRITERS,
  lotIds: lotIdRule(),
  newEventId: () => `${instanceId}-${Math.random()}`,
  digest: { channel: 'C0DIGEST1', at: '07:00' },
});
let posts = 0;
const scheduler = new DigestScheduler({
  service,
  repo,
  channel: 'C0DIGEST1',
  at: '07:00',
  timeZone: 'Europe/London',
  now,
  instanceId,
  publish: async () => {
    posts += 1;
  },
});
process.stdout.write('ready\n');
while (Date.now() < Number(startAt)) {
  // busy-wait to the shared instant (a timer would add up to a few ms of skew)
}
const result = await scheduler.runDue();
process.stdout.write(JSON.stringify({ status: result.status, posts }) + '\n');
await repo.close();
