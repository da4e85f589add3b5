/** A HandleContext for tests: fixed clock, counting ids, in-memory result store. */
import { MemoryResultStore } from '../../src/adapters/storage/memory.js';
import { type HandleContext, type Surface } from '../../src/commands/context.js';
import type { LotService } from '../../src/lots/service.js';
import { demoLots } from './lots.js';

export const FIXED_NOW = new Date('2026-11-30T14:05:00Z');

export function testContext(overrides: Partial<HandleContext> & { surface?: Surface } = {}): HandleContext {
  let n = 0;
  let lots: LotService | undefined;
  return {
    surface: 'console',
    caller: { userId: 'console', channelId: 'console' },
    now: () => FIXED_NOW,
    newId: () => `r-${(++n).toString(16).padStart(6, '0')}`,
    results: new MemoryResultStore(),
    session: {},
    // Lot records over an in-memory store with the demo history, made on first use.
    get lots(): LotService {
      return (lots ??= demoLots(() => FIXED_NOW).service);
    },
    ...overrides,
  };
}
