/**
 * Lot records benchmark (`npm run bench:lots`; not part of the tests — speed is measured here,
 * never asserted). On a file database in a temporary folder (WAL, synchronous=FULL, as in
 * production), prints:
 *
 *   - record: one `record` through the lot service (validate → read the lot → check against the
 *     spec with the physics core → write readings and flags → COMMIT, fsync) — per call and per
 *     second; the same through handle() with the reply rendered as text; and in memory (no fsync)
 *     to separate the disk from the computation;
 *   - digest over 100 000 readings in 2 000 lots (one lot in twenty flagged, over 7 days): the
 *     summary computed, built as a Reply and rendered, as the scheduler does at send time;
 *   - lot, flags 7d on the same store, for scale.
 *
 * Targets from issue 4: record under 1 ms each; digest under 1 s.
 */
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { handle } from '../src/commands/handle.js';
import { MemoryResultStore } from '../src/adapters/storage/memory.js';
import { type HandleContext } from '../src/commands/context.js';
import { digestReply } from '../src/commands/lots/digest.js';
import { DEMO_SPEC_FILE } from '../src/lots/config.js';
import { corePhysics } from '../src/lots/core-physics.js';
import { lotIdRule } from '../src/lots/ids.js';
import { NO_CHAT_WRITERS } from '../src/lots/permissions.js';
import { planRecord } from '../src/lots/plan.js';
import { RecordRequest, type Actor } from '../src/lots/readings.js';
import { LotService } from '../src/lots/service.js';
import { loadSpecFile } from '../src/lots/spec/load.js';
import { SqliteLotRepository } from '../src/adapters/storage/sqlite/lots-repository.js';
import { renderText } from '../src/render/text.js';

const load = loadSpecFile(DEMO_SPEC_FILE, { demo: true });
if (!load.ok) throw new Error('demo specs do not load');
const catalog = load.catalog;
const ACTOR: Actor = { userId: 'U0BENCH01', userName: 'Tomasz Reyes', surface: 'console', channelId: 'console' };
const T0 = Date.parse('2026-11-23T06:00:00Z');
const NOW = new Date(T0 + 7 * 24 * 3600_000);

function serviceOn(repo: SqliteLotRepository, now: () => Date): LotService {
  let n = 0;
  return new LotService({
    repo,
    specs: () => catalog,
    physics: corePhysics,
    now,
    timeZone: 'Europe/London',
    permissions: NO_CHAT_WRITERS,
    lotIds: lotIdRule(),
    newEventId: () => `bench-${++n}`,
    digest: { channel: 'console', at: '07:00' },
  });
}

function quantile(sorted: readonly number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;
}

interface Timing {
  readonly name: string;
  readonly n: number;
  readonly meanMs: number;
  readonly p50Ms: number;
  readonly p99Ms: number;
  readonly maxMs: number;
}

async function timeEach(name: string, n: number, op: (i: number) => Promise<unknown> | unknown): Promise<Timing> {
  const times: number[] = [];
  for (let i = 0; i < n; i++) {
    const t = process.hrtime.bigint();
    await op(i);
    times.push(Number(process.hrtime.bigint() - t) / 1e6);
  }
  const sorted = [...times].sort((a, b) => a - b);
  return { name, n, meanMs: times.reduce((s, x) => s + x, 0) / n, p50Ms: quantile(sorted, 0.5), p99Ms: quantile(sorted, 0.99), maxMs: sorted[sorted.length - 1]! };
}

/** A typical reading of a lot: HX-200P around 10 Ω·cm, a few outside; sites 1–5 on wafers 1–10. */
function readingFor(i: number, lotCount: number, flaggedEvery = 20) {
  const lot = i % lotCount;
  const k = Math.floor(i / lotCount);
  const wafer = (k % 10) + 1;
  const site = (Math.floor(k / 10) % 5) + 1;
  // Deterministic scatter of ±2 % (inside the window and the spread limits), and in one lot out
  // of twenty a wafer reads far out (about 5 % of lots end up flagged).
  const scatter = Math.sin(i * 12.9898) * 0.02;
  const rho = lot % flaggedEvery === 3 % flaggedEvery && k === 17 ? 13.4 : 10 * (1 + scatter);
  return {
    lotId: `LOT-${String.fromCharCode(65 + (lot % 26))}${1000 + lot}`,
    wafer,
    site,
    ...(k === 0 ? { productId: 'HX-200P' } : {}),
    primary: { kind: 'resistivity' as const, resistivityOhmCm: Number(rho.toFixed(3)), asEntered: `${rho.toFixed(3)} ohm-cm` },
  };
}

