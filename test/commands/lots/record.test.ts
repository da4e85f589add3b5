/**
 * `record` through handle(): the text people type → stored, checked reading → the reply.
 * Bad input gets a clear error with the right form, and nothing is written.
 * Lots and products are the invented demo ones (Harrowgate Fab 3).
 */
import { describe, expect, it } from 'vitest';
import { handle } from '../../../src/commands/handle.js';
import { CONFIRM_PROCEDURE } from '../../../src/reply/cautions.js';
import type { Reply, ReplyOk } from '../../../src/reply/reply.js';
import { renderText } from '../../../src/render/text.js';
import { FIXED_NOW, testContext } from '../../helpers/context.js';
import { demoLots } from '../../helpers/lots.js';

function setup(surface: 'console' | 'slack' = 'console', caller = { userId: 'console', channelId: 'console' }) {
  const rt = demoLots(() => FIXED_NOW, {
    recordUsers: new Set(['U0PRIYA01']),
    recordChannels: new Set(),
    clearUsers: new Set(['U0PRIYA01']),
    clearChannels: new Set(),
  });
  const ctx = testContext({ lots: rt.service, surface, caller });
  const count = () => rt.repo.countReadings();
  return { rt, ctx, count };
}

function ok(r: Reply): ReplyOk {
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r;
}

const value = (r: ReplyOk, key: string) => r.values.find((v) => v.key === key)?.value;

