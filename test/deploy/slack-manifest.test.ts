import { readFileSync } from 'node:fs';
import { parse as parseDotenv } from 'dotenv';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config.js';

interface Manifest {
  features: { slash_commands: { command: string; usage_hint?: string; url?: string; description: string }[]; app_home: { messages_tab_enabled: boolean; messages_tab_read_only_enabled: boolean } };
  oauth_config: { scopes: { bot: string[]; user?: string[] } };
  settings: { event_subscriptions: { bot_events: string[]; request_url?: string }; interactivity: { is_enabled: boolean; request_url?: string }; socket_mode_enabled: boolean };
}

const read = (mode: string): Manifest => parse(readFileSync(`deploy/slack-manifest.${mode}.yaml`, 'utf8')) as Manifest;

describe.each(['socket', 'http'])('the %s manifest', (mode) => {
  const m = read(mode);

  it('asks for exactly the scopes the bot uses, and no user scopes', () => {
    expect([...m.oauth_config.scopes.bot].sort()).toEqual(['app_mentions:read', 'chat:write', 'commands', 'files:read', 'files:write', 'im:history', 'users:read']);
    expect(m.oauth_config.scopes.user).toBeUndefined();
  });

  it('subscribes to the events those scopes go with, and only those', () => {
    expect([...m.settings.event_subscriptions.bot_events].sort()).toEqual(['app_mention', 'message.im']);
  });

  it('has the slash command of the default configuration, with a usage hint, and interactivity on', () => {
    const defaults = loadConfig({ SLACK_BOT_TOKEN: 'xoxb-1-2-x', SLACK_APP_TOKEN: 'xapp-1-x' });
    expect(defaults.ok && defaults.config.slack?.slashCommand).toBe(m.features.slash_commands[0]!.command);
    expect(m.features.slash_commands).toHaveLength(1);
    // Slack's manifest limits: description up to 100 characters, usage hint up to 1000.
    expect(m.features.slash_commands[0]!.description.length).toBeLessThanOrEqual(100);
    expect(m.features.slash_commands[0]!.usage_hint).toMatch(/rho 8\.2 ohm-cm p/);
    expect(m.settings.interactivity.is_enabled).toBe(true);
    expect(m.features.app_home.messages_tab_enabled).toBe(true);
    expect(m.features.app_home.messages_tab_read_only_enabled).toBe(false);
  });

  it(mode === 'socket' ? 'turns Socket Mode on and needs no URL' : 'sends everything to /slack/events', () => {
    const urls = [m.features.slash_commands[0]!.url, m.settings.event_subscriptions.request_url, m.settings.interactivity.request_url];
    if (mode === 'socket') {
      expect(m.settings.socket_mode_enabled).toBe(true);
      expect(urls.filter(Boolean)).toEqual([]);
    } else {
      expect(m.settings.socket_mode_enabled).toBe(false);
      for (const url of urls) expect(url).toMatch(/^https:\/\/.+\/slack\/events$/);
    }
  });
});

describe('deploy/.env.example', () => {
  const text = readFileSync('deploy/.env.example', 'utf8');
  const example = parseDotenv(text);

  it('as shipped (no tokens) starts the console without a problem', () => {
    const r = loadConfig(example);
    expect(r.ok).toBe(true);
    expect(r.ok && r.config.slack).toBeUndefined();
    expect(r.ok && r.config.httpApi).toBeUndefined();
    expect(r.ok && r.config.teams).toBeUndefined();
  });

  it('names only variables the configuration reads', () => {
    const sources = ['src/config.ts', 'src/lots/config.ts', 'src/adapters/slack/config.ts', 'src/adapters/storage/config.ts', 'src/adapters/http/config.ts', 'src/adapters/teams/config.ts', 'src/adapters/proxy.ts'].map((f) => readFileSync(f, 'utf8')).join('\n');
    // A section's zod key (`NAME:`), or a variable read by name (the proxy's `'NAME'`).
    for (const name of Object.keys(example)) expect(sources.includes(`${name}:`) || sources.includes(`'${name}'`), name).toBe(true);
  });

  it('holds no token or secret', () => {
    expect(text).not.toMatch(/xox[bpa]-\w|xapp-\w/);
    expect(example.SLACK_SIGNING_SECRET).toBe('');
  });
});
