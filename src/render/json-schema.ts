/**
 * The JSON reply contract (render/json.ts) as a zod schema: documentation for the HTTP API's
 * OpenAPI document, and a check — a test parses the JSON of every help example with it, so the
 * schema and the renderer cannot drift apart.
 */
import { z } from 'zod';

const Value = z.object({ value: z.union([z.number(), z.string()]), unit: z.string(), label: z.string() });
const Input = z.object({ value: z.union([z.number(), z.string()]), unit: z.string().optional(), label: z.string(), asTyped: z.string().optional() });
const Warning = z.object({ code: z.string(), message: z.string() });

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