function row(t: Timing, note = ''): string {
  const perSecond = 1000 / t.meanMs;
  return [
    t.name.padEnd(60),
    String(t.n).padStart(7),
    t.meanMs.toFixed(3).padStart(9),
    t.p50Ms.toFixed(3).padStart(9),
    t.p99Ms.toFixed(3).padStart(9),
    t.maxMs.toFixed(3).padStart(9),
    perSecond.toFixed(0).padStart(9),
    ' ' + note,
  ].join(' ');
}

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'shiftprobe-lots-bench-'));
  const rows: string[] = [];
  try {
    // ---------- record ----------
    const recordRepo = SqliteLotRepository.open(join(dir, 'record.db'));
    let clock = T0;
    const recordService = serviceOn(recordRepo, () => new Date((clock += 1000)));
    // Warm up (JIT, statement cache) on other lots.
    for (let i = 0; i < 200; i++) await recordService.record({ ...readingFor(i, 50), lotId: `LOT-W${i % 50}` }, { actor: ACTOR, eventId: `warm-${i}` });
    const file = await timeEach('record → file db (WAL, synchronous=FULL)', 3000, (i) =>
      recordService.record(readingFor(i, 60), { actor: ACTOR, eventId: `rec-${i}` }),
    );
    rows.push(row(file, 'target < 1 ms'));

    const ctx: HandleContext = {
      surface: 'console',
      caller: { userId: 'console', displayName: 'Tomasz Reyes', channelId: 'console' },
      now: () => new Date((clock += 1000)),
      newId: (() => {
        let n = 0;
        return () => `r-${(++n).toString(16).padStart(6, '0')}`;
      })(),
      results: new MemoryResultStore(),
      session: {},
      lots: recordService,
    };
    const typed = await timeEach('"record LOT-… w3 site 2 rho 9.8 ohm-cm" → text', 2000, async (i) => {
      const r = readingFor(i + 5000, 60);
      const reply = await handle(`record ${r.lotId} w${r.wafer} site ${r.site} rho ${r.primary.resistivityOhmCm} ohm-cm`, ctx);
      return renderText(reply);
    });
    rows.push(row(typed, 'parse + record + reply + render'));
    await recordRepo.close();

    const memRepo = SqliteLotRepository.open(':memory:');
    const memService = serviceOn(memRepo, () => new Date((clock += 1000)));
    for (let i = 0; i < 200; i++) await memService.record(readingFor(i, 50), { actor: ACTOR, eventId: `warm-${i}` });
    const mem = await timeEach('record → in-memory db (no fsync: the computation)', 3000, (i) =>
      memService.record(readingFor(i + 10_000, 60), { actor: ACTOR, eventId: `mem-${i}` }),
    );
    rows.push(row(mem));
    await memRepo.close();

    // ---------- digest over 100 000 readings in 2 000 lots ----------
    const READINGS = 100_000;
    const LOTS = 2_000;
    const stores: string[] = [];
    for (const [label, flaggedEvery] of [
      ['1 lot in 20 flagged', 20],
      ['every lot flagged (stress)', 1],
    ] as const) {
      const bigPath = join(dir, `big-${flaggedEvery}.db`);
      const bigRepo = SqliteLotRepository.open(bigPath);
      const db = bigRepo.database;
      const fill = process.hrtime.bigint();
      // Filled through the same plans as `record`, 2 000 records per transaction (to fill
      // quickly; each record is still its own savepoint with the same checks).
      const BATCH = 2000;
      for (let start = 0; start < READINGS; start += BATCH) {
        db.transaction(() => {
          for (let i = start; i < Math.min(READINGS, start + BATCH); i++) {
            const req = RecordRequest.parse(readingFor(i, LOTS, flaggedEvery));
            const lotId = req.lotId;
            const at = new Date(T0 + Math.floor((i / READINGS) * 7 * 24 * 3600_000)).toISOString();
            const r = bigRepo.commitRecordSync({ lotId, eventId: `big-${i}`, actor: ACTOR, at }, (state) =>
              planRecord({ lotId, request: req, catalog, physics: corePhysics }, state),
            );
            if (!r.ok) throw new Error(JSON.stringify(r.error));
          }
        })();
      }
      const fillS = Number(process.hrtime.bigint() - fill) / 1e9;
      const flagCount = (db.prepare('SELECT count(*) AS n FROM lot_flags').get() as { n: number }).n;
      const flaggedLots = (db.prepare('SELECT count(DISTINCT lot_id) AS n FROM lot_flags').get() as { n: number }).n;
      const bigService = serviceOn(bigRepo, () => NOW);
      let lastReply = '';
      const windowStart = new Date(NOW.getTime() - 24 * 3600_000);
      const digest = await timeEach(`digest, ${label}: compute + Reply + text`, 30, async () => {
        const d = await bigService.digest({ windowStart, now: NOW });
        lastReply = renderText(digestReply({ id: 'r-bench0', createdAt: NOW.toISOString() }, d, { demo: true }));
        return lastReply;
      });
      rows.push(row(digest, 'target < 1 s'));
      if (flaggedEvery === 20) {
        const lotTiming = await timeEach('lot <lot> (50 readings) → view', 200, async (i) => {
          const n = (1001 + i) % LOTS;
          const r = await bigService.lot(`LOT-${String.fromCharCode(65 + (n % 26))}${1000 + n}`);
          return r.ok ? r.value.readings.length : 0;
        });
        rows.push(row(lotTiming));
        const flags7d = await timeEach('flags 7d (every flag of the week)', 20, () => bigService.flags('7d'));
        rows.push(row(flags7d));
      }
      const size = statSync(bigPath).size;
      await bigRepo.close();
      stores.push(
        `${label}: ${READINGS} readings in ${LOTS} lots over 7 days, ${flaggedLots} lots flagged, ${flagCount} flags; ` +
          `filled in ${fillS.toFixed(1)} s; file ${(size / 1e6).toFixed(1)} MB (WAL not counted)\n  digest: ${lastReply.split('\n')[0]}`,
      );
    }

    const header = [
      'operation'.padEnd(60),
      'n'.padStart(7),
      'mean ms'.padStart(9),
      'p50 ms'.padStart(9),
      'p99 ms'.padStart(9),
      'max ms'.padStart(9),
      'per s'.padStart(9),
    ].join(' ');
    process.stdout.write(`shiftprobe lot records benchmark — node ${process.version}, ${process.platform}/${process.arch}\n`);
    process.stdout.write(`database in ${tmpdir()} (WAL, synchronous=FULL)\n\n${header}\n${'─'.repeat(header.length)}\n${rows.join('\n')}\n\n`);
    process.stdout.write(`${stores.join('\n')}\n`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
