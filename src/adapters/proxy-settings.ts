/**
 * Whether the environment names an outbound proxy (HTTPS_PROXY / HTTP_PROXY, upper or lower
 * case). Kept apart from ./proxy.ts so that the check costs nothing: undici loads only when a
 * proxy is set.
 */
export type Env = Readonly<Record<string, string | undefined>>;

const PROXY_VARIABLES = ['HTTPS_PROXY', 'https_proxy', 'HTTP_PROXY', 'http_proxy'];

export function proxyConfigured(env: Env): boolean {
  return PROXY_VARIABLES.some((v) => (env[v] ?? '').trim() !== '');
}
