import { describe, expect, it } from 'vitest';
import { Args } from '../../src/commands/args.js';
import { tokenize } from '../../src/commands/tokens.js';

describe('tokenize', () => {
  it('reads commas and semicolons as separators', () => {
    expect(tokenize('rho 8.2 ohm-cm, p').map((t) => t.raw)).toEqual(['rho', '8.2 ohm-cm', 'p']);
  });
  it('keeps free text after a keyword as typed, punctuation included', () => {
    const args = new Args(tokenize('LOT-B204 type w5 because repeat hot probe; tip was contaminated, see log').slice(0));
    expect(args.rest(['because'])).toBe('repeat hot probe; tip was contaminated, see log');
  });
  it('glues a unit of up to three words to its number', () => {
    expect(tokenize('45 ohm per square thick 525 um')).toMatchObject([
      { kind: 'number', value: 45, raw: '45 ohm per square' },
      { kind: 'word', text: 'thick' },
      { kind: 'number', value: 525, raw: '525 um' },
    ]);
  });
});