describe('record: pass or which flag', () => {
  it('a reading inside the window passes and carries the procedure caution', async () => {
    const { ctx } = setup();
    const r = ok(await handle('record LOT-A21 w4 rho 9.8 ohm-cm', ctx));
    expect(r.command).toBe('record');
    expect(r.title).toMatch(/^LOT-A21 w4 · pass/);
    expect(value(r, 'verdict')).toBe('pass');
    expect(value(r, 'resistivityOhmCm')).toBe(9.8);
    expect(r.cautions).toContain(CONFIRM_PROCEDURE);
    expect(r.assumptions.some((a) => /invented demo specs/.test(a))).toBe(true);
  });

  it('a reading above the window says which flag and by how much', async () => {
    const { ctx } = setup();
    const r = ok(await handle('record LOT-A21 w4 site 1 rho 12.9 ohm-cm', ctx));
    expect(r.title).toContain('FLAGGED: outside window (+7.5 %)');
    expect(value(r, 'verdict')).toBe('flagged');
    expect(value(r, 'specMarginPercent')).toBeWithinRelative(-7.5, 1e-9);
    expect(r.warnings.some((w) => w.code === 'flag_out_of_window' && /7\.5 % above the 12\.0 Ω·cm maximum/.test(w.message))).toBe(true);
    expect(r.cautions.some((c) => /hold\/release procedure/.test(c))).toBe(true);
  });

  it('a sheet reading with thickness is converted to resistivity and checked', async () => {
    const { ctx } = setup();
    // ρ = Rs·t with F = 1 when no spacing is given: 125 Ω/□ × 0.0725 cm = 9.06 Ω·cm.
    const r = ok(await handle('record LOT-B205 w3 sheet 125 ohm/sq thick 725um', ctx));
    expect(value(r, 'resistivityOhmCm')).toBeWithinRelative(125 * 0.0725, 1e-12);
    expect(value(r, 'sheetResistanceOhmPerSq')).toBe(125);
    expect(r.assumptions.some((a) => /thickness factor F\(t\/s\) taken as 1/.test(a))).toBe(true);
  });

  it('a hot-probe reading of the wrong sign on an n-type product is a type mismatch', async () => {
    const { ctx } = setup();
    // Hot probe on the meter's + terminal: n-type reads positive (docs/references.md, textbook convention); −0.8 mV is p.
    const r = ok(await handle('record LOT-B204 w6 type hot -0.8mV', ctx));
    expect(value(r, 'carrierType')).toBe('p');
    expect(r.title).toContain('type mismatch');
  });

  it('record with "corrects" supersedes the earlier reading and closes its flags', async () => {
    const { ctx } = setup();
    const bad = ok(await handle('record LOT-A21 w5 rho 96 ohm-cm confirm', ctx));
    const id = String(value(bad, 'readingId'));
    const fixed = ok(await handle(`record LOT-A21 w5 rho 9.6 ohm-cm corrects ${id}`, ctx));
    expect(value(fixed, 'verdict')).toBe('pass');
    expect(fixed.sections?.find((s) => s.heading === 'Flags')?.lines?.some((l) => l.startsWith('Closed:'))).toBe(true);
  });

  it('a reading more than 3× outside the window asks to confirm and stores nothing until then', async () => {
    const { ctx, count } = setup();
    const before = await count();
    const asked = await handle('record LOT-A21 w5 rho 98 ohm-cm', ctx);
    expect(asked.ok).toBe(false);
    if (asked.ok) return;
    expect(asked.error.code).toBe('confirm_reading');
    expect(asked.error.message).toMatch(/more than 3× above the HX-200P window .* Nothing was stored/);
    expect(asked.error.choices?.[0]?.command).toBe('record LOT-A21 w5 rho 98 ohm-cm confirm');
    expect(await count()).toBe(before);
    // Answering "confirm" runs the offered command: stored once, flagged, and said so.
    const stored = ok(await handle('confirm', ctx));
    expect(value(stored, 'verdict')).toBe('flagged');
    expect(stored.assumptions.some((a) => /after confirmation/.test(a))).toBe(true);
    expect(await count()).toBe(before + 1);
    // 30 Ω·cm on a 8–12 Ω·cm product is inside ×3: flagged, not asked.
    expect(ok(await handle('record LOT-A21 w6 rho 30 ohm-cm', ctx)).command).toBe('record');
  });

  it('a repeat of the same value at the same place within minutes is said, and stored as a second reading', async () => {
    const { ctx, count } = setup();
    const first = ok(await handle('record LOT-A21 w4 site 2 rho 9.8 ohm-cm', ctx));
    const before = await count();
    const second = ok(await handle('record LOT-A21 w4 site 2 rho 9.8 ohm-cm', ctx));
    expect(await count()).toBe(before + 1);
    const note = second.warnings.find((w) => w.code === 'record_context')?.message ?? '';
    expect(note).toContain(`Same value as #${value(first, 'readingId')}`);
    expect(note).toContain('stored as a second reading');
  });

  it('the wafer’s other open flags and disagreeing type readings are mentioned', async () => {
    const { ctx } = setup();
    ok(await handle('record LOT-A21 w7 rho 12.9 ohm-cm', ctx));
    ok(await handle('record LOT-A21 w7 type hot +1.4mV', ctx));
    const r = ok(await handle('record LOT-A21 w7 type hot -1.4mV', ctx));
    const notes = r.warnings.filter((w) => w.code === 'record_context').map((w) => w.message).join(' ');
    expect(notes).toMatch(/W7 already has open flags?: .*F\d+ outside window/);
    expect(notes).toMatch(/W7 has type readings that disagree: #\d+ [np]-type .*#\d+ [np]-type/);
    expect(notes).toContain('n-type (hot +1.4mV)');
    expect(notes).toContain('p-type (hot -1.4mV)');
  });

  it('RECORD_CONFIRM_FACTOR changes the factor; 0 turns the question off', async () => {
    const rt = demoLots(() => FIXED_NOW);
    const off = Object.create(rt.service, { confirmFactor: { get: () => 0 } });
    const r = await handle('record LOT-A21 w5 rho 98 ohm-cm', testContext({ lots: off }));
    expect(r.ok).toBe(true);
  });

  it('a product-only record names the lot’s product', async () => {
    const { ctx, count } = setup();
    const r = ok(await handle('record LOT-E5 product nv-725n', ctx));
    expect(r.title).toBe('LOT-E5 · product set to NV-725N');
    expect(await count()).toBeGreaterThan(0); // the demo history
  });

  it('the text reply reads well in the console', async () => {
    const { ctx } = setup();
    const text = renderText(ok(await handle('record LOT-A21 w4 site 1 rho 12.9 ohm-cm at 24C', ctx)), { width: 100 });
    expect(text).toContain('Resistivity window');
    expect(text).toContain('corrected to');
  });
});

describe('record: the same chat event three times', () => {
  it('writes one reading; the repeats say so', async () => {
    const { ctx, count } = setup();
    const before = await count();
    const replies = [];
    for (let i = 0; i < 3; i++) replies.push(ok(await handle('record LOT-A21 w6 rho 10.2 ohm-cm', { ...ctx, eventId: 'Ev0TRIPLE1' })));
    expect(await count()).toBe(before + 1);
    expect(new Set(replies.map((r) => value(r, 'readingId'))).size).toBe(1);
    expect(replies[1]?.assumptions.some((a) => /delivered again and nothing new was written/.test(a))).toBe(true);
  });
});

describe('record: permissions', () => {
  it('a Slack user who is not listed gets a polite refusal and nothing is written', async () => {
    const { ctx, count } = setup('slack', { userId: 'U0STRANGER', channelId: 'C0RANDOM1' });
    const before = await count();
    const r = await handle('record LOT-A21 w4 rho 9.8 ohm-cm', ctx);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe('not_permitted');
      expect(r.error.message).toMatch(/^Sorry/);
      expect(r.error.message).toContain('RECORD_USERS');
    }
    expect(await count()).toBe(before);
    // Reading is open to everyone.
    expect((await handle('lot LOT-A21', ctx)).ok).toBe(true);
  });

  it('a listed Slack user may record', async () => {
    const { ctx } = setup('slack', { userId: 'U0PRIYA01', channelId: 'C0RANDOM1' });
    expect((await handle('record LOT-A21 w4 rho 9.8 ohm-cm', { ...ctx, eventId: 'Ev0P1' })).ok).toBe(true);
  });
});

