import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { type RainflowCycle, RainflowCounter, TurningPointFilter, rainflow } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

/** Counts per range, summed: { range: count }. */
function histogram(cycles: readonly RainflowCycle[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const c of cycles) out[String(c.rangeK)] = (out[String(c.rangeK)] ?? 0) + c.count;
  return out;
}

const points = (values: readonly number[]) => values.map((value, i) => ({ timeS: i, value }));

/** Sorted "range@mean×count" keys, to compare cycle multisets. */
function keys(cycles: readonly RainflowCycle[]): string[] {
  return cycles.map((c) => `${c.rangeK.toFixed(9)}@${c.meanC.toFixed(9)}x${c.count}`).sort();
}

/** Drop repeated values and points that do not reverse the direction (turning points only). */
function turning(values: readonly number[]): number[] {
  const out: number[] = [];
  for (const v of values) {
    if (out.length > 0 && out[out.length - 1] === v) continue;
    if (out.length >= 2 && (out[out.length - 1]! - out[out.length - 2]!) * (v - out[out.length - 1]!) > 0) out.pop();
    out.push(v);
  }
  return out;
}

/**
 * Literal ASTM E1049-85 (2017) §5.4.5 on a whole history, written independently of the
 * streaming class: rotate the turning points to start at the largest peak, close on it, then
 * repeat "read the next point; while X ≥ Y count Y as one cycle and drop its two points".
 * Returns [range, mean] pairs.
 */
function literalRepeating(values: readonly number[]): [number, number][] {
  const tp = turning(values);
  if (tp.length < 2) return [];
  const top = tp.indexOf(Math.max(...tp));
  const seq = turning([...tp.slice(top), ...tp.slice(0, top + 1)]);
  const stack: number[] = [];
  const out: [number, number][] = [];
  for (const v of seq) {
    stack.push(v);
    while (stack.length >= 3) {
      const n = stack.length;
      const x = Math.abs(stack[n - 1]! - stack[n - 2]!);
      const y = Math.abs(stack[n - 2]! - stack[n - 3]!);
      if (x < y) break;
      out.push([y, (stack[n - 2]! + stack[n - 3]!) / 2]);
      stack.splice(n - 3, 2);
    }
  }
  return out;
}

/**
 * Literal ASTM E1049-85 (2017) §5.4.4 steps 1-6, written independently of the streaming class:
 * read the next point; while X ≥ Y: if Y contains the start S, count it as a half cycle and drop
 * its first point (S moves on), else count it as one cycle and drop both its points; at the end
 * every remaining range is a half cycle. Returns "range@mean×count" keys.
 */
function literalOpen(values: readonly number[]): string[] {
  const stack: number[] = [];
  const out: string[] = [];
  const key = (a: number, b: number, count: number) => `${Math.abs(a - b).toFixed(9)}@${((a + b) / 2).toFixed(9)}x${count}`;
  for (const v of turning(values)) {
    stack.push(v);
    while (stack.length >= 3) {
      const n = stack.length;
      const x = Math.abs(stack[n - 1]! - stack[n - 2]!);
      const y = Math.abs(stack[n - 2]! - stack[n - 3]!);
      if (x < y) break;
      if (n === 3) {
        out.push(key(stack[0]!, stack[1]!, 0.5));
        stack.shift();
      } else {
        out.push(key(stack[n - 3]!, stack[n - 2]!, 1));
        stack.splice(n - 3, 2);
      }
    }
  }
  for (let i = 0; i + 1 < stack.length; i++) out.push(key(stack[i]!, stack[i + 1]!, 0.5));
  return out.sort();
}

