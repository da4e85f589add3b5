/**
 * The Teams-style chat surface: activities arrive at POST /api/messages (TEAMS_PORT), each with
 * a bearer token checked before anything else (auth.ts: 401 otherwise); a message in a personal
 * chat or a mention in a channel is asked through the application layer, once per activity id
 * (the connector redelivers), and answered as an Adaptive Card in the same conversation (in a
 * channel, in the message's reply chain). The card's buttons come back as message activities
 * carrying their data: "Show derivation" asks `why <id>`, "Post to channel" posts the kept
 * result as a new thread in the channel (once per result and channel), a question's choices run
 * their command. The daily summary is posted to TEAMS_DIGEST_CONVERSATION.
 *
 * Hand-written rather than the Microsoft 365 Agents SDK: the SDK brings its own turn pipeline,
 * state and storage, where this surface needs only token checks, three REST calls and our
 * application layer's exactly-once `ask` — about 250 lines, all tested offline.
 */
import { Hono } from 'hono';
import { bodyLimit } from 'hono/body-limit';
import type { Application } from '../../app/application.js';
import type { SummaryNotifier } from '../../app/daily-summary.js';
import type { Surface } from '../../app/surface.js';
import type { FailureLog } from '../../commands/context.js';
import { isShareable } from '../../reply/kinds.js';
import type { Reply } from '../../reply/reply.js';
import { renderTeamsCard, type TeamsCardData, type TeamsCardOptions } from '../../render/teams-card.js';
import { addServiceRoutes, listen, type Listening } from '../serving.js';
import { TokenValidator } from './auth.js';
import type { TeamsConfig } from './config.js';
import { Connector } from './connector.js';

interface Activity {
  readonly type?: string;
  readonly id?: string;
  readonly text?: string;
  readonly value?: unknown;
  readonly serviceUrl?: string;
  readonly replyToId?: string;
  readonly from?: { readonly id?: string; readonly name?: string; readonly aadObjectId?: string };
  readonly conversation?: { readonly id?: string; readonly conversationType?: string; readonly tenantId?: string };
  readonly recipient?: { readonly id?: string; readonly name?: string };
}

const HELP_HINT = '@shiftprobe help';

/** The text a person typed: mentions of the bot removed, Teams' HTML turned back into text. */
export function textFromTeams(text: string | undefined): string {
  return (text ?? '')
    .replace(/<at>[^<]*<\/at>/gi, ' ')
    .replace(/<br\s*\/?>/gi, ' ')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&nbsp;/g, ' ')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ')
    .trim();
}

/** A channel conversation id names the thread after ';messageid='; the channel is before it. */
export function channelOf(conversationId: string): string {
  return conversationId.split(';messageid=')[0]!;
}

function cardActivity(reply: Reply, options: TeamsCardOptions): Record<string, unknown> {
  const card = renderTeamsCard(reply, options);
  return { type: 'message', text: '', summary: card.fallbackText.slice(0, 200), attachments: [{ contentType: 'application/vnd.microsoft.card.adaptive', content: card }] };
}

function cardData(value: unknown): TeamsCardData | undefined {
  const v = value as { shiftprobe?: unknown; resultId?: unknown; command?: unknown } | undefined;
  if (!v || typeof v !== 'object') return undefined;
  if ((v.shiftprobe === 'why' || v.shiftprobe === 'share') && typeof v.resultId === 'string' && /^r-[0-9a-f]{4,12}$/i.test(v.resultId)) return { shiftprobe: v.shiftprobe, resultId: v.resultId };
  if (v.shiftprobe === 'choice' && typeof v.command === 'string' && v.command.length <= 500) return { shiftprobe: 'choice', command: v.command };
  return undefined;
}

export interface TeamsSurfaceOptions {
  readonly config: TeamsConfig;
  readonly host?: string | undefined;
  readonly log: FailureLog & { info?(...a: unknown[]): void; warn?(...a: unknown[]): void };
  readonly fetch?: typeof fetch;
  /** How long stopping waits for activities in flight. */
  readonly stopGraceMs?: number;
}

