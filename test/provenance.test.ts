/**
 * Sources a fresh clone can follow: nothing in the repository points at a file outside it (a
 * development machine's path, a references file that is not here); the project's own list of
 * sources exists and names every model family the core uses.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? (e.name === 'node_modules' || e.name.startsWith('.') ? [] : files(join(dir, e.name))) : /\.(ts|md|yaml|csv|json|mjs|sh)$/.test(e.name) ? [join(dir, e.name)] : [],
  );
}

describe('provenance', () => {
  it('no path outside the repository and no references file that is not in it', () => {
    const all = ['src', 'test', 'docs', 'fixtures', 'scripts', 'bench', 'deploy'].flatMap(files).concat(['README.md', 'DEVELOPERS.md']);
    const bad = all.filter((f) => f !== 'test/provenance.test.ts').filter((f) => /\/work\/|\/home\/\w|REFERENCES\.md/.test(readFileSync(f, 'utf8')));
    expect(bad).toEqual([]);
  });

  it('docs/references.md names the sources of every model family', () => {
    const refs = readFileSync('docs/references.md', 'utf8');
    for (const name of ['ASTM F723', 'Masetti', 'Caughey', 'Arora', 'Klaassen', 'Misiakos', 'Sproul', 'Altermatt', 'Green', 'Thurmond', 'Irvin', 'Valdes', 'Uhlir', 'Smits', 'ASTM F42', 'CODATA']) {
      expect(refs, name).toContain(name);
    }
  });
});