describe("rainflow: ASTM E1049-85 (reapproved 2017) example history", () => {
  // The standard's example load history, peaks and valleys A..I = -2, 1, -3, 5, -1, 3, -4, 4, -2
  // (ASTM E1049-85 (2017), the rainflow-counting figure of §5.4.4 and the repeating history of
  // §5.4.5; history, figure and tabulated counts recalled, from memory). The counts were
  // re-derived by stepping §5.4.4 by hand, and the literal-procedure property tests below
  // check the same rules on thousands of histories: A-B half (3), B-C half (4), E-F full (4), C-D half (8), D-G half (9),
  // G-H half (8), H-I half (6). Exact: integer ranges, so toEqual.
  const history = [-2, 1, -3, 5, -1, 3, -4, 4, -2];

  test("rainflow(open) gives the §5.4.4 ranges and counts, half cycles included", () => {
    expect(histogram(rainflow(points(history), { mode: "open" }))).toEqual({ "3": 0.5, "4": 1.5, "6": 0.5, "8": 1, "9": 0.5 });
  });

  test("rainflow(repeating) closes the history at its largest peak: §5.4.5 counts, full cycles only", () => {
    // §5.4.5 by hand: start at D = 5: 5,-1,3,-4,4,-2,1,-3,5 -> E-F 4, I/A-B 3, H-C 7, D-G 9, one each.
    expect(histogram(rainflow(points(history), { mode: "repeating" }))).toEqual({ "3": 1, "4": 1, "7": 1, "9": 1 });
  });

  test("each cycle carries its min, max, mean and start", () => {
    const cycles = rainflow(points(history), { mode: "open" });
    const full = cycles.find((c) => c.count === 1)!;
    // E-F: E = -1 at t = 4, F = 3 at t = 5, closed by G = -4.
    expect([full.minC, full.maxC, full.meanC, full.rangeK, full.startS]).toEqual([-1, 3, 1, 4, 4]);
    // it rises first, so it heats from E to F: 1 s; it regains E's level 4/7 of the way down F-G.
    expect(full.heatingTimeS).toBe(1);
    expectClose(full.durationS, 1 + 4 / 7, { rel: 1e-15 }); // one rounding of a division
  });
});

describe("rainflow invariants (fast-check)", () => {
  const history = fc.array(fc.integer({ min: -50, max: 50 }), { minLength: 2, maxLength: 60 });

  test("adding a constant shifts the means and nothing else", () => {
    fc.assert(
      fc.property(history, fc.integer({ min: -100, max: 100 }), fc.constantFrom("open" as const, "repeating" as const), (h, shift, mode) => {
        const a = rainflow(points(h), { mode });
        const b = rainflow(points(h.map((v) => v + shift)), { mode });
        expect(b.map((c) => [c.rangeK, c.count, c.heatingTimeS])).toEqual(a.map((c) => [c.rangeK, c.count, c.heatingTimeS]));
        b.forEach((c, i) => expect(c.meanC).toBe(a[i]!.meanC + shift)); // integers: exact
      }),
    );
  });

  test("scaling by a positive factor scales the ranges", () => {
    fc.assert(
      fc.property(history, fc.integer({ min: 1, max: 9 }), (h, k) => {
        const a = rainflow(points(h));
        const b = rainflow(points(h.map((v) => v * k)));
        expect(b.map((c) => [c.rangeK, c.count])).toEqual(a.map((c) => [c.rangeK * k, c.count]));
      }),
    );
  });

  test("open mode: every range of the turning points is used once, 2·full + half = turning points − 1", () => {
    // §5.4.4: a full cycle removes two ranges, a half cycle one, the residue's ranges are halves.
    fc.assert(
      fc.property(history, (h) => {
        const cycles = rainflow(points(h), { mode: "open" });
        const full = cycles.filter((c) => c.count === 1).length;
        const half = cycles.filter((c) => c.count === 0.5).length;
        expect(2 * full + half).toBe(Math.max(0, turning(h).length - 1));
      }),
    );
  });

  test("open mode equals the literal §5.4.4 procedure", () => {
    fc.assert(
      fc.property(history, (h) => {
        expect(keys(rainflow(points(h), { mode: "open" }))).toEqual(literalOpen(h));
      }),
    );
  });

  test("repeating mode equals the literal rotated §5.4.5 count, with no half cycles", () => {
    fc.assert(
      fc.property(history, (h) => {
        const cycles = rainflow(points(h), { mode: "repeating" });
        expect(cycles.every((c) => c.count === 1)).toBe(true);
        const literal = literalRepeating(h).map(([r, m]) => `${r.toFixed(9)}@${m.toFixed(9)}x1`).sort();
        expect(keys(cycles)).toEqual(literal);
      }),
    );
  });

  test("repeating mode: any rotation of the history gives the same cycles", () => {
    fc.assert(
      fc.property(history, fc.nat(), (h, r) => {
        const k = r % h.length;
        const rotated = [...h.slice(k), ...h.slice(0, k)];
        expect(keys(rainflow(points(rotated), { mode: "repeating" }))).toEqual(keys(rainflow(points(h), { mode: "repeating" })));
      }),
    );
  });

  test("repeating mode: a history run twice back to back has every cycle twice", () => {
    fc.assert(
      fc.property(history, (h) => {
        const once = keys(rainflow(points(h), { mode: "repeating" }));
        const twice = keys(rainflow(points([...h, ...h]), { mode: "repeating" }));
        expect(twice).toEqual([...once, ...once].sort());
      }),
    );
  });

  test("the stack stays small on a long random history (memory bounded by the residue)", () => {
    let seed = 12345;
    const next = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 100;
    const counter = new RainflowCounter(() => {}, { mode: "repeating" });
    for (let i = 0; i < 200_000; i++) counter.push(i, next());
    counter.finish();
    // values bounded in [0, 100): the residue of a bounded random walk of peaks is tens of points.
    expect(counter.peakStackSize).toBeLessThan(200);
  });
});

