/**
 * The one entry every surface calls: text in, a typed Reply out. Errors of every kind end in a
 * Reply too (never a stack trace): bad input gets the right form and an example, a word with two
 * readings gets a question, and a failure on our side is logged with its cause and told honestly
 * (what was stored and what was not).
 *
 * The way from text to a command:
 *   1. phrasing (src/commands/phrasing.ts): look-alike characters, chat markup, "what is …?",
 *      "@ 25C", decimal commas
 *   2. tokens; the verb (a command word or alias), or one implied by the first reading
 *      ("8.2 ohm-cm p" → rho, "hot probe -1.4 mV" → type hot)
 *   3. conductivity-type words (src/commands/conductivity-words.ts): "P type" is p-type, a lone
 *      "P" is asked about
 *   4. the command's own parse, leftovers reported with a "did you mean" and the whole corrected
 *      command when one near word makes it read
 */
import { errorReply } from '../reply/build.js';
import { isResult } from '../reply/kinds.js';
import type { Reply, ReplyChoice, ReplyError, ReplyOk } from '../reply/reply.js';
import { ArgError, Args, AskError, type AskChoice } from './args.js';
import { refuseUncovered } from './common.js';
import { mergeTypePhrases, resolveLoneP } from './conductivity-words.js';
import { ResultIdTakenError, type EffectLog, type HandleContext } from './context.js';
import { preparePhrasing } from './phrasing.js';
import { COMMANDS, findCommand, knownVerbs } from './registry.js';
import type { CommandSpec } from './spec.js';
import { editDistance, suggest } from './suggest.js';
import { MAX_INPUT_CHARS, tokenize, type Token } from './tokens.js';
import { parseQuantity, type Dimension } from './units.js';
import { DOPANT_WORDS, MATERIAL_WORDS, PROBE_METHOD_WORDS } from './words.js';

/** A reading alone implies the command: "8.2 ohm-cm p" → rho. */
const IMPLIED_VERB: Partial<Record<Dimension, string>> = {
  resistivity: 'rho',
  density: 'doping',
  sheetResistance: 'sheet',
  voltage: 'sheet',
  temperature: 'ni',
  hallCoefficient: 'type hall',
};

/** Lot commands start with a lot id, which is never read as a type word. */
const LOT_ID_FIRST = new Set(['record', 'lot', 'clear', 'trend']);

export async function handle(text: string, ctx: HandleContext): Promise<Reply> {
  const effects = new Effects();
  const inner: HandleContext = Object.create(ctx, { effects: { value: effects } }) as HandleContext;
  let stage: 'reading' | 'answering' | 'keeping' = 'reading';
  try {
    const pending = ctx.session.pendingChoices;
    const answer = pending?.find((c) => c.answer.toLowerCase() === text.trim().toLowerCase());
    ctx.session.pendingChoices = undefined;
    let reply = await dispatch(answer ? answer.command : text, inner, () => {
      stage = 'answering';
    });
    if (!reply.ok && reply.error.choices?.length) {
      ctx.session.pendingChoices = reply.error.choices.map((c) => ({ answer: c.answer, command: c.command }));
    }
    if (isResult(reply)) {
      stage = 'keeping';
      reply = await keep(reply, ctx);
      ctx.session.lastResultId = reply.id;
    }
    return reply;
  } catch (e) {
    if (e instanceof ArgError) return errorReply(e.code, e.message);
    (ctx.log ?? defaultLog).error(
      { err: e, stage, surface: ctx.surface, user: ctx.caller.userId, text: text.slice(0, 200), stored: effects.stored, writing: effects.writing },
      `shiftprobe: a request failed while ${stage}`,
    );
    return errorReply('internal', failureWording(effects, stage));
  }
}

