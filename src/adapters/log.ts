/**
 * The process's logger, shared by every surface, the chat framework and the Web API clients:
 * pino, one JSON object per line on stderr (time, level as a word, name, msg, and the fields of
 * whatever was logged — an error's name, message, code and the first stack lines), or a readable
 * line for a person at a terminal (LOG_FORMAT=text, the default when stderr is a terminal).
 *
 * Every line passes through `redact` before it is written: the configured secrets (tokens,
 * signing secret, API keys, the database password) and anything shaped like a Slack token or
 * signature are replaced, so no secret reaches a log even if a library puts one in a message.
 * The level (LOG_LEVEL) holds for everything, the chat framework included: it is given to Bolt
 * explicitly, which otherwise resets its logger to info.
 */
import { pino, type Level } from 'pino';

export type LogLevelName = 'debug' | 'info' | 'warn' | 'error';
export type LogFormat = 'json' | 'text';

const TOKEN_SHAPES = [/\bxox[abpers]-[A-Za-z0-9-]+/g, /\bxapp-[A-Za-z0-9-]+/g, /\bv0=[0-9a-f]{64}\b/g];

export function redact(text: string, secrets: readonly string[]): string {
  let out = text;
  for (const s of secrets) if (s.length >= 6) out = out.split(s).join('[redacted]');
  for (const shape of TOKEN_SHAPES) out = out.replace(shape, '[redacted]');
  return out;
}

/** What the chat framework (Bolt), the Web API client and our code call. */
export interface AppLogger {
  debug(...msg: unknown[]): void;
  info(...msg: unknown[]): void;
  warn(...msg: unknown[]): void;
  error(...msg: unknown[]): void;
  setLevel(level: string): void;
  getLevel(): LogLevelName;
  setName(name: string): void;
}

function errorFields(e: Error): Record<string, unknown> {
  const code = (e as { code?: unknown }).code;
  const data = (e as { data?: { error?: unknown } }).data;
  return {
    type: e.name,
    message: e.message,
    ...(code !== undefined ? { code: String(code) } : {}),
    ...(data?.error !== undefined ? { slackError: String(data.error) } : {}),
    ...(e.stack ? { stack: e.stack.split('\n').slice(1, 6).map((l) => l.trim()) } : {}),
  };
}

/** Bolt-style arguments (strings, errors, objects) → pino's (fields, message). */
function split(args: readonly unknown[]): [Record<string, unknown>, string] {
  const fields: Record<string, unknown> = {};
  const words: string[] = [];
  for (const a of args) {
    if (a instanceof Error) {
      fields['err'] = errorFields(a);
      words.push(`${a.name}: ${a.message}`);
    } else if (a && typeof a === 'object') {
      for (const [k, v] of Object.entries(a as Record<string, unknown>)) fields[k] = v instanceof Error ? errorFields(v) : v;
    } else {
      words.push(String(a));
    }
  }
  return [fields, words.join(' ')];
}

const LEVELS: readonly LogLevelName[] = ['debug', 'info', 'warn', 'error'];
const normalise = (l: string): LogLevelName => (LEVELS.includes(l.toLowerCase() as LogLevelName) ? (l.toLowerCase() as LogLevelName) : 'info');

/** A JSON log line → the readable form. */
function readable(line: string): string {
  try {
    const o = JSON.parse(line) as Record<string, unknown>;
    const { time, level, name, msg, err, ...rest } = o;
    const extra = Object.keys(rest).length > 0 ? ` ${JSON.stringify(rest)}` : '';
    const e = err as { type?: string; message?: string; stack?: string[] } | undefined;
    const stack = e?.stack?.length ? `\n    ${e.stack.join('\n    ')}` : '';
    return `${String(time)} ${String(level).toUpperCase()} [${String(name)}] ${String(msg ?? '')}${extra}${stack}\n`;
  } catch {
    return line;
  }
}

export function createLogger(options: {
  /** Where each finished line goes (stderr in production, an array in tests). */
  sink: (line: string) => void;
  level?: string;
  secrets?: readonly string[];
  name?: string;
  now?: () => Date;
  format?: LogFormat;
}): AppLogger {
  const secrets = options.secrets ?? [];
  const now = options.now ?? (() => new Date());
  const format = options.format ?? 'json';
  let name = options.name ?? 'shiftprobe';
  const destination = {
    write(s: string) {
      const safe = redact(s, secrets);
      const out = format === 'text' ? readable(safe) : safe;
      options.sink(out.endsWith('\n') ? out.slice(0, -1) : out);
    },
  };
  const base = pino(
    {
      level: normalise(options.level ?? 'info'),
      base: undefined,
      messageKey: 'msg',
      // Errors are already turned into plain fields (errorFields); keep them as they are.
      serializers: { err: (e: unknown) => e },
      timestamp: () => `,"time":"${now().toISOString()}"`,
      formatters: { level: (label) => ({ level: label }) },
    },
    destination,
  );
  const write = (level: Level, args: readonly unknown[]): void => {
    const [fields, msg] = split(args);
    base[level]({ name, ...fields }, msg);
  };
  return {
    debug: (...a) => write('debug', a),
    info: (...a) => write('info', a),
    warn: (...a) => write('warn', a),
    error: (...a) => write('error', a),
    setLevel: (l) => {
      base.level = normalise(l);
    },
    getLevel: () => normalise(base.level),
    setName: (n) => {
      name = n;
    },
  };
}
