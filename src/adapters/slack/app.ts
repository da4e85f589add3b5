/**
 * The Slack app factory: the receiver chosen by configuration (HTTP with signed requests at
 * /slack/events, or Socket Mode), the Web API base URL (`clientOptions.slackApiUrl`, for a
 * local fake or a proxy), the listeners grouped by kind, the global error handler, and
 * /healthz + /readyz on the HTTP port in both modes.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { App, HTTPReceiver, SocketModeReceiver, webApi, type Logger } from '@slack/bolt';
import { SurfaceConfigError } from '../../app/surface.js';
import type { SlackConfig } from './config.js';
import type { SlackDeps } from './deps.js';
import { installErrorHandler } from './errors.js';
import { healthRoutes, healthServer, Readiness } from './health.js';
import { displayNames } from './names.js';
import { registerActions } from './listeners/actions.js';
import { registerCommands } from './listeners/commands.js';
import { registerEvents } from './listeners/events.js';
import { slackErrorCode } from './slack-errors.js';
import { RECEIVED_AT } from './outbound.js';

export interface SlackAppOptions {
  readonly slack: SlackConfig;
  /** HTTP port (events in HTTP mode, health in both); 0 picks a free port. */
  readonly port: number;
  /**
   * How long stopping waits for work in flight: events are acknowledged to Slack before they
   * are answered, so an acknowledged `record` must finish before the process ends.
   */
  readonly stopGraceMs?: number;
  /** The Web API client's fetch (a proxy's, see src/adapters/proxy.ts); none: the global fetch. */
  readonly fetch?: typeof fetch;
  readonly host?: string | undefined;
  readonly deps: SlackDeps;
}

export interface SlackRuntime {
  readonly app: App;
  /** A Web API client with the bot token, for posts not caused by an event (the daily summary). */
  readonly client: webApi.WebClient;
  readonly readiness: Readiness;
  /** Listens, checks the bot token with Slack, connects (Socket Mode); resolves with the HTTP port. */
  start(): Promise<{ port: number }>;
  stop(): Promise<void>;
}

/** How long stopping waits for answers in flight, unless the options say otherwise. */
const STOP_GRACE_MS = 25_000;

/** Answers from auth.test that no retry will change. */
const REJECTED = new Set(['invalid_auth', 'not_authed', 'account_inactive', 'token_revoked', 'token_expired', 'not_allowed_token_type']);

interface BotIdentity {
  readonly botUserId: string;
  readonly botId: string;
  readonly teamId: string | undefined;
}

