/** `help`: rendered from the commands' own help data. */
import { z } from 'zod';
import { errorReply, okReply } from '../reply/build.js';
import type { ReplySection } from '../reply/reply.js';
import { identity } from './common.js';
import { suggest } from './suggest.js';
import { defineCommand, type CommandSpec } from './spec.js';

export const HelpRequest = z.object({ topic: z.string().optional() });
export type HelpRequest = z.infer<typeof HelpRequest>;

export function helpCommandFor(commands: () => readonly CommandSpec<any>[]): CommandSpec<HelpRequest> {
  return defineCommand<HelpRequest>({
    verb: 'help',
    aliases: ['?', 'usage'],
    help: {
      summary: 'What each command answers, its form and examples.',
      usage: 'help [<command>]',
      examples: ['help', 'help rho', 'help type'],
      seeAlso: ['models'],
    },
    schema: HelpRequest,
    parse(args) {
      const rest = args.leftovers();
      const topic = rest[0];
      // consume everything: "help rho 8.2" still shows help for rho
      while (args.word(Object.fromEntries(rest.map((r) => [r, r])))) {
        /* consumed */
      }
      return { topic };
    },
    run(req, ctx) {
      const all = commands();
      if (!req.topic) {
        return okReply(identity(ctx), {
          command: 'help',
          title: 'shiftprobe — ask in plain trade terms',
          decision: false,
          sections: [
            {
              table: {
                columns: ['command', 'answers', 'example'],
                rows: all.map((c) => [c.verb, c.help.summary, c.help.examples[0] ?? '']),
              },
            },
            {
              lines: [
                'Words after the command can come in any order; `key value` and `key=value` both work.',
                'A reading alone also works: `8.2 ohm-cm p` is read as `rho 8.2 ohm-cm p`.',
                '`help <command>` shows the options and more examples.',
              ],
            },
          ],
        });
      }
      const spec = all.find((c) => c.verb === req.topic!.toLowerCase() || c.aliases?.includes(req.topic!.toLowerCase()));
      if (!spec) {
        const s = suggest(req.topic, all.flatMap((c) => [c.verb, ...(c.aliases ?? [])]));
        return errorReply('unknown_topic', `There is no command "${req.topic}".`, {
          usage: 'help [<command>]',
          example: 'help rho',
          ...(s ? { suggestion: s } : {}),
        });
      }
      const sections: ReplySection[] = [
        { heading: 'Form', lines: [spec.help.usage] },
        ...(spec.help.options?.length ? [{ heading: 'Options', lines: spec.help.options }] : []),
        { heading: 'Examples', lines: spec.help.examples },
        ...(spec.aliases?.length ? [{ heading: 'Also answers to', lines: [spec.aliases.join(', ')] }] : []),
        ...(spec.help.seeAlso?.length ? [{ heading: 'See also', lines: [spec.help.seeAlso.join(', ')] }] : []),
      ];
      return okReply(identity(ctx), { command: 'help', title: `${spec.verb} — ${spec.help.summary}`, decision: false, sections });
    },
  });
}
