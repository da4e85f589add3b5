/**
 * Display names for replies ("recorded by Priya"), looked up once per person with users.info and
 * remembered for an hour; user ids stay what the database keeps. A lookup that fails (no
 * users:read scope, a slow API) gives no name and the reply shows the id: never a failed answer.
 */
import type { webApi } from '@slack/bolt';

const TTL_MS = 3600_000;
const LIMIT = 5000;
const TIMEOUT_MS = 400;

export type NameLookup = (userId: string) => Promise<string | undefined>;

export function displayNames(client: Pick<webApi.WebClient, 'users'>, now: () => number = Date.now, log?: (m: string) => void): NameLookup {
  const cache = new Map<string, { name: string | undefined; at: number }>();
  return async (userId) => {
    const hit = cache.get(userId);
    if (hit && now() - hit.at < TTL_MS) return hit.name;
    let name: string | undefined;
    try {
      const info = await Promise.race([
        client.users.info({ user: userId }),
        new Promise<undefined>((resolve) => setTimeout(() => resolve(undefined), TIMEOUT_MS).unref?.()),
      ]);
      const profile = info?.user?.profile;
      name = (profile?.display_name || profile?.real_name || info?.user?.name || undefined)?.slice(0, 80);
    } catch (e) {
      log?.(`display name of ${userId} not available: ${e instanceof Error ? e.message : String(e)}`);
    }
    if (cache.size >= LIMIT) cache.clear();
    cache.set(userId, { name, at: now() });
    return name;
  };
}
