/**
 * The composition root, behind `npx shiftprobe` and `npm start`:
 *   shiftprobe "<command>"          one reply as text (exit 2 on bad input)
 *   shiftprobe --json "<command>"   one reply as a JSON object (the contract: docs/json-contract.md)
 *   shiftprobe --serve              every configured surface (Slack…), otherwise the local console
 *   shiftprobe                      (no command) the same
 *   shiftprobe --backup <file>      an online copy of the SQLite database (safe while it runs)
 *   shiftprobe --file wafer.csv [--png map.png] "<command>"
 *                                   the command gets the file (a measurement CSV for `map`);
 *                                   --png writes the picture of any reply that has one
 *
 * The only module that knows every part: it reads the settings, opens the storage backend,
 * builds the application layer, starts any number of surfaces in one process and the one daily
 * summary job, and stops them in order. Exit 78 (EX_CONFIG) for anything the operator must fix
 * in the settings, with a message naming the setting and no stack trace.
 */
import { existsSync, mkdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { userInfo } from 'node:os';
import { basename, dirname, join } from 'node:path';
import type { AppLogger } from './adapters/log.js';
import { proxyConfigured } from './adapters/proxy-settings.js';
import { Application, StartupError, type ApplicationOptions, type Handler } from './app/application.js';
import type { DailySummaryJob } from './app/daily-summary.js';
import { StorageError, type StorageBackend } from './app/ports.js';
import { SurfaceConfigError, type Surface } from './app/surface.js';
import { consoleSummaryNotifier, runConsole } from './adapters/console/console.js';
import type { SlackDeps, SlackRuntime } from './adapters/slack/index.js';
import { openBackend } from './adapters/storage/open.js';
import { describeConfigProblems, loadConfig, readEnvironment, surfaceOf, type Config } from './config.js';
import { MAX_FILE_BYTES } from './commands/measurement-file.js';
import { usesLotRecords } from './commands/registry.js';
import { renderJson } from './render/json.js';
import { renderText } from './render/text.js';

export interface MainIo {
  readonly stdout: NodeJS.WritableStream & { isTTY?: boolean; columns?: number };
  readonly stderr: NodeJS.WritableStream;
  readonly stdin: NodeJS.ReadableStream;
  readonly env: Readonly<Record<string, string | undefined>>;
}

const USAGE = [
  'usage: shiftprobe [--json] "<command>"   one answer, e.g. shiftprobe "rho 8.2 ohm-cm p"',
  '       shiftprobe --file wafer.csv [--png map.png] "map thick 525um p"',
  '                                        the command gets the file; --png writes the reply\'s picture',
  '       shiftprobe --backup <file>       a consistent copy of the SQLite database, taken while it runs',
  '       shiftprobe                       the local console (or the chat surfaces, when configured)',
].join('\n');

const EX_CONFIG = 78;

export async function main(argv: readonly string[], io: MainIo = process as unknown as MainIo): Promise<number> {
  const json = argv.includes('--json');
  const serveFlag = argv.includes('--serve');
  if (argv.includes('--help') || argv.includes('-h')) {
    io.stdout.write(USAGE + '\n');
    return 0;
  }
  const backupAt = argv.indexOf('--backup');
  if (backupAt >= 0) return backup(argv[backupAt + 1], io);
  const withValue = takeValueFlags(argv, ['--file', '--png']);
  if ('error' in withValue) {
    io.stderr.write(`shiftprobe: ${withValue.error}\n${USAGE}\n`);
    return 2;
  }
  const rest = withValue.rest;
  const unknownFlag = rest.find((a) => a.startsWith('--') && a !== '--json' && a !== '--serve');
  if (unknownFlag) {
    io.stderr.write(`shiftprobe: unknown option ${unknownFlag}\n${USAGE}\n`);
    return 2;
  }
  const text = rest.filter((a) => a !== '--json' && a !== '--serve').join(' ');
  const loaded = loadConfig(readEnvironment({ env: io.env }));
  if (!loaded.ok) {
    io.stderr.write(describeConfigProblems(loaded.problems) + '\n');
    return EX_CONFIG;
  }
  const config = loaded.config;
  const filePath = withValue.values['--file'];
  const pngPath = withValue.values['--png'];
  if ((filePath !== undefined || pngPath !== undefined) && text.trim() === '') {
    io.stderr.write(`shiftprobe: --file and --png go with a command, e.g. shiftprobe --file wafer.csv --png map.png "map thick 525um p"\n`);
    return 2;
  }
  if (text.trim() !== '' && !serveFlag) {
    const attachment = filePath === undefined ? undefined : readAttachment(filePath, io);
    if (attachment === null) return 2;
    return oneShot(text, json, config, io, { ...(attachment ? { attachment } : {}), ...(pngPath !== undefined ? { pngPath } : {}) });
  }
  if (surfaceOf(config) === 'serve') return serve(config, { io, env: io.env });
  return startConsole(config, io);
}

/**
 * `--backup <file>`: SQLite's online backup API copies the database page by page while other
 * processes keep writing, so the copy is consistent without stopping the service. PostgreSQL has
 * its own tools (pg_dump; docs/operations.md).
 */
async function backup(target: string | undefined, io: MainIo): Promise<number> {
  if (!target || target.startsWith('--')) {
    io.stderr.write(`shiftprobe: --backup needs the file to write, e.g. shiftprobe --backup ./backups/shiftprobe-2026-12-02.db\n`);
    return 2;
  }
  const loaded = loadConfig(readEnvironment({ env: io.env }));
  if (!loaded.ok) {
    io.stderr.write(describeConfigProblems(loaded.problems) + '\n');
    return EX_CONFIG;
  }
  const storage = loaded.config.storage;
  if (storage.kind !== 'sqlite') {
    io.stderr.write('shiftprobe: DATABASE_URL names PostgreSQL; back it up with pg_dump -Fc (docs/operations.md, "Backup and restore").\n');
    return 2;
  }
  if (existsSync(target)) {
    io.stderr.write(`shiftprobe: ${target} exists already; choose a new file (a backup never overwrites one).\n`);
    return 2;
  }
  const { openDatabase } = await import('./adapters/storage/sqlite/db.js');
  const { SQLITE_MIGRATIONS } = await import('./adapters/storage/sqlite/backend.js');
  let db;
  try {
    db = openDatabase(storage.path, SQLITE_MIGRATIONS);
  } catch (e) {
    io.stderr.write(`shiftprobe cannot back up: ${e instanceof Error ? e.message : String(e)}\n`);
    return EX_CONFIG;
  }
  try {
    mkdirSync(dirname(target), { recursive: true });
    const r = await db.backup(target);
    io.stdout.write(`Backed up ${storage.path} to ${target} (${r.totalPages} pages). Restore: stop shiftprobe, put the copy at DATABASE_PATH, start it.\n`);
    return 0;
  } catch (e) {
    io.stderr.write(`shiftprobe: the backup to ${target} failed (${(e as { code?: string }).code ?? (e instanceof Error ? e.message : 'error')}); nothing was changed in ${storage.path}.\n`);
    return 1;
  } finally {
    db.close();
  }
}

/**
 * The backend and the application; a problem the operator must fix is printed (naming the
 * setting) and undefined returned.
 */
export async function openApplication(
  config: Config,
  stderr: NodeJS.WritableStream,
  options: ApplicationOptions & { backend?: StorageBackend; withoutLots?: boolean } = {},
): Promise<Application | undefined> {
  let backend: StorageBackend | undefined;
  try {
    backend = options.backend ?? (await openBackend(config.storage, options.now ? { now: options.now } : {}));
    const { withoutLots, backend: _given, ...rest } = options;
    return await Application.open(backend, { ...(withoutLots ? {} : { lots: config.lots }), ...rest });
  } catch (e) {
    if (!options.backend) await backend?.close().catch(() => undefined);
    if (e instanceof StorageError || e instanceof StartupError) {
      stderr.write(`shiftprobe cannot start: ${e.message}\n`);
      return undefined;
    }
    throw e;
  }
}

/**
 * Who is at the console or the CLI: SHIFTPROBE_USER, or the login name, so lot records say who
 * recorded (never a placeholder such as "console user").
 */
export function localOperator(env: Readonly<Record<string, string | undefined>>, surface: 'cli' | 'console'): { userId: string; displayName: string; channelId: string } {
  let name = env['SHIFTPROBE_USER']?.trim();
  if (!name) {
    try {
      name = userInfo().username;
    } catch {
      name = undefined;
    }
  }
  name = (name || `unknown ${surface} user`).slice(0, 64);
  return { userId: name, displayName: name, channelId: surface };
}

/** `--file <path>` and `--png <path>` taken out of argv (each once, each with its path). */
function takeValueFlags(argv: readonly string[], flags: readonly string[]): { values: Record<string, string>; rest: string[] } | { error: string } {
  const values: Record<string, string> = {};
  const rest: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    const eq = a.indexOf('=');
    const flag = eq > 0 ? a.slice(0, eq) : a;
    if (!flags.includes(flag)) {
      rest.push(a);
      continue;
    }
    const value = eq > 0 ? a.slice(eq + 1) : argv[++i];
    if (value === undefined || value === '' || value.startsWith('--')) return { error: `${flag} needs a file path after it, e.g. ${flag} ${flag === '--png' ? 'map.png' : 'wafer.csv'}` };
    if (values[flag] !== undefined) return { error: `${flag} is given twice` };
    values[flag] = value;
  }
  return { values, rest };
}

