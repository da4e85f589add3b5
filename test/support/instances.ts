/**
 * Real shiftprobe instances for the several-instances test and benchmark: each is the entry
 * point (`bin/shiftprobe.mjs --serve`) in a process of its own, Slack over HTTP on a free
 * loopback port, the given environment (DATABASE_URL for the shared PostgreSQL database).
 */
import { spawn, type ChildProcess } from 'node:child_process';

export interface Instance {
  /** http://127.0.0.1:<port>/slack/events */
  readonly eventsUrl: string;
  readonly port: number;
  /** Everything the instance wrote to stderr (its log). */
  readonly log: string[];
  readonly child: ChildProcess;
  /** SIGTERM, then the exit status. */
  stop(): Promise<number | null>;
}

export async function startInstance(env: Record<string, string>, timeoutMs = 60_000): Promise<Instance> {
  const child = spawn(process.execPath, ['bin/shiftprobe.mjs', '--serve'], {
    env: { ...process.env, PORT: '0', HOST: '127.0.0.1', SLACK_APP_TOKEN: '', DATABASE_PATH: '', ...env },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  const log: string[] = [];
  let buffered = '';
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`instance did not start within ${timeoutMs} ms:\n${log.join('\n')}`)), timeoutMs);
    child.stderr!.on('data', (d: Buffer) => {
      buffered += d.toString('utf8');
      const lines = buffered.split('\n');
      buffered = lines.pop() ?? '';
      for (const line of lines) {
        log.push(line);
        const m = /events at :(\d+)\/slack\/events/.exec(line);
        if (m) {
          clearTimeout(timer);
          resolve(Number(m[1]));
        }
      }
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`instance exited with ${code} before it started:\n${log.join('\n')}${buffered}`));
    });
  });
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  return {
    eventsUrl: `http://127.0.0.1:${port}/slack/events`,
    port,
    log,
    child,
    async stop() {
      if (child.exitCode === null) child.kill('SIGTERM');
      return exited;
    },
  };
}
