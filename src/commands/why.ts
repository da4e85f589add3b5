/** `why`: the full derivation of the last result, or of a result id. */
import { z } from 'zod';
import { errorReply, okReply } from '../reply/build.js';
import { formatNumber } from '../reply/format.js';
import type { ReplyOk, ReplySection } from '../reply/reply.js';
import { identity } from './common.js';
import { defineCommand } from './spec.js';

export const WhyRequest = z.object({ resultId: z.string().regex(/^r-[0-9a-f]{4,12}$/i, { message: 'a result id looks like r-4f2a9c' }).optional() });
export type WhyRequest = z.infer<typeof WhyRequest>;

function show(v: number | string): string {
  return typeof v === 'number' ? formatNumber(v, { sigFigs: 6, trim: true }) : v;
}

export function derivationSections(r: ReplyOk): ReplySection[] {
  const sections: ReplySection[] = [
    {
      heading: 'Inputs as understood',
      table: {
        columns: ['input', 'value', 'as typed'],
        rows: Object.values(r.inputs).map((i) => [i.label, `${show(i.value)}${i.unit ? ' ' + i.unit : ''}`, i.asTyped ?? '']),
      },
    },
  ];
  const d = r.derivation;
  if (d) {
    if (d.equations.length) sections.push({ heading: 'Equations', lines: d.equations });
    if (d.parameters.length) {
      sections.push({
        heading: 'Parameters',
        table: {
          columns: ['parameter', 'value', 'source'],
          rows: d.parameters.map((p) => [p.name, `${show(p.value)}${p.unit ? ' ' + p.unit : ''}`, p.source ?? '']),
        },
      });
    }
    if (d.steps.length) sections.push({ heading: 'Steps', lines: d.steps });
    if (d.sources.length) sections.push({ heading: 'Sources', lines: d.sources });
  }
  if (r.assumptions.length) sections.push({ heading: 'Assumptions', lines: r.assumptions });
  return sections;
}

export const whyCommand = defineCommand<WhyRequest>({
  verb: 'why',
  aliases: ['how', 'derivation'],
  help: {
    summary: 'The full derivation of the last result, or of a result id: inputs, equations, parameters, sources.',
    usage: 'why [<result id>]',
    examples: ['why'],
    options: ['<result id>: the id shown under every result, e.g. r-4f2a9c'],
    seeAlso: ['models'],
  },
  schema: WhyRequest,
  parse(args, ctx) {
    const rest = args.leftovers();
    const id = rest[0];
    args.word(id ? { [id]: id } : {});
    return { resultId: id ?? ctx.session.lastResultId };
  },
  async run(req, ctx) {
    if (!req.resultId) {
      return errorReply('nothing_to_explain', 'There is no earlier result here yet. Ask something first, or give a result id.', {
        usage: 'why [<result id>]',
        example: 'why r-4f2a9c',
      });
    }
    const r = await ctx.results.get(req.resultId);
    if (!r) {
      return errorReply('unknown_result', `I have no result "${req.resultId}". Result ids are shown under each answer, like r-4f2a9c.`, {
        usage: 'why [<result id>]',
      });
    }
    return okReply(identity(ctx), {
      command: 'why',
      title: `How ${r.id} was worked out: ${r.title}`,
      values: r.values,
      // inputs are shown in the "Inputs as understood" table below
      ...(r.model ? { model: r.model } : {}),
      warnings: r.warnings,
      cautions: r.cautions,
      sections: derivationSections(r),
      decision: r.decision,
    });
  },
});
