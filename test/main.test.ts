import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';

const run = promisify(execFile);
const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-cli-'));
const env = { ...process.env, DATABASE_PATH: join(dir, 'cli.db'), SLACK_BOT_TOKEN: '', SLACK_APP_TOKEN: '', SLACK_SIGNING_SECRET: '' };
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function cli(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(process.execPath, ['bin/shiftprobe.mjs', ...args], { env, cwd: process.cwd() });
    return { code: 0, stdout, stderr };
  } catch (e) {
    const x = e as { code: number; stdout: string; stderr: string };
    return { code: x.code, stdout: x.stdout, stderr: x.stderr };
  }
}

describe('the one-shot CLI (bin/shiftprobe.mjs, the file behind `npx shiftprobe`)', () => {
  it('prints one reply as text', async () => {
    const r = await cli('rho 8.2 ohm-cm p');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Boron density\s+1\.6\d×10¹⁵ cm⁻³/);
  });

  it('--json prints one JSON object in the contract shape', async () => {
    const r = await cli('--json', 'rho 8.2 ohm-cm p');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j).toMatchObject({ ok: true, command: 'rho' });
    expect(typeof j.id).toBe('string');
    expect(j.values.dopantDensityPerCm3).toMatchObject({ unit: 'cm⁻³' });
    expect(typeof j.values.dopantDensityPerCm3.value).toBe('number');
    expect(j.values.carrierType.value).toBe('p');
    expect(j.model).toHaveProperty('citation');
    expect(Array.isArray(j.assumptions) && Array.isArray(j.warnings) && Array.isArray(j.cautions)).toBe(true);
  });

  it('bad input: ok:false and exit status 2', async () => {
    const r = await cli('--json', 'rho -3 ohm-cm p');
    expect(r.code).toBe(2);
    const j = JSON.parse(r.stdout);
    expect(j.ok).toBe(false);
    expect(j.error).toHaveProperty('code');
    expect(j.error).toHaveProperty('message');
    expect(j.error.usage).toContain('rho');
  });

  it('a later call can explain an earlier result by id (results are kept in the database)', async () => {
    const first = JSON.parse((await cli('--json', 'doping 2e15 boron')).stdout);
    const why = await cli('why', first.id);
    expect(why.code).toBe(0);
    expect(why.stdout).toContain('Equations');
  });
}, 60_000);
