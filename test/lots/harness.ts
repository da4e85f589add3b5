/**
 * Test wiring for the lot domain: a store (in-memory or temporary-file SQLite, or a fresh
 * database on the throw-away PostgreSQL server), the demo specs, the real physics core, a clock
 * the test moves by hand, and numbered event ids.
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
import type { LotRepository } from '../../src/lots/repository.js';
import { freshPostgresBackend } from '../support/postgres.js';

export function demoCatalog(): SpecCatalog {
  const load = loadSpecFile(DEMO_SPEC_FILE, { demo: true });
  if (!load.ok) throw new Error(`demo specs do not load: ${JSON.stringify(load.problems)}`);
  return load.catalog;
}

export interface Harness<R extends LotRepository = SqliteLotRepository> {
  readonly repo: R;
  readonly service: LotService;
  readonly clock: { now: Date; set(iso: string): void; advance(ms: number): void };
  close(): Promise<void>;
}

export interface HarnessOptions {
  path?: string;
  timeZone?: string;
  digestAt?: string;
  channel?: string;
  permissions?: Permissions;
  start?: string;
  catalog?: SpecCatalog;
}

export function makeHarness(options: HarnessOptions = {}): Harness {
  return harnessOn(SqliteLotRepository.open(options.path ?? ':memory:'), options, (repo) => repo.close());
}

/** The backends the shared suites run on: one suite, two drivers. */
export const DRIVERS = ['sqlite', 'postgres'] as const;
export type Driver = (typeof DRIVERS)[number];

/** A harness on either backend, with `exec` to run raw SQL (to prove the database refuses changes). */
export async function openHarness(driver: Driver, options: HarnessOptions = {}): Promise<Harness<LotRepository> & { exec(sql: string): Promise<void> }> {
  if (driver === 'sqlite') {
    const h = makeHarness(options);
    return { ...h, exec: async (sql) => void h.repo.database.prepare(sql).run() };
  }
  const backend = await freshPostgresBackend();
  const h = harnessOn(backend.lots, options, () => backend.close());
  return { ...h, exec: async (sql) => void (await backend.pool.query(sql)) };
}

function harnessOn<R extends LotRepository>(repo: R, options: HarnessOptions, close: (repo: R) => Promise<void>): Harness<R> {
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
  return { repo, service, clock, close: () => close(repo) };
}

export const CONSOLE: Actor = { userId: 'console', userName: 'Priya Okonkwo-Hale', surface: 'console', channelId: 'console' };
export const SLACK_TOMASZ: Actor = { userId: 'U0TOMASZ1', userName: 'Tomasz Reyes', surface: 'slack', channelId: 'C0SHIFTA1' };

export function tempDir(): { dir: string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-lots-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

export const rho = (resistivityOhmCm: number) => ({ kind: 'resistivity' as const, resistivityOhmCm, asEntered: `${resistivityOhmCm} ohm-cm` });
