/**
 * The card's buttons (each value is a result id, nothing else) and the thread dialog:
 * - Post in channel → chat.postMessage into the card's channel, once per result and channel;
 * - Post in a thread… → the dialog (recent threads or a pasted link) → chat.postMessage with
 *   thread_ts, once per result and thread;
 * - Show derivation → `why <id>`, privately.
 * Results come from the result store, so the buttons work after a restart and on any instance.
 */
import type { App, BlockAction, ButtonAction } from '@slack/bolt';
import { SLACK_ACTION_IDS, SLACK_CHOICE_ACTION } from '../../../render/slack-blocks.js';
import type { ReplyOk } from '../../../reply/reply.js';
import { ask, eventKeys } from '../conversation.js';
import { isShareable } from '../../../reply/kinds.js';
import { cardFor, noteCard as note } from '../cards.js';
import type { ListenerDeps } from '../deps.js';
import { parseMessageLink } from '../message-link.js';
import { postMessage, toResponseUrl } from '../outbound.js';
import { postFailureText, RESULT_GONE } from '../slack-errors.js';
import { listThreads } from '../threads.js';
import {
  decodePickerState,
  LINK_ACTION,
  LINK_BLOCK,
  parseChoiceValue,
  PICK_ACTION,
  PICK_BLOCK,
  THREAD_PICKER_CALLBACK,
  threadPickerView,
} from '../views/thread-picker.js';

const RESULT_ID = /^r-[0-9a-f]{4,12}$/i;


/** Who pressed a button, where, under the button press's own exactly-once key. */
function actionWhere(body: BlockAction<ButtonAction>) {
  return {
    teamId: body.team?.id,
    userId: body.user.id,
    channelId: body.channel?.id ?? 'unknown',
    eventKey: eventKeys.action(body.team?.id, body.trigger_id),
  };
}

export function registerActions(app: App, deps: ListenerDeps): void {
  const load = async (value: string | undefined): Promise<ReplyOk | undefined> =>
    value && RESULT_ID.test(value) ? deps.results.get(value) : undefined;

  app.action<BlockAction<ButtonAction>>(SLACK_ACTION_IDS.shareChannel, async ({ ack, body, action, client }) => {
    await ack();
    const channel = body.channel?.id;
    const reply = await load(action.value);
    if (!reply || !channel || !isShareable(reply)) return void (await toResponseUrl(deps.fetch, body.response_url, note(RESULT_GONE), 'add'));
    const key = eventKeys.share(reply.id, channel, undefined);
    if (!(await deps.ledger.claim(key))) return;
    const sent = await postMessage(client, { channel }, cardFor(reply, 'shared', { sharedBy: body.user.id }));
    if (!sent.ok) {
      await deps.ledger.release(key);
      return void (await toResponseUrl(deps.fetch, body.response_url, note(postFailureText(sent.code, 'channel')), 'add'));
    }
    await deps.ledger.complete(key);
    await toResponseUrl(deps.fetch, body.response_url, cardFor(reply, 'private', { notice: 'Posted in the channel.', omit: ['shareChannel'] }), 'replace');
  });

  app.action<BlockAction<ButtonAction>>(SLACK_ACTION_IDS.shareThread, async ({ ack, body, action, client }) => {
    await ack();
    const channel = body.channel?.id;
    const reply = await load(action.value);
    if (!reply || !channel || !isShareable(reply)) return void (await toResponseUrl(deps.fetch, body.response_url, note(RESULT_GONE), 'add'));
    const list = await listThreads(client, channel, deps.conversations, {
      now: deps.now,
      timeoutMs: deps.historyTimeoutMs,
      log: (m) => deps.logger.debug(m),
    });
    const hint = list.fromHistory ? undefined : 'Only threads where shiftprobe has answered are listed; a pasted link works for any message in a channel I am in.';
    await client.views.open({
      trigger_id: body.trigger_id,
      view: threadPickerView({ resultId: reply.id, channelId: channel, responseUrl: body.response_url }, reply.title, list.choices, hint),
    });
  });

  app.action<BlockAction<ButtonAction>>(SLACK_ACTION_IDS.why, async ({ ack, body, action }) => {
    await ack();
    const value = action.value ?? '';
    const where = actionWhere(body);
    const asked = await ask(deps, RESULT_ID.test(value) ? `why ${value}` : 'why', where);
    if (!asked) return; // a duplicate delivery
    const place = body.channel?.id?.startsWith('D') ? 'dm' : 'derivation';
    await toResponseUrl(deps.fetch, body.response_url, cardFor(asked.reply, place), 'add');
    await asked.settle();
  });

  // An answer to a question the bot asked ("P: p-type or phosphorus?"): run the chosen reading.
  app.action<BlockAction<ButtonAction>>(SLACK_CHOICE_ACTION, async ({ ack, body, action }) => {
    await ack();
    const command = (action.value ?? '').trim();
    if (command === '') return;
    const where = actionWhere(body);
    const asked = await ask(deps, command, where);
    if (!asked) return; // a duplicate delivery
    const place = body.channel?.id?.startsWith('D') ? 'dm' : 'private';
    await toResponseUrl(deps.fetch, body.response_url, cardFor(asked.reply, place), 'replace');
    await asked.settle();
  });

  app.view(THREAD_PICKER_CALLBACK, async ({ ack, view, body, client }) => {
    const state = decodePickerState(view.private_metadata);
    const picked = parseChoiceValue(view.state.values[PICK_BLOCK]?.[PICK_ACTION]?.selected_option?.value);
    const pasted = view.state.values[LINK_BLOCK]?.[LINK_ACTION]?.value?.trim();
    const link = pasted ? parseMessageLink(pasted) : undefined;
    if (pasted && !link) {
      return void (await ack({
        response_action: 'errors',
        errors: { [LINK_BLOCK]: 'That is not a Slack message link. On the message: ⋯ → Copy link, then paste it here.' },
      }));
    }
    const target = link ? { channelId: link.channelId, threadTs: link.threadTs } : picked;
    if (!target) {
      return void (await ack({ response_action: 'errors', errors: { [LINK_BLOCK]: 'Choose a thread above or paste a message link.' } }));
    }
    await ack();
    const reply = state ? await deps.results.get(state.resultId) : undefined;
    const tell = async (text: string, card?: ReturnType<typeof cardFor>): Promise<void> => {
      if (state?.responseUrl) await toResponseUrl(deps.fetch, state.responseUrl, card ?? note(text), card ? 'replace' : 'add');
    };
    if (!reply || !isShareable(reply)) return tell(RESULT_GONE);
    const key = eventKeys.share(reply.id, target.channelId, target.threadTs);
    if (!(await deps.ledger.claim(key))) return;
    const sent = await postMessage(client, { channel: target.channelId, threadTs: target.threadTs }, cardFor(reply, 'shared', { sharedBy: body.user.id }));
    if (!sent.ok) {
      await deps.ledger.release(key);
      return tell(postFailureText(sent.code, 'thread'));
    }
    await deps.ledger.complete(key);
    await deps.conversations.rememberThread({ channelId: target.channelId, threadTs: target.threadTs, title: reply.title, lastAt: deps.now() });
    await tell('', cardFor(reply, 'private', { notice: 'Posted in the thread.' }));
  });
}
