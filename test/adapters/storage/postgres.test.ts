/**
 * The PostgreSQL backend's guarantees with several instances on one database, on a real
 * PostgreSQL 15 server (the throw-away one of this run). Each "instance" is a backend with a
 * connection pool of its own, as a second process would have; the races are real, between
 * connections, decided by the server.
 */
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { openPostgresBackend, type PostgresBackend } from '../../../src/adapters/storage/postgres/backend.js';
import { StorageError } from '../../../src/app/ports.js';
import { DailySummaryJob } from '../../../src/app/daily-summary.js';
import { corePhysics } from '../../../src/lots/core-physics.js';
import { lotIdRule } from '../../../src/lots/ids.js';
import { NO_CHAT_WRITERS } from '../../../src/lots/permissions.js';
import { LotService } from '../../../src/lots/service.js';
import { CONSOLE, demoCatalog, rho } from '../../lots/harness.js';
import { freshPostgresDatabase, postgresConfig, postgresServerUrl } from '../../support/postgres.js';

const NOW = new Date('2026-11-30T07:00:00Z');

async function instances(n: number, url?: string): Promise<PostgresBackend[]> {
  const u = url ?? (await freshPostgresDatabase());
  return Promise.all(Array.from({ length: n }, () => openPostgresBackend(postgresConfig(u, { poolSize: 4 }), { now: () => NOW })));
}

async function closeAll(backends: PostgresBackend[]): Promise<void> {
  await Promise.all(backends.map((b) => b.close()));
}

function serviceOn(backend: PostgresBackend, name: string): LotService {
  const catalog = demoCatalog();
  let n = 0;
  return new LotService({
    repo: backend.lots,
    specs: () => catalog,
    physics: corePhysics,
    now: () => NOW,
    timeZone: 'Europe/London',
    permissions: NO_CHAT_WRITERS,
    lotIds: lotIdRule(),
    newEventId: () => `${name}-${++n}`,
    digest: { channel: 'C0DIGEST1', at: '07:00' },
  });
}

describe('migrations', () => {
  it('four instances starting together on an empty database apply each migration once (advisory lock)', async () => {
    const url = await freshPostgresDatabase();
    const backends = await instances(4, url);
    const rows = await backends[0]!.pool.query<{ id: string; n: number }>('SELECT id, count(*)::integer AS n FROM schema_migrations GROUP BY id ORDER BY id');
    expect(rows.rows.map((r) => r.id)).toEqual(['conversations-001-create', 'events-001-create', 'lots-001-create', 'lots-002-map-sites', 'results-001-create']);
    expect(rows.rows.every((r) => r.n === 1)).toBe(true);
    await closeAll(backends);
    // A later start finds everything applied and changes nothing.
    const [again] = await instances(1, url);
    expect((await again!.pool.query('SELECT count(*)::integer AS n FROM schema_migrations')).rows[0].n).toBe(5);
    await again!.close();
  });
});

