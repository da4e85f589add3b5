/**
 * Local time for the fab: dates, clock times and daily slots in one IANA time zone.
 * The clock is always injected (`now`); nothing here reads the wall clock.
 *
 * Daily slots (the summary time, local midnight) are computed with croner, the same library
 * that fires the scheduler, so "which slot is due" and "when the job fires" never disagree —
 * including on daylight-saving change days (a local time that does not exist that day is moved
 * forward by the gap; an ambiguous one is taken once).
 */
import { Cron } from 'croner';

export type Clock = () => Date;

/** 'HH:MM', 24-hour. */
export const CLOCK_TIME = /^([01]\d|2[0-3]):([0-5]\d)$/;

export function isValidTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function partsFormatter(tz: string): Intl.DateTimeFormat {
  let f = formatters.get(tz);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone: tz,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZoneName: 'short',
    });
    formatters.set(tz, f);
  }
  return f;
}

interface LocalParts {
  readonly date: string; // YYYY-MM-DD
  readonly time: string; // HH:MM
  readonly zone: string; // 'GMT', 'BST', 'GMT+1'…
}

export function localParts(instant: Date, tz: string): LocalParts {
  const parts = partsFormatter(tz).formatToParts(instant);
  const get = (t: Intl.DateTimeFormatPartTypes): string => parts.find((p) => p.type === t)?.value ?? '';
  return {
    date: `${get('year')}-${get('month')}-${get('day')}`,
    time: `${get('hour')}:${get('minute')}`,
    zone: get('timeZoneName'),
  };
}

/** The local calendar date of an instant, 'YYYY-MM-DD'. */
export function localDate(instant: Date, tz: string): string {
  return localParts(instant, tz).date;
}

/** '2025-03-30 07:00 BST' — for people. */
export function formatLocal(instant: Date, tz: string): string {
  const p = localParts(instant, tz);
  return `${p.date} ${p.time} ${p.zone}`;
}

/** Cron pattern for a daily local clock time 'HH:MM'. */
export function dailyPattern(clockTime: string): string {
  const m = CLOCK_TIME.exec(clockTime);
  if (!m) throw new RangeError(`not a clock time: ${clockTime}`);
  return `${Number(m[2])} ${Number(m[1])} * * *`;
}

/**
 * The most recent daily slot at local `clockTime` that is at or before `now`, and the one
 * before it (one local day earlier: 23, 24 or 25 hours).
 */
export function recentSlots(now: Date, clockTime: string, tz: string): { current: Date; previous: Date } {
  const job = new Cron(dailyPattern(clockTime), { timezone: tz, paused: true });
  try {
    // Three days back always holds at least two slots; keep the last two at or before now.
    const from = new Date(now.getTime() - 74 * 3600_000);
    const runs = job.nextRuns(6, from).filter((d) => d.getTime() <= now.getTime());
    const current = runs[runs.length - 1];
    const previous = runs[runs.length - 2];
    if (!current || !previous) throw new Error('no daily slot found in the last three days');
    return { current, previous };
  } finally {
    job.stop();
  }
}

/** The next daily slot strictly after `now`. */
export function nextSlot(now: Date, clockTime: string, tz: string): Date {
  const job = new Cron(dailyPattern(clockTime), { timezone: tz, paused: true });
  try {
    const next = job.nextRun(now);
    if (!next) throw new Error('no next daily slot');
    return next;
  } finally {
    job.stop();
  }
}

/** Start of the local day containing `now` (local midnight, or the first instant after it). */
export function startOfLocalDay(now: Date, tz: string): Date {
  return recentSlots(now, '00:00', tz).current;
}

/** '45 min', '5 h', '3 d' — the age of something, for people. */
export function formatAge(fromIso: string, now: Date): string {
  const ms = Math.max(0, now.getTime() - Date.parse(fromIso));
  const min = Math.floor(ms / 60_000);
  if (min < 1) return 'just now';
  if (min < 60) return `${min} min`;
  const h = Math.floor(min / 60);
  if (h < 48) return `${h} h`;
  return `${Math.floor(h / 24)} d`;
}
