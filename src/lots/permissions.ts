/**
 * Who may write lot records. Reading (`lot`, `flags`, `digest`) is open to everyone who can
 * reach the bot; recording and clearing are limited to the Slack user ids and/or channel ids in
 * the configuration. The local console and CLI run as the person at the keyboard, who is
 * always allowed. Anyone else gets a polite refusal and nothing is written.
 */
import type { Actor } from './readings.js';

export interface Permissions {
  readonly recordUsers: ReadonlySet<string>;
  readonly recordChannels: ReadonlySet<string>;
  readonly clearUsers: ReadonlySet<string>;
  readonly clearChannels: ReadonlySet<string>;
}

export const NO_CHAT_WRITERS: Permissions = {
  recordUsers: new Set(),
  recordChannels: new Set(),
  clearUsers: new Set(),
  clearChannels: new Set(),
};

/** Surfaces where the caller is the local user at the keyboard. */
const LOCAL_SURFACES = new Set(['console', 'cli']);

export type LotAction = 'record' | 'clear';

export function mayWrite(permissions: Permissions, action: LotAction, actor: Actor): boolean {
  if (LOCAL_SURFACES.has(actor.surface)) return true;
  const users = action === 'record' ? permissions.recordUsers : permissions.clearUsers;
  const channels = action === 'record' ? permissions.recordChannels : permissions.clearChannels;
  return users.has(actor.userId) || channels.has(actor.channelId);
}
