/**
 * Slack mrkdwn helpers. Slack reads `&`, `<` and `>` as control characters (links, mentions,
 * `<!channel>`), so every piece of text that reaches a mrkdwn field is escaped exactly once,
 * here; nothing a person typed can turn into a mention or a link.
 */

export function escapeMrkdwn(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/** Echoed input as inline code: no formatting, no mentions; a typed backtick becomes ˋ. */
export function codeSpan(text: string): string {
  const inner = escapeMrkdwn(text.replace(/`/g, 'ˋ').replace(/\s+/g, ' ').trim());
  return inner === '' ? '' : '`' + inner + '`';
}

export function bold(escapedText: string): string {
  return escapedText === '' ? '' : `*${escapedText}*`;
}

/**
 * Cuts already-escaped mrkdwn to at most `max` characters, never inside an entity (&amp;) and
 * preferably at a line break or space, ending with '…' (and closing an open code span).
 */
export function fitMrkdwn(text: string, max: number): string {
  if (text.length <= max) return text;
  let cut = max - 2; // room for a closing backtick and the ellipsis
  const amp = text.lastIndexOf('&', cut - 1);
  if (amp !== -1) {
    const semi = text.indexOf(';', amp);
    if (semi === -1 || semi >= cut) cut = amp;
  }
  const soft = Math.max(text.lastIndexOf('\n', cut), text.lastIndexOf(' ', cut));
  if (soft > max * 0.6) cut = soft;
  let head = text.slice(0, cut).trimEnd();
  if ((head.match(/`/g)?.length ?? 0) % 2 === 1) head += '`';
  return head + '…';
}

/** Plain text (header, buttons) cut to `max` characters with '…'. */
export function fitPlain(text: string, max: number): string {
  const oneLine = text.replace(/\s+/g, ' ').trim();
  return oneLine.length <= max ? oneLine : oneLine.slice(0, max - 1).trimEnd() + '…';
}
