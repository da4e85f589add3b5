/**
 * The JSON reply contract (render/json.ts) as a zod schema: documentation for the HTTP API's
 * OpenAPI document, and a check — a test parses the JSON of every help example with it, so the
 * schema and the renderer cannot drift apart.
 */
import { z } from 'zod';

const Value = z.object({ value: z.union([z.number(), z.string()]), unit: z.string(), label: z.string() });
const Input = z.object({ value: z.union([z.number(), z.string()]), unit: z.string().optional(), label: z.string(), asTyped: z.string().optional() });
const Warning = z.object({ code: z.string(), message: z.string() });

const Nullable = z.array(z.number().nullable());
const WaferMapPicture = z.object({
  kind: z.literal('waferMap'),
  title: z.string(),
  quantityLabel: z.string(),
  unit: z.string(),
  diameterMm: z.number(),
  edgeExclusionMm: z.number(),
  statistics: z.array(z.string()),
  sites: z.object({
    name: z.array(z.string()),
    line: z.array(z.number()),
    xMm: z.array(z.number()),
    yMm: z.array(z.number()),
    value: Nullable,
    sheetResistanceOhmPerSq: Nullable.optional(),
    resistivityOhmCm: Nullable.optional(),
    dopantDensityPerCm3: Nullable.optional(),
    thicknessUm: Nullable.optional(),
    included: z.array(z.boolean()),
    outlier: z.array(z.boolean()),
  }),
});
const TrendPicture = z.object({
  kind: z.literal('trend'),
  title: z.string(),
  quantityLabel: z.string(),
  unit: z.string(),
  points: z.array(z.object({ at: z.string(), value: z.number(), label: z.string(), lot: z.string(), flagged: z.boolean(), rules: z.array(z.number()) })),
  lotMeans: z.array(z.object({ at: z.string(), value: z.number(), lot: z.string() })),
  spec: z.object({ min: z.number().optional(), max: z.number().optional(), target: z.number().optional() }).optional(),
  control: z.object({ centre: z.number(), lower: z.number(), upper: z.number() }).optional(),
});

export const JsonReplyOk = z.object({
  ok: z.literal(true),
  id: z.string().describe('result id: `why <id>` shows the derivation'),
  command: z.string(),
  title: z.string(),
  createdAt: z.string(),
  values: z.record(z.string(), Value).describe('keyed by the stable value keys (README, "The JSON contract")'),
  inputs: z.record(z.string(), Input),
  assumptions: z.array(z.string()),
  model: z.object({ id: z.string(), name: z.string(), citation: z.string(), validity: z.string().optional() }).optional(),
  warnings: z.array(Warning),
  cautions: z.array(z.string()),
  sections: z.array(z.object({ heading: z.string().optional(), lines: z.array(z.string()).optional(), table: z.object({ columns: z.array(z.string()), rows: z.array(z.array(z.string())) }).optional() })).optional(),
  derivation: z
    .object({
      equations: z.array(z.string()),
      parameters: z.array(z.object({ name: z.string(), value: z.union([z.number(), z.string()]), unit: z.string().optional(), source: z.string().optional() })),
      steps: z.array(z.string()),
      sources: z.array(z.string()),
    })
    .optional(),
  picture: z.union([WaferMapPicture, TrendPicture]).optional().describe('data of the reply\'s picture (wafer map with every site\'s conversion, or trend chart)'),
});

export const JsonReplyError = z.object({
  ok: z.literal(false),
  error: z.object({
    code: z.string(),
    message: z.string(),
    usage: z.string().optional(),
    example: z.string().optional(),
    suggestion: z.string().optional(),
    choices: z.array(z.object({ label: z.string(), answer: z.string(), command: z.string() })).optional(),
  }),
});

export const JsonReply = z.union([JsonReplyOk, JsonReplyError]);
