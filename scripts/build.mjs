#!/usr/bin/env node
/**
 * The bundled build, made by `npm ci` / `npm install` (the `prepare` script) with no extra step:
 * src/main.ts → dist/main.js and its chunks (ES modules, code-split so the console and the CLI
 * never load a chat framework, the HTTP server or the PostgreSQL driver). Native and optional
 * modules stay outside the bundle. bin/shiftprobe.mjs runs it (see the rule there).
 */
import { build } from 'esbuild';
import { rmSync, writeFileSync } from 'node:fs';

const started = Date.now();
rmSync('dist', { recursive: true, force: true });
await build({
  entryPoints: ['src/main.ts'],
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  outdir: 'dist',
  // better-sqlite3 loads a native addon; pg-native is pg's optional native driver (not used).
  external: ['better-sqlite3', 'pg-native', '@resvg/resvg-js'],
  // Some bundled CommonJS packages call require(); give ES modules one.
  banner: { js: "import { createRequire as __shiftprobeRequire } from 'node:module'; const require = __shiftprobeRequire(import.meta.url);" },
  minify: true,
  legalComments: 'linked',
  logLevel: 'warning',
});
writeFileSync('dist/build-info.json', JSON.stringify({ builtAt: new Date().toISOString(), node: process.version }) + '\n');
if (!process.env.npm_config_loglevel || process.env.npm_config_loglevel !== 'silent') {
  process.stderr.write(`shiftprobe: bundled build in dist/ (${Date.now() - started} ms)\n`);
}
