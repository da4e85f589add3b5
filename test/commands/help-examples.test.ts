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
        // `map` reads the measurement file sent with the message: the demo 200 mm file.
        const ctx =
          spec.verb === 'map'
            ? testContext({ attachment: { name: 'LOT-A17-w03-rs.csv', text: readFileSync('examples/maps/LOT-A17-w03-rs.csv', 'utf8') } })
            : testContext();
        if (spec.verb === 'why') await handle('rho 8.2 ohm-cm p', ctx);
        const r = await handle(example, ctx);
        if (!r.ok) throw new Error(`${example}: ${r.error.code} ${r.error.message}`);
        expect(r.command).toBe(spec.verb);
        if (r.decision) expect(r.cautions).toContain(CONFIRM_PROCEDURE);
      });
    }
  }
});