/** The `--file` attachment, or null after telling the person what is wrong. */
function readAttachment(path: string, io: MainIo): { name: string; text: string } | null {
  try {
    const size = statSync(path).size;
    if (size > MAX_FILE_BYTES) {
      io.stderr.write(`shiftprobe: ${path} is ${(size / 1048576).toFixed(1)} MB; a measurement file is at most 8 MB (10 000 sites)\n`);
      return null;
    }
    return { name: basename(path), text: readFileSync(path, 'utf8') };
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    io.stderr.write(`shiftprobe: cannot read ${path}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : code === 'EACCES' ? 'permission denied' : 'unreadable'}\n`);
    return null;
  }
}

async function oneShot(
  text: string,
  json: boolean,
  config: Config,
  io: MainIo,
  extra: { attachment?: { name: string; text: string }; pngPath?: string } = {},
): Promise<number> {
  // The lot records (spec file, demo history) open only for a lot command: a conversion does not wait for them.
  const app = await openApplication(config, io.stderr, { withoutLots: !usesLotRecords(text) });
  if (!app) return EX_CONFIG;
  try {
    const asked = await app.ask({ text, surface: 'cli', caller: localOperator(io.env, 'cli'), ...(extra.attachment ? { attachment: extra.attachment } : {}) });
    if (asked.duplicate) return 0; // no event key on the CLI: cannot happen
    io.stdout.write((json ? renderJson(asked.reply) : renderText(asked.reply, { width: io.stdout.columns ?? 88 })) + '\n');
    if (extra.pngPath !== undefined && asked.reply.ok) {
      if (!asked.reply.picture) {
        io.stderr.write(`shiftprobe: this reply has no picture; ${extra.pngPath} not written (map and trend replies have one)\n`);
      } else {
        // Loaded only here: the rasteriser stays out of every other start.
        const { replyPng } = await import('./render/picture/png.js');
        try {
          writeFileSync(extra.pngPath, replyPng(asked.reply)!);
          io.stderr.write(`shiftprobe: picture written to ${extra.pngPath}\n`);
        } catch (e) {
          const code = (e as NodeJS.ErrnoException).code;
          io.stderr.write(`shiftprobe: could not write ${extra.pngPath}: ${code === 'ENOENT' ? 'no such folder' : code === 'EACCES' ? 'permission denied' : code === 'EISDIR' ? 'it is a folder' : 'write failed'}\n`);
          return 1;
        }
      }
    }
    return asked.reply.ok ? 0 : 2;
  } finally {
    await app.close();
  }
}

