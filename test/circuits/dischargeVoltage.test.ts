import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { type DischargePath, dischargeVoltage } from "../../src/internal.js";
import { createOdexSolver } from "../../src/circuits/loadOdex.js";
import { expectClose } from "../helpers/expectClose.js";
import { inputErrorMessage } from "./inputErrorMessage.js";

/**
 * Reference: integrate C·dV/dt = −i(V) with odex (a general-purpose ODE solver from the
 * registry), restarting at the voltage `kinkV` where i(V) jumps (located by bisection on odex's
 * dense output), as an integrator must at a discontinuity of the right-hand side.
 */
function odexDischarge(current: (v: number) => number, cF: number, v0: number, tS: number, kinkV: number): number {
  const solver = createOdexSolver(1);
  solver.relativeTolerance = 1e-12;
  solver.absoluteTolerance = 1e-12;
  solver.maxSteps = 1e6;
  solver.denseOutput = true;
  // time in units of the pause, voltage in units of v0: a unit-size problem for odex
  const f = (_x: number, y: number[]): number[] => [-(current(y[0]! * v0) * tS) / (cF * v0)];
  let kinkX: number | undefined;
  const first = solver.solve(f, 0, [1], 1, (_n, xOld, x, y, dense) => {
    if (dense === undefined || x === xOld || y[0]! * v0 > kinkV) return;
    let lo = xOld;
    let hi = x;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (dense(0, mid) * v0 > kinkV) lo = mid;
      else hi = mid;
    }
    kinkX = hi;
    return false;
  });
  if (kinkX === undefined) return v0 * first.y[0]!;
  const second = createOdexSolver(1);
  second.relativeTolerance = 1e-12;
  second.absoluteTolerance = 1e-12;
  second.maxSteps = 1e6;
  return v0 * second.solve((x, y) => f(x, [Math.min(y[0]!, (kinkV / v0) * (1 - 1e-15))]), kinkX, [kinkV / v0], 1).y[0]!;
}

