/**
 * What the application counts, as a port: the composition root gives it a Prometheus registry
 * (src/adapters/metrics.ts); tests and tools run without one. Every surface serves the text at
 * /metrics beside /healthz.
 */
export type AnswerOutcome = 'ok' | 'bad_input' | 'internal';

export interface MetricsPort {
  /** One question answered on a surface: its command, outcome and how long it took. */
  answered(e: { readonly surface: string; readonly command: string; readonly outcome: AnswerOutcome; readonly seconds: number }): void;
  /** One destination's run of the daily summary. */
  summaryRun(status: 'posted' | 'taken' | 'failed'): void;
  /** A storage operation that failed (the database refused or did not answer). */
  storageError(): void;
  /** The Prometheus text exposition. */
  exposition(): Promise<{ readonly contentType: string; readonly body: string }>;
}

export const NO_METRICS: MetricsPort = {
  answered: () => undefined,
  summaryRun: () => undefined,
  storageError: () => undefined,
  exposition: async () => ({ contentType: 'text/plain; version=0.0.4', body: '' }),
};
