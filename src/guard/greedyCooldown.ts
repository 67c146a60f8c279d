/** Decay factors over 2^k ticks kept for the cool-down query, k = 0 .. COOLDOWN_DOUBLINGS − 1. */
export const COOLDOWN_DOUBLINGS = 31;

/**
 * The cool-down answer of the guard: the fewest whole ticks of free cooling after which the
 * may-start test passes, by greedy descent over the decays of 2^k ticks (k from
 * COOLDOWN_DOUBLINGS − 1 down to 0): a step is taken whenever the state after it still fails, so
 * the answer is one tick past the last failing state. The decayed state only falls with time (its
 * modes are non-negative and decay), so the test is monotone and the descent is a binary search.
 * Source: binary search on a monotone predicate (Press, Teukolsky, Vetterling & Flannery,
 * Numerical Recipes, 3rd ed. (2007), §9.1, bracketing and bisection). Cost COOLDOWN_DOUBLINGS + 1
 * may-start tests.
 * @param start the state's non-negative part
 * @param allowed the may-start test
 * @param decayed the state decayed by 2^k ticks
 * @returns 0 when the test passes now; null when it fails even after 2^COOLDOWN_DOUBLINGS ticks
 */
export function greedyCooldown<T>(start: T, allowed: (z: T) => boolean, decayed: (z: T, k: number) => T): number | null {
  let z = start;
  if (allowed(z)) return 0;
  let n = 0;
  for (let k = COOLDOWN_DOUBLINGS - 1; k >= 0; k--) {
    const candidate = decayed(z, k);
    if (!allowed(candidate)) {
      z = candidate;
      n += 2 ** k;
    }
  }
  return allowed(decayed(z, 0)) ? n + 1 : null;
}
