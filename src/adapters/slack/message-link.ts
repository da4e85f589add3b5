/**
 * A pasted Slack message link → the channel and the thread to reply in. Slack's "Copy link"
 * gives https://<workspace>.slack.com/archives/<channel>/p<ts without the dot>, and for a
 * reply inside a thread adds ?thread_ts=<parent ts>&cid=<channel>. Message timestamps are
 * seconds with six decimals ("1712345678.123456").
 */
export interface MessageLink {
  readonly channelId: string;
  readonly messageTs: string;
  /** The thread to reply in: the parent of a threaded reply, else the message itself. */
  readonly threadTs: string;
}

const ARCHIVES = /^https:\/\/[a-z0-9-]+(?:\.[a-z0-9-]+)*\.slack\.com\/archives\/([CGD][A-Z0-9]{2,})\/p(\d{10})(\d{6})\/?(?:\?(.*))?$/i;
const TS = /^\d{10}\.\d{6}$/;

export function parseMessageLink(pasted: string): MessageLink | undefined {
  const text = pasted.trim().replace(/^<|>$/g, '').split('|')[0]!.replace(/#.*$/, '');
  const m = ARCHIVES.exec(text);
  if (!m) return undefined;
  const channelId = m[1]!.toUpperCase();
  const messageTs = `${m[2]}.${m[3]}`;
  const threadParam = new URLSearchParams(m[4] ?? '').get('thread_ts');
  const threadTs = threadParam && TS.test(threadParam) ? threadParam : messageTs;
  return { channelId, messageTs, threadTs };
}
