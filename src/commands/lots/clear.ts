/**
 * `clear <lot> <flag> because <reason>`: closes an open flag with a reason, kept in the history.
 * The flag is its number (F12), a kind (window, type, spread, uniformity, model, spec) optionally with the
 * wafer/site, or `all`.
 */
import { z } from 'zod';
import { FLAG_CODES, FLAG_WORDS, flagCodeFromWord, flagHandle, parseFlagHandle } from '../../lots/flags.js';
import { ClearRequest } from '../../lots/service.js';
import { errorReply, okReply } from '../../reply/build.js';
import { ArgError } from '../args.js';
import { identity } from '../common.js';
import { defineCommand } from '../spec.js';
import { actorOf, lotsOf, NOT_SET_UP, takeLotId, takeSite, takeWafer } from './parse.js';
import { countValue, flagLine, lotErrorReply } from './wording.js';

export const ClearCommandRequest = ClearRequest;
export type ClearCommandRequest = z.infer<typeof ClearCommandRequest>;

const USAGE = 'clear <lot> <F<n>|window|type|spread|uniformity|model|spec|all> [w<n>] [site <n>] because <reason>';
const EXAMPLE = 'clear LOT-A17 window because re-measured on the referee tool: 11.8 ohm-cm';

const SELECTOR_WORDS: Readonly<Record<string, string>> = {
  all: 'all',
  ...Object.fromEntries(FLAG_CODES.flatMap((c) => [[FLAG_WORDS[c], c], [c, c]])),
};

export const clearCommand = defineCommand<ClearCommandRequest>({
  verb: 'clear',
  aliases: ['close', 'resolve'],
  help: {
    summary: 'Close an open flag with the reason; the flag and the reason stay in the lot’s history.',
    usage: USAGE,
    examples: [
      'clear LOT-A17 window because re-measured on the referee tool: 11.8 ohm-cm',
      'clear LOT-B204 type w5 because repeat hot-probe and SPV both read n-type, probe tip was contaminated',
      'clear LOT-A17 all because lot scrapped per engineering disposition',
    ],
    options: [
      'F<n>: the flag number shown by lot / flags; or its kind: window, type, spread, uniformity, model, spec (with w<n> if there are several)',
      'because <reason>: required; say what was checked or decided',
    ],
    seeAlso: ['lot', 'flags'],
  },
  schema: ClearCommandRequest,
  parse(args) {
    const lotId = takeLotId(args, EXAMPLE);
    const reason = args.rest(['because', 'reason', 'as']);
    // The flag: its handle (F12) or a kind word.
    const handleToken = args.tokens.find((t) => t.kind === 'word' && parseFlagHandle(t.text) !== undefined);
    let selector: ClearCommandRequest['selector'] | undefined;
    if (handleToken && handleToken.kind === 'word' && args.flag([handleToken.text])) {
      selector = { kind: 'id', flagId: parseFlagHandle(handleToken.text)! };
    } else {
      const word = args.word(SELECTOR_WORDS);
      if (word?.value === 'all') selector = { kind: 'all' };
      else if (word) {
        const code = flagCodeFromWord(word.value);
        if (code) {
          const wafer = takeWafer(args);
          const site = takeSite(args);
          selector = { kind: 'code', code, ...(wafer !== undefined ? { wafer } : {}), ...(site !== undefined ? { site } : {}) };
        }
      }
    }
    if (!selector) throw new ArgError('missing_flag', `Say which flag: its number (F12), its kind (window, type, spread, uniformity, model, spec) or all, e.g. ${EXAMPLE}`);
    if (reason === undefined || reason.trim().length < 3) {
      throw new ArgError('missing_reason', `Say why, after "because": e.g. ${EXAMPLE}`);
    }
    return { lotId, selector, reason: reason.trim() };
  },
  async run(req, ctx) {
    const lots = lotsOf(ctx);
    if (!lots) return errorReply('lots_unavailable', NOT_SET_UP);
    ctx.effects?.willStore(`the clearing of the flag on ${req.lotId}`, `"lot ${req.lotId}" shows which flags are open.`);
    const r = await lots.clear(req, { actor: actorOf(ctx), ...(ctx.eventId ? { eventId: ctx.eventId } : {}) });
    if (!r.ok) return lotErrorReply(r.error, { usage: USAGE, example: EXAMPLE });
    ctx.effects?.didStore(`the clearing of ${r.value.outcome.cleared.map((f) => flagHandle(f.id)).join(', ')} on ${r.value.outcome.lotId}`);
    const { outcome, duplicate } = r.value;
    const n = outcome.cleared.length;
    return okReply(identity(ctx), {
      command: 'clear',
      title: `${outcome.lotId} · cleared ${n === 1 ? flagHandle(outcome.cleared[0]!.id) : `${n} flags`}`,
      values: [countValue('clearedFlagCount', n, 'Flags cleared', true)],
      inputs: { lot: { value: outcome.lotId, label: 'Lot' }, reason: { value: req.reason, label: 'Reason' } },
      assumptions: [
        'The flag stays in the lot’s history with who cleared it, when and why; nothing is deleted.',
        ...(duplicate ? ['This message was already handled (delivered again); nothing new was written.'] : []),
      ],
      sections: [{ heading: 'Cleared', lines: outcome.cleared.map((f) => flagLine(f)) }],
    });
  },
});
