/**
 * The corpus of shift phrasings (test/commands/corpus/shift-phrasings.txt): each line's reading,
 * and, over every reply of the corpus, the rules no reply may break:
 *   - no internal code (snake_case identifiers) and no raw library text reaches a person;
 *   - no NaN, Infinity, "undefined" or "[object Object]";
 *   - never a conductivity type contrary to a type word the person typed;
 *   - a question always offers its readings as commands, and each of them reads.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { renderJson } from '../../src/render/json.js';
import { renderSlackMessage } from '../../src/render/slack-blocks.js';
import { renderText } from '../../src/render/text.js';
import type { Reply } from '../../src/reply/reply.js';
import { testContext } from '../helpers/context.js';

interface Case {
  readonly line: number;
  readonly text: string;
  readonly expectation: string;
}

const CORPUS = new URL('./corpus/shift-phrasings.txt', import.meta.url);

function loadCorpus(): Case[] {
  return readFileSync(CORPUS, 'utf8')
    .split('\n')
    .map((l, i) => ({ l, line: i + 1 }))
    .filter(({ l }) => l.trim() !== '' && !l.startsWith('#'))
    .map(({ l, line }) => {
      const [text, expectation] = l.split('  =>  ');
      if (text === undefined || expectation === undefined) throw new Error(`corpus line ${line} has no "  =>  "`);
      return { line, text, expectation: expectation.trim() };
    });
}

/** The conductivity type a person typed, if any (p-type, type=N, P<100>, p+…), from the raw text. */
export function typedType(text: string): 'p' | 'n' | undefined {
  const before = text.split(/\bbecause\b/i)[0]!;
  const m =
    /(?:^|[\s,;])([pn])[-_ ]?typ(?:e)?\b/i.exec(before) ??
    /\b(?:type|conductivity)[\s=]+([pn])(?:\b|$)/i.exec(before) ??
    /(?:^|\s)([pn])(?:<1[01][01]>|\+\+?|--?)(?:\s|$)/i.exec(before);
  return m ? (m[1]!.toLowerCase() as 'p' | 'n') : undefined;
}

const INTERNAL_CODE = /\b[a-z]+(?:_[a-z0-9]+)+\b/;
/** Phrases of the libraries we use, which must never reach a person. */
const LIBRARY_TEXT = /Invalid input|Expected (?:number|string)|ZodError|TypeError|SyntaxError|Unexpected token|Units do not match|Unit ".*" not found|at Object\.|\bundefined\b|\[object Object\]|\bNaN\b|Infinity/;

function humanTexts(reply: Reply): string[] {
  if (!reply.ok) return [reply.error.message, reply.error.usage ?? '', reply.error.suggestion ?? '', ...(reply.error.choices ?? []).map((c) => c.label)];
  return [reply.title, ...reply.assumptions, ...reply.warnings.map((w) => w.message), ...reply.cautions, renderText(reply, { width: 80 })];
}

/** Words that look like codes but are the trade's or ours to show (model ids, value keys in help). */
const ALLOWED_CODE_WORDS = new Set(['n_i', 'c_s', 'n_d', 'n_a', 'e_f', 'e_c', 'e_v', 'e_i', 'x_j', 't_x', 'r_h', 'n_b']);

describe('shift phrasings corpus', () => {
  const cases = loadCorpus();

  it('has at least 300 phrasings', () => {
    expect(cases.length).toBeGreaterThanOrEqual(300);
  });

  it.each(cases)('line $line: "$text" → $expectation', async ({ text, expectation }) => {
    const reply = await handle(text, testContext());
    const [head, ...rest] = expectation.split(' ');
    const describeReply = reply.ok ? `${reply.command}: ${reply.title}` : `${reply.error.code}: ${reply.error.message}`;

    // The rules every reply keeps.
    for (const t of humanTexts(reply)) {
      const code = INTERNAL_CODE.exec(t.replace(/`[^`]*`/g, ''));
      if (code && !ALLOWED_CODE_WORDS.has(code[0].toLowerCase())) throw new Error(`internal code "${code[0]}" in a reply to "${text}": ${t}`);
      expect(t, `library text in a reply to "${text}"`).not.toMatch(LIBRARY_TEXT);
    }
    expect(renderJson(reply)).not.toMatch(/NaN|Infinity|"undefined"/);
    expect(() => renderSlackMessage(reply)).not.toThrow();
    const typed = typedType(text);
    if (typed && reply.ok && reply.command !== 'layer') {
      const carrierType = reply.values.find((v) => v.key === 'carrierType')?.value;
      if (carrierType !== undefined && reply.command !== 'type') expect(carrierType, `"${text}" typed ${typed}-type`).toBe(typed);
      const dopant = reply.inputs['dopant']?.value;
      if (typeof dopant === 'string') expect(dopant === 'boron' ? 'p' : 'n', `"${text}" typed ${typed}-type`).toBe(typed);
    }

    if (head === 'asks') {
      expect(reply.ok, describeReply).toBe(false);
      if (!reply.ok) {
        expect(reply.error.choices?.length ?? 0, describeReply).toBeGreaterThanOrEqual(2);
        for (const c of reply.error.choices ?? []) {
          const answered = await handle(c.command, testContext());
          expect(answered.ok, `choice "${c.command}" for "${text}": ${answered.ok ? '' : answered.error.message}`).toBe(true);
        }
      }
      return;
    }
    if (head!.startsWith('error=')) {
      expect(reply.ok, describeReply).toBe(false);
      const code = head!.slice('error='.length);
      if (!reply.ok && code !== '*') expect(reply.error.code, describeReply).toBe(code);
      return;
    }
    if (head!.startsWith('suggests=')) {
      expect(reply.ok, describeReply).toBe(false);
      if (!reply.ok) expect(reply.error.suggestion, describeReply).toBe(expectation.slice('suggests='.length));
      return;
    }
    expect(reply.ok, describeReply).toBe(true);
    if (!reply.ok) return;
    expect(reply.command).toBe(head);
    for (const part of rest) {
      const [key, want] = part.split('=') as [string, string];
      if (key === 'dopant') expect(reply.inputs['dopant']?.value, describeReply).toBe(want);
      else if (key === 'type') expect(reply.values.find((v) => v.key === 'carrierType')?.value, describeReply).toBe(want);
      else {
        const v = reply.values.find((x) => x.key === key);
        expect(v, `${key} in ${describeReply}`).toBeDefined();
        // Canonical units of what was typed: exact up to floating-point rounding of the unit factor.
        expect(v!.value as number).toBeWithinRelative(Number(want), 1e-9);
      }
    }
  });
});
