/** The lot settings: defaults, and each malformed variable named in its problem. */
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config.js';
import { DEMO_SPEC_FILE } from '../../src/lots/config.js';

const problemsFor = (env: Record<string, string>) => {
  const r = loadConfig(env);
  return r.ok ? [] : r.problems;
};

describe('lot settings', () => {
  it('defaults: demo specs, 07:00 UTC, nobody on chat may write, the demo lot pattern', () => {
    const r = loadConfig({});
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const lots = r.config.lots;
    expect(lots.specFile).toBe(DEMO_SPEC_FILE);
    expect(lots.demoSpecs).toBe(true);
    expect(lots.digest).toEqual({ at: '07:00', timeZone: 'UTC' });
    expect(lots.permissions.recordUsers.size + lots.permissions.clearChannels.size).toBe(0);
    expect(lots.lotIds.pattern.test('LOT-A17')).toBe(true);
    expect(r.config.storage).toEqual({ kind: 'sqlite', path: './data/shiftprobe.db' });
  });

  it('reads ids, channel, time and zone', () => {
    const r = loadConfig({
      SPEC_FILE: '/etc/shiftprobe/specs.yaml',
      DIGEST_CHANNEL: 'C0DIGEST1',
      DIGEST_AT: '06:45',
      DIGEST_TZ: 'Europe/London',
      RECORD_USERS: 'U0PRIYA01, U0TOMASZ1',
      RECORD_CHANNELS: 'C0SHIFTA1',
      CLEAR_USERS: 'U0PRIYA01',
      LOT_PATTERN: '^K[0-9]{7}\\.[0-9]$',
      LOT_EXAMPLE: 'K2345678.1',
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const l = r.config.lots;
    expect(l.demoSpecs).toBe(false);
    expect(l.digest).toEqual({ channel: 'C0DIGEST1', at: '06:45', timeZone: 'Europe/London' });
    expect([...l.permissions.recordUsers]).toEqual(['U0PRIYA01', 'U0TOMASZ1']);
    expect(l.lotIds.pattern.test('K2345678.1')).toBe(true);
  });

  it('each malformed variable gives a problem naming it', () => {
    const cases: [Record<string, string>, string][] = [
      [{ DIGEST_AT: '7am' }, 'DIGEST_AT'],
      [{ DIGEST_AT: '24:00' }, 'DIGEST_AT'],
      [{ DIGEST_TZ: 'Mars/Olympus' }, 'DIGEST_TZ'],
      [{ DIGEST_CHANNEL: '#shift-a' }, 'DIGEST_CHANNEL'],
      [{ RECORD_USERS: 'priya' }, 'RECORD_USERS'],
      [{ CLEAR_CHANNELS: 'U0PRIYA01' }, 'CLEAR_CHANNELS'],
      [{ LOT_PATTERN: '([' }, 'LOT_PATTERN'],
      [{ LOT_PATTERN: '^K[0-9]+$', LOT_EXAMPLE: 'LOT-A17' }, 'LOT_EXAMPLE'],
    ];
    for (const [env, variable] of cases) {
      const problems = problemsFor(env);
      expect(problems.map((p) => p.variable), JSON.stringify(env)).toEqual([variable]);
      expect(problems[0]?.message).toContain(variable);
    }
  });
});
