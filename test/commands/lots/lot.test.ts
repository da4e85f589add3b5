/** `lot`, `flags`, `clear` and `digest` through handle(), on the invented demo history. */
import { describe, expect, it } from 'vitest';
import { handle } from '../../../src/commands/handle.js';
import { CONFIRM_PROCEDURE } from '../../../src/reply/cautions.js';
import type { Reply, ReplyOk } from '../../../src/reply/reply.js';
import { FIXED_NOW, testContext } from '../../helpers/context.js';
import { demoLots } from '../../helpers/lots.js';
import { NO_CHAT_WRITERS } from '../../../src/lots/permissions.js';

function ok(r: Reply): ReplyOk {
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r;
}
const value = (r: ReplyOk, key: string) => r.values.find((v) => v.key === key)?.value;

describe('lot', () => {
  it('shows product, wafers, open flags, readings latest first and who recorded them', async () => {
    const ctx = testContext();
    const r = ok(await handle('lot lot-a17', ctx));
    expect(r.title).toBe('LOT-A17 · HX-200P · 2 open flags');
    expect(value(r, 'openFlagCount')).toBe(2);
    const headings = r.sections?.map((s) => s.heading);
    expect(headings).toEqual(['Product HX-200P', 'Wafers', 'Open flags', 'Readings, latest first', 'Recorded by']);
    const readings = r.sections?.find((s) => s.heading === 'Readings, latest first')?.table;
    const ids = readings?.rows.map((row) => Number(row[0]));
    expect(ids).toEqual([...(ids ?? [])].sort((a, b) => b - a));
    expect(readings?.rows[0]?.[5]).toBe('Tomasz Reyes');
    expect(r.cautions).toContain(CONFIRM_PROCEDURE);
  });

  it('an unknown lot says so and suggests a known one', async () => {
    const r = await handle('lot LOT-A1', testContext());
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe('unknown_lot');
      expect(r.error.suggestion).toMatch(/^lot LOT-A1\d$/);
    }
  });

  it('a corrected reading is shown as corrected, the correction says what it replaced', async () => {
    const r = ok(await handle('lot LOT-A21', testContext()));
    const rows = r.sections?.find((s) => s.heading === 'Readings, latest first')?.table?.rows ?? [];
    expect(rows.some((row) => /corrected by #\d+/.test(row[4] ?? ''))).toBe(true);
    expect(rows.some((row) => /corrects #\d+/.test(row[4] ?? ''))).toBe(true);
  });
});

describe('flags', () => {
  it('lists every open flag with reason and age; periods narrow to what was raised', async () => {
    const ctx = testContext();
    const open = ok(await handle('flags', ctx));
    expect(open.title).toBe('Open flags: 6 on 5 lots');
    const rows = open.sections?.[0]?.table?.rows ?? [];
    expect(rows.find((row) => row[1] === 'LOT-B204')?.[6]).toBe('type mismatch: reads p-type (hot probe); the product is n-type');
    expect(rows.find((row) => row[1] === 'LOT-C31')?.[4]).toBe('2 d');
    const today = ok(await handle('flags today', ctx));
    expect(today.title).toMatch(/^Flags raised today \(since 2026-11-30 00:00 GMT\): 4 on 3 lots$/);
    const week = ok(await handle('flags 7d', ctx));
    // The week also holds the flags that were closed since (corrected or cleared).
    expect(Number(value(week, 'flagCount'))).toBeGreaterThan(Number(value(week, 'openFlagCount')));
  });

  it('a wrong period is explained', async () => {
    const r = await handle('flags yesterday', testContext());
    expect(!r.ok && r.error.message).toContain('today, 24h or 7d');
  });
});

describe('clear', () => {
  it('closes the flag with the reason, kept in the history', async () => {
    const rt = demoLots(() => FIXED_NOW);
    const ctx = testContext({ lots: rt.service });
    const r = ok(await handle('clear LOT-B204 type w5 because repeat hot probe and SPV both read n-type; tip was contaminated', ctx));
    expect(r.title).toMatch(/^LOT-B204 · cleared F\d+$/);
    const lot = ok(await handle('lot LOT-B204', ctx));
    expect(lot.title).toBe('LOT-B204 · NV-725N · no open flags');
    const cleared = lot.sections?.find((s) => s.heading?.startsWith('Cleared flags'))?.lines?.[0] ?? '';
    expect(cleared).toContain('cleared by console: “repeat hot probe and SPV both read n-type; tip was contaminated”');
  });

  it('needs a reason, names the flag, and says which when there are several', async () => {
    const ctx = testContext();
    const noReason = await handle('clear LOT-A17 window', ctx);
    expect(!noReason.ok && noReason.error.code).toBe('missing_reason');
    const noFlag = await handle('clear LOT-A17 because fine', ctx);
    expect(!noFlag.ok && noFlag.error.code).toBe('missing_flag');
    const none = await handle('clear LOT-A21 window because fine', ctx);
    expect(!none.ok && none.error.message).toBe('LOT-A21 has no open flags to clear.');
    const all = ok(await handle('clear LOT-A17 all because lot scrapped per engineering disposition', ctx));
    expect(value(all, 'clearedFlagCount')).toBe(2);
  });
});

/** A lot store with the demo specs and no history. */
function emptyLotsContext() {
  return testContext({ lots: demoLots(() => FIXED_NOW, NO_CHAT_WRITERS, { history: false }).service });
}

describe('digest', () => {
  it('the preview groups flagged lots by product with counts and posts nothing', async () => {
    const ctx = testContext();
    const r = ok(await handle('digest', ctx));
    expect(r.title).toBe('Summary preview · 5 flagged lots (HX-200P 2, HX-50PP 1, NV-725N 1, ZX-410P 1)');
    expect(r.sections?.map((s) => s.heading).filter(Boolean)).toEqual([
      'HX-200P — 2 lots, 3 flags (2 new, 3 open)',
      'HX-50PP — 1 lot, 1 flag (0 new, 1 open)',
      'NV-725N — 1 lot, 1 flag (1 new, 1 open)',
      'ZX-410P — 1 lot, 1 flag (1 new, 1 open)',
    ]);
    expect(r.assumptions[0]).toMatch(/^Preview: nothing was posted/);
  });

  it('a clean day gives the short "no flagged lots" line', async () => {
    const ctx = emptyLotsContext();
    ok(await handle('record LOT-A21 w1 rho 9.7 ohm-cm product HX-200P', ctx));
    const r = ok(await handle('digest', ctx));
    expect(r.title).toBe('Summary preview · no flagged lots');
    expect(r.sections?.some((s) => s.lines?.some((l) => l.startsWith('No flagged lots.')))).toBe(true);
    expect(r.cautions).toContain(CONFIRM_PROCEDURE);
  });

  it('a flag closed by correcting its reading does not count the lot as flagged', async () => {
    const ctx = emptyLotsContext();
    const typo = ok(await handle('record LOT-A21 w1 rho 14.7 ohm-cm product HX-200P', ctx));
    expect(ok(await handle('digest', ctx)).title).toMatch(/1 flagged lot/);
    const id = typo.values.find((v) => v.key === 'readingId')!.value;
    ok(await handle(`record LOT-A21 w1 rho 9.7 ohm-cm corrects ${id}`, ctx));
    expect(ok(await handle('digest', ctx)).title).toBe('Summary preview · no flagged lots');
  });
});