describe("TurningPointFilter", () => {
  const run = (values: readonly number[], h: number) => {
    const out: [number, number][] = [];
    const f = new TurningPointFilter((t, v) => out.push([t, v]), h);
    values.forEach((v, i) => f.push(i, v));
    f.finish();
    return out;
  };

  test.each([
    // [history, hysteresis, turning points (time, value)]
    [[0, 5, 4.5, 10, 2], 1, [[0, 0], [3, 10], [4, 2]]], // the 0.5 K dip is inside the band
    [[0, 5, 4.5, 10, 2], 0, [[0, 0], [1, 5], [2, 4.5], [3, 10], [4, 2]]],
    [[20, 30, 30, 30, 25], 1, [[0, 20], [1, 30], [4, 25]]], // plateau: earliest time of the peak
    [[20, 20.5, 20.2], 1, [[0, 20]]], // never leaves the band: only the start
    [[3, 2, 1, 0, 4], 0.5, [[0, 3], [3, 0], [4, 4]]],
  ] as const)("filter(%j, %d K) gives %j", (values, h, expected) => {
    expect(run(values, h)).toEqual(expected);
  });

  // Leave times: the last point within the hysteresis band of the extreme before the history
  // moves out of it for good (the rule stated in src/stress/turningPoints.ts; common practice).
  const runWithLeave = (values: readonly number[], h: number) => {
    const out: [number, number, number][] = [];
    const f = new TurningPointFilter((t, v, leave) => out.push([t, v, leave]), h);
    values.forEach((v, i) => f.push(i, v));
    f.finish();
    return out;
  };

  test.each([
    // [history, hysteresis, turning points (reached, value, left)]
    [[40, 40, 40.3, 148, 40], 0.5, [[0, 40, 2], [3, 148, 3], [4, 40, 4]]], // hours at ambient, then a pulse: left at t = 2
    [[50, 45, 40, 40.2, 39.9, 40.1, 120, 60], 0.5, [[0, 50, 0], [4, 39.9, 5], [6, 120, 6], [7, 60, 7]]], // settling within the band
    [[20, 30, 30, 30, 25], 1, [[0, 20, 0], [1, 30, 3], [4, 25, 4]]], // plateau: reached first, left last
    [[40, 40.4, 40, 41, 40], 0, [[0, 40, 0], [1, 40.4, 1], [2, 40, 2], [3, 41, 3], [4, 40, 4]]], // no band: the level itself
    [[20, 20.5, 20.2], 1, [[0, 20, 2]]], // never leaves the band: only the start, left at the end
  ] as const)("filter(%j, %d K) gives reached/value/left %j", (values, h, expected) => {
    expect(runWithLeave(values, h)).toEqual(expected);
  });

  test("bad input names the field", () => {
    expect(() => new TurningPointFilter(() => {}, -1)).toThrow("cycleHysteresis: expected a temperature difference ≥ 0 K, found -1");
    const f = new TurningPointFilter(() => {});
    f.push(1, 20);
    expect(() => f.push(0.5, 21)).toThrow("history: expected points in time order, found 0.5 s after 1 s");
    expect(() => f.push(2, Number.NaN)).toThrow("history: expected finite times and temperatures, found (2, NaN)");
  });
});

