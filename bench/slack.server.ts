/**
 * One server process for bench/slack.bench.ts: `ours` (shiftprobe's Slack app, started the way
 * `npm start` starts it) or `bare` (a Bolt app that acknowledges a constant). It tells the
 * parent its port over IPC and stops when the parent says so.
 */
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { Writable } from 'node:stream';
import { App, HTTPReceiver, LogLevel } from '@slack/bolt';
import { serve } from '../src/main.js';
import { loadConfig } from '../src/config.js';

const [mode, apiUrl, databasePath] = process.argv.slice(2);
const BOT_TOKEN = process.env.BENCH_BOT_TOKEN!;
const SECRET = process.env.BENCH_SIGNING_SECRET!;
const send = (m: unknown): void => void process.send?.(m);
let stopNow: () => void = () => undefined;
const stopSignal = new Promise<void>((r) => (stopNow = r));
process.on('message', (m) => {
  if (m === 'stop') stopNow();
});

if (mode === 'bare') {
  const receiver = new HTTPReceiver({ signingSecret: SECRET, logLevel: LogLevel.ERROR });
  const app = new App({ token: BOT_TOKEN, receiver, logLevel: LogLevel.ERROR, clientOptions: { slackApiUrl: apiUrl! } });
  app.command('/shiftprobe', async ({ ack }) => ack('ok'));
  const server = (await app.start({ port: 0, host: '127.0.0.1' })) as Server;
  send({ port: (server.address() as AddressInfo).port });
  await stopSignal;
  await app.stop();
} else {
  const loaded = loadConfig({
    SLACK_BOT_TOKEN: BOT_TOKEN,
    SLACK_SIGNING_SECRET: SECRET,
    SLACK_API_URL: apiUrl,
    PORT: '0',
    HOST: '127.0.0.1',
    LOG_LEVEL: 'error',
    DATABASE_PATH: databasePath,
  });
  if (!loaded.ok) throw new Error(loaded.problems.map((p) => p.message).join('; '));
  const code = await serve(loaded.config, {
    io: { stderr: new Writable({ write: (_c, _e, done) => done() }) },
    stopSignal,
    onReady: ({ port }) => send({ port }),
  });
  process.exitCode = code;
}
process.disconnect?.();
