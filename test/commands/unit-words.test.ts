/** The unit words the tokenizer checks before asking mathjs are those of the installed mathjs. */
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { parseQuantity } from '../../src/commands/units.js';

describe('unit words (src/commands/unit-words.ts)', () => {
  it('match the installed mathjs (scripts/make-unit-words.mjs --check)', () => {
    expect(() => execFileSync(process.execPath, ['scripts/make-unit-words.mjs', '--check'], { stdio: 'pipe' })).not.toThrow();
  });
  it('turn down words that cannot be units of ours, and still let mathjs read the rest', () => {
    expect(parseQuantity('8.2 ohm cm p').ok).toBe(false);
    expect(parseQuantity('8.2 ohm cm at').ok).toBe(false);
    // Read by mathjs (no shortcut for them): inches, feet and kiloohm-metres.
    const inch = parseQuantity('2 inch');
    expect(inch.ok && inch.quantity.value).toBeCloseTo(5.08, 12);
    const kohmM = parseQuantity('1.5 kohm*m');
    expect(kohmM.ok && kohmM.quantity.dimension).toBe('resistivity');
    expect(kohmM.ok && kohmM.quantity.value).toBeCloseTo(1.5e5, 6);
  });
});
