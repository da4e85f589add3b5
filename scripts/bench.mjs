#!/usr/bin/env node
/**
 * Runs benchmarks on the code as it ships: each entry is bundled by esbuild (as `npm run build`
 * bundles src/ into dist/) and run by plain Node. Under a TypeScript loader the same hot loops
 * ran up to twice as slow (measured 2026-12-02: Masetti ρ→N 660 ns per element under tsx,
 * 310 ns bundled), which is not what a fab's server runs.
 *
 *   node scripts/bench.mjs bench/physics.bench.ts [bench/other.bench.ts …] [-- args for each]
 */
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { basename, join } from 'node:path';

const split = process.argv.indexOf('--');
const entries = process.argv.slice(2, split < 0 ? undefined : split);
const args = split < 0 ? [] : process.argv.slice(split + 1);
const outDir = join('node_modules', '.cache', 'shiftprobe-bench');
mkdirSync(outDir, { recursive: true });
for (const entry of entries) {
  const outfile = join(outDir, basename(entry).replace(/\.ts$/, '.mjs'));
  await build({
    entryPoints: [entry],
    bundle: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    outfile,
    packages: 'external',
    logLevel: 'warning',
  });
  const run = spawnSync(process.execPath, [outfile, ...args], { stdio: 'inherit' });
  if (run.status !== 0) process.exit(run.status ?? 1);
}
