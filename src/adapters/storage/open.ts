/**
 * Opens the backend the settings name: PostgreSQL when DATABASE_URL is set, otherwise the
 * embedded SQLite file at DATABASE_PATH. Each backend applies its own migrations. A problem the
 * operator must fix is a StorageError naming the setting (never a password).
 */
import { StorageError, type StorageBackend } from '../../app/ports.js';
import type { StorageConfig } from './config.js';
import { openSqliteBackend } from './sqlite/backend.js';

export async function openBackend(config: StorageConfig, options: { now?: () => Date } = {}): Promise<StorageBackend> {
  if (config.kind === 'postgres') {
    // Loaded only when configured, so the embedded default never loads the driver.
    const { openPostgresBackend } = await import('./postgres/backend.js');
    return openPostgresBackend(config, options);
  }
  try {
    return openSqliteBackend(config.path, options);
  } catch (e) {
    if (e instanceof StorageError) throw e;
    throw new StorageError(`DATABASE_PATH (${config.path}) could not be opened: ${e instanceof Error ? e.message : String(e)}`, { cause: e });
  }
}
