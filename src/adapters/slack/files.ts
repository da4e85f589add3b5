/**
 * Files in and pictures out, on Slack.
 *
 * In: a measurement file attached to a message that mentions the bot, or sent in a DM, is
 * downloaded from its private URL with the bot token (scope files:read) and handed to the
 * command as its attachment. Only one file per message, CSV or plain text, at most 8 MB.
 * Out: a reply with a picture (wafer map, trend chart) gets its PNG uploaded into the same
 * conversation and thread as the card, with the Web API client's files.uploadV2 (scope
 * files:write). A failed upload is logged with its cause and told to the person in one line;
 * the card with the numbers is out already.
 */
import type { App, Logger } from '@slack/bolt';
import type { Attachment } from '../../commands/context.js';
import { MAX_FILE_BYTES } from '../../commands/measurement-file.js';
import type { ReplyOk } from '../../reply/reply.js';


/** The fields of a Slack file object shiftprobe reads. */
export interface SlackFile {
  readonly id?: string;
  readonly name?: string;
  readonly mimetype?: string;
  readonly filetype?: string;
  readonly size?: number;
  readonly url_private_download?: string;
  readonly url_private?: string;
}

export type FileIn = { readonly attachment?: Attachment } | { readonly problem: string };

const TEXT_TYPES = new Set(['csv', 'text', 'tsv']);

function looksLikeText(f: SlackFile): boolean {
  const name = (f.name ?? '').toLowerCase();
  return name.endsWith('.csv') || name.endsWith('.txt') || TEXT_TYPES.has(f.filetype ?? '') || (f.mimetype ?? '').startsWith('text/');
}

/** The message's measurement file, downloaded; no file: no attachment. */
export async function fileIn(files: readonly SlackFile[] | undefined, botToken: string | undefined, fetchFn: typeof fetch, logger: Logger): Promise<FileIn> {
  if (!files || files.length === 0) return {};
  if (files.length > 1) return { problem: 'Send one measurement file per message (one wafer per file).' };
  const f = files[0]!;
  const name = f.name ?? 'measurement.csv';
  if (!looksLikeText(f)) return { problem: `${name} is not a CSV file. A map takes a CSV measurement file (docs/measurement-files.md).` };
  if ((f.size ?? 0) > MAX_FILE_BYTES) return { problem: `${name} is ${((f.size ?? 0) / 1048576).toFixed(1)} MB; a measurement file is at most 8 MB (10 000 sites).` };
  const url = f.url_private_download ?? f.url_private;
  if (!url || !botToken) return { problem: `I could not fetch ${name} from Slack. Ask your Slack admin to check that shiftprobe has the files:read scope.` };
  try {
    const res = await fetchFn(url, { headers: { authorization: `Bearer ${botToken}` }, redirect: 'follow' });
    if (!res.ok) {
      logger.error(`shiftprobe: downloading the file ${f.id ?? name} failed: HTTP ${res.status}`);
      return { problem: `I could not fetch ${name} from Slack (HTTP ${res.status}). Ask your Slack admin to check that shiftprobe has the files:read scope.` };
    }
    const type = res.headers.get('content-type') ?? '';
    if (type.startsWith('text/html')) {
      // Slack answers a token without files:read with its sign-in page, not an error status.
      logger.error(`shiftprobe: downloading the file ${f.id ?? name} returned a web page (content-type ${type}): missing files:read scope?`);
      return { problem: `Slack did not give me ${name}. Ask your Slack admin to add the files:read scope to shiftprobe.` };
    }
    const bytes = new Uint8Array(await res.arrayBuffer());
    if (bytes.length > MAX_FILE_BYTES) return { problem: `${name} is over 8 MB; a measurement file is at most 8 MB (10 000 sites).` };
    return { attachment: { name, text: new TextDecoder('utf-8').decode(bytes) } };
  } catch (error) {
    logger.error('shiftprobe: downloading a file from Slack failed', error);
    return { problem: `I could not fetch ${name} from Slack just now; please send it again in a minute.` };
  }
}

/** Upload the reply's picture into the conversation (and thread). False when it failed (logged). */
export async function uploadPicture(client: App['client'], where: { channel: string; threadTs?: string }, reply: ReplyOk, logger: Logger): Promise<boolean> {
  if (!reply.picture) return true;
  try {
    // Loaded only when a reply has a picture: the rasteriser stays out of ordinary answers.
    const { pictureFileName, replyPng } = await import('../../render/picture/png.js');
    const png = replyPng(reply)!;
    const file = {
      file: Buffer.from(png),
      filename: pictureFileName(reply),
      title: reply.title,
      alt_text: `${reply.picture.kind === 'waferMap' ? 'Wafer map' : 'Trend chart'}: ${reply.title}`,
    };
    await (where.threadTs
      ? client.files.uploadV2({ ...file, channel_id: where.channel, thread_ts: where.threadTs })
      : client.files.uploadV2({ ...file, channel_id: where.channel }));
    return true;
  } catch (error) {
    logger.error(`shiftprobe: uploading the picture of ${reply.id} failed`, error);
    return false;
  }
}

export const UPLOAD_FAILED =
  'The picture could not be uploaded (the numbers above stand). Ask your Slack admin to check that shiftprobe has the files:write scope; on the command line, --png writes it.';
