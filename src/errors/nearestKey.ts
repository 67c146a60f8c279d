/**
 * Levenshtein edit distance between two strings (insertions, deletions, substitutions).
 * Source: Levenshtein, "Binary codes capable of correcting deletions, insertions and reversals",
 * Soviet Physics Doklady 10 (1966); Wagner & Fischer, JACM 21 (1974) dynamic programme.
 * Cost O(|a|·|b|) time, O(|b|) memory.
 */
export function editDistance(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      current[j] = Math.min(previous[j]! + 1, current[j - 1]! + 1, previous[j - 1]! + cost);
    }
    previous = current;
  }
  return previous[b.length]!;
}

/**
 * The valid key closest to an unknown one, for "unknown key 'capacitence' (did you mean
 * 'capacitance'?)"; undefined when nothing is within about a third of the key's length.
 * Cost O(keys × length²).
 */
export function nearestKey(unknown: string, valid: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const key of valid) {
    const d = editDistance(unknown.toLowerCase(), key.toLowerCase());
    if (d < bestDistance) {
      bestDistance = d;
      best = key;
    }
  }
  return bestDistance <= Math.max(2, Math.ceil(unknown.length / 3)) ? best : undefined;
}

/** "one of a, b, c (did you mean b?)": the expectation text for an unknown key. */
export function unknownKeyExpectation(unknown: string, valid: readonly string[]): string {
  const guess = nearestKey(unknown, valid);
  return `one of the keys ${valid.join(", ")}${guess === undefined ? "" : ` (did you mean "${guess}"?)`}`;
}
