/**
 * Where the project's own data files (fixtures/) are, from the sources (src/lots/…) or from the
 * bundle (dist/…): the nearest folder above this module that holds fixtures/lots.
 */
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

function fixturesDir(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 6; i++) {
    const candidate = join(dir, 'fixtures', 'lots');
    if (existsSync(candidate)) return candidate;
    dir = dirname(dir);
  }
  return join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures', 'lots');
}

/** A file in fixtures/lots. */
export function fixtureFile(name: string): string {
  return join(fixturesDir(), name);
}
