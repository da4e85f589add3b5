/** A HandleContext for tests: fixed clock, counting ids, in-memory result store. */
import { MemoryResultStore, type HandleContext, type Surface } from '../../src/commands/context.js';

export const FIXED_NOW = new Date('2026-11-30T14:05:00Z');

export function testContext(overrides: Partial<HandleContext> & { surface?: Surface } = {}): HandleContext {
  let n = 0;
  return {
    surface: 'console',
    caller: { userId: 'console', channelId: 'console' },
    now: () => FIXED_NOW,
    newId: () => `r-${(++n).toString(16).padStart(6, '0')}`,
    results: new MemoryResultStore(),
    session: {},
    ...overrides,
  };
}
