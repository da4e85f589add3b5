/**
 * An in-memory lot store with the invented demo specs and demo history (Harrowgate Fab 3),
 * for command tests: the help examples for `lot`, `clear`, `record` need lots that exist.
 *
 * Synchronous for the tests' convenience: the demo history is written through the (async)
 * repository port in the background, and every repository call waits for it first.
 */
import { openSqliteBackend } from '../../src/adapters/storage/sqlite/backend.js';
import { DEMO_SPEC_FILE, type LotsConfig } from '../../src/lots/config.js';
import { corePhysics } from '../../src/lots/core-physics.js';
import { seedDemoHistory } from '../../src/lots/demo.js';
import { lotIdRule } from '../../src/lots/ids.js';
import { NO_CHAT_WRITERS, type Permissions } from '../../src/lots/permissions.js';
import type { LotRepository } from '../../src/lots/repository.js';
import type { LotsRuntime } from '../../src/lots/runtime.js';
import { loadLotSpecs } from '../../src/lots/spec/load.js';
import { LotService } from '../../src/lots/service.js';

/** A repository whose every method first waits for `ready`. */
export function afterReady<R extends object>(repo: R, ready: Promise<unknown>): R {
  return new Proxy(repo, {
    get(target, prop, receiver) {
      const value = Reflect.get(target, prop, receiver) as unknown;
      if (typeof value !== 'function') return value;
      return async (...args: unknown[]) => {
        await ready;
        return (value as (...a: unknown[]) => unknown).apply(target, args);
      };
    },
  });
}

export function demoLotsConfig(permissions: Permissions = NO_CHAT_WRITERS): LotsConfig {
  return {
    specFile: DEMO_SPEC_FILE,
    demoSpecs: true,
    digest: { at: '07:00', timeZone: 'Europe/London' },
    permissions,
    lotIds: lotIdRule(),
  };
}

export function demoLots(now: () => Date, permissions: Permissions = NO_CHAT_WRITERS, options: { history?: boolean } = {}): LotsRuntime {
  let n = 0;
  const config = demoLotsConfig(permissions);
  const specs = loadLotSpecs(config);
  if (!specs.ok) throw new Error(specs.message);
  const backend = openSqliteBackend(':memory:', { now });
  const seeded = options.history === false ? Promise.resolve() : seedDemoHistory({ repo: backend.lots, catalog: specs.catalog, physics: corePhysics, lotIds: config.lotIds, now: now() });
  const repo: LotRepository = afterReady(backend.lots, seeded);
  const service = new LotService({
    repo,
    specs: () => specs.catalog,
    physics: corePhysics,
    now,
    timeZone: config.digest.timeZone,
    permissions: config.permissions,
    lotIds: config.lotIds,
    newEventId: () => `test-event-${++n}`,
    digest: { channel: 'console', at: config.digest.at },
  });
  return { service, repo, catalog: specs.catalog, config, demoEntriesWritten: 0 };
}
