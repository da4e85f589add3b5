/**
 * Mentions and direct messages. A mention in a channel or inside a thread is answered in the
 * mention's thread (results publicly, errors privately to the person); a direct message is
 * answered in the DM. The event key is the message itself, so Slack's retries, redeliveries
 * and several instances give one answer. A measurement file sent with the message goes to the
 * command (files.ts), and a reply's picture is uploaded under its card.
 */
import type { App } from '@slack/bolt';
import { ask, eventKeys } from '../conversation.js';
import { cardFor, noteCard } from '../cards.js';
import type { ListenerDeps } from '../deps.js';
import { commandTextFromSlack } from '../incoming-text.js';
import { fileIn, UPLOAD_FAILED, uploadPicture, type SlackFile } from '../files.js';
import { postEphemeral, postMessage } from '../outbound.js';


interface IncomingMessage {
  readonly channel: string;
  readonly user?: string;
  readonly text?: string;
  readonly ts: string;
  readonly thread_ts?: string;
  readonly team?: string;
  readonly files?: readonly SlackFile[];
}

export function registerEvents(app: App, deps: ListenerDeps): void {
  app.event('app_mention', async ({ event, body, client, context }) => {
    const m = event as unknown as IncomingMessage;
    if (!m.user) return;
    const where = { teamId: body.team_id, userId: m.user, channelId: m.channel, eventKey: eventKeys.message(body.team_id, m.channel, m.ts) };
    const threadTs = m.thread_ts ?? m.ts;
    const helpHint = '@shiftprobe help';
    const file = await fileIn(m.files, context.botToken, deps.fetch, deps.logger);
    if ('problem' in file) return void (await postEphemeral(client, { channel: m.channel, user: m.user, threadTs }, noteCard(file.problem)));
    const asked = await ask(deps, commandTextFromSlack(m.text, context.botUserId), where, file.attachment);
    if (!asked) return; // a duplicate delivery
    if (asked.reply.ok) {
      const sent = await postMessage(client, { channel: m.channel, threadTs }, cardFor(asked.reply, 'thread', { helpHint }));
      if (sent.ok) await deps.conversations.rememberThread({ channelId: m.channel, threadTs, title: asked.reply.title, lastAt: deps.now() });
      else throw Object.assign(new Error(`posting the answer failed: ${sent.code}`), { data: { error: sent.code } });
      if (!(await uploadPicture(client, { channel: m.channel, threadTs }, asked.reply, deps.logger))) {
        await postEphemeral(client, { channel: m.channel, user: m.user, threadTs }, noteCard(UPLOAD_FAILED));
      }
    } else {
      await postEphemeral(client, { channel: m.channel, user: m.user, threadTs }, cardFor(asked.reply, 'thread', { helpHint }));
    }
    await asked.settle();
  });

  app.event('message', async ({ event, body, client, context }) => {
    const m = event as unknown as IncomingMessage & { channel_type?: string; subtype?: string; bot_id?: string };
    // Only what a person typed (or a file they shared) in a DM with the bot: no edits, joins, bot
    // posts or our own replies.
    if (m.channel_type !== 'im' || (m.subtype !== undefined && m.subtype !== 'file_share') || m.bot_id !== undefined || !m.user) return;
    if (m.user === context.botUserId) return;
    const where = { teamId: body.team_id, userId: m.user, channelId: m.channel, eventKey: eventKeys.message(body.team_id, m.channel, m.ts) };
    const place = { channel: m.channel, ...(m.thread_ts ? { threadTs: m.thread_ts } : {}) };
    const file = await fileIn(m.files, context.botToken, deps.fetch, deps.logger);
    if ('problem' in file) return void (await postMessage(client, place, noteCard(file.problem)));
    const asked = await ask(deps, commandTextFromSlack(m.text, context.botUserId), where, file.attachment);
    if (!asked) return; // a duplicate delivery
    const sent = await postMessage(client, place, cardFor(asked.reply, 'dm', { helpHint: 'help' }));
    if (!sent.ok) throw Object.assign(new Error(`posting the answer failed: ${sent.code}`), { data: { error: sent.code } });
    if (asked.reply.ok && !(await uploadPicture(client, place, asked.reply, deps.logger))) await postMessage(client, place, noteCard(UPLOAD_FAILED));
    await asked.settle();
  });
}
