/**
 * Wiring the lot records at start-up: load the spec file (a bad one stops start-up with every
 * problem and its line), load the demo history into an empty store when the demo specs are in
 * use, and build the service, all over the LotRepository port (whichever backend the
 * composition root opened). The daily summary is the application layer's job (src/app).
 */
import { randomUUID } from 'node:crypto';
import type { LotsConfig } from './config.js';
import { corePhysics } from './core-physics.js';
import type { LotPhysics } from './physics.js';
import type { LotRepository } from './repository.js';
import { LotService } from './service.js';
import type { SpecCatalog } from './spec/schema.js';
import type { Clock } from './time.js';

export interface LotsRuntime {
  readonly service: LotService;
  readonly repo: LotRepository;
  readonly catalog: SpecCatalog;
  readonly config: LotsConfig;
  /** Demo history entries written at this start (0 when none or already there). */
  readonly demoEntriesWritten: number;
}

export type LotsStart = { readonly ok: true; readonly lots: LotsRuntime } | { readonly ok: false; readonly message: string };

export interface LotsOptions {
  readonly now?: Clock;
  readonly physics?: LotPhysics;
  readonly newEventId?: () => string;
  /** Load the demo history into an empty store when the demo specs are used (default true). */
  readonly demoHistory?: boolean;
}

export async function startLots(repo: LotRepository, config: LotsConfig, options: LotsOptions = {}): Promise<LotsStart> {
  // The YAML reader and the demo history load with the lot records, not with every start.
  const { loadLotSpecs } = await import('./spec/load.js');
  const { seedDemoHistory } = await import('./demo.js');
  const specs = loadLotSpecs(config);
  if (!specs.ok) return specs;
  const catalog = specs.catalog;
  const now = options.now ?? (() => new Date());
  const physics = options.physics ?? corePhysics;
  let demoEntriesWritten = 0;
  if (config.demoSpecs && (options.demoHistory ?? true) && (await repo.countLots()) === 0) {
    demoEntriesWritten = (await seedDemoHistory({ repo, catalog, physics, lotIds: config.lotIds, now: now() })).written;
  }
  const service = new LotService({
    repo,
    specs: () => catalog,
    physics,
    now,
    timeZone: config.digest.timeZone,
    permissions: config.permissions,
    lotIds: config.lotIds,
    ...(config.confirmFactor !== undefined ? { confirmFactor: config.confirmFactor } : {}),
    ...(config.probeSpacingCm !== undefined ? { probeSpacingCm: config.probeSpacingCm } : {}),
    newEventId: options.newEventId ?? (() => `local-${randomUUID()}`),
    digest: { channel: config.digest.channel ?? 'console', at: config.digest.at },
  });
  return { ok: true, lots: { service, repo, catalog, config, demoEntriesWritten } };
}
