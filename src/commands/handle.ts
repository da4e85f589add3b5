/**
 * The one entry every surface calls: text in, a typed Reply out. Errors of every kind end in a
 * Reply too (never a stack trace): bad input gets the right form and an example.
 */
import { errorReply } from '../reply/build.js';
import type { Reply, ReplyOk } from '../reply/reply.js';
import { ArgError, Args } from './args.js';
import { ResultIdTakenError, type HandleContext } from './context.js';
import { findCommand, knownVerbs } from './registry.js';
import { suggest } from './suggest.js';
import { MAX_INPUT_CHARS, tokenize, type Token } from './tokens.js';
import { parseQuantity, type Dimension } from './units.js';

/** Commands whose replies are not results (nothing to share or explain later). */
const NOT_RESULTS = new Set(['help', 'models', 'why']);

/** A reading alone implies the command: "8.2 ohm-cm p" → rho. */
const IMPLIED_VERB: Partial<Record<Dimension, string>> = {
  resistivity: 'rho',
  density: 'doping',
  sheetResistance: 'sheet',
  voltage: 'sheet',
  temperature: 'ni',
  hallCoefficient: 'type hall',
};

export async function handle(text: string, ctx: HandleContext): Promise<Reply> {
  try {
    let reply = await dispatch(text, ctx);
    if (reply.ok && !NOT_RESULTS.has(reply.command)) {
      reply = await keep(reply, ctx);
      ctx.session.lastResultId = reply.id;
    }
    return reply;
  } catch (e) {
    if (e instanceof ArgError) return errorReply(e.code, e.message);
    // The person always gets an answer; the details go to whoever runs the bot, not the channel.
    return errorReply(
      'internal',
      'Something went wrong on our side while answering that. Nothing was recorded. Please try again; if it keeps happening, tell whoever runs shiftprobe.',
    );
  }
}

/** Keep a result; on the rare clash of a random id with an older result, take a fresh id. */
async function keep(reply: ReplyOk, ctx: HandleContext): Promise<ReplyOk> {
  let current = reply;
  for (let attempt = 0; ; attempt++) {
    try {
      await ctx.results.save(current);
      return current;
    } catch (e) {
      if (!(e instanceof ResultIdTakenError) || attempt >= 4) throw e;
      current = { ...current, id: ctx.newId() };
    }
  }
}

async function dispatch(text: string, ctx: HandleContext): Promise<Reply> {
  const trimmed = text.trim();
  if (trimmed === '') {
    return errorReply('empty', 'Ask me something, for example a resistivity reading.', { usage: 'help', example: 'rho 8.2 ohm-cm p' });
  }
  if (trimmed.length > MAX_INPUT_CHARS) {
    return errorReply('too_long', `That message is ${trimmed.length} characters; I read commands of up to ${MAX_INPUT_CHARS}. Send one question at a time.`, {
      usage: 'help',
      example: 'rho 8.2 ohm-cm p',
    });
  }
  let tokens = tokenize(trimmed);
  const first = tokens[0];
  if (!first) {
    return errorReply('empty', 'Ask me something, for example a resistivity reading.', { usage: 'help', example: 'rho 8.2 ohm-cm p' });
  }
  let verbText: string;
  if (first.kind === 'number') {
    const implied = impliedVerb(first);
    if (!implied) {
      return errorReply('unknown_command', `I can't tell what "${first.raw}" is. Start with a command, or give the reading with its unit.`, {
        usage: 'help',
        example: '8.2 ohm-cm p',
      });
    }
    verbText = implied;
    tokens = [...tokenize(implied.split(' ').slice(1).join(' ')), ...tokens];
  } else {
    verbText = first.text;
    tokens = tokens.slice(1);
  }
  const spec = findCommand(verbText.split(' ')[0]!);
  if (!spec) {
    const s = suggest(verbText, knownVerbs());
    return errorReply('unknown_command', `I don't know the command "${verbText}".`, {
      usage: 'help',
      example: 'rho 8.2 ohm-cm p',
      ...(s ? { suggestion: s } : {}),
    });
  }
  const usage = { usage: spec.help.usage, example: spec.help.examples[0] ?? '' };
  const args = new Args(tokens);
  let candidate: unknown;
  try {
    candidate = spec.parse(args, ctx);
  } catch (e) {
    if (e instanceof ArgError) return errorReply(e.code, e.message, usage);
    throw e;
  }
  const left = args.leftovers();
  if (left.length > 0) {
    return errorReply('not_understood', `I didn't understand ${left.map((w) => `"${w}"`).join(', ')} in a ${spec.verb} command.`, usage);
  }
  const checked = spec.schema.safeParse(candidate);
  if (!checked.success) {
    const msg = checked.error.issues.map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message)).join('; ');
    return errorReply('bad_request', msg, usage);
  }
  return spec.run(checked.data, ctx);
}

function impliedVerb(t: Token & { kind: 'number' }): string | undefined {
  if (t.unitText === '') return undefined;
  const q = parseQuantity(`${t.value} ${t.unitText}`);
  if (!q.ok) return undefined;
  return IMPLIED_VERB[q.quantity.dimension];
}