describe('exactly once across instances', () => {
  it('each event key is won by exactly one of three instances claiming it at the same moment', async () => {
    const backends = await instances(3);
    const keys = Array.from({ length: 60 }, (_, i) => `slack:message:T1:C1:${i}`);
    const wins = await Promise.all(keys.map(async (k) => (await Promise.all(backends.map((b) => b.ledger.claim(k)))).filter(Boolean).length));
    expect(wins).toEqual(keys.map(() => 1));
    await closeAll(backends);
  });

  it('the same record event delivered to two instances at once stores one reading', async () => {
    const backends = await instances(2);
    const [a, b] = backends.map((x, i) => serviceOn(x, `i${i}`));
    const req = { lotId: 'LOT-A17', wafer: 3, productId: 'HX-200P', primary: rho(9.6) };
    const [ra, rb] = await Promise.all([a!.record(req, { actor: CONSOLE, eventId: 'slack:message:T1:C1:77' }), b!.record(req, { actor: CONSOLE, eventId: 'slack:message:T1:C1:77' })]);
    expect(ra.ok && rb.ok).toBe(true);
    if (ra.ok && rb.ok) expect(ra.value.outcome.readings[0]!.id).toBe(rb.value.outcome.readings[0]!.id);
    expect(await backends[0]!.lots.countReadings()).toBe(1);
    await closeAll(backends);
  });

  it('concurrent writers of one lot never check against a stale lot: every record sees all earlier readings', async () => {
    const backends = await instances(3);
    const services = backends.map((x, i) => serviceOn(x, `w${i}`));
    const sites = 24;
    const results = await Promise.all(
      Array.from({ length: sites }, (_, i) =>
        services[i % services.length]!.record({ lotId: 'LOT-A21', wafer: 1, site: i + 1, productId: 'HX-200P', primary: rho(9.5 + (i % 5) * 0.1) }, { actor: CONSOLE }),
      ),
    );
    expect(results.every((r) => r.ok)).toBe(true);
    // The site-to-site check counts the wafer's readings, this one included. With lost updates two
    // records would have seen the same number; serialised, the counts are 2…N, each once.
    const counts = results
      .flatMap((r) => (r.ok ? r.value.outcome.readings : []))
      .map((reading) => reading.evaluation.checks.find((c) => c.check === 'site_spread'))
      .filter((c) => c !== undefined)
      .map((c) => (c.check === 'site_spread' ? c.count : 0))
      .sort((x, y) => x - y);
    expect(counts).toEqual(Array.from({ length: sites - 1 }, (_, i) => i + 2));
    expect(await backends[0]!.lots.countReadings()).toBe(sites);
    await closeAll(backends);
  });

  it('the daily summary: three instances firing at the same instant post it once', async () => {
    const backends = await instances(3);
    const posts: string[] = [];
    const jobs = backends.map(
      (b, i) =>
        new DailySummaryJob({
          service: serviceOn(b, `d${i}`),
          repo: b.lots,
          results: b.results,
          at: '07:00',
          timeZone: 'Europe/London',
          now: () => NOW,
          newId: () => `r-0000d${i}`,
          demo: true,
          instanceId: `instance-${i}`,
          notifiers: [{ surface: 'test', destination: 'C0DIGEST1', notify: async (reply) => void posts.push(reply.id) }],
        }),
    );
    const runs = (await Promise.all(jobs.map((j) => j.runDue()))).flat();
    expect(runs.map((r) => r.status).sort()).toEqual(['posted', 'taken', 'taken']);
    expect(posts).toHaveLength(1);
    // Kept as a result on the shared database: `why` and the buttons find it on any instance.
    expect((await backends[2]!.results.get(posts[0]!))?.command).toBe('digest');
    await closeAll(backends);
  });
});

describe('conversation memory', () => {
  it('the last result and the known threads are shared by the instances', async () => {
    const [a, b] = await instances(2);
    await a!.conversations.setLastResult('slack:T1:C1:U1', 'r-00000a');
    expect(await b!.conversations.lastResult('slack:T1:C1:U1')).toBe('r-00000a');
    for (let i = 0; i < 55; i++) await a!.conversations.rememberThread({ channelId: 'C1', threadTs: `1930000000.${String(i).padStart(6, '0')}`, title: `t${i}`, lastAt: new Date(NOW.getTime() + i) });
    const recent = await b!.conversations.recentThreads('C1', 3);
    expect(recent.map((t) => t.title)).toEqual(['t54', 't53', 't52']);
    expect((await b!.conversations.recentThreads('C1', 100)).length).toBe(50);
    await closeAll([a!, b!]);
  });
});

describe('start-up problems name DATABASE_URL and never print the password', () => {
  const expectRefusal = async (url: string, pattern: RegExp) => {
    const error = await openPostgresBackend(postgresConfig(url), { connectTimeoutMs: 3000 }).then(
      () => undefined,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(StorageError);
    const message = (error as Error).message;
    expect(message).toMatch(/^DATABASE_URL \(/);
    expect(message).toMatch(pattern);
    expect(message).not.toContain('throwaway-only-on-loopback');
    expect(message).not.toContain('wrong-password-7');
    return message;
  };

  it('a wrong password', async () => {
    const u = new URL(postgresServerUrl());
    u.password = 'wrong-password-7';
    await expectRefusal(u.toString(), /refused the user name or password/);
  });

  it('nothing listening at the address', async () => {
    const u = new URL(postgresServerUrl());
    u.port = '9'; // discard: nothing listens there
    await expectRefusal(u.toString(), /nothing is listening there/);
  });

  it('a database that does not exist', async () => {
    const u = new URL(postgresServerUrl());
    u.pathname = '/no_such_database_here';
    await expectRefusal(u.toString(), /does not exist/);
  });

  it("another application's database is refused and left untouched", async () => {
    const url = await freshPostgresDatabase();
    const client = new pg.Client({ connectionString: url });
    await client.connect();
    await client.query('CREATE TABLE wafer_inventory (slot integer PRIMARY KEY, carrier text)');
    await expectRefusal(url, /another application's tables \(wafer_inventory\)/);
    const tables = await client.query<{ name: string }>(`SELECT table_name AS name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY 1`);
    expect(tables.rows.map((r) => r.name)).toEqual(['wafer_inventory']);
    await client.end();
  });
});
