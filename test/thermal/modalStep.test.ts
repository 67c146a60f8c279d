import { create, all } from "mathjs";
import { describe, expect, test } from "vitest";
import { type PowerTerm, advanceModalState, createModalStepper, fosterToModal, runThermalHistory, traceSteps } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Edge cases of the exact one-mode update dy/ds = (P(s) − y)/tau from y(0) = 0, against the closed
// forms of the variation-of-constants formula (Boyce & DiPrima, Elementary Differential Equations,
// 10th ed. (2012), §2.1) evaluated in mathjs (registry library) BigNumber arithmetic at 80 digits:
//   constant a:                y(h) = a·(1 − e^(−h/tau))
//   a·e^(−lambda·s), lambda·tau ≠ 1:  y(h) = a·(e^(−lambda·h) − e^(−h/tau))/(1 − lambda·tau)
//   a·e^(−s/tau) (lambda = 1/tau):     y(h) = a·(h/tau)·e^(−h/tau)
//   b·s·e^(−lambda·s), k = 1/tau − lambda:  y(h) = (b/tau)·e^(−h/tau)·(e^(k·h)·(k·h − 1) + 1)/k²
//   b·s·e^(−s/tau) (k = 0):            y(h) = (b/tau)·e^(−h/tau)·h²/2
// Tolerance 1e-12 relative: measured worst 1.4e-14, for results near e^(−333), where rounding the
// exponent itself (333·2^-53 ≈ 4e-14) dominates; a cancellation or overflow bug shows as 1e-3 or NaN.
const big = create(all!, { number: "BigNumber", precision: 80 });
const B = (x: number) => big.bignumber(x);

function exactResponse(tau: number, h: number, term: PowerTerm): number {
  const T = B(tau);
  const H = B(h);
  const decay = H.div(T).neg().exp();
  const L = B(term.lambda);
  let y = B(0);
  if (term.a !== 0) {
    const lt = L.times(T);
    if (lt.eq(1)) y = y.plus(B(term.a).times(H.div(T)).times(decay));
    else y = y.plus(B(term.a).times(L.times(H).neg().exp().minus(decay)).div(B(1).minus(lt)));
  }
  if (term.b !== 0) {
    const k = B(1).div(T).minus(L);
    const lead = B(term.b).div(T).times(decay);
    if (k.isZero()) y = y.plus(lead.times(H.times(H)).div(2));
    else {
      const kh = k.times(H);
      y = y.plus(lead.times(kh.exp().times(kh.minus(1)).plus(1)).div(k.times(k)));
    }
  }
  return y.toNumber();
}

const taus = [1e-6, 1e-3, 1, 1e5];
const lengths = [1e-9, 1e-6, 1e-3, 1, 1e3, 1e7];
// Powers as functions of tau and h so every case has a meaningful size.
const shapes: [string, (tau: number, h: number) => PowerTerm][] = [
  ["constant", () => ({ a: 7, b: 0, lambda: 0 })],
  ["decay lambda = 1/tau", (tau) => ({ a: 7, b: 0, lambda: 1 / tau })],
  ["decay lambda = 3/tau", (tau) => ({ a: 7, b: 0, lambda: 3 / tau })],
  ["decay lambda = 1/(3 tau)", (tau) => ({ a: 7, b: 0, lambda: 1 / (3 * tau) })],
  ["decay lambda = 1/h", (_, h) => ({ a: 7, b: 0, lambda: 1 / h })],
  ["ramp", (_, h) => ({ a: 0, b: 7 / h, lambda: 0 })],
  ["ramp times decay, lambda = 1/tau", (tau, h) => ({ a: 2, b: 7 / h, lambda: 1 / tau })],
  ["ramp times decay, lambda = 2/h", (_, h) => ({ a: 0, b: 7 / h, lambda: 2 / h })],
];
const cases = taus.flatMap((tau) => lengths.flatMap((h) => shapes.map(([name, make]) => [tau, h, name, make(tau, h)] as const)));

describe("advanceModalState edge cases: tau 1 µs..1e5 s, steps 1 ns..1e7 s", () => {
  test.each(cases)("tau %d s, h %d s, %s", (tau, h, _, term) => {
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 1, tauS: tau }] });
    const y = advanceModalState(model, new Float64Array(1), h, [[term]]);
    const expected = exactResponse(tau, h, term);
    expect(Number.isFinite(y[0]!)).toBe(true);
    expectClose(y[0]!, expected, { rel: 1e-12, abs: 1e-300 });
  });
});

