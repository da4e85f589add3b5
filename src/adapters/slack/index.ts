/**
 * The Slack surface's entry, called by src/main.ts when Slack settings are present:
 * opens the store, builds the app, starts it, and runs until SIGINT/SIGTERM (or `stopSignal`).
 * Resolves with the process exit status: 0 after a clean stop, 78 when the configuration is
 * wrong (a rejected token), 1 when start-up failed otherwise.
 */
import type { Logger } from '@slack/bolt';
import { openServices, StartupError, type Services } from '../../app.js';
import { handle as defaultHandle } from '../../commands/handle.js';
import type { Config } from '../../config.js';
import { openChatState, type ChatState } from '../../store/chat-state.js';
import { createSlackApp, SlackStartError, type SlackRuntime } from './app.js';
import { DEFAULT_ACK_DEADLINE_MS, DEFAULT_HISTORY_TIMEOUT_MS, type Handler, type SlackDeps } from './deps.js';
import { slackDigestPublisher } from './digest.js';
import { createLogger } from './logger.js';

export { createSlackApp, SlackStartError, type SlackRuntime } from './app.js';
export type { Handler, SlackDeps } from './deps.js';

export interface StartSlackDeps {
  readonly io: { readonly stderr: NodeJS.WritableStream };
  readonly handle?: Handler;
  readonly services?: Services;
  readonly logger?: Logger;
  /** Resolves when the process should stop; SIGINT or SIGTERM when absent. */
  readonly stopSignal?: Promise<unknown>;
  /** Replaces parts of the adapter's dependencies (tests: deadlines, fetch). */
  readonly overrides?: Partial<SlackDeps>;
  /** Told the HTTP port once everything is up (tests, the benchmark). */
  readonly onReady?: (info: { port: number; runtime: SlackRuntime }) => void;
}

/** The adapter's dependencies: the chat state (see src/store/chat-state.ts), clock, ids, logger. */
export function slackDepsFor(services: Services, chat: ChatState, logger: Logger, handle: Handler = defaultHandle): SlackDeps {
  return {
    handle,
    results: chat.results,
    ledger: chat.ledger,
    conversations: chat.conversations,
    now: services.now,
    newId: services.newId,
    logger,
    fetch: globalThis.fetch.bind(globalThis),
    storeHealthy: () => chat.healthy(),
    ackDeadlineMs: DEFAULT_ACK_DEADLINE_MS,
    historyTimeoutMs: DEFAULT_HISTORY_TIMEOUT_MS,
    ...(services.lots ? { lots: services.lots } : {}),
  };
}

function untilSignal(): Promise<string> {
  return new Promise((resolve) => {
    const done = (signal: string): void => {
      process.off('SIGINT', onInt);
      process.off('SIGTERM', onTerm);
      resolve(signal);
    };
    const onInt = (): void => done('SIGINT');
    const onTerm = (): void => done('SIGTERM');
    process.on('SIGINT', onInt);
    process.on('SIGTERM', onTerm);
  });
}

export async function startSlack(config: Config, deps: StartSlackDeps): Promise<number> {
  const slack = config.slack;
  if (!slack) {
    deps.io.stderr.write('shiftprobe: no Slack settings (see docs/slack.md).\n');
    return 78;
  }
  const secrets = [slack.botToken.reveal(), slack.transport === 'socket' ? slack.appToken.reveal() : slack.signingSecret.reveal()];
  const logger =
    deps.logger ?? createLogger({ sink: (line) => deps.io.stderr.write(line + '\n'), level: config.base.logLevel, secrets });
  let services: Services;
  try {
    services = deps.services ?? openServices(config.base.databasePath, { lots: config.lots });
  } catch (e) {
    if (!(e instanceof StartupError)) throw e;
    deps.io.stderr.write(`shiftprobe cannot start: ${e.message}\n`);
    return 78;
  }
  const chat = openChatState(config.base.databasePath, services.db, services.now);
  const runtime = createSlackApp({
    slack,
    port: config.base.port,
    host: config.base.host,
    deps: { ...slackDepsFor(services, chat, logger, deps.handle), ...deps.overrides },
  });
  try {
    const { port } = await runtime.start();
    logger.info(
      `shiftprobe is answering on Slack (${slack.transport === 'http' ? `HTTP, events at :${port}/slack/events` : 'Socket Mode'}); ` +
        `${slack.slashCommand}, mentions and DMs; health at :${port}/healthz and /readyz`,
    );
    // The daily summary of flagged lots to DIGEST_CHANNEL (none when it is not set).
    const digest = await services.lots?.startDigest(
      slackDigestPublisher(runtime.client, { now: services.now, newId: services.newId, results: chat.results, demo: services.lots.catalog.demo }),
      { onError: (e, context) => logger.error(`shiftprobe: ${context} could not be posted:`, e) },
    );
    deps.onReady?.({ port, runtime });
    await (deps.stopSignal ?? untilSignal());
    digest?.stop();
    await runtime.stop();
    return 0;
  } catch (error) {
    if (error instanceof SlackStartError) {
      deps.io.stderr.write(`shiftprobe cannot start: ${error.message}\n`);
      return 78;
    }
    logger.error('shiftprobe could not start on Slack:', error);
    return 1;
  } finally {
    chat.close();
    if (!deps.services) services.close();
  }
}
