/**
 * Wilson score interval of a binomial proportion: k successes in n trials, at the two-sided
 * confidence whose normal quantile is z (1.96 for 95 %):
 * centre (k + z²/2)/(n + z²), half-width z·√(k(n − k)/n + z²/4)/(n + z²).
 * Unlike the normal-approximation interval it stays inside [0, 1] and is not empty at k = 0
 * (the upper end is then z²/(n + z²)), which a rare crossing needs.
 * Source: E. B. Wilson, "Probable inference, the law of succession, and statistical inference",
 * J. Am. Stat. Assoc. 22 (1927), 209–212.
 * Cost O(1). Returns [0, 1] for n = 0.
 */
export function wilsonInterval(k: number, n: number, z: number): { readonly low: number; readonly high: number } {
  if (n <= 0) return { low: 0, high: 1 };
  const z2 = z * z;
  const centre = (k + z2 / 2) / (n + z2);
  const half = (z * Math.sqrt((k * (n - k)) / n + z2 / 4)) / (n + z2);
  return { low: Math.max(0, centre - half), high: Math.min(1, centre + half) };
}
