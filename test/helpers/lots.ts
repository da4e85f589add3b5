/**
 * An in-memory lot store with the invented demo specs and demo history (Harrowgate Fab 3),
 * for command tests: the help examples for `lot`, `clear`, `record` need lots that exist.
 */
import { DEMO_SPEC_FILE } from '../../src/lots/config.js';
import { lotIdRule } from '../../src/lots/ids.js';
import { NO_CHAT_WRITERS, type Permissions } from '../../src/lots/permissions.js';
import { startLots, type LotsRuntime } from '../../src/lots/runtime.js';
import { openDatabase } from '../../src/store/db.js';

export function demoLots(now: () => Date, permissions: Permissions = NO_CHAT_WRITERS): LotsRuntime {
  let n = 0;
  const started = startLots(
    openDatabase(':memory:', []),
    {
      specFile: DEMO_SPEC_FILE,
      demoSpecs: true,
      digest: { at: '07:00', timeZone: 'Europe/London' },
      permissions,
      lotIds: lotIdRule(),
    },
    { now, newEventId: () => `test-event-${++n}` },
  );
  if (!started.ok) throw new Error(started.message);
  return started.lots;
}
