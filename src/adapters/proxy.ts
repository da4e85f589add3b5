/**
 * Outbound HTTP through the fab's proxy: HTTPS_PROXY / HTTP_PROXY with NO_PROXY exceptions (the
 * usual variables, upper or lower case). Every client that goes out — the Slack Web API client
 * (posts, file uploads), Slack response URLs, the Teams connector and its key set — is given a
 * `fetch` bound to a proxy dispatcher. Nothing changes when no proxy is set.
 */
import { EnvHttpProxyAgent, fetch as undiciFetch } from 'undici';

import { proxyConfigured, type Env } from './proxy-settings.js';

export { proxyConfigured };

/**
 * A `fetch` that goes through the proxy the variables name (undici's EnvHttpProxyAgent reads
 * HTTPS_PROXY, HTTP_PROXY and NO_PROXY per request); undefined when no proxy is set. It is given
 * to each client explicitly — the Slack Web API client, response URLs, the Teams connector and
 * its key set — rather than replacing the process-wide fetch.
 */
export function proxiedFetch(env: Env): typeof fetch | undefined {
  if (!proxyConfigured(env)) return undefined;
  const pick = (a: string, b: string) => env[a] || env[b] || undefined;
  const httpsProxy = pick('HTTPS_PROXY', 'https_proxy');
  const httpProxy = pick('HTTP_PROXY', 'http_proxy');
  const noProxy = pick('NO_PROXY', 'no_proxy');
  const dispatcher = new EnvHttpProxyAgent({
    ...(httpProxy ? { httpProxy } : {}),
    ...(httpsProxy ? { httpsProxy } : {}),
    ...(noProxy !== undefined ? { noProxy } : {}),
  });
  return ((input: Parameters<typeof fetch>[0], init?: Parameters<typeof fetch>[1]) =>
    undiciFetch(input as never, { ...(init as object), dispatcher } as never)) as unknown as typeof fetch;
}
