/**
 * Settings of the lot records, as a section of the configuration (src/config.ts): parsed once
 * with zod, each problem naming its variable.
 *
 *   SPEC_FILE        product specs, YAML or JSON (default: the invented demo specs in fixtures/)
 *   DIGEST_CHANNEL   Slack channel id for the daily summary (console mode prints it)
 *   DIGEST_AT        local time of the summary, HH:MM (default 07:00)
 *   DIGEST_TZ        IANA time zone of the fab, e.g. Europe/London (default UTC)
 *   RECORD_USERS     Slack user ids allowed to record (comma-separated)
 *   RECORD_CHANNELS  Slack channel ids where anyone may record
 *   CLEAR_USERS      Slack user ids allowed to clear flags
 *   CLEAR_CHANNELS   Slack channel ids where anyone may clear flags
 *   LOT_PATTERN      regular expression for lot ids (default ^LOT-[A-Z][0-9]{1,5}$)
 *   LOT_EXAMPLE      a lot id that fits LOT_PATTERN, shown in error messages
 *   RECORD_CONFIRM_FACTOR  a reading more than this factor outside its product window is stored
 *                    only when confirmed (default 3; 0 turns the question off)
 *   PROBE_SPACING_MM the pin spacing of the fab's four-point probe head, used when a `sheet`
 *                    reading gives none (a product's spec may name its own, probeSpacingMm)
 *
 * DATABASE_PATH (default ./data/shiftprobe.db) is in the base section.
 */
import { fixtureFile } from './fixtures.js';
import { z } from 'zod';
import { DEFAULT_LOT_EXAMPLE, DEFAULT_LOT_PATTERN, lotIdRule, type LotIdRule } from './ids.js';
import type { Permissions } from './permissions.js';
import { CLOCK_TIME, isValidTimeZone } from './time.js';

/** The invented demo specs shipped with the project (Harrowgate Fab 3). */
export const DEMO_SPEC_FILE = fixtureFile('harrowgate-fab3-specs.yaml');

/** Who may be listed: Slack user ids (U…), HTTP API clients (api:<name>), Teams users (teams:<AAD object id>). */
const SLACK_USER = /^([UW][A-Z0-9]{2,20}|api:[a-z0-9][a-z0-9_-]{0,31}|teams:[0-9a-fA-F-]{36})$/;
const SLACK_CHANNEL = /^[CGD][A-Z0-9]{2,20}$/;

const idList = (variable: string, pattern: RegExp, what: string, example: string) =>
  z
    .string()
    .optional()
    .superRefine((text, ctx) => {
      if (text === undefined) return;
      const bad = splitList(text).filter((id) => !pattern.test(id));
      if (bad.length > 0) {
        ctx.addIssue({
          code: 'custom',
          message: `${variable} must be ${what}, separated by commas (e.g. ${example}); not understood: ${bad.slice(0, 3).map((b) => JSON.stringify(b.slice(0, 24))).join(', ')}`,
        });
      }
    })
    .transform((text) => new Set(text === undefined ? [] : splitList(text)));

function splitList(text: string): string[] {
  return text
    .split(/[,\s]+/)
    .map((s) => s.trim())
    .filter((s) => s.length > 0);
}

export interface LotsConfig {
  readonly specFile: string;
  /** True when SPEC_FILE is unset and the demo specs are used. */
  readonly demoSpecs: boolean;
  readonly digest: {
    /** undefined: no scheduled summary in Slack mode (console mode prints it). */
    readonly channel?: string;
    readonly at: string;
    readonly timeZone: string;
  };
  readonly permissions: Permissions;
  readonly lotIds: LotIdRule;
  /** A reading more than this factor outside the window asks for confirmation (0: never). */
  readonly confirmFactor?: number;
  /** The fab's four-point probe head: pin spacing, cm (PROBE_SPACING_MM). */
  readonly probeSpacingCm?: number;
}

