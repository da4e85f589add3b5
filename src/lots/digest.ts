/**
 * The daily summary of flagged lots, as data. Computed at send time from the flags: every flag
 * raised in the window (since the previous summary), open or since cleared, and every flag
 * still open from before the window; grouped by the lot's product, with counts. Pure.
 */
import type { FlagCode } from './flags.js';
import type { FlagWithProduct } from './repository.js';

export interface DigestFlag {
  readonly flag: FlagWithProduct;
  /** Raised inside the window. */
  readonly isNew: boolean;
  readonly open: boolean;
}

export interface DigestLot {
  readonly lotId: string;
  readonly flags: readonly DigestFlag[];
  readonly newCount: number;
  readonly openCount: number;
  /** The most recent time a flag of this lot was raised. */
  readonly lastRaisedAt: string;
}

export interface DigestGroup {
  /** undefined: lots with no product. */
  readonly productId?: string;
  readonly lots: readonly DigestLot[];
  readonly flagCount: number;
  readonly openCount: number;
  readonly newCount: number;
}

export interface Digest {
  readonly localDate: string;
  readonly timeZone: string;
  readonly windowStart: string;
  readonly windowEnd: string;
  readonly late: boolean;
  /** When late: the time the summary was due. */
  readonly dueAt?: string;
  readonly preview: boolean;
  readonly groups: readonly DigestGroup[];
  readonly totals: {
    readonly lots: number;
    readonly flags: number;
    readonly newFlags: number;
    readonly openFlags: number;
    readonly byCode: Readonly<Partial<Record<FlagCode, number>>>;
  };
}

export interface DigestInput {
  readonly localDate: string;
  readonly timeZone: string;
  readonly windowStart: Date;
  readonly windowEnd: Date;
  /** Flags raised in [windowStart, windowEnd]. */
  readonly raisedInWindow: readonly FlagWithProduct[];
  /** Flags raised before windowStart and still open. */
  readonly olderOpen: readonly FlagWithProduct[];
  readonly late?: boolean;
  readonly dueAt?: Date;
  readonly preview?: boolean;
}

export function buildDigest(input: DigestInput): Digest {
  const endIso = input.windowEnd.toISOString();
  const entries: DigestFlag[] = [];
  const seen = new Set<number>();
  for (const f of input.raisedInWindow) {
    if (f.raisedAt > endIso || seen.has(f.id)) continue;
    seen.add(f.id);
    // Raised by a reading that was then corrected (closed by the correction, not by a person):
    // the flag was the typo's, not the lot's, and the lot does not count as flagged for it.
    if (f.clearance?.kind === 'correction' && f.clearance.at <= endIso) continue;
    // A clearance after the window's end does not count yet at send time.
    const open = f.clearance === undefined || f.clearance.at > endIso;
    entries.push({ flag: f, isNew: true, open });
  }
  for (const f of input.olderOpen) {
    if (seen.has(f.id)) continue;
    seen.add(f.id);
    entries.push({ flag: f, isNew: false, open: true });
  }

  const byProduct = new Map<string, Map<string, DigestFlag[]>>();
  for (const e of entries) {
    const product = e.flag.lotProductId ?? e.flag.productId ?? '';
    const lots = byProduct.get(product) ?? new Map<string, DigestFlag[]>();
    const list = lots.get(e.flag.lotId) ?? [];
    list.push(e);
    lots.set(e.flag.lotId, list);
    byProduct.set(product, lots);
  }

  const groups: DigestGroup[] = [];
  for (const [product, lots] of byProduct) {
    const lotList: DigestLot[] = [];
    for (const [lotId, flags] of lots) {
      // Open first, then newest first.
      flags.sort((a, b) => Number(b.open) - Number(a.open) || b.flag.raisedAt.localeCompare(a.flag.raisedAt) || b.flag.id - a.flag.id);
      lotList.push({
        lotId,
        flags,
        newCount: flags.filter((f) => f.isNew).length,
        openCount: flags.filter((f) => f.open).length,
        lastRaisedAt: flags.reduce((m, f) => (f.flag.raisedAt > m ? f.flag.raisedAt : m), ''),
      });
    }
    // Lots with open flags first, then the most recently flagged.
    lotList.sort((a, b) => Number(b.openCount > 0) - Number(a.openCount > 0) || b.lastRaisedAt.localeCompare(a.lastRaisedAt) || a.lotId.localeCompare(b.lotId));
    groups.push({
      ...(product !== '' ? { productId: product } : {}),
      lots: lotList,
      flagCount: lotList.reduce((s, l) => s + l.flags.length, 0),
      openCount: lotList.reduce((s, l) => s + l.openCount, 0),
      newCount: lotList.reduce((s, l) => s + l.newCount, 0),
    });
  }
  // Products with the most open flags first; "no product" last.
  groups.sort(
    (a, b) =>
      Number(a.productId === undefined) - Number(b.productId === undefined) ||
      b.openCount - a.openCount ||
      (a.productId ?? '').localeCompare(b.productId ?? ''),
  );

  const byCode: Partial<Record<FlagCode, number>> = {};
  for (const e of entries) byCode[e.flag.code] = (byCode[e.flag.code] ?? 0) + 1;
  return {
    localDate: input.localDate,
    timeZone: input.timeZone,
    windowStart: input.windowStart.toISOString(),
    windowEnd: endIso,
    late: input.late ?? false,
    ...(input.late && input.dueAt ? { dueAt: input.dueAt.toISOString() } : {}),
    preview: input.preview ?? false,
    groups,
    totals: {
      lots: groups.reduce((s, g) => s + g.lots.length, 0),
      flags: entries.length,
      newFlags: entries.filter((e) => e.isNew).length,
      openFlags: entries.filter((e) => e.open).length,
      byCode,
    },
  };
}
