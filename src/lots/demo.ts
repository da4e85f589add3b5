/**
 * The demo lot history (fixtures/lots/harrowgate-fab3-history.yaml, invented): parsed with zod
 * and written through the same plans as `record` and `clear`, with the clock set to each
 * entry's time. Every entry has a fixed event id ('demo-<index>'), so loading twice writes
 * nothing new. Written through the LotRepository port, so any backend takes it.
 */
import { readFileSync } from 'node:fs';
import { fixtureFile } from './fixtures.js';
import { parse as parseYaml } from 'yaml';
import { z } from 'zod';
import { FLAG_CODES, flagCodeFromWord } from './flags.js';
import { normalizeLotId, type LotIdRule } from './ids.js';
import type { LotPhysics } from './physics.js';
import { planClear, planRecord } from './plan.js';
import { RecordRequest, type Actor } from './readings.js';
import type { SpecCatalog } from './spec/schema.js';
import type { LotRepository } from './repository.js';

export const DEMO_HISTORY_FILE = fixtureFile('harrowgate-fab3-history.yaml');

const Person = z.object({ id: z.string(), name: z.string() }).strict();

const ReadingEntry = z
  .object({
    hoursAgo: z.number().nonnegative(),
    by: z.string(),
    lot: z.string(),
    product: z.string().optional(),
    wafer: z.number().int().optional(),
    site: z.number().int().optional(),
    rhoOhmCm: z.number().optional(),
    sheetOhmPerSq: z.number().optional(),
    thickUm: z.number().optional(),
    spacingMm: z.number().optional(),
    type: z.enum(['n', 'p']).optional(),
    probe: z.object({ method: z.enum(['hot', 'cold', 'hall', 'point', 'spv']), reading: z.number() }).strict().optional(),
    atC: z.number().optional(),
    correctsEntry: z.number().int().nonnegative().optional(),
  })
  .strict();

const ClearEntry = z
  .object({
    hoursAgo: z.number().nonnegative(),
    by: z.string(),
    clear: z.object({ lot: z.string(), flag: z.string(), wafer: z.number().int().optional() }).strict(),
    because: z.string().min(3),
  })
  .strict();

export const DemoHistory = z
  .object({
    people: z.record(z.string(), Person),
    entries: z.array(z.union([ClearEntry, ReadingEntry])),
  })
  .strict();
export type DemoHistory = z.infer<typeof DemoHistory>;

export function readDemoHistory(path: string = DEMO_HISTORY_FILE): DemoHistory {
  return DemoHistory.parse(parseYaml(readFileSync(path, 'utf8')));
}

export interface SeedDeps {
  readonly repo: LotRepository;
  readonly catalog: SpecCatalog;
  readonly physics: LotPhysics;
  readonly lotIds: LotIdRule;
  /** The moment `hoursAgo` counts back from. */
  readonly now: Date;
}

export interface SeedResult {
  readonly written: number;
  readonly skipped: number;
}

/** Write the history; an entry whose event was written before is skipped. Throws on a bad fixture. */
export async function seedDemoHistory(deps: SeedDeps, history: DemoHistory = readDemoHistory()): Promise<SeedResult> {
  const readingIdOfEntry = new Map<number, number>();
  let written = 0;
  let skipped = 0;
  for (const [index, entry] of history.entries.entries()) {
    const person = history.people[entry.by];
    if (!person) throw new Error(`demo history entry ${index}: unknown person "${entry.by}"`);
    const actor: Actor = { userId: person.id, userName: person.name, surface: 'demo', channelId: 'demo' };
    const at = new Date(deps.now.getTime() - entry.hoursAgo * 3600_000).toISOString();
    const eventId = `demo-${index}`;
    if ('clear' in entry) {
      const lotId = normalizeLotId(entry.clear.lot, deps.lotIds);
      const code = flagCodeFromWord(entry.clear.flag);
      if (!lotId || !code || !FLAG_CODES.includes(code)) throw new Error(`demo history entry ${index}: bad clear`);
      const r = await deps.repo.commitClear({ lotId, eventId, actor, at }, (state) =>
        planClear(lotId, { kind: 'code', code, ...(entry.clear.wafer !== undefined ? { wafer: entry.clear.wafer } : {}) }, entry.because, state),
      );
      if (!r.ok) throw new Error(`demo history entry ${index}: ${JSON.stringify(r.error)}`);
      if (r.duplicate) skipped += 1;
      else written += 1;
      continue;
    }
    const corrects = entry.correctsEntry !== undefined ? readingIdOfEntry.get(entry.correctsEntry) : undefined;
    if (entry.correctsEntry !== undefined && corrects === undefined) {
      throw new Error(`demo history entry ${index}: correctsEntry ${entry.correctsEntry} is not an earlier reading`);
    }
    const request = RecordRequest.parse({
      lotId: entry.lot,
      ...(entry.wafer !== undefined ? { wafer: entry.wafer } : {}),
      ...(entry.site !== undefined ? { site: entry.site } : {}),
      ...(entry.product !== undefined ? { productId: entry.product } : {}),
      ...(entry.rhoOhmCm !== undefined ? { primary: { kind: 'resistivity', resistivityOhmCm: entry.rhoOhmCm, asEntered: `${entry.rhoOhmCm} ohm-cm` } } : {}),
      ...(entry.sheetOhmPerSq !== undefined
        ? {
            primary: {
              kind: 'sheet',
              sheetResistanceOhmPerSq: entry.sheetOhmPerSq,
              thicknessCm: (entry.thickUm ?? Number.NaN) * 1e-4,
              ...(entry.spacingMm !== undefined ? { spacingCm: entry.spacingMm / 10 } : {}),
              asEntered: `${entry.sheetOhmPerSq} ohm/sq thick ${entry.thickUm}um${entry.spacingMm !== undefined ? ` spacing ${entry.spacingMm}mm` : ''}`,
            },
          }
        : {}),
      ...(entry.type ? { typeReading: { kind: 'stated-type', carrierType: entry.type, asEntered: entry.type } } : {}),
      ...(entry.probe
        ? {
            typeReading: {
              kind: 'type',
              method: entry.probe.method,
              reading: entry.probe.method === 'hall' || entry.probe.method === 'point' ? entry.probe.reading : entry.probe.reading * 1e-3,
              asEntered: `${entry.probe.method} ${entry.probe.reading > 0 ? '+' : ''}${entry.probe.reading}${entry.probe.method === 'hall' ? ' cm3/C' : entry.probe.method === 'point' ? '' : 'mV'}`,
            },
          }
        : {}),
      ...(entry.atC !== undefined ? { temperatureK: entry.atC + 273.15, temperatureAsEntered: `${entry.atC}C` } : {}),
      ...(corrects !== undefined ? { corrects } : {}),
    });
    const lotId = normalizeLotId(request.lotId, deps.lotIds);
    if (!lotId) throw new Error(`demo history entry ${index}: lot id ${request.lotId} does not fit the lot pattern`);
    const r = await deps.repo.commitRecord(
      { lotId, eventId, actor, at, ...(corrects !== undefined ? { corrects } : {}) },
      (state) => planRecord({ lotId, request: { ...request, lotId }, catalog: deps.catalog, physics: deps.physics }, state),
    );
    if (!r.ok) throw new Error(`demo history entry ${index}: ${JSON.stringify(r.error)}`);
    const first = r.outcome.readings[0];
    if (first) readingIdOfEntry.set(index, first.id);
    if (r.duplicate) skipped += 1;
    else written += 1;
  }
  return { written, skipped };
}