describe("zero-length steps and zero power", () => {
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 1, tauS: 1e-6 }, { rKPerW: 2, tauS: 1e5 }] });
  const start = Float64Array.from([3, 4]);
  test("a zero-length step changes nothing, whatever the power", () => {
    expect([...advanceModalState(model, start, 0, [[{ a: 1e6, b: 1e9, lambda: 1e6 }]], new Float64Array(2))]).toEqual([3, 4]);
    const step = createModalStepper(model);
    expect([...step(Float64Array.from(start), 0, [[{ a: 5, b: 0, lambda: 0 }]])]).toEqual([3, 4]);
  });
  test("zero power is pure decay: y·e^(−h/tau)", () => {
    // bit-exact: the update is one multiplication by the same exp(−h/tau)
    for (const powers of [[], [undefined], [[]], [[{ a: 0, b: 0, lambda: 0 }]]] as const) {
      const y = advanceModalState(model, start, 2, powers, new Float64Array(2));
      expect(y[0]).toBe(3 * Math.exp(-2 / 1e-6));
      expect(y[1]).toBe(4 * Math.exp(-2 / 1e5));
    }
  });
  test("a history of zero-power and zero-length segments stays at ambient", () => {
    const run = runThermalHistory(model, traceSteps([[{ startS: 0, durationS: 0, terms: [{ a: 9, b: 0, lambda: 0 }] }, { startS: 1, durationS: 5, terms: [] }]], 0, 10));
    expect(run.peakRiseK).toEqual([0]);
    expect(run.endRiseK).toEqual([0]);
  });
  test.each([
    [[{ a: 3, b: 200, lambda: 0 }]],
    [[{ a: 5, b: -40, lambda: 0 }, { a: 1, b: 7, lambda: 0 }]],
    [[{ a: 0, b: 1e6, lambda: 0 }]],
  ])("the stepper's cached ramp path equals the plain update (%j)", (terms) => {
    const step = createModalStepper(model);
    for (const h of [1e-9, 1e-6, 0.01, 3, 1e6]) {
      const a = step(Float64Array.from(start), h, [terms]);
      const b = advanceModalState(model, start, h, [terms], new Float64Array(2));
      // same closed form, factored differently (a·rise + b·ramp vs per-term sums): rounding, 1e-13
      expectClose(a[0]!, b[0]!, { rel: 1e-13, abs: 1e-300 });
      expectClose(a[1]!, b[1]!, { rel: 1e-13, abs: 1e-300 });
    }
  });

  test("the stepper's kept forced response of exponential terms follows the step length and the terms object", () => {
    // the forced response of one terms object is kept per cached length: alternate lengths and
    // terms objects (with equal and with different contents) and compare every step with the plain update
    const step = createModalStepper(model);
    const charging = [{ a: 40, b: 0, lambda: 25 }, { a: 9, b: 0, lambda: 0 }];
    const other = [{ a: 15, b: 2, lambda: 3 }];
    const sameContent = charging.map((t) => ({ ...t }));
    let a: Float64Array = Float64Array.from(start);
    let b: Float64Array = Float64Array.from(start);
    for (const [h, terms] of [[0.1, charging], [0.1, charging], [0.3, charging], [0.1, other], [0.1, charging], [0.3, sameContent], [0.3, other], [0.1, charging]] as const) {
      a = step(a, h, [terms]);
      b = advanceModalState(model, b, h, [terms], new Float64Array(2));
      expectClose(a[0]!, b[0]!, { rel: 1e-13, abs: 1e-300 });
      expectClose(a[1]!, b[1]!, { rel: 1e-13, abs: 1e-300 });
    }
  });

  test("the cached stepper equals the plain update", () => {
    const step = createModalStepper(model);
    const a = Float64Array.from(start);
    const terms = [[{ a: 5, b: 0, lambda: 0 }]];
    for (let i = 0; i < 3; i++) step(a, 0.25, terms);
    let b: Float64Array = Float64Array.from(start);
    for (let i = 0; i < 3; i++) b = advanceModalState(model, b, 0.25, terms, new Float64Array(2));
    // same operations, same order: bit-exact except for expm1 vs exp in the rise factor (1e-15)
    expectClose(a[0]!, b[0]!, { rel: 1e-15 });
    expectClose(a[1]!, b[1]!, { rel: 1e-15 });
  });
});