/** What a failure message can honestly say about side effects. */
function failureWording(effects: Effects, stage: string): string {
  const tail = 'The cause has been logged for whoever runs shiftprobe.';
  if (effects.stored.length > 0) {
    return `${capital(effects.stored.join('; '))}: stored, but the reply could not be completed. Do not enter it again. ${effects.check ?? ''} ${tail}`.replace(/\s+/g, ' ').trim();
  }
  if (effects.writing.length > 0) {
    return `Something went wrong while storing ${effects.writing.join('; ')}, and I cannot tell whether it was stored. ${effects.check ?? 'Check before entering it again.'} ${tail}`.replace(/\s+/g, ' ').trim();
  }
  return `Something went wrong on our side while ${stage === 'reading' ? 'reading' : 'answering'} that. Nothing was stored. Please try again; if it keeps happening, tell whoever runs shiftprobe. ${tail}`;
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** Side effects a command reports while it runs, so a later failure is worded truthfully. */
class Effects implements EffectLog {
  readonly stored: string[] = [];
  readonly writing: string[] = [];
  check: string | undefined;
  willStore(what: string, check?: string): void {
    this.writing.push(what);
    if (check) this.check = check;
  }
  didStore(what: string): void {
    this.stored.push(what);
    const i = this.writing.indexOf(what);
    if (i >= 0) this.writing.splice(i, 1);
  }
}

const defaultLog = {
  error(detail: unknown, message: string): void {
    const err = (detail as { err?: unknown }).err;
    const cause = err instanceof Error ? `${err.name}: ${err.message}` : String(err);
    process.stderr.write(`${new Date().toISOString()} ERROR ${message} (${cause})\n`);
  },
};

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

const EXAMPLE = 'rho 8.2 ohm-cm p';

function emptyReply(): ReplyError {
  return errorReply('empty', 'Ask me something, for example a resistivity reading.', { usage: 'help', example: EXAMPLE });
}

/** The tokens of a command: the spec, the argument tokens, the verb as typed, and the notes so far. */
interface Reading {
  readonly spec: CommandSpec<any>;
  readonly verbText: string;
  readonly tokens: Token[];
}

async function dispatch(text: string, ctx: HandleContext, answering: () => void): Promise<Reply> {
  if (text.trim() === '') return emptyReply();
  if (text.trim().length > MAX_INPUT_CHARS) {
    return errorReply('too_long', `That message is ${text.trim().length} characters; I read commands of up to ${MAX_INPUT_CHARS}. Send one question at a time.`, {
      usage: 'help',
      example: EXAMPLE,
    });
  }
  const phrasing = preparePhrasing(text);
  if (phrasing.question) {
    return askReply(
      'ambiguous_number',
      phrasing.question.question,
      phrasing.question.choices.map((c) => ({ label: c.label, answer: c.answer, command: c.text })),
    );
  }
  if (phrasing.text === '') return emptyReply();
  const found = findVerb(tokenize(phrasing.text));
  if ('error' in found) return found.error;
  const { spec, verbText } = found;
  let tokens: Token[];
  const notes = [...phrasing.notes];
  try {
    const merged = mergeTypePhrases(found.tokens);
    notes.push(...merged.notes);
    const skip = new Set<Token>(LOT_ID_FIRST.has(spec.verb) && merged.tokens[0] ? [merged.tokens[0]] : []);
    tokens = resolveLoneP(merged.tokens, spec.lonePRule, skip);
  } catch (e) {
    if (e instanceof AskError) return askFromError(e, verbText, found.tokens);
    if (e instanceof ArgError) return errorReply(e.code, e.message, usageOf(spec));
    throw e;
  }
  const parsed = parseWith(spec, tokens, ctx);
  if (!parsed.ok) {
    if (parsed.error instanceof AskError) return askFromError(parsed.error, verbText, tokens);
    return explain(parsed.error, spec, verbText, tokens, ctx);
  }
  answering();
  const reply = await spec.run(parsed.request, ctx);
  notes.push(...parsed.notes);
  if (!reply.ok || notes.length === 0) return reply;
  return { ...reply, assumptions: [...reply.assumptions, ...notes.filter((n) => !reply.assumptions.includes(n))] };
}

type Parsed = { ok: true; request: unknown; notes: string[] } | { ok: false; error: ArgError };

/** The command's parse, its leftovers and its schema: a request, or the reason it does not read. */
function parseWith(spec: CommandSpec<any>, tokens: readonly Token[], ctx: HandleContext): Parsed {
  const args = new Args(tokens);
  let candidate: unknown;
  try {
    candidate = spec.parse(args, ctx);
    const left = args.leftovers();
    if (left.length > 0) {
      refuseUncovered(args);
      return { ok: false, error: new ArgError('not_understood', `I didn't understand ${left.map((w) => `"${w}"`).join(', ')} in a ${spec.verb} command.`) };
    }
  } catch (e) {
    if (e instanceof ArgError) return { ok: false, error: e };
    throw e;
  }
  const checked = spec.schema.safeParse(candidate);
  if (!checked.success) {
    // The parse built something the schema refuses: our mistake, not the person's. Said plainly.
    return { ok: false, error: new ArgError('bad_request', `I could not read that as a ${spec.verb} command; please use the form below.`) };
  }
  return { ok: true, request: checked.data, notes: args.notes };
}

function usageOf(spec: CommandSpec<any>): { usage: string; example: string } {
  return { usage: spec.help.usage, example: spec.help.examples[0] ?? '' };
}

/**
 * A parse error, with a "did you mean" when one near word (or another command for a reading of
 * another kind) makes the whole command read.
 */
function explain(error: ArgError, spec: CommandSpec<any>, verbText: string, tokens: readonly Token[], ctx: HandleContext): ReplyError {
  const usage = usageOf(spec);
  const repaired = error.suggestion ?? repair(spec, verbText, tokens, ctx);
  if (!repaired) return errorReply(error.code, error.message, usage);
  return errorReply(error.code, error.message, { ...usage, suggestion: repaired });
}

/** Words a command may contain, for near-miss suggestions. */
function vocabulary(spec: CommandSpec<any>): string[] {
  const fromHelp = [spec.help.usage, ...spec.help.examples, ...(spec.help.options ?? [])]
    .join(' ')
    .match(/[A-Za-z][A-Za-z_-]{2,}/g) ?? [];
  const words = new Set<string>([
    ...fromHelp.map((w) => w.toLowerCase()),
    ...Object.keys(DOPANT_WORDS).filter((w) => w.length >= 3),
    ...Object.keys(MATERIAL_WORDS).filter((w) => w.length >= 3),
    ...Object.keys(PROBE_METHOD_WORDS),
    'ohm-cm', 'ohm/sq', 'micron', 'um', 'mm', 'mV',
  ]);
  return [...words];
}

function repair(spec: CommandSpec<any>, verbText: string, tokens: readonly Token[], ctx: HandleContext): string | undefined {
  // A reading of another kind: "rho 1e15 cm-3 p" → doping.
  const firstNumber = tokens.find((t): t is Token & { kind: 'number' } => t.kind === 'number' && t.unitText !== '');
  const other = firstNumber ? impliedVerb(firstNumber) : undefined;
  if (other && other.split(' ')[0] !== spec.verb) {
    const otherSpec = findCommand(other.split(' ')[0]!);
    const rest = [...tokenize(other.split(' ').slice(1).join(' ')), ...tokens];
    if (otherSpec && parseWith(otherSpec, rest, ctx).ok) return commandText(other.split(' ')[0]!, rest);
  }
  // One near word: "boro" → boron, "phosporus" → phosphorus.
  const known = vocabulary(spec);
  for (const t of tokens) {
    if (t.kind !== 'word' || t.text.length < 3 || known.includes(t.text.toLowerCase())) continue;
    const near = nearest(t.text, known);
    if (!near) continue;
    const fixed = tokens.map((x) => (x === t ? ({ kind: 'word', text: near, raw: near, verbatim: near } as Token) : x));
    if (parseWith(spec, fixed, ctx).ok) return commandText(verbText, fixed);
  }
  return undefined;
}

function nearest(word: string, known: readonly string[]): string | undefined {
  const w = word.toLowerCase();
  let best: { word: string; d: number } | undefined;
  for (const k of known) {
    const d = editDistance(w, k.toLowerCase());
    if (!best || d < best.d) best = { word: k, d };
  }
  const limit = w.length <= 4 ? 1 : w.length <= 8 ? 2 : 3;
  return best && best.d > 0 && best.d <= limit ? best.word : undefined;
}

function commandText(verb: string, tokens: readonly Token[]): string {
  return [verb, ...tokens.map((t) => t.verbatim)].join(' ');
}

// ---------- questions ----------

function askReply(code: string, question: string, choices: readonly ReplyChoice[]): ReplyError {
  return { ok: false, error: { code, message: question, choices } };
}

function askFromError(e: AskError, verbText: string, tokens: readonly Token[]): ReplyError {
  return askReply(
    e.code,
    e.message,
    e.choices.map((c: AskChoice) => ({ label: c.label, answer: c.answer, command: applyEdits(verbText, tokens, c) })),
  );
}

function applyEdits(verbText: string, tokens: readonly Token[], choice: AskChoice): string {
  const parts = tokens.map((t) => {
    const edit = choice.edits.find((e) => e.token === t || (e.token.raw === t.raw && e.token.verbatim === t.verbatim));
    return edit ? edit.replacement : t.verbatim;
  });
  return [verbText, ...parts].filter((p) => p !== '').join(' ');
}

// ---------- the verb ----------

type FoundVerb = { spec: CommandSpec<any>; verbText: string; tokens: Token[] } | { error: ReplyError };

function findVerb(all: Token[]): FoundVerb {
  const first = all[0];
  if (!first) return { error: emptyReply() };
  // A command word as typed, even one that looks like a number ("4pp").
  // ("type=N rho 8.2 ohm-cm" starts with a type phrase, not with the type command.)
  const startsWithTypePhrase = /^[pn]-type$/.test((mergeTypePhrasesQuiet(all.slice(0, 2))[0] as { text?: string }).text ?? '') && first.kind === 'word' && /^(?:type|typ|conductivity)$/i.test(first.text);
  const direct = startsWithTypePhrase ? undefined : (findCommand(first.raw) ?? (first.kind === 'word' ? findCommand(first.text) : undefined));
  if (direct) return { spec: direct, verbText: first.raw.toLowerCase(), tokens: all.slice(1) };
  // A probe method first: "hot probe -1.4 mV", "hall -1.3e3 cm3/C" → type.
  if (first.kind === 'word' && Object.hasOwn(PROBE_METHOD_WORDS, first.text.toLowerCase())) {
    const tokens = all.filter((t, i) => !(i === 1 && t.kind === 'word' && /^probe$/i.test(t.text)));
    return { spec: findCommand('type')!, verbText: 'type', tokens };
  }
  // A type or dopant word first, the command word after it: "P type rho 8.2 ohm-cm".
  if (isTradeWord(all)) {
    const merged = mergeTypePhrasesQuiet(all);
    const at = merged.findIndex((t, i) => i > 0 && t.kind === 'word' && findCommand(t.text) !== undefined);
    const verb = merged[at];
    if (verb?.kind === 'word') return { spec: findCommand(verb.text)!, verbText: verb.text.toLowerCase(), tokens: merged.filter((_t, i) => i !== at) };
  }
  // A reading with its unit implies the command ("8.2 ohm-cm p", "P-type 8.2 ohm-cm").
  const reading = all.find((t): t is Token & { kind: 'number' } => t.kind === 'number' && t.unitText !== '');
  const leadingWordIsTrade = first.kind === 'number' || isTradeWord(all);
  if (reading && leadingWordIsTrade) {
    const implied = impliedVerbOrAsk(reading, all);
    if ('error' in implied) return implied;
    const [verb, ...extra] = implied.verb.split(' ');
    return { spec: findCommand(verb!)!, verbText: verb!, tokens: [...tokenize(extra.join(' ')), ...all] };
  }
  if (first.kind === 'number') {
    return {
      error: errorReply('unknown_command', `I can't tell what "${first.raw}" is. Start with a command, or give the reading with its unit.`, {
        usage: 'help',
        example: '8.2 ohm-cm p',
      }),
    };
  }
  const verbText = first.text;
  const s = suggestVerb(verbText);
  const corrected = s ? [s, ...all.slice(1).map((t) => t.verbatim)].join(' ') : undefined;
  return {
    error: errorReply('unknown_command', `I don't know the command "${verbText}".`, {
      usage: 'help',
      example: EXAMPLE,
      ...(corrected ? { suggestion: corrected } : {}),
    }),
  };
}

/** The first word names a type or dopant ("P-type 8.2 ohm-cm", "boron 1e15"). */
function isTradeWord(all: readonly Token[]): boolean {
  const merged = mergeTypePhrasesQuiet(all);
  const first = merged[0];
  return first?.kind === 'word' && (Object.hasOwn(DOPANT_WORDS, first.text) || Object.hasOwn(DOPANT_WORDS, first.text.toLowerCase()) || first.text === 'P');
}

function mergeTypePhrasesQuiet(all: readonly Token[]): Token[] {
  try {
    return mergeTypePhrases(all).tokens;
  } catch {
    return [...all];
  }
}

/** The canonical verb a near-miss word points at: "dop" → doping, "recod" → record. */
function suggestVerb(word: string): string | undefined {
  const w = word.toLowerCase();
  if (w.length >= 3) {
    const prefixed = COMMANDS.filter((c) => c.verb.startsWith(w) || c.aliases?.some((a) => a.startsWith(w) && a.length > 3));
    if (prefixed.length === 1) return prefixed[0]!.verb;
  }
  const s = suggest(word, knownVerbs());
  return s ? findCommand(s)?.verb : undefined;
}

function impliedVerb(t: Token & { kind: 'number' }): string | undefined {
  if (t.unitText === '') return undefined;
  const q = parseQuantity(`${t.value} ${t.unitText}`);
  if (!q.ok) return undefined;
  return IMPLIED_VERB[q.quantity.dimension];
}

function impliedVerbOrAsk(t: Token & { kind: 'number' }, all: readonly Token[]): { verb: string } | { error: ReplyError } {
  const q = parseQuantity(`${t.value} ${t.unitText}`);
  if (!q.ok && q.reason === 'ambiguous_unit' && /^ohms?$/i.test(t.unitText.trim())) {
    const rest = all.map((x) => (x === t ? null : x.verbatim)).filter((x): x is string => x !== null);
    return {
      error: askReply('ambiguous_unit', `"${t.raw}": a resistivity (ohm-cm) or a sheet resistance (ohm/sq)? Answer \`ohm-cm\` or \`ohm/sq\`.`, [
        { label: 'resistivity (Ω·cm)', answer: 'ohm-cm', command: ['rho', `${t.value} ohm-cm`, ...rest].join(' ') },
        { label: 'sheet resistance (Ω/□)', answer: 'ohm/sq', command: ['sheet', `${t.value} ohm/sq`, ...rest].join(' ') },
      ]),
    };
  }
  if (!q.ok) {
    return {
      error: errorReply(q.reason === 'ambiguous_unit' ? 'ambiguous_unit' : 'unknown_command', `${q.message}. Start with a command, or give the reading with a unit I know.`, {
        usage: 'help',
        example: '8.2 ohm-cm p',
      }),
    };
  }
  const verb = IMPLIED_VERB[q.quantity.dimension];
  if (!verb) {
    return {
      error: errorReply('unknown_command', `I can't tell what to do with "${t.raw}". Start with a command.`, { usage: 'help', example: '8.2 ohm-cm p' }),
    };
  }
  return { verb };
}
