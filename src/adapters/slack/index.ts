/**
 * The Slack surface, built by the composition root (src/main.ts) when Slack settings are present:
 * the Bolt app over the application layer, started and stopped with the other surfaces, and the
 * daily summary's notifier for DIGEST_CHANNEL.
 */
import type { Logger } from '@slack/bolt';
import type { AppLogger } from '../log.js';
import type { Application } from '../../app/application.js';
import type { Surface } from '../../app/surface.js';
import { createSlackApp, type SlackRuntime } from './app.js';
import type { SlackConfig } from './config.js';
import { DEFAULT_ACK_DEADLINE_MS, DEFAULT_HISTORY_TIMEOUT_MS, type SlackDeps } from './deps.js';
import { slackSummaryNotifier } from './digest.js';

export { createSlackApp, type SlackRuntime } from './app.js';
export type { SlackDeps } from './deps.js';

/** The adapter's dependencies, from the application layer. */
export function slackDepsFor(app: Application, logger: Logger): SlackDeps {
  return {
    ask: (q) => app.ask(q),
    results: app.results,
    ledger: app.ledger,
    conversations: app.conversations,
    now: app.now,
    logger,
    fetch: globalThis.fetch.bind(globalThis),
    storeHealthy: () => app.backend.healthy(),
    metrics: () => app.metrics.exposition(),
    ackDeadlineMs: DEFAULT_ACK_DEADLINE_MS,
    historyTimeoutMs: DEFAULT_HISTORY_TIMEOUT_MS,
  };
}

export interface SlackSurfaceOptions {
  readonly slack: SlackConfig;
  /** HTTP port (events in HTTP mode, health in both); 0 picks a free port. */
  readonly port: number;
  readonly host?: string | undefined;
  /** The process's logger (its level holds for Bolt too). */
  readonly logger: AppLogger;
  /** Where the daily summary is posted (DIGEST_CHANNEL); none when absent. */
  readonly digestChannel?: string | undefined;
  /** Replaces parts of the adapter's dependencies (tests: deadlines, fetch). */
  readonly overrides?: Partial<SlackDeps>;
  /** How long stopping waits for work in flight (SHUTDOWN_GRACE_MS). */
  readonly stopGraceMs?: number;
  /** The fetch for every outbound call (the Web API client, response URLs): a proxy's, or the global one. */
  readonly fetch?: typeof fetch;
}

export interface SlackSurface extends Surface {
  readonly runtime: SlackRuntime;
}

export function slackSurface(app: Application, options: SlackSurfaceOptions): SlackSurface {
  const { slack } = options;
  const runtime = createSlackApp({
    slack,
    port: options.port,
    host: options.host,
    ...(options.stopGraceMs !== undefined ? { stopGraceMs: options.stopGraceMs } : {}),
    ...(options.fetch ? { fetch: options.fetch } : {}),
    // Bolt's Logger has the same methods; its level names are the same strings.
    deps: { ...slackDepsFor(app, options.logger as unknown as Logger), ...(options.fetch ? { fetch: options.fetch } : {}), ...options.overrides },
  });
  return {
    name: 'slack',
    runtime,
    async start() {
      const { port } = await runtime.start();
      return {
        port,
        description:
          `Slack (${slack.transport === 'http' ? `HTTP, events at :${port}/slack/events` : 'Socket Mode'}); ` +
          `${slack.slashCommand}, mentions and DMs; health at :${port}/healthz and /readyz`,
      };
    },
    stop: () => runtime.stop(),
    summaryNotifier: () => (options.digestChannel ? slackSummaryNotifier(runtime.client, options.digestChannel) : undefined),
  };
}