describe("rainflow timing", () => {
  const timed = fc
    .array(fc.tuple(fc.double({ min: 0.001, max: 10, noNaN: true }), fc.integer({ min: 0, max: 100 })), { minLength: 2, maxLength: 50 })
    .map((steps) => {
      let t = 0;
      return steps.map(([dt, value]) => ({ timeS: (t += dt), value }));
    });

  test("every cycle heats for a time ≥ 0 and no longer than the cycle lasts", () => {
    fc.assert(
      fc.property(timed, fc.constantFrom("open" as const, "repeating" as const), (pts, mode) => {
        for (const c of rainflow(pts, { mode })) {
          expect(c.heatingTimeS).toBeGreaterThanOrEqual(0);
          expect(c.heatingTimeS).toBeLessThanOrEqual(c.durationS * (1 + 1e-12));
        }
      }),
    );
  });

  // Heating time runs from the last moment at the cycle's low level to its peak (rule stated in
  // src/stress/rainflowCounter.ts; common practice). The cases are invented histories whose
  // answers are differences of the given times: exact up to the rounding of one subtraction of
  // numbers near 1e5 s, 1e-10 s.
  test("a cycle that rises first heats from the time its valley was left", () => {
    // 40 °C from t = 0, left at 10 800 s (3 h), peak 148 °C at 10 800.3 s, back to 40 °C at 14 400 s
    const cycles = rainflow([{ timeS: 0, value: 40, leaveS: 10800 }, { timeS: 10800.3, value: 148 }, { timeS: 14400, value: 40 }], { mode: "open" });
    const rise = cycles.find((c) => c.startS === 0)!;
    expect(rise.count).toBe(0.5);
    expectClose(rise.heatingTimeS, 0.3, { abs: 1e-10 });
    expectClose(rise.durationS, 0.6, { abs: 1e-10 }); // a half cycle lasts twice its one-way travel
  });

  test("a cycle that falls first heats on its closing travel, from the time its valley was left", () => {
    // peak 100 at 0, valley 60 reached at 10 s and left at 100 s, rising to 140 at 101 s:
    // the closing travel 60 → 140 regains 100 half-way, 0.5 s after leaving the valley.
    const [cycle] = rainflow([{ timeS: 0, value: 20 }, { timeS: 1, value: 100 }, { timeS: 10, value: 60, leaveS: 100 }, { timeS: 101, value: 140 }], { mode: "open" }).filter((c) => c.count === 1);
    expect([cycle!.minC, cycle!.maxC]).toEqual([60, 100]);
    expectClose(cycle!.heatingTimeS, 0.5, { abs: 1e-12 });
    expectClose(cycle!.durationS, 9 + 90 + 0.5, { abs: 1e-12 }); // down 9 s, 90 s at the valley, back up 0.5 s
  });

  test("daily pulses closed on the largest peak each heat for the pulse alone, not for the days between", () => {
    // Three days of a 0.3 s pulse to about 148 °C from 40 °C, each left at the moment its pulse
    // starts; the peaks differ in the last digits, as computed peaks do, and the valleys by less
    // than the 0.5 K band. Closing the repeating history on its largest peak (§5.4.5) pairs the
    // first day's valley with the last peak: the valleys counted away in between (back within the
    // band) move its leave time to the last pulse's start.
    const day = 86400;
    const points = [0, 1, 2].flatMap((k) => [
      { timeS: k * day, value: 40 + 0.1 * k, leaveS: k * day },
      { timeS: k * day + 0.3, value: 148 + 1e-12 * k },
    ]);
    points.push({ timeS: 2 * day + 3600, value: 40.05, leaveS: 3 * day });
    const cycles: RainflowCycle[] = [];
    const counter = new RainflowCounter((c) => cycles.push(c), { mode: "repeating", levelBandK: 0.5 });
    for (const p of points) counter.push(p.timeS, p.value, p.leaveS);
    counter.finish(3 * day);
    expect(cycles).toHaveLength(3);
    for (const c of cycles) expectClose(c.heatingTimeS, 0.3, { abs: 1e-10 });
  });

  test("a repeating history cannot be closed with a period shorter than itself", () => {
    const counter = new RainflowCounter(() => {}, { mode: "repeating" });
    [0, 10, 0].forEach((v, i) => counter.push(i * 2, v));
    expect(() => counter.finish(3)).toThrow("periodS: expected a period at least as long as the history (4 s), found 3 s");
  });
});
