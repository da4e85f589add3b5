/**
 * The environment, parsed once with zod at start-up.
 *
 * - `SLACK_BOT_TOKEN` + `SLACK_APP_TOKEN` → Slack over Socket Mode (no public URL needed).
 * - `SLACK_BOT_TOKEN` + `SLACK_SIGNING_SECRET` → Slack over HTTP on `PORT` at `/slack/events`.
 *   (All three set: Socket Mode; the signing secret is then not needed.)
 * - No Slack variable at all → the local console.
 * - A missing or malformed variable is a `ConfigProblem` naming it; the value of a secret is never
 *   part of a message, and secrets are held in `Secret`, which prints as '[redacted]'.
 *
 * The schema is composed of sections (`configSections`): each is a zod object over the variables
 * it owns, transformed into its part of `Config`. To add settings, write a section and add it to
 * `configSections`; `loadConfig` collects every section's problems in one pass.
 * Empty values (`NAME=` in a .env file) count as unset.
 */
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { inspect } from 'node:util';
import { parse as parseDotenv } from 'dotenv';
import { z } from 'zod';
import { LotsEnv } from './lots/config.js';

export type Environment = Readonly<Record<string, string | undefined>>;

/** A secret value that never prints: String(), JSON and util.inspect all give '[redacted]'. */
export class Secret {
  readonly #value: string;
  constructor(value: string) {
    this.#value = value;
  }
  /** The value, for the one place that hands it to the Slack client. */
  reveal(): string {
    return this.#value;
  }
  toString(): string {
    return '[redacted]';
  }
  toJSON(): string {
    return '[redacted]';
  }
  [inspect.custom](): string {
    return 'Secret([redacted])';
  }
}

// ---------- sections ----------

const LOG_LEVELS = ['debug', 'info', 'warn', 'error'] as const;

export const BaseEnv = z
  .object({
    DATABASE_PATH: z.string().default('./data/shiftprobe.db'),
    PORT: z
      .string()
      .refine((s) => /^\d{1,5}$/.test(s) && Number(s) <= 65535, { error: 'PORT must be a whole number from 0 to 65535, e.g. 3000' })
      .default('3000'),
    HOST: z
      .string()
      .regex(/^[A-Za-z0-9.:_-]+$/, { error: 'HOST must be an address or host name to listen on, e.g. 0.0.0.0 or 127.0.0.1' })
      .optional(),
    LOG_LEVEL: z.enum(LOG_LEVELS, { error: `LOG_LEVEL must be one of ${LOG_LEVELS.join(', ')}` }).default('info'),
  })
  .transform((e) => ({
    databasePath: e.DATABASE_PATH,
    /** The HTTP port: Slack events (HTTP mode) and /healthz, /readyz (both Slack modes). 0 = any free port. */
    port: Number(e.PORT),
    host: e.HOST,
    logLevel: e.LOG_LEVEL,
  }));

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

/** Every section of the configuration; add a section here to extend it. */
export const configSections = {
  base: BaseEnv,
  slack: SlackEnv,
  lots: LotsEnv,
} as const;

export type Config = { readonly [K in keyof typeof configSections]: z.output<(typeof configSections)[K]> };

// ---------- loading ----------

export interface ConfigProblem {
  /** The environment variable at fault. */
  readonly variable: string;
  readonly code: 'missing' | 'malformed';
  /** Names the variable and says what is expected; never contains a secret's value. */
  readonly message: string;
}

export type ConfigResult =
  | { readonly ok: true; readonly config: Config }
  | { readonly ok: false; readonly problems: readonly ConfigProblem[] };

/** Unset, empty and whitespace-only values all count as unset. */
function normalise(env: Environment): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(env)) if (v !== undefined && v.trim() !== '') out[k] = v;
  return out;
}

export function loadConfig(env: Environment): ConfigResult {
  const clean = normalise(env);
  const problems: ConfigProblem[] = [];
  const config: Record<string, unknown> = {};
  for (const [key, schema] of Object.entries(configSections)) {
    const parsed = schema.safeParse(clean, { reportInput: false });
    if (parsed.success) {
      config[key] = parsed.data;
      continue;
    }
    for (const issue of parsed.error.issues) {
      const variable = String(issue.path[0] ?? key);
      if (problems.some((p) => p.variable === variable)) continue; // one message per variable
      const present = clean[variable] !== undefined;
      problems.push({
        variable,
        code: present ? 'malformed' : 'missing',
        // Our own messages name the variable; zod's generic ones get the name in front.
        message: issue.message.includes(variable) ? issue.message : `${variable}: ${issue.message}`,
      });
    }
  }
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, config: config as Config };
}

/** The start-up error text: one line per variable, then where the settings are explained. */
export function describeConfigProblems(problems: readonly ConfigProblem[]): string {
  return [
    'shiftprobe cannot start: the configuration has a problem.',
    ...problems.map((p) => `  - ${p.message}`),
    'See deploy/.env.example and docs/slack.md for every setting.',
  ].join('\n');
}

/**
 * The process environment over a local `.env` file (the real environment wins). Read once by the
 * entry point; `loadConfig` itself never touches the file system.
 */
export function readEnvironment(options: { cwd?: string; file?: string; env?: Environment } = {}): Environment {
  const path = resolve(options.cwd ?? process.cwd(), options.file ?? '.env');
  const fromFile = existsSync(path) ? parseDotenv(readFileSync(path)) : {};
  return { ...fromFile, ...(options.env ?? process.env) };
}

/** Whether a start-up should open Slack or the local console. */
export function surfaceOf(config: Config): 'slack' | 'console' {
  return config.slack === undefined ? 'console' : 'slack';
}
