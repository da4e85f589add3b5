/**
 * What a running shiftprobe holds, wired once at start-up: the embedded database with every
 * module's migrations, the result store, ids and the clock. Surfaces (console, CLI, Slack)
 * build their HandleContext from these.
 */
import { randomBytes } from 'node:crypto';
import type { Caller, HandleContext, ResultStore, Surface } from './commands/context.js';
import { openDatabase, type Db, type Migration } from './store/db.js';
import { eventLedgerMigrations } from './store/event-ledger-sqlite.js';
import { resultStoreMigrations, SqliteResultStore } from './store/results-sqlite.js';

/** Every module's migrations, in the order they apply. */
export const ALL_MIGRATIONS: readonly Migration[] = [...resultStoreMigrations, ...eventLedgerMigrations];

export interface Services {
  readonly db: Db;
  readonly results: ResultStore;
  readonly now: () => Date;
  readonly newId: () => string;
  close(): void;
}

/** Result ids: 'r-' and 6 random hex digits (short enough to type into `why`). */
export function randomResultId(): string {
  return `r-${randomBytes(3).toString('hex')}`;
}

export function openServices(databasePath: string, options: { now?: () => Date; newId?: () => string } = {}): Services {
  const db = openDatabase(databasePath, ALL_MIGRATIONS);
  return {
    db,
    results: new SqliteResultStore(db),
    now: options.now ?? (() => new Date()),
    newId: options.newId ?? randomResultId,
    close: () => db.close(),
  };
}

export function contextFor(
  services: Pick<Services, 'results' | 'now' | 'newId'>,
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
  };
}
