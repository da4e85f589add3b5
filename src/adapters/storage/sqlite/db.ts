/**
 * The embedded database: SQLite through better-sqlite3, WAL journal, synchronous=FULL (a reply is
 * sent only after its row is durable), a busy timeout for a second process on the same file.
 * Each store owns its migrations; `openDatabase` applies the ones not yet applied, in order, each
 * in its own transaction, recording them in `schema_migrations`.
 *
 * Before the file is touched it is checked: a folder, a path under a file, a file that is not a
 * SQLite database, a truncated or damaged one, another application's database or a place that
 * cannot be written each stop start-up with a StorageError naming DATABASE_PATH. Another
 * application's database is left exactly as it was (nothing is added to it, not even the WAL
 * journal mode).
 */
import Database from 'better-sqlite3';
import { accessSync, closeSync, constants, existsSync, mkdirSync, openSync, readSync, statSync } from 'node:fs';
import { dirname } from 'node:path';
import { StorageError } from '../../../app/ports.js';

export type Db = Database.Database;

export interface Migration {
  /** Unique and ordered within its store, e.g. 'results-001-create'. */
  readonly id: string;
  readonly sql: string;
}

const SETTING = 'DATABASE_PATH';
const HEADER = Buffer.from('SQLite format 3\0', 'latin1');
/** Our migration ids start with one of these: a `schema_migrations` without them is someone else's. */
const OUR_MIGRATIONS = /^(results|events|lots|conversations)-\d{3}-/;

function refuse(path: string, what: string, fix: string, cause?: unknown): never {
  throw new StorageError(`${SETTING} (${path}) ${what}. ${fix}`, cause === undefined ? undefined : { cause });
}

const FIX_PATH = `Point ${SETTING} at a file of its own, e.g. ./data/shiftprobe.db (it is created when missing).`;

function codeOf(e: unknown): string {
  return typeof e === 'object' && e !== null && 'code' in e ? String((e as { code: unknown }).code) : '';
}

function unwritable(path: string, e: unknown): never {
  const code = codeOf(e);
  if (code === 'EROFS') refuse(path, 'is on a read-only file system', `Point ${SETTING} at a writable place (the service needs to write readings).`, e);
  if (code === 'EACCES' || code === 'EPERM') refuse(path, 'may not be written by this user', `Give the service user write access to it and its folder, or point ${SETTING} elsewhere.`, e);
  refuse(path, `cannot be written (${code || 'unknown error'})`, FIX_PATH, e);
}

/** Checks that need no SQLite: the path, its folder, the file's header and length. */
function preflight(path: string): void {
  let stat;
  try {
    stat = statSync(path, { throwIfNoEntry: false });
  } catch (e) {
    if (codeOf(e) === 'ENOTDIR') refuse(path, 'is under a file, not a folder', FIX_PATH, e);
    refuse(path, `cannot be read (${codeOf(e) || 'unknown error'})`, FIX_PATH, e);
  }
  if (stat?.isDirectory()) refuse(path, 'is a folder; it must name a database file inside it', `For example ${path.replace(/\/+$/, '')}/shiftprobe.db.`);
  if (!stat) {
    try {
      mkdirSync(dirname(path), { recursive: true });
    } catch (e) {
      const code = codeOf(e);
      if (code === 'ENOTDIR' || code === 'EEXIST') refuse(path, 'is under a file, not a folder', FIX_PATH, e);
      if (code === 'EROFS') refuse(path, 'is on a read-only file system', `Point ${SETTING} at a writable place (the service needs to write readings).`, e);
      if (code === 'EACCES' || code === 'EPERM') refuse(path, 'is in a folder shiftprobe may not create or write', `Give the service user write access to ${dirname(path)}, or point ${SETTING} elsewhere.`, e);
      refuse(path, `cannot be created (${code || 'unknown error'})`, FIX_PATH, e);
    }
    try {
      closeSync(openSync(path, 'wx')); // an empty file: SQLite makes it a database
    } catch (e) {
      unwritable(path, e);
    }
    return;
  }
  if (!stat.isFile()) refuse(path, 'is not a regular file', FIX_PATH);
  try {
    accessSync(path, constants.R_OK | constants.W_OK);
    accessSync(dirname(path), constants.W_OK); // the WAL and shared-memory files go beside it
  } catch (e) {
    unwritable(path, e);
  }
  if (stat.size === 0) return; // an empty file becomes a new database
  const head = Buffer.alloc(100);
  const fd = openSync(path, 'r');
  let read: number;
  try {
    read = readSync(fd, head, 0, 100, 0);
  } finally {
    closeSync(fd);
  }
  if (read < 100 || !head.subarray(0, 16).equals(HEADER)) {
    refuse(path, 'is not a SQLite database (it holds other data: text, or a file of another kind)', `Move that file away or point ${SETTING} at a new file; shiftprobe has not changed it.`);
  }
  const rawPageSize = head.readUInt16BE(16);
  const pageSize = rawPageSize === 1 ? 65536 : rawPageSize;
  const pages = head.readUInt32BE(28);
  const wal = `${path}-wal`;
  const walHasData = existsSync(wal) && statSync(wal).size > 0;
  if (!walHasData && pages > 0 && stat.size < pageSize * pages) {
    refuse(path, `is damaged: it is ${stat.size} bytes, shorter than the ${pageSize * pages} bytes its header names (a truncated copy?)`, `Restore it from a backup (docs/operations.md), or point ${SETTING} at a new file; shiftprobe has not changed it.`);
  }
}

