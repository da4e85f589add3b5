import { PassThrough } from 'node:stream';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runConsole } from '../../../src/adapters/console/console.js';
import { Application } from '../../../src/app/application.js';
import { openSqliteBackend } from '../../../src/adapters/storage/sqlite/backend.js';
import { FIXED_NOW } from '../../helpers/context.js';

async function session(lines: string[], historyPath?: string): Promise<string> {
  const input = new PassThrough();
  const output = new PassThrough();
  let text = '';
  output.on('data', (d: Buffer) => (text += d.toString('utf8')));
  const app = await Application.open(openSqliteBackend(':memory:'), { now: () => FIXED_NOW });
  const caller = { userId: 'priya', displayName: 'priya', channelId: 'console' };
  const done = runConsole({ input, output, ask: (q) => app.ask(q), caller, terminal: false, ...(historyPath ? { historyPath } : {}) });
  for (const l of lines) input.write(l + '\n');
  input.end();
  await done;
  await app.close();
  return text;
}

describe('local console', () => {
  it('answers each line with the same reply as the CLI, and leaves on exit', async () => {
    const out = await session(['rho 8.2 ohm-cm p', 'help', 'exit', 'ni 85C']);
    expect(out).toContain('Boron density');
    expect(out).toContain('command');
    expect(out).not.toContain('Intrinsic density'); // after exit nothing more is read
    expect(out).toContain('bye');
  });

  it('leaves on end of input (Ctrl-D)', async () => {
    const out = await session(['doping 1e16 phos']);
    expect(out).toContain('Resistivity');
    expect(out).toContain('bye');
  });

  it('keeps a command history file between runs', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-console-'));
    try {
      const path = join(dir, 'history');
      await session(['rho 8.2 ohm-cm p', 'ni 300K'], path);
      expect(readFileSync(path, 'utf8').trim().split('\n')).toEqual(['rho 8.2 ohm-cm p', 'ni 300K']);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('bad input gets a friendly error, and the console goes on', async () => {
    const out = await session(['rhp 8 ohm-cm p', 'rho 8.2 ohm-cm p']);
    expect(out).toContain('Did you mean: rho 8 ohm-cm p?');
    expect(out).toContain('Boron density');
  });
});

describe('the console keeps one conversation', () => {
  it('a bare `why` explains the last result, and a short answer runs the question just asked', async () => {
    const out = await session(['rho 8.2 ohm-cm p', 'why', 'rho 5 ohm-cm P', 'p']);
    expect(out).toContain('μ = 1/(q·N·ρ)');
    expect(out).toContain('p-type (boron) or phosphorus');
    expect(out.split('Boron density').length).toBeGreaterThanOrEqual(3);
  });
});
