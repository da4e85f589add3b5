/**
 * Fresh databases on the run's throw-away PostgreSQL server (started by postgres-global.ts):
 * each call creates an empty database, so tests never share state.
 */
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { inject } from 'vitest';
import { withoutPassword, type StorageConfig } from '../../src/adapters/storage/config.js';
import { openPostgresBackend, type PostgresBackend } from '../../src/adapters/storage/postgres/backend.js';
import { Secret } from '../../src/adapters/secret.js';

/** The server's URL (database 'postgres'). */
export function postgresServerUrl(): string {
  return inject('postgresUrl');
}

export function postgresConfig(url: string, extra: Partial<Extract<StorageConfig, { kind: 'postgres' }>> = {}): Extract<StorageConfig, { kind: 'postgres' }> {
  return { kind: 'postgres', url: new Secret(url), shown: withoutPassword(url), poolSize: 10, ssl: 'off', statementTimeoutMs: 10_000, ...extra };
}

/** Create an empty database and return its URL. */
export async function freshPostgresDatabase(): Promise<string> {
  const server = postgresServerUrl();
  const name = `t_${process.pid}_${randomBytes(5).toString('hex')}`;
  const client = new pg.Client({ connectionString: server });
  await client.connect();
  try {
    await client.query(`CREATE DATABASE ${name}`);
  } finally {
    await client.end();
  }
  const u = new URL(server);
  u.pathname = `/${name}`;
  return u.toString();
}

export async function freshPostgresBackend(options: { now?: () => Date } = {}): Promise<PostgresBackend> {
  return openPostgresBackend(postgresConfig(await freshPostgresDatabase()), options);
}