describe("dischargeVoltage", () => {
  // Source-free RC: V0·e^(−t/RC). Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis,
  // 8th ed. (2012), §8.3, source-free RC circuit (section number from memory).
  test.each([
    [{ kind: "none" } as DischargePath, 5, 400],
    [{ kind: "bleeder", resistanceOhm: 1000 } as DischargePath, 1, 400 / Math.E],
    [{ kind: "constant-current", currentA: 0.1 } as DischargePath, 1, 300],
    [{ kind: "constant-current", currentA: 0.1 } as DischargePath, 5, 0],
    [{ kind: "active", resistanceOhm: 100, untilV: 60 } as DischargePath, 0.05, 400 * Math.exp(-0.5)],
    [{ kind: "active", resistanceOhm: 100, untilV: 60 } as DischargePath, 5, 60],
    [{ kind: "active", resistanceOhm: 100 } as DischargePath, 1, 400 * Math.exp(-10)],
  ])("%j after %d s from 400 V on 1 mF → %d V", (path, t, expected) => {
    // closed forms, double precision: 1e-13 relative is rounding of exp
    expectClose(dischargeVoltage(path, 1e-3, 400, t), expected, { rel: 1e-13, abs: 1e-300 });
  });

  test.each([
    // before the sink reaches 0 V at τ·ln 2 = 1.386 s (τ = Rb·C = 2 s, I·Rb = 400 V)
    [{ kind: "constant-current", currentA: 0.2, bleederOhm: 2000 } as DischargePath, (v: number) => 0.2 + v / 2000, 0, [0.05, 0.3, 1.2]],
    // the active path stops at 100 V (at 0.147 s), the bleeder goes on
    [{ kind: "active", resistanceOhm: 300, untilV: 100, bleederOhm: 5000 } as DischargePath, (v: number) => (v > 100 ? v / 300 : 0) + v / 5000, 100, [0.05, 0.3, 1.5]],
  ])("%j matches odex (1e-9 relative)", (path, current, kinkV, times) => {
    for (const t of times) {
      // odex at 1e-12 per unit-size problem, the crossing located to 1e-15: measured error at most
      // 5e-12, so 1e-9 relative is an honest bound
      expectClose(dischargeVoltage(path, 1e-3, 400, t), odexDischarge(current, 1e-3, 400, t, kinkV), { rel: 1e-9 });
    }
  });

  test("a constant-current sink with a bleeder reaches 0 V at τ·ln((V0 + I·Rb)/(I·Rb)) and stays there", () => {
    const path: DischargePath = { kind: "constant-current", currentA: 0.2, bleederOhm: 2000 };
    const tZero = 2 * Math.log(2);
    expect(dischargeVoltage(path, 1e-3, 400, tZero * 1.0001)).toBe(0);
    expect(dischargeVoltage(path, 1e-3, 400, tZero * 0.999)).toBeGreaterThan(0);
  });

  // A time-invariant discharge is a semigroup: waiting t1 then t2 equals waiting t1 + t2
  // (uniqueness of ODE solutions, Hirsch, Smale & Devaney, Differential Equations, Dynamical
  // Systems, and an Introduction to Chaos, 3rd ed. (2013), §7.2, from memory).
  test("waiting t1 then t2 equals waiting t1 + t2, and the voltage never rises (property)", () => {
    const pathArb: fc.Arbitrary<DischargePath> = fc.oneof(
      fc.double({ min: 1, max: 1e4, noNaN: true }).map((r): DischargePath => ({ kind: "bleeder", resistanceOhm: r })),
      fc.tuple(fc.double({ min: 1e-3, max: 1, noNaN: true }), fc.option(fc.double({ min: 10, max: 1e4, noNaN: true }), { nil: undefined })).map(
        ([i, rb]): DischargePath => (rb === undefined ? { kind: "constant-current", currentA: i } : { kind: "constant-current", currentA: i, bleederOhm: rb }),
      ),
      fc.tuple(fc.double({ min: 1, max: 1e3, noNaN: true }), fc.double({ min: 0, max: 300, noNaN: true }), fc.option(fc.double({ min: 10, max: 1e4, noNaN: true }), { nil: undefined })).map(
        ([r, u, rb]): DischargePath => (rb === undefined ? { kind: "active", resistanceOhm: r, untilV: u } : { kind: "active", resistanceOhm: r, untilV: u, bleederOhm: rb }),
      ),
    );
    fc.assert(
      fc.property(pathArb, fc.double({ min: 0, max: 400, noNaN: true }), fc.double({ min: 0, max: 2, noNaN: true }), fc.double({ min: 0, max: 2, noNaN: true }), (path, v0, t1, t2) => {
        const once = dischargeVoltage(path, 1e-3, v0, t1 + t2);
        const twice = dischargeVoltage(path, 1e-3, dischargeVoltage(path, 1e-3, v0, t1), t2);
        // rounding of exp/log through two evaluations: 1e-9 relative of v0
        expectClose(twice, once, { abs: 1e-9 * Math.max(1, v0) });
        expect(once).toBeLessThanOrEqual(v0);
        expect(once).toBeGreaterThanOrEqual(0);
      }),
      { numRuns: 300, seed: 20261202 },
    );
  });

  test.each([
    [{ kind: "bleeder", resistanceOhm: 1000 } as DischargePath, 0, 10, 1, "capacitanceF: expected a capacitance > 0 F, found 0"],
    [{ kind: "bleeder", resistanceOhm: 1000 } as DischargePath, 1e-3, -1, 1, "initialVoltageV: expected a bus voltage ≥ 0 V, found -1"],
    [{ kind: "bleeder", resistanceOhm: 1000 } as DischargePath, 1e-3, 10, -1, "durationS: expected a pause ≥ 0 s, found -1"],
    [{ kind: "bleeder", resistanceOhm: -3 } as DischargePath, 1e-3, 10, 1, "path.resistanceOhm: expected a bleeder resistance > 0 Ω, found -3"],
    [{ kind: "constant-current", currentA: 0 } as DischargePath, 1e-3, 10, 1, "path.currentA: expected a discharge current > 0 A, found 0"],
    [{ kind: "active", resistanceOhm: 10, untilV: -1 } as DischargePath, 1e-3, 10, 1, "path.untilV: expected a stop voltage ≥ 0 V, found -1"],
    [{ kind: "leak" } as unknown as DischargePath, 1e-3, 10, 1, 'path.kind: expected one of "none", "bleeder", "constant-current", "active", found "leak"'],
  ])("%j, C %d, V0 %d, t %d → %s", (path, c, v0, t, message) => {
    expect(inputErrorMessage(() => dischargeVoltage(path, c, v0, t))).toBe(message);
  });
});
