import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { scanFeasibleBands, scanGrid } from "../../src/internal.js";

// Invariant tests: a predicate with known bands (unions of intervals, each wider than a few grid
// steps so the scan must see it) is recovered band by band, every edge to the bisection's
// relative tolerance 1e-9, always on the feasible side.
describe("scanFeasibleBands", () => {
  test("recovers random bands on a log grid", () => {
    const grid = scanGrid(0, 1000);
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -2.5, max: 2.5, noNaN: true }), { minLength: 2, maxLength: 6 }).map((xs) => [...new Set(xs.map((x) => Math.round(x * 20) / 20))].sort((a, b) => a - b)),
        (exponents) => {
          // edges at 10^e, kept apart by at least 0.05 decade (the grid has 40 points per decade)
          const edges = exponents.filter((e, i) => i === 0 || e - exponents[i - 1]! >= 0.05).map((e) => 10 ** e);
          if (edges.length % 2 === 1) edges.pop();
          const inside = (x: number): boolean => {
            for (let i = 0; i + 1 < edges.length; i += 2) if (x >= edges[i]! && x <= edges[i + 1]!) return true;
            return false;
          };
          const { bands } = scanFeasibleBands(inside, grid);
          expect(bands).toHaveLength(edges.length / 2);
          bands.forEach((b, i) => {
            expect(inside(b.fromS) && inside(b.toS)).toBe(true);
            expect(Math.abs(b.fromS - edges[2 * i]!)).toBeLessThanOrEqual(1e-9 * edges[2 * i]! * 2);
            expect(Math.abs(b.toS - edges[2 * i + 1]!)).toBeLessThanOrEqual(1e-9 * edges[2 * i + 1]! * 2);
          });
        },
      ),
      { numRuns: 200, seed: 61 },
    );
  });

  test("a band touching the scan's ends is open-ended at the top and starts at the lower end", () => {
    const { bands } = scanFeasibleBands((x) => x <= 0.5 || x >= 20, scanGrid(0, 100));
    expect(bands).toHaveLength(2);
    expect(bands[0]!.fromS).toBe(0);
    expect(bands[1]!.openEnded).toBe(true);
    expect(bands[1]!.toS).toBeCloseTo(100, 9);
  });
});
