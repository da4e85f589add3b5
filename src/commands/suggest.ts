/** "Did you mean": the closest known word within a small edit distance. */

/** Optimal-string-alignment distance: insertions, deletions, substitutions, adjacent swaps. */
export function editDistance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  const d: number[][] = Array.from({ length: m + 1 }, (_, i) => Array.from({ length: n + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i <= m; i++) {
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let v = Math.min(d[i - 1]![j]! + 1, d[i]![j - 1]! + 1, d[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, d[i - 2]![j - 2]! + 1);
      d[i]![j] = v;
    }
  }
  return d[m]![n]!;
}

export function suggest(word: string, known: readonly string[]): string | undefined {
  const w = word.toLowerCase();
  if (w.length > 40) return undefined;
  let best: { word: string; d: number } | undefined;
  for (const k of known) {
    const dist = editDistance(w, k.toLowerCase());
    if (!best || dist < best.d) best = { word: k, d: dist };
  }
  if (!best) return undefined;
  const limit = w.length <= 3 ? 1 : 2;
  return best.d <= limit ? best.word : undefined;
}