async function startConsole(config: Config, io: MainIo): Promise<number> {
  const app = await openApplication(config, io.stderr);
  if (!app) return EX_CONFIG;
  // The daily summary of flagged lots prints in the console at DIGEST_AT.
  const daily = app.dailySummary([consoleSummaryNotifier(io.stdout as unknown as import('node:stream').Writable)], {
    onError: (e, context) => io.stderr.write(`shiftprobe: ${context}: the summary could not be printed (${e instanceof Error ? e.message : String(e)})\n`),
  });
  await daily?.start();
  try {
    await runConsole({
      input: io.stdin as unknown as import('node:stream').Readable,
      output: io.stdout as unknown as import('node:stream').Writable,
      ask: (q) => app.ask(q),
      caller: localOperator(io.env, 'console'),
      historyPath: config.storage.kind === 'sqlite' ? join(dirname(config.storage.path), 'console-history') : undefined,
    });
    return 0;
  } finally {
    daily?.stop();
    await app.close();
  }
}

export interface ServeDeps {
  readonly io: { readonly stderr: NodeJS.WritableStream };
  /** The environment, for the proxy variables (HTTPS_PROXY, HTTP_PROXY, NO_PROXY); process.env when absent. */
  readonly env?: Readonly<Record<string, string | undefined>>;
  /** An application built already (tests: fixed clock and ids); opened from the settings when absent. */
  readonly app?: Application;
  /** Replaces the command handler (tests). */
  readonly handle?: Handler;
  readonly logger?: AppLogger;
  /** Resolves when the process should stop; SIGINT or SIGTERM when absent. */
  readonly stopSignal?: Promise<unknown>;
  /** Replaces parts of the Slack adapter's dependencies (tests: deadlines, fetch). */
  readonly slackOverrides?: Partial<SlackDeps>;
  /** Told once every surface is up (tests, the benchmarks). */
  readonly onReady?: (info: {
    readonly port: number;
    readonly app: Application;
    readonly slack?: SlackRuntime;
    readonly daily?: DailySummaryJob;
    /** Each started surface's port, by name ('slack', 'http'). */
    readonly ports: Readonly<Record<string, number>>;
  }) => void;
}

