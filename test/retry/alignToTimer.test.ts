import { describe, expect, test } from "vitest";
import { alignBandsToTimer, ceilToTimer, earliestOnTimer, floorToTimer } from "../../src/internal.js";

// Rounding to a firmware timer: whole steps only, up for what is proposed, checked again by the
// predicate. Expected values are counted by hand (whole multiples of the step, written as the
// decimal the tidy-up to 15 digits gives).
describe("ceilToTimer / floorToTimer", () => {
  test.each([
    [0.0251, 0.01, 0.03, 0.02],
    [0.03, 0.01, 0.03, 0.03],
    [0.07, 0.01, 0.07, 0.07], // 0.07/0.01 is 7.000000000000001 in doubles: still 7 steps
    [0.030000000003, 0.01, 0.03, 0.03], // bisection noise above a step counts as on it (re-checked)
    [0.029999999997, 0.01, 0.03, 0.02], // a hair below a step: down goes a whole step (never above the value)
    [1.2345, 0.001, 1.235, 1.234],
    [0.0123, 0, 0.0123, 0.0123], // resolution 0: no rounding
  ])("%s s on a %s s timer: up %s s, down %s s", (value, step, up, down) => {
    expect(ceilToTimer(value, step)).toBe(up);
    expect(floorToTimer(value, step)).toBe(down);
  });
});

describe("alignBandsToTimer", () => {
  test("a band's lower end is rounded up and re-checked; a band with no passing step is dropped", () => {
    // feasible on [0.032, 0.054] and [0.0601, 0.0609] and from 0.7 on, except a hole at exactly 0.04
    const feasible = (x: number): boolean => ((x >= 0.032 && x <= 0.054) || (x >= 0.0601 && x <= 0.0609) || x >= 0.7) && x !== 0.04;
    const bands = [
      { fromS: 0.032, toS: 0.054, openEnded: false },
      { fromS: 0.0601, toS: 0.0609, openEnded: false },
      { fromS: 0.7, toS: 20, openEnded: true },
    ];
    const out = alignBandsToTimer(bands, 0.01, feasible);
    // 0.032 → 0.04 fails the check (the hole) → 0.05 passes; 0.054 rounds down to 0.05.
    // [0.0601, 0.0609] holds no whole 10 ms step: dropped. 0.7 is on the grid; the open end stays.
    expect(out.bands).toEqual([
      { fromS: 0.05, toS: 0.05, openEnded: false },
      { fromS: 0.7, toS: 20, openEnded: true },
    ]);
    expect(out.evaluations).toBe(3);
  });

  test("resolution 0 returns the bands untouched, with no check spent", () => {
    const bands = [{ fromS: 0.0123, toS: 0.5, openEnded: false }];
    expect(alignBandsToTimer(bands, 0, () => false)).toEqual({ bands, evaluations: 0 });
  });
});

describe("earliestOnTimer", () => {
  test("steps up one timer step at a time while the check fails, never past the limit", () => {
    const feasible = (x: number): boolean => x >= 0.061;
    expect(earliestOnTimer(0.0441, 0.01, 1, feasible)).toBe(0.07);
    expect(earliestOnTimer(0.0441, 0.01, 0.065, feasible)).toBeNull();
    expect(earliestOnTimer(0.0441, 0, 1, feasible)).toBe(0.0441);
  });
});