export function createSlackApp(options: SlackAppOptions): SlackRuntime {
  const { slack, deps } = options;
  const logger: Logger = deps.logger;
  const botToken = slack.botToken.reveal();
  // The level is passed explicitly: Bolt and the Web API client otherwise reset the logger to info.
  const logLevel = logger.getLevel();
  const clientOptions: webApi.WebClientOptions = { logger, ...(slack.apiUrl ? { slackApiUrl: slack.apiUrl } : {}), ...(options.fetch ? { fetch: options.fetch } : {}) };
  const readiness = new Readiness(deps.storeHealthy);
  const routes = healthRoutes(readiness, deps.metrics);

  // auth.test once (no client-side retries: start-up handles them), shared by every event.
  const checker = new webApi.WebClient(botToken, { ...clientOptions, retryConfig: { retries: 0 } });
  let identity: Promise<BotIdentity> | undefined;
  const whoAmI = (): Promise<BotIdentity> => {
    identity ??= checker.auth.test().then(
      (r) => ({ botUserId: String(r.user_id), botId: String(r.bot_id), teamId: r.team_id }),
      (error: unknown) => {
        identity = undefined;
        throw error;
      },
    );
    return identity;
  };

  let health: Server | undefined;
  // When each request arrived (HTTP: when the server handed it over; Socket Mode: when the
  // event came off the socket), so the slash command's 3-second budget counts from then, not
  // from when a busy process got round to the listener.
  const arrived = new WeakMap<object, number>();
  const receiver =
    slack.transport === 'http'
      ? new HTTPReceiver({
          signingSecret: slack.signingSecret.reveal(),
          endpoints: '/slack/events',
          customRoutes: routes,
          logger,
          logLevel,
          customPropertiesExtractor: (req) => ({ [RECEIVED_AT]: arrived.get(req) ?? Date.now() }),
        })
      : new SocketModeReceiver({
          appToken: slack.appToken.reveal(),
          logger,
          logLevel,
          installerOptions: { clientOptions },
          customPropertiesExtractor: () => ({ [RECEIVED_AT]: Date.now() }),
        });
  if (receiver instanceof HTTPReceiver) {
    const inner = receiver.requestListener;
    receiver.requestListener = (req, res) => {
      arrived.set(req, Date.now());
      inner(req, res);
    };
  }

  const app = new App({
    receiver,
    logger,
    logLevel,
    clientOptions,
    extendedErrorHandler: true,
    authorize: async () => {
      const me = await whoAmI();
      return { botToken, botId: me.botId, botUserId: me.botUserId, ...(me.teamId ? { teamId: me.teamId } : {}) };
    },
  });
  // Work in flight, so that stopping lets answers being made finish before the store closes.
  let inFlight = 0;
  let drained: (() => void) | undefined;
  app.use(async ({ next }) => {
    inFlight += 1;
    try {
      await next();
    } finally {
      inFlight -= 1;
      if (inFlight === 0) drained?.();
    }
  });
  const drain = (ms: number): Promise<void> =>
    inFlight === 0
      ? Promise.resolve()
      : new Promise<void>((resolve) => {
          const timer = setTimeout(resolve, ms);
          drained = () => {
            clearTimeout(timer);
            resolve();
          };
        });

  // app.client has no token (tokens come from `authorize`), so posts outside events use this one.
  const client = new webApi.WebClient(botToken, clientOptions);
  const listenerDeps = {
    ...deps,
    slashCommand: slack.slashCommand,
    displayName: deps.displayName ?? displayNames(client, Date.now, (m) => logger.debug(m)),
  };
  registerCommands(app, listenerDeps);
  registerEvents(app, listenerDeps);
  registerActions(app, listenerDeps);
  installErrorHandler(app, deps, client);

  if (receiver instanceof SocketModeReceiver) {
    receiver.client.on('connected', () => (readiness.slack = 'connected'));
    receiver.client.on('reconnecting', () => (readiness.slack = 'reconnecting'));
    receiver.client.on('disconnected', () => {
      if (readiness.slack !== 'stopped') readiness.slack = 'reconnecting';
    });
  }

  let retry: NodeJS.Timeout | undefined;
  const checkToken = async (): Promise<boolean> => {
    try {
      await whoAmI();
      return true;
    } catch (error) {
      const code = slackErrorCode(error);
      if (REJECTED.has(code)) {
        readiness.slack = 'rejected';
        throw new SurfaceConfigError('SLACK_BOT_TOKEN', `Slack did not accept SLACK_BOT_TOKEN (${code}). Copy the Bot User OAuth Token (xoxb-…) from OAuth & Permissions again, or reinstall the app.`);
      }
      logger.warn(`Slack is not reachable yet (${code}); retrying.`);
      return false;
    }
  };

  return {
    app,
    client,
    readiness,
    async start() {
      let port: number;
      if (receiver instanceof HTTPReceiver) {
        const server = (await app.start({ port: options.port, ...(options.host ? { host: options.host } : {}) })) as Server;
        port = (server.address() as AddressInfo).port;
      } else {
        health = healthServer(routes);
        const server = health;
        await new Promise<void>((resolve, reject) => {
          server.once('error', reject);
          server.listen({ port: options.port, ...(options.host ? { host: options.host } : {}) }, () => resolve());
        });
        port = (server.address() as AddressInfo).port;
      }
      try {
        const ok = await checkToken();
        if (receiver instanceof SocketModeReceiver) {
          try {
            await app.start();
          } catch (error) {
            const code = slackErrorCode(error);
            throw new SurfaceConfigError('SLACK_APP_TOKEN', `Slack did not open a Socket Mode connection (${code}). Check SLACK_APP_TOKEN (xapp-…, with the connections:write scope) and that Socket Mode is on.`);
          }
        }
        if (receiver instanceof HTTPReceiver) {
          if (ok) readiness.slack = 'connected';
          else {
            let delayMs = 1000;
            const again = async (): Promise<void> => {
              if (readiness.slack === 'stopped') return;
              if (await checkToken().catch(() => false)) readiness.slack = 'connected';
              else retry = setTimeout(() => void again(), (delayMs = Math.min(delayMs * 2, 60_000)));
            };
            retry = setTimeout(() => void again(), delayMs);
          }
        }
      } catch (error) {
        await this.stop().catch(() => undefined);
        throw error;
      }
      return { port };
    },
    async stop() {
      readiness.slack = 'stopped';
      clearTimeout(retry);
      await app.stop().catch(() => undefined); // no new requests
      await drain(options.stopGraceMs ?? STOP_GRACE_MS); // answers already being made (and acknowledged events) finish
      if (health) await new Promise<void>((resolve) => health!.close(() => resolve()));
      health = undefined;
    },
  };
}
