/**
 * A surface is one place people ask: Slack, the HTTP API, a Teams-style chat. The composition
 * root (src/main.ts) builds each configured one on the application, starts them all in one
 * process and hands their summary notifiers to the one daily job.
 */
import type { SummaryNotifier } from './daily-summary.js';

export interface Surface {
  /** For logs: 'slack', 'http', 'teams'. */
  readonly name: string;
  /** Start answering; resolves with a line for the log. A SurfaceConfigError means the settings are wrong (exit 78). */
  start(): Promise<{ readonly description: string; readonly port?: number }>;
  /** Stop answering, letting answers in flight finish. */
  stop(): Promise<void>;
  /** Where this surface sends the daily summary (after start), if anywhere. */
  summaryNotifier(): SummaryNotifier | undefined;
}

/** Start-up failed for a reason the operator must fix in the settings; names the variable, never its value. */
export class SurfaceConfigError extends Error {
  constructor(
    readonly variable: string,
    message: string,
  ) {
    super(message);
    this.name = 'SurfaceConfigError';
  }
}
