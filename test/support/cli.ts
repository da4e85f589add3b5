/**
 * The real entry point (bin/shiftprobe.mjs) in a child process, with no chat surface, no
 * database URL and the demo specs unless `env` says otherwise; the exit status and both streams.
 */
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';

const run = promisify(execFile);

export const CLI_BASE_ENV = {
  ...process.env,
  SLACK_BOT_TOKEN: '',
  SLACK_APP_TOKEN: '',
  SLACK_SIGNING_SECRET: '',
  HTTP_API_PORT: '',
  TEAMS_APP_ID: '',
  TEAMS_APP_PASSWORD: '',
  SPEC_FILE: '',
  DATABASE_URL: '',
};

export async function cli(env: Record<string, string>, ...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(process.execPath, ['bin/shiftprobe.mjs', ...args], { env: { ...CLI_BASE_ENV, ...env } });
    return { code: 0, stdout, stderr };
  } catch (e) {
    const x = e as { code: number; stdout: string; stderr: string };
    return { code: x.code, stdout: x.stdout, stderr: x.stderr };
  }
}
