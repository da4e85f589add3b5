/**
 * The Teams-style chat surface's settings, a section of the configuration (src/config.ts):
 *
 *   TEAMS_APP_ID         the bot's app (client) id: the audience every incoming token must name.
 *                        Required whenever Teams is configured — there is no anonymous mode.
 *   TEAMS_APP_PASSWORD   the app's client secret, for the tokens our replies are sent with
 *   TEAMS_PORT           where activities arrive (POST /api/messages); default 3978
 *   TEAMS_DIGEST_CONVERSATION  conversation id for the daily summary (a channel's 19:…@thread… id)
 *   TEAMS_SERVICE_URL    the connector's base URL for the daily summary (replies use the one each
 *                        activity names); default https://smba.trafficmanager.net/teams/
 *   TEAMS_OPENID_URL     where the connector's signing keys are published (override for a test
 *                        double); default the Bot Framework's OpenID configuration
 *   TEAMS_TOKEN_URL      where our reply tokens come from (override for a test double)
 */
import { z } from 'zod';
import { Secret } from '../secret.js';

export const DEFAULT_OPENID_URL = 'https://login.botframework.com/v1/.well-known/openidconfiguration';
export const DEFAULT_TOKEN_URL = 'https://login.microsoftonline.com/botframework.com/oauth2/v2.0/token';
export const DEFAULT_SERVICE_URL = 'https://smba.trafficmanager.net/teams/';
/** The issuer of the connector's tokens. */
export const CONNECTOR_ISSUER = 'https://api.botframework.com';

export interface TeamsConfig {
  readonly appId: string;
  readonly appPassword: Secret;
  readonly port: number;
  readonly digestConversation?: string;
  readonly serviceUrl: string;
  readonly openIdUrl: string;
  readonly tokenUrl: string;
}

const httpUrl = (variable: string) =>
  z.url({ protocol: /^https?$/, error: `${variable} must be an http(s) URL` }).optional();

export const TeamsEnv = z
  .object({
    TEAMS_APP_ID: z.string().optional(),
    TEAMS_APP_PASSWORD: z.string().optional(),
    TEAMS_PORT: z
      .string()
      .optional()
      .refine((s) => s === undefined || (/^\d{1,5}$/.test(s) && Number(s) <= 65535), { error: 'TEAMS_PORT must be a whole number from 0 to 65535, e.g. 3978' }),
    TEAMS_DIGEST_CONVERSATION: z.string().max(300).optional(),
    TEAMS_SERVICE_URL: httpUrl('TEAMS_SERVICE_URL'),
    TEAMS_OPENID_URL: httpUrl('TEAMS_OPENID_URL'),
    TEAMS_TOKEN_URL: httpUrl('TEAMS_TOKEN_URL'),
  })
  .superRefine((e, ctx) => {
    // The app id or password turns Teams on; the other settings alone (defaults in a copied
    // .env) do not.
    if (e.TEAMS_APP_ID === undefined && e.TEAMS_APP_PASSWORD === undefined && e.TEAMS_DIGEST_CONVERSATION === undefined) return;
    if (e.TEAMS_APP_ID === undefined) {
      ctx.addIssue({ code: 'custom', path: ['TEAMS_APP_ID'], message: 'TEAMS_APP_ID is missing: the Teams surface checks that every request is addressed to this app id (there is no anonymous mode)' });
    } else if (!/^[0-9a-fA-F-]{36}$/.test(e.TEAMS_APP_ID)) {
      ctx.addIssue({ code: 'custom', path: ['TEAMS_APP_ID'], message: 'TEAMS_APP_ID must be the app (client) id, a GUID such as 8f2b6c1e-0a4d-4b7e-9c3f-5d6e7f8a9b0c' });
    }
    if (e.TEAMS_APP_PASSWORD === undefined) {
      ctx.addIssue({ code: 'custom', path: ['TEAMS_APP_PASSWORD'], message: 'TEAMS_APP_PASSWORD is missing: the client secret of the app, needed to send replies' });
    }
  })
  .transform((e): TeamsConfig | undefined => {
    if (e.TEAMS_APP_ID === undefined || e.TEAMS_APP_PASSWORD === undefined) return undefined;
    const withSlash = (u: string) => (u.endsWith('/') ? u : `${u}/`);
    return {
      appId: e.TEAMS_APP_ID.toLowerCase(),
      appPassword: new Secret(e.TEAMS_APP_PASSWORD),
      port: Number(e.TEAMS_PORT ?? 3978),
      ...(e.TEAMS_DIGEST_CONVERSATION ? { digestConversation: e.TEAMS_DIGEST_CONVERSATION } : {}),
      serviceUrl: withSlash(e.TEAMS_SERVICE_URL ?? DEFAULT_SERVICE_URL),
      openIdUrl: e.TEAMS_OPENID_URL ?? DEFAULT_OPENID_URL,
      tokenUrl: e.TEAMS_TOKEN_URL ?? DEFAULT_TOKEN_URL,
    };
  });
