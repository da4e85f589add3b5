/**
 * The environment, parsed once with zod at start-up. Each part of the house owns its section
 * and this file assembles them: storage (src/adapters/storage/config.ts: DATABASE_PATH or
 * DATABASE_URL), Slack (src/adapters/slack/config.ts), lot records (src/lots/config.ts), and the
 * process-wide base below (PORT, HOST, LOG_LEVEL). No chat surface configured → the local console.
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
import { parse as parseDotenv } from 'dotenv';
import { z } from 'zod';
import { HttpApiEnv } from './adapters/http/config.js';
import { SlackEnv } from './adapters/slack/config.js';
import { StorageEnv } from './adapters/storage/config.js';
import { TeamsEnv } from './adapters/teams/config.js';
import { LotsEnv } from './lots/config.js';

export { Secret } from './adapters/secret.js';
export type { SlackConfig, SlackHttpConfig, SlackSocketConfig } from './adapters/slack/config.js';

export type Environment = Readonly<Record<string, string | undefined>>;

// ---------- sections ----------

const LOG_LEVELS = ['debug', 'info', 'warn', 'error'] as const;

export const BaseEnv = z
  .object({
    PORT: z
      .string()
      .refine((s) => /^\d{1,5}$/.test(s) && Number(s) <= 65535, { error: 'PORT must be a whole number from 0 to 65535, e.g. 3000' })
      .default('3000'),
    HOST: z
      .string()
      .regex(/^[A-Za-z0-9.:_-]+$/, { error: 'HOST must be an address or host name to listen on, e.g. 0.0.0.0 or 127.0.0.1' })
      .optional(),
    LOG_LEVEL: z.enum(LOG_LEVELS, { error: `LOG_LEVEL must be one of ${LOG_LEVELS.join(', ')}` }).default('info'),
    SHUTDOWN_GRACE_MS: z
      .string()
      .refine((s) => /^\d{1,7}$/.test(s), { error: 'SHUTDOWN_GRACE_MS must be a whole number of milliseconds, e.g. 25000' })
      .default('25000'),
    LOG_FORMAT: z.enum(['json', 'text'], { error: 'LOG_FORMAT must be json (one JSON object per line) or text (readable lines)' }).optional(),
  })
  .transform((e) => ({
    /** The HTTP port: Slack events (HTTP mode) and /healthz, /readyz (both Slack modes). 0 = any free port. */
    port: Number(e.PORT),
    host: e.HOST,
    logLevel: e.LOG_LEVEL,
    /** Unset: text when stderr is a terminal, JSON otherwise. */
    logFormat: e.LOG_FORMAT,
    /** How long a stop (SIGTERM) waits for answers in flight before closing the database. */
    shutdownGraceMs: Number(e.SHUTDOWN_GRACE_MS),
  }));

/** Every section of the configuration; add a section here to extend it. */
export const configSections = {
  base: BaseEnv,
  storage: StorageEnv,
  slack: SlackEnv,
  httpApi: HttpApiEnv,
  teams: TeamsEnv,
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

/** Whether a start-up serves the configured surfaces (Slack, the HTTP API, Teams) or opens the local console. */
export function surfaceOf(config: Config): 'serve' | 'console' {
  return config.slack !== undefined || config.httpApi !== undefined || config.teams !== undefined ? 'serve' : 'console';
}