export const LotsEnv = z
  .object({
    SPEC_FILE: z.string().optional(),
    DIGEST_CHANNEL: z
      .string()
      .regex(SLACK_CHANNEL, {
        error: 'DIGEST_CHANNEL must be a Slack channel id such as C0123ABCD (channel details → About → Channel ID), not its #name',
      })
      .optional(),
    DIGEST_AT: z
      .string()
      .regex(CLOCK_TIME, { error: 'DIGEST_AT must be a 24-hour local time HH:MM, e.g. 06:45' })
      .default('07:00'),
    DIGEST_TZ: z
      .string()
      .refine(isValidTimeZone, { error: 'DIGEST_TZ must be an IANA time zone name, e.g. Europe/London or America/Phoenix' })
      .default('UTC'),
    RECORD_USERS: idList('RECORD_USERS', SLACK_USER, 'Slack user ids, api:<client> or teams:<user id>', 'U012AB3CD,api:mes-line3'),
    RECORD_CHANNELS: idList('RECORD_CHANNELS', SLACK_CHANNEL, 'Slack channel ids', 'C0123ABCD'),
    CLEAR_USERS: idList('CLEAR_USERS', SLACK_USER, 'Slack user ids, api:<client> or teams:<user id>', 'U012AB3CD'),
    CLEAR_CHANNELS: idList('CLEAR_CHANNELS', SLACK_CHANNEL, 'Slack channel ids', 'C0123ABCD'),
    LOT_PATTERN: z
      .string()
      .max(200)
      .refine(
        (p) => {
          try {
            new RegExp(p);
            return true;
          } catch {
            return false;
          }
        },
        { error: 'LOT_PATTERN must be a regular expression over upper-case lot ids, e.g. ^LOT-[A-Z][0-9]{1,5}$' },
      )
      .optional(),
    LOT_EXAMPLE: z.string().max(64).optional(),
    RECORD_CONFIRM_FACTOR: z
      .string()
      .regex(/^\d+(?:\.\d+)?$/, { error: 'RECORD_CONFIRM_FACTOR must be a number such as 3 (or 0 to turn the question off)' })
      .transform(Number)
      .refine((n) => n === 0 || n > 1, { error: 'RECORD_CONFIRM_FACTOR must be above 1 (e.g. 3), or 0 to turn the question off' })
      .optional(),
    PROBE_SPACING_MM: z
      .string()
      .regex(/^\d+(?:\.\d+)?$/, { error: 'PROBE_SPACING_MM must be the probe head’s pin spacing in millimetres, e.g. 1.0' })
      .transform(Number)
      .refine((n) => n >= 0.1 && n <= 10, { error: 'PROBE_SPACING_MM must be between 0.1 and 10 (millimetres), e.g. 1.0 or 1.59' })
      .optional(),
  })
  .superRefine((e, ctx) => {
    if (e.LOT_PATTERN !== undefined && e.LOT_EXAMPLE !== undefined && !new RegExp(e.LOT_PATTERN).test(e.LOT_EXAMPLE.toUpperCase())) {
      ctx.addIssue({ code: 'custom', path: ['LOT_EXAMPLE'], message: `LOT_EXAMPLE ${e.LOT_EXAMPLE} does not fit LOT_PATTERN` });
    }
    if (e.LOT_PATTERN === undefined && e.LOT_EXAMPLE !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['LOT_EXAMPLE'], message: 'LOT_EXAMPLE needs LOT_PATTERN (the example describes your own lot-id pattern)' });
    }
  })
  .transform(
    (e): LotsConfig => ({
      specFile: e.SPEC_FILE ?? DEMO_SPEC_FILE,
      demoSpecs: e.SPEC_FILE === undefined,
      digest: { ...(e.DIGEST_CHANNEL !== undefined ? { channel: e.DIGEST_CHANNEL } : {}), at: e.DIGEST_AT, timeZone: e.DIGEST_TZ },
      permissions: {
        recordUsers: e.RECORD_USERS,
        recordChannels: e.RECORD_CHANNELS,
        clearUsers: e.CLEAR_USERS,
        clearChannels: e.CLEAR_CHANNELS,
      },
      ...(e.RECORD_CONFIRM_FACTOR !== undefined ? { confirmFactor: e.RECORD_CONFIRM_FACTOR } : {}),
      ...(e.PROBE_SPACING_MM !== undefined ? { probeSpacingCm: e.PROBE_SPACING_MM / 10 } : {}),
      lotIds:
        e.LOT_PATTERN === undefined
          ? lotIdRule(DEFAULT_LOT_PATTERN, DEFAULT_LOT_EXAMPLE)
          : lotIdRule(e.LOT_PATTERN, e.LOT_EXAMPLE?.toUpperCase() ?? ''),
    }),
  );
