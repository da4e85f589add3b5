#!/usr/bin/env node
// Runs the bundled build (dist/, made by `npm ci` / `npm install`). The rule: the bundle is used
// when it exists, unless this is a development checkout (a .git folder beside src/) where some
// file in src/ is newer than the bundle — then the TypeScript sources run through tsx, so an edit
// is never silently ignored. SHIFTPROBE_FROM_SOURCE=1 forces the sources; `npm run build` remakes
// the bundle.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const bundle = join(root, 'dist', 'main.js');

function newestIn(dir) {
  let newest = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    newest = Math.max(newest, e.isDirectory() ? newestIn(p) : statSync(p).mtimeMs);
  }
  return newest;
}

function useBundle() {
  if (process.env.SHIFTPROBE_FROM_SOURCE === '1' || !existsSync(bundle)) return false;
  if (!existsSync(join(root, '.git')) || !existsSync(join(root, 'src'))) return true;
  return newestIn(join(root, 'src')) <= statSync(bundle).mtimeMs;
}

let main;
if (useBundle()) {
  ({ main } = await import(pathToFileURL(bundle).href));
} else {
  const { register } = await import('tsx/esm/api');
  register();
  ({ main } = await import(pathToFileURL(join(root, 'src', 'main.ts')).href));
}
process.exitCode = await main(process.argv.slice(2));