function untilSignal(): Promise<string> {
  return new Promise((resolve) => {
    const done = (signal: string): void => {
      process.off('SIGINT', onInt);
      process.off('SIGTERM', onTerm);
      resolve(signal);
    };
    const onInt = (): void => done('SIGINT');
    const onTerm = (): void => done('SIGTERM');
    process.on('SIGINT', onInt);
    process.on('SIGTERM', onTerm);
  });
}

function codeOf(e: unknown): string | undefined {
  const c = (e as { code?: unknown; original?: { code?: unknown } } | undefined)?.code ?? (e as { original?: { code?: unknown } } | undefined)?.original?.code;
  return typeof c === 'string' ? c : undefined;
}

/**
 * Every configured surface in one process, on one backend, with one daily job; runs until
 * SIGINT/SIGTERM (or `stopSignal`). 0 after a clean stop, 78 when the settings are wrong, 1 when
 * start-up failed otherwise.
 */
export async function serve(config: Config, deps: ServeDeps): Promise<number> {
  const secrets = [
    config.slack?.botToken.reveal(),
    config.slack?.transport === 'socket' ? config.slack.appToken.reveal() : config.slack?.signingSecret.reveal(),
    config.storage.kind === 'postgres' ? config.storage.url.reveal() : undefined,
    config.teams?.appPassword.reveal(),
    ...(config.httpApi?.keys.map((k) => k.key.reveal()) ?? []),
  ].filter(
    (s): s is string => s !== undefined && s !== '',
  );
  // pino loads with a service only.
  const { createLogger } = await import('./adapters/log.js');
  const logger = deps.logger ?? createLogger({ sink: (line) => deps.io.stderr.write(line + '\n'), level: config.base.logLevel, secrets, format: config.base.logFormat ?? ((deps.io.stderr as { isTTY?: boolean }).isTTY ? 'text' : 'json') });
  // Metrics for every surface's /metrics; the gauges read the database at scrape time.
  let built: Application | undefined;
  // prom-client and undici (the proxy) load only for a service: the CLI and the console never pay for them.
  const { createMetrics } = await import('./adapters/metrics.js');
  const metrics = createMetrics(() => ({
    ...(built?.lots ? { readingsStored: () => built!.lots!.repo.countReadings(), flagsOpen: async () => (await built!.lots!.repo.listFlags({ openOnly: true })).length } : {}),
    ...(built ? { storeHealthy: () => built!.backend.healthy() } : {}),
  }));
  const app = deps.app ?? (await openApplication(config, deps.io.stderr, { metrics, ...(deps.handle ? { handle: deps.handle } : {}) }));
  built = app;
  if (!app) return EX_CONFIG;
  const env = deps.env ?? process.env;
  const outbound = proxyConfigured(env) ? (await import('./adapters/proxy.js')).proxiedFetch(env) : undefined;
  if (outbound) logger.info('outbound HTTP goes through the proxy named by HTTPS_PROXY / HTTP_PROXY (NO_PROXY excepted)');
  const surfaces: Surface[] = [];
  let slack: SlackRuntime | undefined;
  if (config.slack) {
    // Loaded only when configured, so the console and the CLI never load Bolt.
    const { slackSurface } = await import('./adapters/slack/index.js');
    const s = slackSurface(app, {
      slack: config.slack,
      port: config.base.port,
      host: config.base.host,
      logger,
      digestChannel: config.lots.digest.channel,
      stopGraceMs: config.base.shutdownGraceMs,
      ...(outbound ? { fetch: outbound } : {}),
      ...(deps.slackOverrides ? { overrides: deps.slackOverrides } : {}),
    });
    slack = s.runtime;
    surfaces.push(s);
  }
  if (config.httpApi) {
    const { httpApiSurface } = await import('./adapters/http/index.js');
    surfaces.push(httpApiSurface(app, { config: config.httpApi, host: config.base.host, log: logger, stopGraceMs: config.base.shutdownGraceMs }));
  }
  if (config.teams) {
    const { teamsSurface } = await import('./adapters/teams/index.js');
    surfaces.push(teamsSurface(app, { config: config.teams, host: config.base.host, log: logger, stopGraceMs: config.base.shutdownGraceMs, ...(outbound ? { fetch: outbound } : {}) }));
  }
  const started: Surface[] = [];
  let daily: DailySummaryJob | undefined;
  try {
    let port = 0;
    const ports: Record<string, number> = {};
    for (const s of surfaces) {
      const up = await s.start();
      started.push(s);
      if (up.port !== undefined && port === 0) port = up.port;
      if (up.port !== undefined) ports[s.name] = up.port;
      logger.info(`shiftprobe is answering on ${up.description}`);
    }
    const notifiers = started.map((s) => s.summaryNotifier()).filter((n) => n !== undefined);
    daily = app.dailySummary(notifiers, { onError: (e, context) => logger.error(`shiftprobe: ${context} could not be posted:`, e) });
    await daily?.start();
    deps.onReady?.({ port, ports, app, ...(slack ? { slack } : {}), ...(daily ? { daily } : {}) });
    const signal = await (deps.stopSignal ?? untilSignal());
    logger.info(`shiftprobe is stopping${typeof signal === 'string' ? ` (${signal})` : ''}: no new requests; answers in flight finish (up to ${config.base.shutdownGraceMs} ms), then the database closes`);
    return 0;
  } catch (error) {
    if (error instanceof SurfaceConfigError) {
      deps.io.stderr.write(`shiftprobe cannot start: ${error.message}\n`);
      return EX_CONFIG;
    }
    if (codeOf(error) === 'EADDRINUSE' || codeOf(error) === 'EACCES') {
      const where = `${config.base.host ?? 'all addresses'} port ${config.base.port}`;
      deps.io.stderr.write(
        codeOf(error) === 'EADDRINUSE'
          ? `shiftprobe cannot start: PORT ${config.base.port} is already in use (${where}): another shiftprobe or another program is listening there. Stop it, or set PORT to a free port.\n`
          : `shiftprobe cannot start: PORT ${config.base.port} may not be opened by this user (${where}). Use a port above 1023, or set PORT to one that is allowed.\n`,
      );
      return EX_CONFIG;
    }
    logger.error('shiftprobe could not start:', error);
    return 1;
  } finally {
    daily?.stop();
    for (const s of started.reverse()) await s.stop().catch((e: unknown) => logger.error(`stopping ${s.name} failed:`, e));
    if (!deps.app) await app.close();
  }
}
