import { PLAN_DEFAULTS } from "./planDefaults.js";

/** A range of a scanned variable (interval, wait, lockout) over which a predicate holds. */
export interface FeasibleBand {
  /** lower end [s] */
  readonly fromS: number;
  /** upper end [s]; the scan's upper end when openEnded */
  readonly toS: number;
  /** true when the band reaches the top of the scan (feasible there; longer values were not scanned) */
  readonly openEnded: boolean;
}

/** Bands found by {@link scanFeasibleBands}, with the cost of finding them. */
export interface BandScan {
  readonly bands: readonly FeasibleBand[];
  /** predicate evaluations spent */
  readonly evaluations: number;
}

/**
 * The scan grid: `points` values log-spaced over `decades` decades up to `toS`, preceded by
 * `fromS` itself (0 or the smallest meaningful value), sorted and unique.
 * Cost O(points).
 */
export function scanGrid(fromS: number, toS: number, points: number = PLAN_DEFAULTS.scanPoints, decades: number = PLAN_DEFAULTS.scanDecades): number[] {
  const lowest = Math.max(fromS, toS * 10 ** -decades);
  const values = [fromS];
  if (toS > lowest) {
    const a = Math.log(lowest > 0 ? lowest : toS * 10 ** -decades);
    const b = Math.log(toS);
    for (let i = 0; i < points; i++) values.push(Math.exp(a + ((b - a) * i) / (points - 1)));
  }
  return [...new Set(values.filter((v) => v >= fromS))].sort((x, y) => x - y);
}

/**
 * Every band of a grid over which a predicate holds, with each edge refined by bisection.
 *
 * Peak temperature against interval is not always monotone (a quick retry finds a nearly full
 * capacitor and dissipates little; a slower one finds it empty), so no single bisection can be
 * trusted: the predicate is evaluated on the whole grid, each change between neighbours brackets
 * an edge, and each edge is bisected until the bracket is below relTol × its upper end. An edge
 * returned is always on the feasible side. Bands narrower than the grid spacing can be missed;
 * the grid density is PLAN_DEFAULTS.scanPoints over PLAN_DEFAULTS.scanDecades.
 * Source: bracketing and bisection, Press et al., Numerical Recipes, 3rd ed. (2007), §9.1.
 * Cost O((grid + edges × log2(1/relTol)) × cost of the predicate).
 */
export function scanFeasibleBands(feasible: (x: number) => boolean, grid: readonly number[], relTol: number = PLAN_DEFAULTS.bisectionRelTol): BandScan {
  let evaluations = 0;
  const test = (x: number): boolean => {
    evaluations++;
    return feasible(x);
  };
  const ok = grid.map(test);
  const edge = (lo: number, hi: number, loFeasible: boolean): number => {
    // invariant: test(lo) === loFeasible, test(hi) === !loFeasible
    while (hi - lo > relTol * Math.abs(hi)) {
      const mid = 0.5 * (lo + hi);
      if (mid <= lo || mid >= hi) break;
      if (test(mid) === loFeasible) lo = mid;
      else hi = mid;
    }
    return loFeasible ? lo : hi;
  };
  const bands: FeasibleBand[] = [];
  let from: number | null = ok[0] ? grid[0]! : null;
  for (let i = 1; i < grid.length; i++) {
    if (ok[i] === ok[i - 1]) continue;
    if (ok[i]) from = edge(grid[i - 1]!, grid[i]!, false);
    else {
      bands.push({ fromS: from!, toS: edge(grid[i - 1]!, grid[i]!, true), openEnded: false });
      from = null;
    }
  }
  if (from !== null) bands.push({ fromS: from, toS: grid[grid.length - 1]!, openEnded: true });
  return { bands, evaluations };
}
