/**
 * The slash command: answered privately (ephemeral) inside Slack's 3-second window. The card
 * goes out with the acknowledgement itself; if the answer takes longer than the ack deadline,
 * the ack says "working on it" and the card follows through the response URL.
 */
import type { AckFn, App, RespondArguments, SlashCommand } from '@slack/bolt';
import { failureMessage, markAnswered } from '../errors.js';
import { ask, eventKeys } from '../conversation.js';
import { cardFor } from '../cards.js';
import type { ListenerDeps } from '../deps.js';
import { commandTextFromSlack } from '../incoming-text.js';
import { ackBudgetMs, RECEIVED_AT, toResponseUrl, within } from '../outbound.js';

const WORKING = ':hourglass_flowing_sand: Working on it…';

export function registerCommands(app: App, deps: ListenerDeps): void {
  app.command(deps.slashCommand, async ({ command, ack: ackSlack, context }) => {
    const budgetMs = ackBudgetMs(context[RECEIVED_AT], Date.now(), deps.ackDeadlineMs);
    // Slack takes one acknowledgement; if something fails before it, the failure note is it.
    let acked = false;
    const ack: typeof ackSlack = async (body) => {
      acked = true;
      await ackSlack(body);
    };
    try {
      await answer(command, ack, budgetMs);
    } catch (error) {
      if (acked) throw error; // the global handler answers through the response URL
      await ackSlack({ response_type: 'ephemeral', ...failureMessage() });
      throw markAnswered(error); // logged by the global handler, not answered twice
    }
  });

  async function answer(command: SlashCommand, ack: (body?: Parameters<AckFn<string | RespondArguments>>[0]) => Promise<void>, budgetMs: number): Promise<void> {
    const where = {
      teamId: command.team_id,
      userId: command.user_id,
      channelId: command.channel_id,
      eventKey: eventKeys.command(command.team_id, command.trigger_id),
    };
    const helpHint = `${deps.slashCommand} help`;
    const pending = ask(deps, commandTextFromSlack(command.text), where);
    const asked = await within(pending, budgetMs);
    if (asked === null) return ack(); // a duplicate delivery: answered elsewhere
    if (asked) {
      await ack({ response_type: 'ephemeral', ...cardFor(asked.reply, 'private', { helpHint }) });
      return asked.settle();
    }
    await ack({ response_type: 'ephemeral', text: WORKING });
    const late = await pending;
    if (!late) return;
    await toResponseUrl(deps.fetch, command.response_url, cardFor(late.reply, 'private', { helpHint }), 'replace');
    return late.settle();
  }
}
