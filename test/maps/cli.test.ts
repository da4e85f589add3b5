/** `shiftprobe --file … [--png …] "<command>"` through the real entry point. */
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-map-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const DEMO = 'examples/maps/LOT-A17-w03-rs.csv';

describe('the CLI with a measurement file', () => {
  it('answers `map` from --file and writes the picture with --png', async () => {
    const png = join(dir, 'w03.png');
    const r = await cli({ DATABASE_PATH: join(dir, 'a.db') }, '--file', DEMO, '--png', png, 'map thick 525um p diam 200mm');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Wafer map W03 — sheet resistance: non-uniformity/);
    expect(r.stderr).toContain(`picture written to ${png}`);
    expect(readFileSync(png).subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
  });
  it('--json carries every site', async () => {
    const r = await cli({ DATABASE_PATH: join(dir, 'b.db') }, '--json', `--file=${DEMO}`, 'map');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout) as { picture: { sites: { value: unknown[] } } };
    expect(json.picture.sites.value).toHaveLength(49);
  });
  it('a missing file is named, with no stack trace', async () => {
    const r = await cli({ DATABASE_PATH: join(dir, 'c.db') }, '--file', join(dir, 'nope.csv'), 'map');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/cannot read .*nope\.csv: no such file/);
    expect(r.stderr).not.toMatch(/at .*\.js:\d+/);
  });
  it('--png on a reply without a picture says so and writes nothing', async () => {
    const png = join(dir, 'none.png');
    const r = await cli({ DATABASE_PATH: join(dir, 'd.db') }, '--png', png, 'rho 8.2 ohm-cm p');
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/has no picture/);
    expect(existsSync(png)).toBe(false);
  });
  it('--file needs a path', async () => {
    const r = await cli({}, 'map', '--file');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--file needs a file path/);
  });
});
