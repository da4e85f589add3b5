/** The Teams app package in deploy/teams/: a manifest with our names and the two icons at the sizes Teams asks for. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const manifest = JSON.parse(readFileSync('deploy/teams/manifest.json', 'utf8')) as {
  id: string;
  name: { short: string };
  accentColor: string;
  icons: { color: string; outline: string };
  bots: { botId: string; scopes: string[]; commandLists: { commands: { title: string }[] }[] }[];
};

/** Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948). */
function pngSize(path: string): [number, number] {
  const b = readFileSync(path);
  expect(b.subarray(0, 8)).toEqual(Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]));
  return [b.readUInt32BE(16), b.readUInt32BE(20)];
}

describe('the Teams app package', () => {
  it('names our app, leaves the app id to fill in, and lists commands that work', () => {
    expect(manifest.name.short).toBe('shiftprobe');
    expect(manifest.id).toBe('{{TEAMS_APP_ID}}');
    expect(manifest.bots[0]!.botId).toBe('{{TEAMS_APP_ID}}');
    expect(manifest.bots[0]!.scopes).toEqual(['personal', 'team']);
    expect(manifest.accentColor).toMatch(/^#[0-9A-F]{6}$/);
  });

  it('icons: color 192×192 and outline 32×32 (the sizes Teams requires; common practice, no source beyond its docs)', () => {
    expect(pngSize(`deploy/teams/${manifest.icons.color}`)).toEqual([192, 192]);
    expect(pngSize(`deploy/teams/${manifest.icons.outline}`)).toEqual([32, 32]);
  });
});

describe('the manifest’s command list', () => {
  it('every listed command answers', async () => {
    const { handle } = await import('../../src/commands/handle.js');
    const { testContext } = await import('../helpers/context.js');
    for (const c of manifest.bots[0]!.commandLists[0]!.commands) {
      const reply = await handle(c.title, testContext());
      expect(reply.ok, c.title).toBe(true);
    }
  });
});
