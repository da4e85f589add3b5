/**
 * The embedded database: SQLite through better-sqlite3, WAL journal, synchronous=FULL (a reply is
 * sent only after its row is durable), a busy timeout for a second process on the same file.
 * Each module owns its migrations; `openDatabase` applies the ones not yet applied, in order,
 * each in its own transaction, recording them in `schema_migrations`.
 */
import Database from 'better-sqlite3';
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';

export type Db = Database.Database;

export interface Migration {
  /** Unique and ordered within its module, e.g. 'results-001-create'. */
  readonly id: string;
  readonly sql: string;
}

export function openDatabase(path: string, migrations: readonly Migration[]): Db {
  if (path !== ':memory:') mkdirSync(dirname(path), { recursive: true });
  const db = new Database(path);
  db.pragma('journal_mode = WAL');
  db.pragma('synchronous = FULL');
  db.pragma('busy_timeout = 5000');
  db.pragma('foreign_keys = ON');
  migrate(db, migrations);
  return db;
}

export function migrate(db: Db, migrations: readonly Migration[]): void {
  db.exec(
    'CREATE TABLE IF NOT EXISTS schema_migrations (id TEXT PRIMARY KEY, applied_at TEXT NOT NULL)',
  );
  const applied = new Set(
    (db.prepare('SELECT id FROM schema_migrations').all() as { id: string }[]).map((r) => r.id),
  );
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