export function createTeamsApp(app: Application, options: TeamsSurfaceOptions): { http: Hono; connector: Connector } {
  const { config, log } = options;
  const fetchFn = options.fetch ?? globalThis.fetch.bind(globalThis);
  const validator = new TokenValidator(config.appId, config.openIdUrl, fetchFn);
  const connector = new Connector(config.appId, config.appPassword, config.tokenUrl, fetchFn);
  const http = new Hono();

  addServiceRoutes(http, app);

  http.post('/api/messages', bodyLimit({ maxSize: 256 * 1024, onError: (c) => c.json({ error: 'too_large' }, 413) }), async (c) => {
    let activity: Activity;
    try {
      activity = (await c.req.json()) as Activity;
    } catch {
      return c.json({ error: 'the body is not JSON' }, 400);
    }
    // The token first: nothing of an unauthenticated request is acted on.
    const check = await validator.check(c.req.header('authorization'), activity.serviceUrl);
    if (!check.ok) {
      if (check.unavailable) {
        log.error({ reason: check.reason }, 'shiftprobe: Teams request not checked');
        return c.json({ error: 'cannot check the token now' }, 503);
      }
      log.warn?.(`Teams request refused: ${check.reason}`);
      return c.json({ error: 'unauthorized' }, 401);
    }
    if (activity.type !== 'message' || !activity.id || !activity.conversation?.id || !activity.serviceUrl) return c.body(null, 200);
    const status = await answer(activity as Required<Pick<Activity, 'id' | 'serviceUrl'>> & Activity);
    return c.body(null, status);
  });

  async function answer(a: Activity & { id: string; serviceUrl: string }): Promise<200 | 502> {
    const conversationId = a.conversation!.id!;
    const inChannel = a.conversation?.conversationType === 'channel';
    const userId = `teams:${a.from?.aadObjectId ?? a.from?.id ?? 'unknown'}`;
    const caller = { userId, channelId: channelOf(conversationId), ...(a.from?.name ? { displayName: a.from.name } : {}) };
    const data = cardData(a.value);
    const eventKey = `teams:activity:${channelOf(conversationId)}:${a.id}`;
    const replyTo = a.replyToId ?? a.id;

    if (data?.shiftprobe === 'share') {
      const reply = await app.results.get(data.resultId);
      if (!reply || !isShareable(reply) || !inChannel) {
        await connector.reply(a.serviceUrl, conversationId, replyTo, { type: 'message', text: inChannel ? 'I no longer have that result; ask again.' : 'Posting to a channel works from a card in a channel.' });
        return 200;
      }
      const key = `teams:share:${reply.id}:${channelOf(conversationId)}`;
      if (!(await app.ledger.claim(key))) return 200;
      const sent = await connector.send(a.serviceUrl, channelOf(conversationId), cardActivity(reply, { actions: ['why'], ...(a.from?.name ? { sharedBy: a.from.name } : {}) }));
      if (!sent.ok) {
        await app.ledger.release(key);
        log.error({ status: sent.status, error: sent.error }, 'shiftprobe: posting a shared card to Teams failed');
        return 502;
      }
      await app.ledger.complete(key);
      return 200;
    }

    const text = data?.shiftprobe === 'why' ? `why ${data.resultId}` : data?.shiftprobe === 'choice' ? data.command : textFromTeams(a.text);
    const asked = await app.ask({ text, surface: 'teams', caller, eventKey, conversationKey: `teams:${channelOf(conversationId)}:${userId}`, log });
    if (asked.duplicate) return 200;
    const actions: TeamsCardOptions['actions'] = isShareable(asked.reply) ? (asked.reply.command === 'why' ? (inChannel ? ['share'] : []) : inChannel ? ['why', 'share'] : ['why']) : [];
    const sent = await connector.reply(a.serviceUrl, conversationId, replyTo, cardActivity(asked.reply, { actions, helpHint: HELP_HINT }));
    if (!sent.ok) {
      // Not delivered: let the connector's redelivery try again (a record is stored once anyway).
      log.error({ status: sent.status, error: sent.error }, 'shiftprobe: sending the answer to Teams failed');
      await asked.abandon();
      return 502;
    }
    await asked.settle();
    return 200;
  }

  return { http, connector };
}

export function teamsSurface(app: Application, options: TeamsSurfaceOptions): Surface {
  let server: Listening | undefined;
  let connector: Connector | undefined;
  return {
    name: 'teams',
    async start() {
      const built = createTeamsApp(app, options);
      connector = built.connector;
      server = await listen(built.http.fetch, options.config.port, options.host);
      return { port: server.port, description: `Teams (activities at :${server.port}/api/messages, app ${options.config.appId})` };
    },
    async stop() {
      const s = server;
      server = undefined;
      await s?.close(options.stopGraceMs ?? 25_000);
    },
    summaryNotifier(): SummaryNotifier | undefined {
      const conversation = options.config.digestConversation;
      if (!conversation || !connector) return undefined;
      const c = connector;
      return {
        surface: 'teams',
        destination: `teams:${conversation}`,
        async notify(reply) {
          const sent = await c.send(options.config.serviceUrl, conversation, cardActivity(reply, { actions: [] }));
          if (!sent.ok) throw new Error(`posting the daily summary to Teams failed: ${sent.error ?? sent.status}`);
        },
      };
    },
  };
}
