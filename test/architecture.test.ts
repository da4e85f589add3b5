/**
 * The arrows point down. Every import in src/ (static and dynamic) is read and checked against
 * the layers of the house (DEVELOPERS.md):
 *
 *   physics  →  reply  →  lots  →  commands  →  app | render  →  adapters  →  main.ts, config.ts
 *
 * A module may import its own layer and the layers to its left, never one to its right; the
 * application layer and the renderers are peers that do not import each other; one adapter
 * never imports another (a chat surface does not know which database is behind it), except the
 * utilities directly under src/adapters (the secret holder, the logger, the serving helpers); the physics
 * core imports no package and nothing of Node (no I/O).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const SRC = resolve('src');

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? files(join(dir, e.name)) : e.name.endsWith('.ts') ? [join(dir, e.name)] : []));
}

/** Every module specifier a file imports: `import … from`, `export … from`, `import(…)`. */
export function importsOf(source: string): string[] {
  const out: string[] = [];
  const re = /(?:^|\n)\s*(?:import|export)\s[^'"`;]*?from\s*['"]([^'"]+)['"]|(?:^|[^.\w])import\(\s*['"]([^'"]+)['"]\s*\)|(?:^|\n)\s*import\s*['"]([^'"]+)['"]/g;
  for (const m of source.matchAll(re)) out.push((m[1] ?? m[2] ?? m[3])!);
  return out;
}

const RANK = { physics: 0, reply: 1, lots: 2, commands: 3, app: 4, render: 4, adapters: 5, root: 6 } as const;
type Layer = keyof typeof RANK;

function layerOf(file: string): Layer {
  const top = relative(SRC, file).split('/')[0]!;
  if (top in RANK && top !== 'root') return top as Layer;
  return 'root';
}

/** 'slack', 'console', 'storage', or '' for files directly under adapters/. */
function adapterOf(file: string): string {
  const parts = relative(SRC, file).split('/');
  return parts[0] === 'adapters' && parts.length > 2 ? parts[1]! : '';
}

interface Arrow {
  readonly from: string;
  readonly to: string;
  readonly why: string;
}

/** The rules applied to one file's source text (its path decides its layer). */
function checkImports(file: string, text: string): Arrow[] {
  const bad: Arrow[] = [];
  const from = layerOf(file);
  const name = relative(SRC, file);
  for (const spec of importsOf(text)) {
    if (!spec.startsWith('.')) {
      if (from === 'physics') bad.push({ from: name, to: spec, why: 'the physics core imports no package and no Node module' });
      continue;
    }
    const target = resolve(dirname(file), spec).replace(/\.js$/, '.ts');
    const to = layerOf(target);
    const toName = relative(SRC, target);
    if (RANK[to] > RANK[from]) bad.push({ from: name, to: toName, why: `${from} may not import ${to} (an arrow up the layers)` });
    else if ((from === 'app' && to === 'render') || (from === 'render' && to === 'app')) {
      bad.push({ from: name, to: toName, why: 'the application layer and the renderers do not import each other' });
    } else if (from === 'adapters' && to === 'adapters') {
      const a = adapterOf(file);
      const b = adapterOf(target);
      // Files directly under src/adapters (secret, log, serving …) are shared by the adapters.
      if (a !== b && b !== '') bad.push({ from: name, to: toName, why: `adapter ${a || '(root)'} may not import adapter ${b || '(root)'}` });
    }
  }
  return bad;
}

describe('the import arrows', () => {
  it('point down the layers everywhere in src/', () => {
    const all = files(SRC);
    expect(all.length).toBeGreaterThan(150);
    expect(all.flatMap((f) => checkImports(f, readFileSync(f, 'utf8')))).toEqual([]);
  });

  it('the check itself reads every form of import and catches each kind of wrong arrow', () => {
    expect(importsOf("import { a } from './x.js';\nexport { b } from '../y.js';\nconst m = await import('./z.js');\nimport './side.js';")).toEqual([
      './x.js',
      '../y.js',
      './z.js',
      './side.js',
    ]);
    // Made-up sources at pretend paths under src/ (nothing is written).
    const at = (path: string, text: string) => checkImports(join(SRC, path), text).map((v) => v.why);
    expect(at('physics/fake.ts', "import { readFileSync } from 'node:fs';")).toEqual(['the physics core imports no package and no Node module']);
    expect(at('lots/fake.ts', "import { handle } from '../commands/handle.js';")).toEqual(['lots may not import commands (an arrow up the layers)']);
    expect(at('commands/fake.ts', "const m = await import('../adapters/slack/index.js');")).toEqual(['commands may not import adapters (an arrow up the layers)']);
    expect(at('adapters/slack/fake.ts', "import { openSqliteBackend } from '../storage/sqlite/backend.js';")).toEqual(['adapter slack may not import adapter storage']);
    expect(at('app/fake.ts', "import { renderText } from '../render/text.js';")).toEqual(['the application layer and the renderers do not import each other']);
    expect(at('adapters/slack/fake.ts', "import { Secret } from '../secret.js';\nimport { ask } from '../../app/application.js';")).toEqual([]);
  });
});
