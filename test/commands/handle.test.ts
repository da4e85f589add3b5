import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { CONFIRM_PROCEDURE } from '../../src/reply/cautions.js';
import { renderText } from '../../src/render/text.js';
import { testContext } from '../helpers/context.js';

async function ok(text: string) {
  const r = await handle(text, testContext());
  if (!r.ok) throw new Error(`expected ok for "${text}", got ${r.error.code}: ${r.error.message}`);
  return r;
}

async function err(text: string) {
  const r = await handle(text, testContext());
  if (r.ok) throw new Error(`expected an error for "${text}", got ${r.title}`);
  return r.error;
}

describe('handle: verbs and order-free tokens', () => {
  it('rho with tokens in any order gives the same density', async () => {
    const a = await ok('rho 8.2 ohm-cm p');
    const b = await ok('rho p 8.2 ohm-cm');
    const c = await ok('RHO 8.2 Ω·cm boron');
    const n = (r: typeof a) => r.values.find((v) => v.key === 'dopantDensityPerCm3')!.value;
    expect(n(b)).toBe(n(a));
    expect(n(c)).toBe(n(a));
  });

  it('a leading quantity implies the verb: "8.2 ohm-cm p" is rho', async () => {
    expect((await ok('8.2 ohm-cm p')).command).toBe('rho');
    expect((await ok('2e15 cm-3 boron')).command).toBe('doping');
    expect((await ok('45 ohm/sq')).command).toBe('sheet');
    expect((await ok('85C')).command).toBe('ni');
  });

  it('key=value and key value are the same', async () => {
    const a = await ok('rho 8.2 ohm-cm p model=masetti');
    const b = await ok('rho 8.2 ohm-cm p model masetti');
    expect(a.model?.id).toBe(b.model?.id);
    expect(a.model?.id).toContain('masetti');
  });

  it('every decision reply carries the procedure caution; help does not need it', async () => {
    for (const t of ['rho 8.2 ohm-cm p', 'doping 2e15 boron', 'ni 85C', 'type hot +2.1mV', 'sheet 45 ohm/sq thick 525um n']) {
      expect((await ok(t)).cautions).toContain(CONFIRM_PROCEDURE);
    }
    expect((await ok('help')).decision).toBe(false);
  });

  it('hot-probe replies carry the heat hazard caution', async () => {
    const r = await ok('type hot +2.1mV');
    expect(r.cautions.some((c) => /hot probe/i.test(c))).toBe(true);
  });

  it('why explains the last result and a result by id', async () => {
    const ctx = testContext();
    const first = await handle('rho 8.2 ohm-cm p', ctx);
    await handle('doping 1e16 phos', ctx);
    expect(first.ok).toBe(true);
    const last = await handle('why', ctx);
    expect(last.ok && last.title).toContain('r-000002');
    const byId = await handle(`why ${first.ok ? first.id : ''}`, ctx);
    expect(byId.ok && byId.sections?.some((s) => s.heading === 'Equations')).toBe(true);
  });
});

describe('handle: bad input gets a clear error with the right form', () => {
  it('empty input', async () => {
    expect((await err('   ')).code).toBe('empty');
  });
  it('unknown verb with a did-you-mean: the whole corrected command', async () => {
    const e = await err('rhp 8.2 ohm-cm p');
    expect(e.code).toBe('unknown_command');
    expect(e.suggestion).toBe('rho 8.2 ohm-cm p');
    expect((await err('dopign 2e15 B')).suggestion).toBe('doping 2e15 B');
  });
  it('negative and zero resistivity are refused, not converted', async () => {
    expect((await err('rho -8.2 ohm-cm p')).message).toMatch(/greater than zero/);
    expect((await err('rho 0 ohm-cm p')).message).toMatch(/greater than zero/);
  });
  it('NaN and huge exponents', async () => {
    expect((await err('rho NaN ohm-cm p')).usage).toContain('rho');
    expect((await err('rho 1e999 ohm-cm p')).code).toBe('not_finite');
  });
  it('wrong dimension says what was expected', async () => {
    const e = await err('rho 8.2 mV p');
    expect(e.message).toMatch(/not a resistivity/);
    const k = await err('sheet 45 ohm/sq thick 5 mV');
    expect(k.message).toMatch(/a voltage.*takes a length/);
  });
  it('a missing dopant asks for it', async () => {
    expect((await err('rho 8.2 ohm-cm')).message).toMatch(/dopant or type/);
  });
  it('words it does not understand are named', async () => {
    const e = await err('rho 8.2 ohm-cm p banana');
    expect(e.message).toContain('banana');
    expect(e.usage).toContain('rho');
  });
  it('10 kB of junk gets a clear refusal', async () => {
    expect((await err('x'.repeat(10_000))).code).toBe('too_long');
    expect((await err('rho ' + '8.2 '.repeat(400))).code).not.toBe('internal');
  });
  it('errors render as text without a stack trace', async () => {
    const text = renderText(await handle('rho -1 ohm-cm p', testContext()));
    expect(text).not.toMatch(/at .*\.ts:\d+/);
    expect(text).toContain('Form:');
  });
});

