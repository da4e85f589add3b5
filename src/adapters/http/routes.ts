/**
 * The HTTP API's routes, declared once with their zod schemas: the same schemas validate each
 * request and make the OpenAPI 3.1 document at /v1/openapi.json (no hand-written copy).
 */
import { createRoute, z } from '@hono/zod-openapi';
import { ConvertDensityRequest, ConvertError, ConvertResistivityRequest, ConvertResponse } from '../../app/convert.js';
import { JsonReply } from '../../render/json-schema.js';
import { MAX_FILE_BYTES } from '../../commands/measurement-file.js';

export const ApiError = z.object({
  ok: z.literal(false),
  error: z.object({ code: z.string(), message: z.string(), usage: z.string().optional() }),
});

const security = [{ apiKey: [] }];
const errors = {
  400: { description: 'The body is not valid JSON or does not fit the schema (the message says which field)', content: { 'application/json': { schema: ApiError } } },
  401: { description: 'No valid API key', content: { 'application/json': { schema: ApiError } } },
  413: { description: 'The body is larger than HTTP_API_BODY_LIMIT_BYTES', content: { 'application/json': { schema: ApiError } } },
  429: { description: 'Over the client’s rate (HTTP_API_RATE_PER_MINUTE); Retry-After says when to try again', content: { 'application/json': { schema: ApiError } } },
};
const idempotencyHeader = z.object({
  'idempotency-key': z.string().min(1).max(200).optional().describe('the same key again returns the first outcome and stores nothing new'),
});

export const AskBody = z
  .object({
    text: z.string().min(1).max(2000).describe('a shiftprobe command, e.g. "rho 8.2 ohm-cm p"'),
    file: z
      .object({
        name: z.string().min(1).max(200).describe('the file name, as the replies name it'),
        text: z.string().min(1).max(MAX_FILE_BYTES).describe('the measurement file (CSV) as text, layout in docs/measurement-files.md'),
      })
      .strict()
      .optional()
      .describe('a measurement file for `map` or `record <lot> w<n> map`, as the chat surfaces take an attached file'),
  })
  .strict();

export const askRoute = createRoute({
  method: 'post',
  path: '/v1/ask',
  summary: 'Ask in the command language; the reply is the JSON contract of `shiftprobe --json`',
  security,
  request: { headers: idempotencyHeader, body: { required: true, content: { 'application/json': { schema: AskBody, example: { text: 'rho 8.2 ohm-cm p' } } } } },
  description: 'With `file`, a measurement file goes with the command (`map …`, `record <lot> w<n> map …`); the wafer map comes back as data in `picture`.',
  responses: {
    200: { description: 'A reply: ok:true with values, or ok:false with the error and the right form (bad input is a reply, not an HTTP error)', content: { 'application/json': { schema: JsonReply } } },
    ...errors,
  },
});

export const convertResistivityRoute = createRoute({
  method: 'post',
  path: '/v1/convert/resistivity',
  summary: 'Resistivity (Ω·cm) → dopant density (cm⁻³): one value or up to 10 000',
  security,
  request: {
    body: { required: true, content: { 'application/json': { schema: ConvertResistivityRequest, example: { resistivityOhmCm: [8.2, 9.1, 10.4], dopant: 'boron', temperatureC: 23 } } } },
  },
  responses: {
    200: { description: 'Each value with its status (ok, outside_validity, refused), the model and its source, assumptions and cautions; or ok:false for an unknown model', content: { 'application/json': { schema: z.union([ConvertResponse, ConvertError]) } } },
    ...errors,
  },
});

export const convertDensityRoute = createRoute({
  method: 'post',
  path: '/v1/convert/density',
  summary: 'Dopant density (cm⁻³) → resistivity at 23 °C (Ω·cm): one value or up to 10 000',
  security,
  request: { body: { required: true, content: { 'application/json': { schema: ConvertDensityRequest, example: { dopantDensityPerCm3: 1e15, dopant: 'phosphorus' } } } } },
  responses: {
    200: { description: 'Each value with its status, the model and its source', content: { 'application/json': { schema: z.union([ConvertResponse, ConvertError]) } } },
    ...errors,
  },
});

/** The record request of the lot records (src/lots/readings.ts), plus `confirm`. */
export const ReadingBody = z
  .object({
    lotId: z.string(),
    wafer: z.number().int().optional(),
    site: z.number().int().optional(),
    productId: z.string().optional(),
    primary: z
      .union([
        z.object({ kind: z.literal('resistivity'), resistivityOhmCm: z.number(), asEntered: z.string().optional() }),
        z.object({ kind: z.literal('sheet'), sheetResistanceOhmPerSq: z.number(), thicknessCm: z.number(), spacingCm: z.number().optional(), asEntered: z.string().optional() }),
      ])
      .optional(),
    typeReading: z
      .union([
        z.object({ kind: z.literal('type'), method: z.enum(['hot', 'cold', 'hall', 'point', 'spv']), reading: z.number(), asEntered: z.string().optional() }),
        z.object({ kind: z.literal('stated-type'), carrierType: z.enum(['n', 'p']), asEntered: z.string().optional() }),
      ])
      .optional(),
    temperatureK: z.number().optional(),
    corrects: z.number().int().optional(),
    note: z.string().max(500).optional(),
    confirm: z.boolean().optional().describe('store a reading far outside its product window without asking'),
  })
  .describe('checked again, in full, by the lot records’ own schema');

export const readingsRoute = createRoute({
  method: 'post',
  path: '/v1/readings',
  summary: 'Record a lot reading (the `record` command from typed fields)',
  security,
  request: {
    headers: idempotencyHeader,
    body: {
      required: true,
      content: { 'application/json': { schema: ReadingBody, example: { lotId: 'LOT-A21', wafer: 3, site: 2, primary: { kind: 'resistivity', resistivityOhmCm: 9.6 } } } },
    },
  },
  responses: {
    200: { description: 'The record reply (verdict, checks, flags) as in the JSON contract, or ok:false (not permitted, no product, confirm_reading …)', content: { 'application/json': { schema: JsonReply } } },
    ...errors,
  },
});
