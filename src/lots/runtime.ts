/**
 * Wiring the lot records at start-up: load the spec file (a bad one stops start-up with every
 * problem and its line), open the SQLite repository on the shared database, load the demo
 * history into an empty store when the demo specs are in use, and build the service. The
 * daily-summary scheduler is started by the surface, which knows how to post.
 */
import { randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import { migrate, type Db } from '../store/db.js';
import type { LotsConfig } from './config.js';
import { corePhysics } from './core-physics.js';
import { seedDemoHistory } from './demo.js';
import type { LotPhysics } from './physics.js';
import { DigestScheduler, type Publish } from './scheduler.js';
import { LotService } from './service.js';
import { describeSpecProblems, loadSpecFile } from './spec/load.js';
import type { SpecCatalog } from './spec/schema.js';
import { LOT_MIGRATIONS } from './sqlite/migrations.js';
import { SqliteLotRepository } from './sqlite/repository.js';
import type { Clock } from './time.js';

export interface LotsRuntime {
  readonly service: LotService;
  readonly repo: SqliteLotRepository;
  readonly catalog: SpecCatalog;
  readonly config: LotsConfig;
  /** Demo history entries written at this start (0 when none or already there). */
  readonly demoEntriesWritten: number;
  /**
   * Start the daily summary to `channel` (default DIGEST_CHANNEL; the console passes
   * 'console'). Returns undefined when there is no channel to post to.
   */
  startDigest(publish: Publish, options?: { channel?: string; onError?: (e: unknown, context: string) => void }): Promise<DigestScheduler | undefined>;
}

export type LotsStart = { readonly ok: true; readonly lots: LotsRuntime } | { readonly ok: false; readonly message: string };

export interface LotsOptions {
  readonly now?: Clock;
  readonly physics?: LotPhysics;
  readonly newEventId?: () => string;
  /** Load the demo history into an empty store when the demo specs are used (default true). */
  readonly demoHistory?: boolean;
}

export function startLots(db: Db, config: LotsConfig, options: LotsOptions = {}): LotsStart {
  const load = loadSpecFile(config.specFile, { demo: config.demoSpecs });
  if (!load.ok) return { ok: false, message: `${describeSpecProblems(load)}\nFix the file (see docs/lots.md, "The spec file") or point SPEC_FILE at the right one.` };
  const catalog = load.catalog;
  migrate(db, LOT_MIGRATIONS);
  const repo = new SqliteLotRepository(db);
  const now = options.now ?? (() => new Date());
  const physics = options.physics ?? corePhysics;
  let demoEntriesWritten = 0;
  if (config.demoSpecs && (options.demoHistory ?? true) && repo.countLotsSync() === 0) {
    demoEntriesWritten = seedDemoHistory({ repo, catalog, physics, lotIds: config.lotIds, now: now() }).written;
  }
  const defaultChannel = config.digest.channel;
  const service = new LotService({
    repo,
    specs: () => catalog,
    physics,
    now,
    timeZone: config.digest.timeZone,
    permissions: config.permissions,
    lotIds: config.lotIds,
    ...(config.confirmFactor !== undefined ? { confirmFactor: config.confirmFactor } : {}),
    newEventId: options.newEventId ?? (() => `local-${randomUUID()}`),
    digest: { channel: defaultChannel ?? 'console', at: config.digest.at },
  });
  return {
    ok: true,
    lots: {
      service,
      repo,
      catalog,
      config,
      demoEntriesWritten,
      async startDigest(publish, o = {}) {
        const channel = o.channel ?? defaultChannel;
        if (channel === undefined) return undefined;
        const scheduler = new DigestScheduler({
          service,
          repo,
          channel,
          at: config.digest.at,
          timeZone: config.digest.timeZone,
          now,
          publish,
          instanceId: `${hostname()}:${process.pid}`,
          ...(o.onError ? { onError: o.onError } : {}),
        });
        await scheduler.start();
        return scheduler;
      },
    },
  };
}
