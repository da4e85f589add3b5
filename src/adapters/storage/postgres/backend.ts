/**
 * The PostgreSQL backend (DATABASE_URL): one connection pool per instance (DATABASE_POOL_SIZE),
 * shared by every store; any number of instances may use one database.
 *
 * At start: connect (an unreachable server, a wrong password or a missing database is a
 * StorageError naming DATABASE_URL, the password never printed), check that the database is
 * empty or ours (another application's tables are left untouched), then apply the migrations
 * under a session advisory lock, so instances starting together apply each exactly once.
 */
import pg from 'pg';
import { StorageError, type StorageBackend } from '../../../app/ports.js';
import type { StorageConfig } from '../config.js';
import { PgConversationMemory, PgEventLedger, PgResultStore } from './chat-state.js';
import { PgLotRepository } from './lots-repository.js';
import { PG_MIGRATIONS, type PgMigration } from './schema.js';

export type PostgresConfig = Extract<StorageConfig, { kind: 'postgres' }>;

/** Our advisory lock key for migrations (any fixed 64-bit number; 'shiftprb' in ASCII). */
const MIGRATION_LOCK = '8319373686757708386';
const OUR_MIGRATIONS = /^(results|events|lots|conversations)-\d{3}-/;

export interface PostgresBackend extends StorageBackend {
  readonly kind: 'postgres';
  readonly pool: pg.Pool;
}

/** Why connecting failed, in the operator's words; never the URL's password. */
export function describeConnectError(e: unknown, shown: string): string {
  const code = (e as { code?: string } | undefined)?.code ?? '';
  const head = `DATABASE_URL (${shown})`;
  switch (code) {
    case 'ECONNREFUSED':
      return `${head}: nothing is listening there. Check the host and port, and that PostgreSQL is running.`;
    case 'ENOTFOUND':
    case 'EAI_AGAIN':
      return `${head}: the host name does not resolve. Check the host in DATABASE_URL.`;
    case 'ETIMEDOUT':
    case 'ECONNRESET':
      return `${head}: the server did not answer in time (a firewall, or the wrong host?).`;
    case '28P01':
    case '28000':
      return `${head}: the server refused the user name or password. Check the credentials in DATABASE_URL.`;
    case '3D000':
      return `${head}: that database does not exist. Create it (createdb) or correct the name in DATABASE_URL.`;
    case '42501':
      return `${head}: the user may not create tables there. Grant it CREATE on the database's schema, or use the owner.`;
    default:
      return `${head}: cannot use the database (${code || (e instanceof Error ? e.message.replace(/postgres(ql)?:\/\/\S+/g, '[url]') : 'unknown error')}).`;
  }
}

function sslOption(mode: PostgresConfig['ssl']): pg.PoolConfig['ssl'] {
  if (mode === 'on') return { rejectUnauthorized: true };
  if (mode === 'no-verify') return { rejectUnauthorized: false };
  return false;
}

async function migrate(client: pg.PoolClient, migrations: readonly PgMigration[], shown: string): Promise<void> {
  await client.query('SELECT pg_advisory_lock($1::bigint)', [MIGRATION_LOCK]);
  try {
    const tables = (
      await client.query<{ name: string }>(`SELECT table_name AS name FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE'`)
    ).rows.map((r) => r.name);
    if (tables.length > 0) {
      let ours = false;
      if (tables.includes('schema_migrations')) {
        const ids = (await client.query<{ id: string }>('SELECT id::text AS id FROM schema_migrations').catch(() => ({ rows: [] as { id: string }[] }))).rows;
        ours = ids.some((r) => OUR_MIGRATIONS.test(r.id));
      }
      if (!ours) {
        const list = tables.slice(0, 4).join(', ') + (tables.length > 4 ? ', …' : '');
        throw new StorageError(
          `DATABASE_URL (${shown}) already holds another application's tables (${list}). Give shiftprobe a database (or schema) of its own; nothing there has been changed.`,
        );
      }
    }
    await client.query('CREATE TABLE IF NOT EXISTS schema_migrations (id text PRIMARY KEY, applied_at text NOT NULL)');
    const applied = new Set((await client.query<{ id: string }>('SELECT id FROM schema_migrations')).rows.map((r) => r.id));
    for (const m of migrations) {
      if (applied.has(m.id)) continue;
      await client.query('BEGIN');
      try {
        await client.query(m.sql);
        await client.query('INSERT INTO schema_migrations (id, applied_at) VALUES ($1, $2)', [m.id, new Date().toISOString()]);
        await client.query('COMMIT');
      } catch (e) {
        await client.query('ROLLBACK').catch(() => undefined);
        throw e;
      }
    }
  } finally {
    await client.query('SELECT pg_advisory_unlock($1::bigint)', [MIGRATION_LOCK]).catch(() => undefined);
  }
}

export async function openPostgresBackend(config: PostgresConfig, options: { now?: () => Date; connectTimeoutMs?: number } = {}): Promise<PostgresBackend> {
  const now = options.now ?? (() => new Date());
  const pool = new pg.Pool({
    connectionString: config.url.reveal(),
    max: config.poolSize,
    ssl: sslOption(config.ssl),
    connectionTimeoutMillis: options.connectTimeoutMs ?? 10_000,
    ...(config.statementTimeoutMs > 0 ? { statement_timeout: config.statementTimeoutMs } : {}),
    application_name: 'shiftprobe',
  });
  // An idle connection dropped by the server must not crash the process; the next query reconnects.
  pool.on('error', () => undefined);
  let client: pg.PoolClient | undefined;
  try {
    client = await pool.connect();
    await migrate(client, PG_MIGRATIONS, config.shown);
  } catch (e) {
    client?.release(true);
    client = undefined;
    await pool.end().catch(() => undefined);
    if (e instanceof StorageError) throw e;
    throw new StorageError(describeConnectError(e, config.shown), { cause: e });
  } finally {
    client?.release();
  }
  return {
    kind: 'postgres',
    location: config.shown,
    pool,
    results: new PgResultStore(pool),
    ledger: new PgEventLedger(pool, { now }),
    conversations: new PgConversationMemory(pool, now),
    lots: new PgLotRepository(pool),
    async healthy() {
      try {
        await pool.query('SELECT 1');
        return true;
      } catch {
        return false;
      }
    },
    async close() {
      await pool.end().catch(() => undefined);
    },
  };
}
