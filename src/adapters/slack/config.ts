/**
 * The Slack surface's settings, a section of the configuration (assembled in src/config.ts):
 *
 * - `SLACK_BOT_TOKEN` + `SLACK_APP_TOKEN` → Slack over Socket Mode (no public URL needed).
 * - `SLACK_BOT_TOKEN` + `SLACK_SIGNING_SECRET` → Slack over HTTP on `PORT` at `/slack/events`.
 *   (All three set: Socket Mode; the signing secret is then not needed.)
 * - No Slack variable at all → no Slack surface.
 * A missing or malformed variable is a problem naming it; a secret's value is never quoted.
 */
import { z } from 'zod';
import { Secret } from '../secret.js';

const BOT_TOKEN = /^xoxb-[A-Za-z0-9-]+$/;
const APP_TOKEN = /^xapp-[A-Za-z0-9-]+$/;
const SIGNING_SECRET = /^[A-Za-z0-9]{16,128}$/;
const SLASH_COMMAND = /^\/[a-z0-9][a-z0-9_-]{0,30}$/;

/** What a wrong token looks like, without ever quoting it. */
function tokenHint(value: string, expected: 'xoxb-' | 'xapp-'): string {
  if (/\s/.test(value)) return 'it contains a space or line break';
  if (/^["']/.test(value)) return 'it starts with a quote mark';
  if (expected === 'xoxb-' && value.startsWith('xapp-')) return 'it starts with xapp-, which is the app-level token (SLACK_APP_TOKEN)';
  if (expected === 'xoxb-' && value.startsWith('xoxp-')) return 'it starts with xoxp-, which is a user token, not the bot token';
  if (expected === 'xapp-' && value.startsWith('xoxb-')) return 'it starts with xoxb-, which is the bot token (SLACK_BOT_TOKEN)';
  return `it does not start with ${expected}`;
}

export const SlackEnv = z
  .object({
    SLACK_BOT_TOKEN: z.string().optional(),
    SLACK_APP_TOKEN: z.string().optional(),
    SLACK_SIGNING_SECRET: z.string().optional(),
    SLACK_API_URL: z
      .url({ protocol: /^https?$/, error: 'SLACK_API_URL must be an http(s) URL, e.g. https://slack.com/api/' })
      .optional(),
    SLACK_SLASH_COMMAND: z
      .string()
      .regex(SLASH_COMMAND, {
        error: 'SLACK_SLASH_COMMAND must be a slash and up to 31 lower-case letters, digits, - or _, e.g. /shiftprobe',
      })
      .default('/shiftprobe'),
  })
  .superRefine((e, ctx) => {
    const problem = (variable: string, message: string): void => {
      ctx.addIssue({ code: 'custom', path: [variable], message });
    };
    const bot = e.SLACK_BOT_TOKEN;
    const app = e.SLACK_APP_TOKEN;
    const secret = e.SLACK_SIGNING_SECRET;
    if (bot === undefined && app === undefined && secret === undefined) return; // console mode
    if (bot === undefined) {
      problem(
        'SLACK_BOT_TOKEN',
        'SLACK_BOT_TOKEN is missing: Slack needs the Bot User OAuth Token (xoxb-…) from OAuth & Permissions',
      );
    } else if (!BOT_TOKEN.test(bot)) {
      problem('SLACK_BOT_TOKEN', `SLACK_BOT_TOKEN is malformed: ${tokenHint(bot, 'xoxb-')}`);
    }
    if (app !== undefined && !APP_TOKEN.test(app)) {
      problem('SLACK_APP_TOKEN', `SLACK_APP_TOKEN is malformed: ${tokenHint(app, 'xapp-')}`);
    }
    if (app === undefined && secret === undefined) {
      problem(
        'SLACK_APP_TOKEN',
        'SLACK_APP_TOKEN or SLACK_SIGNING_SECRET is missing: set SLACK_APP_TOKEN (xapp-…) for Socket Mode, or SLACK_SIGNING_SECRET for HTTP mode',
      );
    }
    if (app === undefined && secret !== undefined && !SIGNING_SECRET.test(secret)) {
      problem(
        'SLACK_SIGNING_SECRET',
        'SLACK_SIGNING_SECRET is malformed: it should be the Signing Secret from Basic Information (letters and digits only, no spaces or quotes)',
      );
    }
  })
  .transform((e): SlackConfig | undefined => {
    if (e.SLACK_BOT_TOKEN === undefined) return undefined;
    const common = {
      botToken: new Secret(e.SLACK_BOT_TOKEN),
      apiUrl: e.SLACK_API_URL === undefined ? undefined : withTrailingSlash(e.SLACK_API_URL),
      slashCommand: e.SLACK_SLASH_COMMAND,
    };
    if (e.SLACK_APP_TOKEN !== undefined) {
      return { ...common, transport: 'socket', appToken: new Secret(e.SLACK_APP_TOKEN) };
    }
    return { ...common, transport: 'http', signingSecret: new Secret(e.SLACK_SIGNING_SECRET ?? '') };
  });

function withTrailingSlash(url: string): string {
  return url.endsWith('/') ? url : `${url}/`;
}

interface SlackCommon {
  readonly botToken: Secret;
  /** Web API base URL override (a local fake in tests, or a proxy); Slack's own when absent. */
  readonly apiUrl: string | undefined;
  readonly slashCommand: string;
}
export interface SlackSocketConfig extends SlackCommon {
  readonly transport: 'socket';
  readonly appToken: Secret;
}
export interface SlackHttpConfig extends SlackCommon {
  readonly transport: 'http';
  readonly signingSecret: Secret;
}
export type SlackConfig = SlackSocketConfig | SlackHttpConfig;
