/**
 * "Did you mean ...?" for a misspelt setting: the known name that differs only in case, else the
 * one that a short word begins (a unit suffix left off: "redline" for redlineRpm), else the
 * nearest by edit distance (optimal string alignment: insert, delete, substitute, swap two
 * neighbours), compared without case and only when close enough to be a slip. No package in the
 * project offers this as a supported API, so it is written here; it is a few lines.
 */

/** Edit distance with adjacent swaps (optimal string alignment), on the strings as given. */
export function editDistance(a: string, b: string): number {
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d: number[][] = Array.from({ length: rows }, (_, i) => Array.from({ length: cols }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(d[i - 1]![j]! + 1, d[i]![j - 1]! + 1, d[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) best = Math.min(best, d[i - 2]![j - 2]! + 1);
      d[i]![j] = best;
    }
  }
  return d[a.length]![b.length]!;
}

/** The known name the person most likely meant, or null when none is close. */
export function closestName(word: string, known: readonly string[]): string | null {
  const w = word.toLowerCase();
  const sameButCase = known.find((k) => k.toLowerCase() === w);
  if (sameButCase) return sameButCase;
  if (w.length >= 4) {
    const extended = known.filter((k) => k.toLowerCase().startsWith(w));
    if (extended.length === 1) return extended[0]!;
  }
  const allowed = Math.max(1, Math.floor(w.length / 3));
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const k of known) {
    const dist = editDistance(w, k.toLowerCase());
    if (dist <= allowed && dist < bestDistance) {
      best = k;
      bestDistance = dist;
    }
  }
  return best;
}
