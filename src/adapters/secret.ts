/** Secrets from the settings (tokens, signing secrets, database passwords), held so they never print. */
import { inspect } from 'node:util';

/** A secret value that never prints: String(), JSON and util.inspect all give '[redacted]'. */
export class Secret {
  readonly #value: string;
  constructor(value: string) {
    this.#value = value;
  }
  /** The value, for the one place that hands it to the Slack client. */
  reveal(): string {
    return this.#value;
  }
  toString(): string {
    return '[redacted]';
  }
  toJSON(): string {
    return '[redacted]';
  }
  [inspect.custom](): string {
    return 'Secret([redacted])';
  }
}
