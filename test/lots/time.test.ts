/**
 * Local dates and daily slots in the fab's time zone, on ordinary and daylight-saving change days.
 * Change rules: in the EU/UK summer time starts on the last Sunday of March at 01:00 UTC and ends
 * on the last Sunday of October at 01:00 UTC (Directive 2000/84/EC, art. 2–3; UK Summer Time Order
 * 2002); in the US it starts on the second Sunday of March at 02:00 local time (Energy Policy Act
 * of 2005, 15 U.S.C. 260a). So: 2025-03-30 and 2025-10-26 in London, 2025-03-09 in New York.
 */
import { describe, expect, it } from 'vitest';
import { formatAge, formatLocal, localDate, nextSlot, recentSlots, startOfLocalDay } from '../../src/lots/time.js';

const H = 3600_000;
const iso = (d: Date) => d.toISOString();

describe('local dates', () => {
  it('a UTC instant late in the evening is already the next day in summer-time London', () => {
    expect(localDate(new Date('2025-06-09T23:30:00Z'), 'Europe/London')).toBe('2025-06-10');
    expect(localDate(new Date('2025-06-09T23:30:00Z'), 'UTC')).toBe('2025-06-09');
    expect(formatLocal(new Date('2025-06-09T23:30:00Z'), 'Europe/London')).toBe('2025-06-10 00:30 BST');
  });
});

describe('daily slots across daylight-saving changes', () => {
  it('spring forward (London 2025-03-30): 07:00 local is 06:00 UTC, 23 h after the day before', () => {
    const { current, previous } = recentSlots(new Date('2025-03-30T07:30:00Z'), '07:00', 'Europe/London');
    expect(iso(current)).toBe('2025-03-30T06:00:00.000Z');
    expect(iso(previous)).toBe('2025-03-29T07:00:00.000Z');
    expect(current.getTime() - previous.getTime()).toBe(23 * H);
  });

  it('fall back (London 2025-10-26): 07:00 local is 07:00 UTC, 25 h after the day before', () => {
    const { current, previous } = recentSlots(new Date('2025-10-26T08:00:00Z'), '07:00', 'Europe/London');
    expect(iso(current)).toBe('2025-10-26T07:00:00.000Z');
    expect(iso(previous)).toBe('2025-10-25T06:00:00.000Z');
    expect(current.getTime() - previous.getTime()).toBe(25 * H);
  });

  it('a local time that does not exist that day (01:30 on 2025-03-30 in London) still gives one slot that date', () => {
    const slot = nextSlot(new Date('2025-03-29T12:00:00Z'), '01:30', 'Europe/London');
    expect(localDate(slot, 'Europe/London')).toBe('2025-03-30');
    const after = nextSlot(slot, '01:30', 'Europe/London');
    expect(localDate(after, 'Europe/London')).toBe('2025-03-31');
  });

  it('a local time that happens twice (01:30 on 2025-10-26 in London) gives one slot that date, not two', () => {
    const first = nextSlot(new Date('2025-10-25T12:00:00Z'), '01:30', 'Europe/London');
    expect(localDate(first, 'Europe/London')).toBe('2025-10-26');
    const second = nextSlot(first, '01:30', 'Europe/London');
    expect(localDate(second, 'Europe/London')).toBe('2025-10-27');
  });

  it('New York spring forward (2025-03-09): 06:45 local is 10:45 UTC, after 11:45 UTC the day before', () => {
    const { current, previous } = recentSlots(new Date('2025-03-09T12:00:00Z'), '06:45', 'America/New_York');
    expect(iso(current)).toBe('2025-03-09T10:45:00.000Z');
    expect(iso(previous)).toBe('2025-03-08T11:45:00.000Z');
  });

  it('start of the local day follows the zone', () => {
    expect(iso(startOfLocalDay(new Date('2025-06-10T09:00:00Z'), 'Europe/London'))).toBe('2025-06-09T23:00:00.000Z');
    expect(iso(startOfLocalDay(new Date('2025-10-26T12:00:00Z'), 'Europe/London'))).toBe('2025-10-25T23:00:00.000Z');
    expect(iso(startOfLocalDay(new Date('2025-10-27T12:00:00Z'), 'Europe/London'))).toBe('2025-10-27T00:00:00.000Z');
  });
});

describe('ages', () => {
  it('reads as minutes, hours, then days', () => {
    const now = new Date('2025-06-10T09:00:00Z');
    expect(formatAge('2025-06-10T08:59:40Z', now)).toBe('just now');
    expect(formatAge('2025-06-10T08:15:00Z', now)).toBe('45 min');
    expect(formatAge('2025-06-09T09:00:00Z', now)).toBe('24 h');
    expect(formatAge('2025-06-07T09:00:00Z', now)).toBe('3 d');
  });
});
