/**
 * The application's metrics in Prometheus text (prom-client), shared by every surface's
 * /metrics. Counters and the latency histogram are this process's; the gauges of stored
 * readings and open flags are read from the database at scrape time, so they agree on every
 * instance. Names and labels are documented in docs/operations.md.
 */
import { collectDefaultMetrics, Counter, Gauge, Histogram, Registry } from 'prom-client';
import type { AnswerOutcome, MetricsPort } from '../app/metrics.js';

export interface MetricsSources {
  /** Readings stored in the database (all instances). */
  readonly readingsStored?: () => Promise<number>;
  /** Flags open now. */
  readonly flagsOpen?: () => Promise<number>;
  /** Whether the database answers. */
  readonly storeHealthy?: () => Promise<boolean>;
}

export function createMetrics(sources: () => MetricsSources): MetricsPort & { readonly registry: Registry } {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry, prefix: 'shiftprobe_process_' });
  const questions = new Counter({ name: 'shiftprobe_questions_total', help: 'Questions answered, by surface, command and outcome (ok, bad_input, internal)', labelNames: ['surface', 'command', 'outcome'] as const, registers: [registry] });
  const latency = new Histogram({
    name: 'shiftprobe_answer_seconds',
    help: 'Time from question to reply, by surface',
    labelNames: ['surface'] as const,
    buckets: [0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5],
    registers: [registry],
  });
  const summaries = new Counter({ name: 'shiftprobe_summary_runs_total', help: 'Daily summary runs per destination, by status (posted, taken by another instance, failed)', labelNames: ['status'] as const, registers: [registry] });
  const storageErrors = new Counter({ name: 'shiftprobe_storage_errors_total', help: 'Storage operations that failed', registers: [registry] });
  new Gauge({
    name: 'shiftprobe_readings_stored',
    help: 'Lot readings stored in the database (every instance)',
    registers: [registry],
    async collect() {
      const f = sources().readingsStored;
      if (f) this.set(await f().catch(() => Number.NaN));
    },
  });
  new Gauge({
    name: 'shiftprobe_flags_open',
    help: 'Lot flags open now',
    registers: [registry],
    async collect() {
      const f = sources().flagsOpen;
      if (f) this.set(await f().catch(() => Number.NaN));
    },
  });
  new Gauge({
    name: 'shiftprobe_store_up',
    help: '1 when the database answers a query, else 0',
    registers: [registry],
    async collect() {
      const f = sources().storeHealthy;
      this.set(f ? ((await f().catch(() => false)) ? 1 : 0) : 1);
    },
  });
  return {
    registry,
    answered(e: { surface: string; command: string; outcome: AnswerOutcome; seconds: number }) {
      questions.inc({ surface: e.surface, command: e.command, outcome: e.outcome });
      latency.observe({ surface: e.surface }, e.seconds);
    },
    summaryRun: (status) => summaries.inc({ status }),
    storageError: () => storageErrors.inc(),
    async exposition() {
      return { contentType: registry.contentType, body: await registry.metrics() };
    },
  };
}