describe('handle: property — no input string crashes the parser', () => {
  const vocabulary = fc.constantFrom(
    'rho', 'doping', 'sheet', 'type', 'ni', 'why', 'help', 'models', 'hot', 'cold', 'hall', 'point', 'spv',
    'p', 'n', 'B', 'P', 'As', 'Sb', 'boron', 'model', 'masetti', 'thick', 'spacing', 'diam', 'at', 'expect', 'noise',
    '8.2', '-1', '0', '1e400', 'NaN', '1.5x10^15', 'ohm-cm', 'Ω·cm', 'ohm/sq', 'mV', 'mA', 'um', 'K', 'C', 'cm-3', '=', '+', '−',
    // prototype keys, which once crashed plain-object look-ups
    'constructor', '__proto__', 'toString', 'hasOwnProperty', 'valueOf', 'prototype', '__defineGetter__',
    // unicode look-alikes: ohm sign vs omega, micro sign vs mu, times vs x, minus vs hyphen, NBSP
    'Ω·cm', 'Ω·cm', '8.2Ω', 'µm', 'μm', '1.5×10¹⁵', '1.5x10¹⁵', '−1.4mV', '8.2\u00a0ohm-cm', '8,2', '1,500', '1,5e15',
    // chat markup and framing
    '*rho*', '_p_', '`8.2 ohm-cm`', '~n~', '<@U012ABCDEF>', '<#C012ABC|fab>', '&gt;', '```', 'what is', '?', '@', 'P type', 'type=P', 'P<100>', 'N/Ph', 'p+',
    'ohms', 'MOHM-CM', 'mils', 'because', 'record', 'LOT-A17', 'w3', 'site', 'confirm',
  );
  it('random token soups always give a Reply, never an internal error', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(vocabulary, { maxLength: 12 }), async (words) => {
        const r = await handle(words.join(' '), testContext());
        expect(typeof r.ok).toBe('boolean');
        if (!r.ok) expect(r.error.code).not.toBe('internal');
      }),
      { numRuns: 400 },
    );
  });
  it('a type word typed is never contradicted by the reply', async () => {
    const typeWord = fc.constantFrom('P type', 'type P', 'type=P', 'P-type', 'ptype', 'p', 'N type', 'type=N', 'n-type', 'n');
    const reading = fc.constantFrom('rho 8.2 ohm-cm', 'doping 1e15', 'sheet 45 ohm/sq thick 525um', '8.2 ohm-cm', 'rho 0.02 ohms');
    await fc.assert(
      fc.asyncProperty(reading, typeWord, fc.boolean(), async (r, t, before) => {
        const text = before ? `${r} ${t}` : `${t} ${r}`;
        const reply = await handle(text, testContext());
        const typed = t.toLowerCase().replace('type', '').includes('p') ? 'p' : 'n';
        expect(reply.ok, text).toBe(true);
        if (reply.ok) expect(reply.values.find((v) => v.key === 'carrierType')?.value, text).toBe(typed);
      }),
      { numRuns: 200 },
    );
  });
  it('arbitrary unicode strings always give a Reply, never an internal error', async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ maxLength: 200, unit: 'grapheme' }), async (s) => {
        const r = await handle(s, testContext());
        if (!r.ok) expect(r.error.code).not.toBe('internal');
      }),
      { numRuns: 400 },
    );
  });
});

describe('handle: result ids', () => {
  it('a random id that clashes with an older result is re-drawn, never an error', async () => {
    const ids = ['r-aaaaaa', 'r-aaaaaa', 'r-bbbbbb'];
    const ctx = testContext({ newId: () => ids.shift() ?? 'r-cccccc' });
    const first = await handle('rho 8.2 ohm-cm p', ctx);
    const second = await handle('doping 1e16 phos', ctx);
    expect(first.ok && first.id).toBe('r-aaaaaa');
    expect(second.ok && second.id).toBe('r-bbbbbb');
    const why = await handle('why r-aaaaaa', ctx);
    expect(why.ok && why.title).toContain('Boron');
  });
});