describe('record: bad input gets a clear error and writes nothing', () => {
  const cases: [string, string, RegExp][] = [
    ['unknown lot format', 'record A-17 w3 rho 8.4 ohm-cm', /not a lot id here. Lot ids look like LOT-A17/],
    ['negative value', 'record LOT-A21 w3 rho -8.4 ohm-cm', /must be a positive number/],
    ['zero value', 'record LOT-A21 w3 rho 0 ohm-cm', /must be a positive number/],
    ['wrong unit', 'record LOT-A21 w3 rho 45 ohm/sq', /is a sheet resistance, but "rho" takes a resistivity/],
    ['unknown unit', 'record LOT-A21 w3 rho 8.4 furlongs', /didn't understand "furlongs"/],
    ['missing product on a new lot', 'record LOT-Q77 w1 rho 9.6 ohm-cm', /LOT-Q77 has no product yet/],
    ['product keyword without a value', 'record LOT-Q77 w1 rho 9.6 ohm-cm product', /"product" needs a word after it/],
    ['sheet without thickness', 'record LOT-B205 w1 sheet 45 ohm/sq', /needs the thickness/],
    ['wafer out of range', 'record LOT-A21 w99 rho 9 ohm-cm', /./],
    ['absurd resistivity', 'record LOT-A21 w3 rho 5e9 ohm-cm', /outside what a silicon reading can be/],
    ['temperature out of range', 'record LOT-A21 w3 rho 9 ohm-cm at 900C', /between −20 °C and 120 °C/],
    ['no reading', 'record LOT-A21 w3', /Give a reading/],
    ['no lot', 'record rho 9 ohm-cm', /Start with the lot id/],
    ['type word unknown', 'record LOT-A21 w3 type warm 2mV', /give n or p, or a probe reading/],
    ['correction of an unknown reading', 'record LOT-A21 w3 rho 9 ohm-cm corrects 999999', /There is no reading #999999/],
    ['10 kB of text', `record LOT-A21 w3 rho 9 ohm-cm ${'x'.repeat(10_000)}`, /characters/],
  ];
  for (const [name, text, message] of cases) {
    it(name, async () => {
      const { ctx, count, rt } = setup();
      const before = await count();
      const flagsBefore = (await rt.repo.listFlags({})).length;
      const r = await handle(text, ctx);
      expect(r.ok, name).toBe(false);
      if (!r.ok) {
        expect(r.error.message).toMatch(message);
        expect(r.error.message).not.toMatch(/\n\s+at /); // never a stack trace
      }
      expect(await count()).toBe(before);
      expect((await rt.repo.listFlags({})).length).toBe(flagsBefore);
    });
  }
});
