/**
 * Start-up, measured in one run on this machine (not a test): one CLI answer through the bundle
 * (`node bin/shiftprobe.mjs --json "rho 8.2 ohm-cm p"`, the direct command — `npx` adds its own
 * start-up), the same conversion in a minimal Python script (bench/peers/f723_boron.py),
 * `node -e 0`, peak memory (GNU time's maximum resident set), the console to its prompt, and the
 * services (HTTP API) to ready. Runs are interleaved; medians of BENCH_RUNS (default 15).
 *
 *   npm run bench:start
 *
 * Targets (the issue): CLI ≤ 2 × the Python script and ≤ 0.30 s median on a quiet machine; peak
 * memory ≤ 100 MB; console prompt ≤ 0.6 s; service ready ≤ 1 s.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';

const RUNS = Number(process.env.BENCH_RUNS ?? 15);
const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-start-'));
const env = { ...process.env, DATABASE_PATH: join(dir, 'bench.db'), SLACK_BOT_TOKEN: '', SLACK_APP_TOKEN: '', SLACK_SIGNING_SECRET: '', DATABASE_URL: '', SHIFTPROBE_USER: 'bench' };
const GNU_TIME = existsSync('/usr/bin/time') ? '/usr/bin/time' : undefined;

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

function timed(cmd: string, args: string[]): { ms: number; peakKb?: number } {
  const t0 = performance.now();
  const r = GNU_TIME ? spawnSync(GNU_TIME, ['-f', '%M', cmd, ...args], { env, encoding: 'utf8' }) : spawnSync(cmd, args, { env, encoding: 'utf8' });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed: ${r.stderr}`);
  const peak = GNU_TIME ? Number(r.stderr.trim().split('\n').at(-1)) : undefined;
  return { ms, ...(peak !== undefined && Number.isFinite(peak) ? { peakKb: peak } : {}) };
}

/** ms from spawn until `pattern` appears on stdout or stderr; then the process is stopped. */
function until(args: string[], pattern: RegExp, extraEnv: Record<string, string> = {}): Promise<number> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    const child = spawn(process.execPath, args, { env: { ...env, ...extraEnv }, stdio: ['pipe', 'pipe', 'pipe'] });
    let out = '';
    const check = (d: Buffer) => {
      out += d.toString('utf8');
      if (pattern.test(out)) {
        const ms = performance.now() - t0;
        child.kill('SIGTERM');
        child.once('exit', () => resolve(ms));
      }
    };
    child.stdout.on('data', check);
    child.stderr.on('data', check);
    child.once('error', reject);
    setTimeout(() => reject(new Error(`no ${pattern} within 30 s: ${out}`)), 30_000).unref();
  });
}

async function main(): Promise<void> {
  if (!existsSync('dist/main.js')) throw new Error('no bundle: run npm ci (or npm run build) first');
  const cli: number[] = [];
  const peaks: number[] = [];
  const py: number[] = [];
  const bare: number[] = [];
  // One warm run each (file-system caches), not counted.
  timed(process.execPath, ['bin/shiftprobe.mjs', '--json', 'rho 8.2 ohm-cm p']);
  timed('python3', ['bench/peers/f723_boron.py', '8.2']);
  for (let i = 0; i < RUNS; i++) {
    const c = timed(process.execPath, ['bin/shiftprobe.mjs', '--json', 'rho 8.2 ohm-cm p']);
    cli.push(c.ms);
    if (c.peakKb) peaks.push(c.peakKb);
    py.push(timed('python3', ['bench/peers/f723_boron.py', '8.2']).ms);
    bare.push(timed(process.execPath, ['-e', '0']).ms);
  }
  const consoleMs: number[] = [];
  const serviceMs: number[] = [];
  for (let i = 0; i < Math.min(RUNS, 7); i++) {
    consoleMs.push(await until(['bin/shiftprobe.mjs'], /shiftprobe ▸/));
    serviceMs.push(await until(['bin/shiftprobe.mjs', '--serve'], /answering on the HTTP API/, { HTTP_API_PORT: '0', HOST: '127.0.0.1', HTTP_API_KEYS: 'bench:0123456789abcdef0123456789abcdef' }));
  }
  rmSync(dir, { recursive: true, force: true });
  const f = (x: number) => `${(x / 1000).toFixed(3)} s`;
  console.log(`node ${process.version}, ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, load average ${loadavg()[0]!.toFixed(2)}; ${RUNS} runs, medians`);
  console.log(`CLI "rho 8.2 ohm-cm p" --json     ${f(median(cli))}   peak ${peaks.length ? (median(peaks) / 1024).toFixed(0) + ' MB' : 'n/a'}`);
  console.log(`python3 minimal F723 script        ${f(median(py))}`);
  console.log(`node -e 0                          ${f(median(bare))}`);
  console.log(`console to its prompt              ${f(median(consoleMs))}`);
  console.log(`service (HTTP API) to ready        ${f(median(serviceMs))}`);
  const ratio = median(cli) / median(py);
  console.log(`CLI / Python: ${ratio.toFixed(2)}× (target ≤ 2×) ${ratio <= 2 ? 'met' : 'NOT met'}; CLI ≤ 0.30 s: ${median(cli) <= 300 ? 'met' : 'NOT met on this machine'}`);
}

await main();
