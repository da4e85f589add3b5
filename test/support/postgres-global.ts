/**
 * Vitest global set-up: one throw-away PostgreSQL server for the whole run (see
 * throwaway-postgres.ts); each test file that needs it creates its own database. The server's
 * URL reaches the tests through `inject('postgresUrl')`. No test is skipped when the server is
 * missing: set-up fails and says how to install it.
 */
import type { TestProject } from 'vitest/node';
import { startThrowawayPostgres } from './throwaway-postgres.js';

declare module 'vitest' {
  export interface ProvidedContext {
    postgresUrl: string;
  }
}

export default async function setup(project: TestProject): Promise<() => void> {
  const server = await startThrowawayPostgres();
  project.provide('postgresUrl', server.url());
  return () => server.stop();
}
