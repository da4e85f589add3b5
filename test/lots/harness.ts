/**
 * Test wiring for the lot domain: an in-memory (or temporary-file) SQLite store, the demo specs,
 * the real physics core, a clock the test moves by hand, and numbered event ids.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEMO_SPEC_FILE } from '../../src/lots/config.js';
import { corePhysics } from '../../src/lots/core-physics.js';
import { lotIdRule } from '../../src/lots/ids.js';
import { NO_CHAT_WRITERS, type Permissions } from '../../src/lots/permissions.js';
import type { Actor } from '../../src/lots/readings.js';
import { LotService } from '../../src/lots/service.js';
import { loadSpecFile } from '../../src/lots/spec/load.js';
import type { SpecCatalog } from '../../src/lots/spec/schema.js';
import { SqliteLotRepository } from '../../src/adapters/storage/sqlite/lots-repository.js';

export function demoCatalog(): SpecCatalog {
  const load = loadSpecFile(DEMO_SPEC_FILE, { demo: true });
  if (!load.ok) throw new Error(`demo specs do not load: ${JSON.stringify(load.problems)}`);
  return load.catalog;
}

export interface Harness {
  readonly repo: SqliteLotRepository;
  readonly service: LotService;
  readonly clock: { now: Date; set(iso: string): void; advance(ms: number): void };
  close(): Promise<void>;
}

export function makeHarness(
  options: {
    path?: string;
    timeZone?: string;
    digestAt?: string;
    channel?: string;
    permissions?: Permissions;
    start?: string;
    catalog?: SpecCatalog;
  } = {},
): Harness {
  const repo = SqliteLotRepository.open(options.path ?? ':memory:');
  const clock = {
    now: new Date(options.start ?? '2025-06-10T09:00:00Z'),
    set(iso: string) {
      this.now = new Date(iso);
    },
    advance(ms: number) {
      this.now = new Date(this.now.getTime() + ms);
    },
  };
  let n = 0;
  const catalog = options.catalog ?? demoCatalog();
  const service = new LotService({
    repo,
    specs: () => catalog,
    physics: corePhysics,
    now: () => clock.now,
    timeZone: options.timeZone ?? 'Europe/London',
    permissions: options.permissions ?? NO_CHAT_WRITERS,
    lotIds: lotIdRule(),
    newEventId: () => `test-${++n}`,
    digest: { channel: options.channel ?? 'console', at: options.digestAt ?? '07:00' },
  });
  return { repo, service, clock, close: () => repo.close() };
}

export const CONSOLE: Actor = { userId: 'console', userName: 'Priya Okonkwo-Hale', surface: 'console', channelId: 'console' };
export const SLACK_TOMASZ: Actor = { userId: 'U0TOMASZ1', userName: 'Tomasz Reyes', surface: 'slack', channelId: 'C0SHIFTA1' };

export function tempDir(): { dir: string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-lots-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

export const rho = (resistivityOhmCm: number) => ({ kind: 'resistivity' as const, resistivityOhmCm, asEntered: `${resistivityOhmCm} ohm-cm` });
