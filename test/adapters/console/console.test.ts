import { PassThrough } from 'node:stream';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runConsole } from '../../../src/adapters/console/console.js';
import { testContext } from '../../helpers/context.js';

async function session(lines: string[], historyPath?: string): Promise<string> {
  const input = new PassThrough();
  const output = new PassThrough();
  let text = '';
  output.on('data', (d: Buffer) => (text += d.toString('utf8')));
  const done = runConsole({ input, output, context: testContext(), terminal: false, ...(historyPath ? { historyPath } : {}) });
  for (const l of lines) input.write(l + '\n');
  input.end();
  await done;
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
