/**
 * The local console: a prompt, command history (kept between runs next to the database),
 * `help`, the same replies as every other surface rendered as text. `exit` or Ctrl-D leaves.
 * Thin: read a line, ask the application layer, print the rendered reply.
 */
import { appendFileSync, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { createInterface } from 'node:readline';
import type { Readable, Writable } from 'node:stream';
import type { Asked, Question } from '../../app/application.js';
import type { SummaryNotifier } from '../../app/daily-summary.js';
import { renderText } from '../../render/text.js';

export interface ConsoleOptions {
  readonly input: Readable;
  readonly output: Writable;
  /** The application layer's `ask`, and who is at the console. */
  readonly ask: (question: Question) => Promise<Asked>;
  readonly caller: Question['caller'];
  /** File for command history; none when undefined. */
  readonly historyPath?: string;
  readonly terminal?: boolean;
}

const BANNER = [
  'shiftprobe — local console (no chat account needed)',
  'Ask in trade terms: "8.2 ohm-cm p", "type hot -1.4mV", "ni 85C". "help" lists everything; "exit" or Ctrl-D leaves.',
  '',
].join('\n');

const HISTORY_LIMIT = 500;

function loadHistory(path: string | undefined): string[] {
  if (!path || !existsSync(path)) return [];
  // readline wants the newest first
  return readFileSync(path, 'utf8').split('\n').filter((l) => l.trim() !== '').slice(-HISTORY_LIMIT).reverse();
}

export async function runConsole(options: ConsoleOptions): Promise<void> {
  const { output } = options;
  // One session for the whole run: a bare `why` and the answer to a question asked just before.
  const session: NonNullable<Question['session']> = {};
  const terminal = options.terminal ?? Boolean((options.output as { isTTY?: boolean }).isTTY);
  const rl = createInterface({
    input: options.input,
    output,
    terminal,
    history: loadHistory(options.historyPath),
    historySize: HISTORY_LIMIT,
    prompt: 'shiftprobe ▸ ',
  });
  if (options.historyPath) mkdirSync(dirname(options.historyPath), { recursive: true });
  const width = Math.min((output as { columns?: number }).columns ?? 88, 100);
  output.write(BANNER);
  rl.prompt();
  for await (const line of rl) {
    const text = line.trim();
    if (text === 'exit' || text === 'quit') break;
    if (text !== '') {
      if (options.historyPath) appendFileSync(options.historyPath, text.replace(/\n/g, ' ') + '\n');
      const asked = await options.ask({ text, surface: 'console', caller: options.caller, session });
      if (!asked.duplicate) {
        output.write(renderText(asked.reply, { width }) + '\n\n');
        await asked.settle();
      }
    }
    rl.prompt();
  }
  rl.close();
  output.write('bye\n');
}

/** The daily summary printed in the console at DIGEST_AT. */
export function consoleSummaryNotifier(output: Writable): SummaryNotifier {
  return {
    surface: 'console',
    destination: 'console',
    async notify(reply) {
      const width = Math.min((output as { columns?: number }).columns ?? 88, 100);
      output.write(`\n${renderText(reply, { width })}\n\n`);
    },
  };
}