/** Whether an existing database is ours (or empty): never migrate someone else's. */
function checkOwnership(db: Db, path: string): void {
  let tables: string[];
  try {
    tables = (db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'").all() as { name: string }[]).map((r) => r.name);
  } catch (e) {
    refuse(path, `is damaged or not a SQLite database (${codeOf(e) || 'unreadable'})`, `Restore it from a backup, or point ${SETTING} at a new file; shiftprobe has not changed it.`, e);
  }
  if (tables.length === 0) return;
  let ours = false;
  if (tables.includes('schema_migrations')) {
    try {
      const ids = (db.prepare('SELECT id FROM schema_migrations').all() as { id: unknown }[]).map((r) => String(r.id));
      ours = ids.some((id) => OUR_MIGRATIONS.test(id));
    } catch {
      ours = false;
    }
  }
  if (!ours) {
    const shown = tables.slice(0, 4).join(', ') + (tables.length > 4 ? ', …' : '');
    refuse(path, `is another application's database (tables ${shown})`, `Point ${SETTING} at a file of shiftprobe's own; that database has been left untouched.`);
  }
}

export function openDatabase(path: string, migrations: readonly Migration[]): Db {
  if (path !== ':memory:') preflight(path);
  let db: Db;
  try {
    db = new Database(path);
  } catch (e) {
    refuse(path, `cannot be opened (${codeOf(e) || 'unknown error'})`, FIX_PATH, e);
  }
  try {
    if (path !== ':memory:') checkOwnership(db, path);
    db.pragma('busy_timeout = 5000');
    db.pragma('journal_mode = WAL');
    db.pragma('synchronous = FULL');
    db.pragma('foreign_keys = ON');
    migrate(db, migrations);
    return db;
  } catch (e) {
    db.close();
    if (e instanceof StorageError) throw e;
    const code = codeOf(e);
    if (code === 'SQLITE_READONLY' || code === 'SQLITE_CANTOPEN' || code === 'SQLITE_IOERR_WRITE' || code.startsWith('SQLITE_READONLY')) {
      refuse(path, 'cannot be written (a read-only file, folder or file system)', `Give the service user write access, or point ${SETTING} at a writable place.`, e);
    }
    if (code === 'SQLITE_CORRUPT' || code === 'SQLITE_NOTADB') {
      refuse(path, 'is damaged', `Restore it from a backup, or point ${SETTING} at a new file.`, e);
    }
    refuse(path, `could not be prepared (${code || (e instanceof Error ? e.name : 'unknown error')})`, FIX_PATH, e);
  }
}

export function migrate(db: Db, migrations: readonly Migration[]): void {
  db.exec('CREATE TABLE IF NOT EXISTS schema_migrations (id TEXT PRIMARY KEY, applied_at TEXT NOT NULL)');
  const applied = new Set((db.prepare('SELECT id FROM schema_migrations').all() as { id: string }[]).map((r) => r.id));
  const record = db.prepare('INSERT OR IGNORE INTO schema_migrations (id, applied_at) VALUES (?, ?)');
  for (const m of migrations) {
    if (applied.has(m.id)) continue;
    // IMMEDIATE: two processes starting together do not both apply the same migration.
    db.transaction(() => {
      const again = db.prepare('SELECT 1 FROM schema_migrations WHERE id = ?').get(m.id);
      if (again) return;
      db.exec(m.sql);
      record.run(m.id, new Date().toISOString());
    }).immediate();
  }
}
