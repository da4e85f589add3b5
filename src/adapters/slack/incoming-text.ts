/**
 * Slack message text → the plain command text `handle` reads. Slack sends text with `&`, `<`,
 * `>` escaped and wraps links, mentions and channels in angle brackets; a mention of the bot
 * itself is dropped, the rest unwrapped to what the person saw.
 * (Slack API reference, "Formatting text for app surfaces": escaping and the <…> forms.)
 */
export function commandTextFromSlack(text: string | undefined, botUserId?: string): string {
  if (!text) return '';
  const unwrapped = text.replace(/<([^<>]*)>/g, (_whole, inner: string) => {
    const [target = '', label] = inner.split('|', 2);
    if (target.startsWith('@')) {
      const id = target.slice(1);
      if (botUserId && id === botUserId) return ' ';
      return label ? `@${label}` : `@${id}`;
    }
    if (target.startsWith('#')) return label ? `#${label}` : target;
    if (target.startsWith('!')) return label ?? `@${target.slice(1).split('^')[0]}`;
    return label ?? target.replace(/^mailto:/, '');
  });
  return unwrapped
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&amp;/g, '&')
    .replace(/[\u00a0\u2007\u202f]/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}
