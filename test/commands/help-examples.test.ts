import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { COMMANDS } from '../../src/commands/registry.js';
import { CONFIRM_PROCEDURE } from '../../src/reply/cautions.js';
import { testContext } from '../helpers/context.js';

/** Help entries are data: every example they show must work, on the command it documents. */
describe('every help example answers', () => {
  for (const spec of COMMANDS) {
    for (const example of spec.help.examples) {
      it(`${spec.verb}: "${example}"`, async () => {
        // `map` and `record … map` read the measurement file sent with the message: demo 200 mm files.
        const file = spec.verb === 'map' ? 'LOT-A17-w03-rs.csv' : / map\b/.test(example) ? 'LOT-A17-w04-rs.csv' : undefined;
        const ctx = file ? testContext({ attachment: { name: file, text: readFileSync(`examples/maps/${file}`, 'utf8') } }) : testContext();
        if (spec.verb === 'why') await handle('rho 8.2 ohm-cm p', ctx);
        const r = await handle(example, ctx);
        if (!r.ok) throw new Error(`${example}: ${r.error.code} ${r.error.message}`);
        expect(r.command).toBe(spec.verb);
        if (r.decision) expect(r.cautions).toContain(CONFIRM_PROCEDURE);
      });
    }
  }
});
