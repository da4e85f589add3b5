/** `models`: the model registry as people see it: id, what it covers, validity, source. */
import { z } from 'zod';
import { INTRINSIC_MODELS } from '../physics/intrinsic/index.js';
import { CONVERSION_MODELS } from '../physics/resistivity/registry.js';
import { errorReply, okReply } from '../reply/build.js';
import { formatNumber } from '../reply/format.js';
import type { ReplySection } from '../reply/reply.js';
import { identity } from './common.js';
import { validitySentence } from './describe.js';
import { defineCommand } from './spec.js';
import { suggest } from './suggest.js';

export const ModelsRequest = z.object({ modelId: z.string().optional() });
export type ModelsRequest = z.infer<typeof ModelsRequest>;

export const modelsCommand = defineCommand<ModelsRequest>({
  verb: 'models',
  aliases: ['model', 'sources'],
  help: {
    summary: 'The published models shiftprobe uses, their validity and sources; `models <id>` for one.',
    usage: 'models [<id>]',
    examples: ['models', 'models f723'],
    options: ['use a model in a command with `model <id>`, e.g. rho 8.2 ohm-cm p model masetti'],
    seeAlso: ['rho', 'doping', 'ni', 'why'],
  },
  schema: ModelsRequest,
  parse(args) {
    const rest = args.leftovers();
    const id = rest[0];
    args.word(id ? { [id]: id } : {});
    return { modelId: id };
  },
  run(req, ctx) {
    const conversion = CONVERSION_MODELS.map((m) => ({
      id: m.id,
      name: m.name,
      covers: m.dopants.join(', '),
      validity: m.dopants.map((d) => validitySentence(m, d)),
      citation: m.citation,
      equations: m.equations,
    }));
    const intrinsic = INTRINSIC_MODELS.map((m) => ({
      id: m.id,
      name: m.name,
      covers: `n_i: ${m.materials.join(', ')}`,
      validity: [`${formatNumber(m.validityTemperatureK.min)} to ${formatNumber(m.validityTemperatureK.max)} K`],
      citation: m.citation,
      equations: m.equations,
    }));
    const all = [...conversion, ...intrinsic];
    if (req.modelId) {
      const id = req.modelId.toLowerCase();
      const m = all.find((x) => x.id === id || x.id.startsWith(id + '-') || x.id.split('-')[0] === id);
      if (!m) {
        const s = suggest(id, all.map((x) => x.id));
        return errorReply('unknown_model', `There is no model "${req.modelId}".`, {
          usage: 'models [<id>]',
          example: 'models f723',
          ...(s ? { suggestion: `models ${s}` } : {}),
        });
      }
      return okReply(identity(ctx), {
        command: 'models',
        title: `${m.name} (${m.id})`,
        decision: false,
        sections: [
          { heading: 'Covers', lines: [m.covers] },
          { heading: 'Validity', lines: m.validity },
          { heading: 'Equations', lines: m.equations },
          { heading: 'Source', lines: [m.citation] },
        ],
      });
    }
    const sections: ReplySection[] = [
      {
        heading: 'Resistivity ↔ dopant density (silicon)',
        table: { columns: ['id', 'model', 'covers'], rows: conversion.map((m) => [m.id, m.name, m.covers]) },
      },
      {
        heading: 'Intrinsic carrier density',
        table: { columns: ['id', 'model', 'covers'], rows: intrinsic.map((m) => [m.id, m.name, m.covers]) },
      },
      { lines: ['`models <id>` shows one model: what it covers, its validity, equations and source.'] },
      { lines: ['Defaults: ASTM F723 for boron and phosphorus, Masetti 1983 for arsenic, the F723 phosphorus conversion for antimony below 1×10¹⁹ cm⁻³.'] },
    ];
    return okReply(identity(ctx), { command: 'models', title: 'Models and their sources', decision: false, sections });
  },
});
