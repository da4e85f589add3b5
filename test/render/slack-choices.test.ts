/** A question's readings become Slack buttons: one per choice, each carrying the whole command. */
import { describe, expect, it } from 'vitest';
import { handle } from '../../src/commands/handle.js';
import { renderSlackMessage, SLACK_CHOICE_ACTION } from '../../src/render/slack-blocks.js';
import { checkMessageLimits } from '../../src/render/slack/limits.js';
import { testContext } from '../helpers/context.js';

describe('Slack: a question with its answers as buttons', () => {
  it('"rho 8.2 ohm-cm P" asks, with a p-type and a phosphorus button that run their command', async () => {
    const reply = await handle('rho 8.2 ohm-cm P', testContext());
    const message = renderSlackMessage(reply);
    expect(checkMessageLimits(message)).toEqual([]);
    const actions = message.blocks.find((b) => b.type === 'actions') as { elements: { action_id: string; value: string; text: { text: string } }[] };
    expect(actions.elements.map((e) => e.value)).toEqual(['rho 8.2 ohm-cm p', 'rho 8.2 ohm-cm phos']);
    expect(actions.elements.every((e) => SLACK_CHOICE_ACTION.test(e.action_id))).toBe(true);
    expect(new Set(actions.elements.map((e) => e.action_id)).size).toBe(2);
    for (const e of actions.elements) expect((await handle(e.value, testContext())).ok).toBe(true);
  });
});
