/**
 * Entry point behind `npx shiftprobe` and `npm start`:
 *   shiftprobe "<command>"          one reply as text (exit 2 on bad input)
 *   shiftprobe --json "<command>"   one reply as a JSON object (the contract in README.md)
 *   shiftprobe --serve              Slack when configured, otherwise the local console
 *   shiftprobe                      (no command) the local console
 */
import { userInfo } from 'node:os';
import { dirname, join } from 'node:path';
import { contextFor, openServices, StartupError, type Services } from './app.js';
import { digestReply } from './commands/lots/digest.js';
import { runConsole } from './adapters/console/console.js';
import { handle } from './commands/handle.js';
import { describeConfigProblems, loadConfig, readEnvironment, surfaceOf, type Config } from './config.js';
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
  '       shiftprobe                       the local console (or Slack, when configured)',
].join('\n');

export async function main(argv: readonly string[], io: MainIo = process as unknown as MainIo): Promise<number> {
  const json = argv.includes('--json');
  const serve = argv.includes('--serve');
  if (argv.includes('--help') || argv.includes('-h')) {
    io.stdout.write(USAGE + '\n');
    return 0;
  }
  const unknownFlag = argv.find((a) => a.startsWith('--') && a !== '--json' && a !== '--serve');
  if (unknownFlag) {
    io.stderr.write(`shiftprobe: unknown option ${unknownFlag}\n${USAGE}\n`);
    return 2;
  }
  const text = argv.filter((a) => a !== '--json' && a !== '--serve').join(' ');
  const loaded = loadConfig(readEnvironment({ env: io.env }));
  if (!loaded.ok) {
    io.stderr.write(describeConfigProblems(loaded.problems) + '\n');
    return 78; // configuration error (EX_CONFIG)
  }
  const config = loaded.config;
  if (text.trim() !== '' && !serve) return oneShot(text, json, config, io);
  if (surfaceOf(config) === 'slack') return startSlackSurface(config, io);
  return startConsole(config, io);
}

/** Open the database and the lot records; a bad spec file stops start-up with its problems. */
function open(config: Config, io: MainIo): Services | undefined {
  try {
    return openServices(config.base.databasePath, { lots: config.lots });
  } catch (e) {
    if (!(e instanceof StartupError)) throw e;
    io.stderr.write(`shiftprobe cannot start: ${e.message}\n`);
    return undefined;
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

async function oneShot(text: string, json: boolean, config: Config, io: MainIo): Promise<number> {
  const services = open(config, io);
  if (!services) return 78;
  try {
    const ctx = contextFor(services, 'cli', localOperator(io.env, 'cli'), {});
    const reply = await handle(text, ctx);
    io.stdout.write((json ? renderJson(reply) : renderText(reply, { width: io.stdout.columns ?? 88 })) + '\n');
    return reply.ok ? 0 : 2;
  } finally {
    services.close();
  }
}

async function startConsole(config: Config, io: MainIo): Promise<number> {
  const services = open(config, io);
  if (!services) return 78;
  // The daily summary of flagged lots prints in the console at DIGEST_AT.
  const digest = await services.lots?.startDigest(
    async (d) => {
      const reply = digestReply({ id: services.newId(), createdAt: services.now().toISOString() }, d, { demo: services.lots?.catalog.demo ?? false });
      io.stdout.write(`\n${renderText(reply, { width: io.stdout.columns ?? 88 })}\n\n`);
    },
    { channel: 'console', onError: (e) => io.stderr.write(`shiftprobe: the daily summary could not be printed: ${e instanceof Error ? e.message : String(e)}\n`) },
  );
  try {
    const ctx = contextFor(services, 'console', localOperator(io.env, 'console'), {});
    await runConsole({
      input: io.stdin as unknown as import('node:stream').Readable,
      output: io.stdout as unknown as import('node:stream').Writable,
      context: ctx,
      historyPath: join(dirname(config.base.databasePath), 'console-history'),
    });
    return 0;
  } finally {
    digest?.stop();
    services.close();
  }
}

async function startSlackSurface(config: Config, io: MainIo): Promise<number> {
  // The Slack adapter is loaded only when configured, so the console and the CLI never load Bolt.
  const { startSlack } = await import('./adapters/slack/index.js');
  return startSlack(config, { io });
}
