/**
 * What a running shiftprobe holds, wired once at start-up: the embedded database with every
 * module's migrations, the result store, ids and the clock. Surfaces (console, CLI, Slack)
 * build their HandleContext from these.
 */
import { randomBytes } from 'node:crypto';
import type { Caller, HandleContext, ResultStore, Surface } from './commands/context.js';
import type { LotsConfig } from './lots/config.js';
import { startLots, type LotsRuntime } from './lots/runtime.js';
import { LOT_MIGRATIONS } from './lots/sqlite/migrations.js';
import { openDatabase, type Db, type Migration } from './store/db.js';
import { eventLedgerMigrations } from './store/event-ledger-sqlite.js';
import { resultStoreMigrations, SqliteResultStore } from './store/results-sqlite.js';

/** Every module's migrations, in the order they apply. */
export const ALL_MIGRATIONS: readonly Migration[] = [...resultStoreMigrations, ...eventLedgerMigrations, ...LOT_MIGRATIONS];

export interface Services {
  readonly db: Db;
  readonly results: ResultStore;
  readonly now: () => Date;
  readonly newId: () => string;
  /** Lot records, when the lot settings were given. */
  readonly lots?: LotsRuntime;
  close(): void;
}

/** A problem that stops start-up (e.g. a bad spec file), with the message to print. */
export class StartupError extends Error {}

/**
 * Result ids: 'r-' and 8 random hex digits, short enough to type into `why`; a clash with an
 * older result (likely only after tens of thousands) is caught by the store and re-drawn.
 */
export function randomResultId(): string {
  return `r-${randomBytes(4).toString('hex')}`;
}

export function openServices(
  databasePath: string,
  options: { now?: () => Date; newId?: () => string; lots?: LotsConfig } = {},
): Services {
  const db = openDatabase(databasePath, ALL_MIGRATIONS);
  const now = options.now ?? (() => new Date());
  let lots: LotsRuntime | undefined;
  if (options.lots) {
    const started = startLots(db, options.lots, { now });
    if (!started.ok) {
      db.close();
      throw new StartupError(started.message);
    }
    lots = started.lots;
  }
  return {
    db,
    results: new SqliteResultStore(db),
    now,
    newId: options.newId ?? randomResultId,
    ...(lots ? { lots } : {}),
    close: () => db.close(),
  };
}

export function contextFor(
  services: Pick<Services, 'results' | 'now' | 'newId'> & { readonly lots?: LotsRuntime },
  surface: Surface,
  caller: Caller,
  session: { lastResultId?: string },
  eventId?: string,
): HandleContext {
  return {
    surface,
    caller,
    now: services.now,
    newId: services.newId,
    results: services.results,
    session,
    ...(eventId ? { eventId } : {}),
    ...(services.lots ? { lots: services.lots.service } : {}),
  };
}
