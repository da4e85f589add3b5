/** "Did you mean" for product ids: the closest known id within two edits, ignoring case. */
import type { SpecCatalog } from './spec/schema.js';

export function editDistance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  let prev = Array.from({ length: n + 1 }, (_, j) => j);
  for (let i = 1; i <= m; i++) {
    const cur = [i];
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      cur[j] = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + cost);
    }
    prev = cur;
  }
  return prev[n]!;
}

export function suggestProduct(productId: string, catalog: SpecCatalog, maxDistance = 2): string | undefined {
  const wanted = productId.toUpperCase();
  let best: { id: string; d: number } | undefined;
  for (const p of catalog.products) {
    const d = editDistance(wanted, p.id.toUpperCase());
    if (d <= maxDistance && (!best || d < best.d)) best = { id: p.id, d };
  }
  return best?.id;
}
