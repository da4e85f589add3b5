/**
 * The logger handed to Bolt, the Web API client and our own listeners. Lines go to one sink
 * (stderr in production, an array in tests). Every line passes through `redact`: the configured
 * secrets and anything shaped like a Slack token or signature are replaced before it is
 * written, so no token or secret reaches a log even if some library puts one in a message.
 */
import { LogLevel, type Logger } from '@slack/bolt';

const ORDER: Readonly<Record<LogLevel, number>> = {
  [LogLevel.DEBUG]: 0,
  [LogLevel.INFO]: 1,
  [LogLevel.WARN]: 2,
  [LogLevel.ERROR]: 3,
};

const TOKEN_SHAPES = [/\bxox[abpers]-[A-Za-z0-9-]+/g, /\bxapp-[A-Za-z0-9-]+/g, /\bv0=[0-9a-f]{64}\b/g];

export function redact(text: string, secrets: readonly string[]): string {
  let out = text;
  for (const s of secrets) if (s.length >= 6) out = out.split(s).join('[redacted]');
  for (const shape of TOKEN_SHAPES) out = out.replace(shape, '[redacted]');
  return out;
}

function describe(arg: unknown): string {
  if (arg instanceof Error) {
    const code = (arg as { code?: unknown }).code;
    const data = (arg as { data?: { error?: unknown } }).data;
    const detail = [code ? `code=${String(code)}` : '', data?.error ? `slack_error=${String(data.error)}` : ''].filter(Boolean).join(' ');
    return `${arg.name}: ${arg.message}${detail ? ` (${detail})` : ''}${arg.stack ? `\n${arg.stack.split('\n').slice(1, 6).join('\n')}` : ''}`;
  }
  if (typeof arg === 'string') return arg;
  try {
    return JSON.stringify(arg);
  } catch {
    return String(arg);
  }
}

export interface LogSink {
  (line: string): void;
}

export function createLogger(options: {
  sink: LogSink;
  level?: LogLevel | 'debug' | 'info' | 'warn' | 'error';
  secrets?: readonly string[];
  name?: string;
  now?: () => Date;
}): Logger {
  let level = (options.level ?? LogLevel.INFO) as LogLevel;
  let name = options.name ?? 'shiftprobe';
  const secrets = options.secrets ?? [];
  const now = options.now ?? (() => new Date());
  const write = (at: LogLevel, args: unknown[]): void => {
    if (ORDER[at] < ORDER[level]) return;
    const line = `${now().toISOString()} ${at.toUpperCase()} [${name}] ${args.map(describe).join(' ')}`;
    options.sink(redact(line, secrets));
  };
  return {
    debug: (...a: unknown[]) => write(LogLevel.DEBUG, a),
    info: (...a: unknown[]) => write(LogLevel.INFO, a),
    warn: (...a: unknown[]) => write(LogLevel.WARN, a),
    error: (...a: unknown[]) => write(LogLevel.ERROR, a),
    setLevel: (l: LogLevel) => {
      level = l;
    },
    getLevel: () => level,
    setName: (n: string) => {
      name = n;
    },
  };
}
