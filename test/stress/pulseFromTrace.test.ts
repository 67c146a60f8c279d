import { describe, expect, test } from "vitest";
import { constantPowerSegment, powerAt, pulseFromTrace } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

describe("pulseFromTrace", () => {
  test("a rectangular pulse: E = P·t, peak P, conduction time t", () => {
    const r = pulseFromTrace([constantPowerSegment(1, 0.02, 300)]);
    expectClose(r.energyJ, 6, { rel: 1e-15 });
    expect([r.peakPowerW, r.startS]).toEqual([300, 1]);
    expectClose(r.durationS, 0.02, { abs: 1e-15 }); // (1 + 0.02) − 1 in double precision
  });

  test("resistor charging, P0·e^(−λs): peak at the start, E = P0/λ·(1 − e^(−λh))", () => {
    // closed-form integral of an exponential; 1e-14 relative is rounding in expm1 and φ0.
    const r = pulseFromTrace([{ startS: 0, durationS: 0.3, terms: [{ a: 3400, b: 0, lambda: 20 }] }]);
    expect(r.peakPowerW).toBe(3400);
    expect(r.peakTimeS).toBe(0);
    expectClose(r.energyJ, (3400 / 20) * -Math.expm1(-20 * 0.3), { rel: 1e-14 });
  });

  test("b·s·e^(−λs) peaks at s = 1/λ with b/(λ·e)", () => {
    // d/ds (b·s·e^(−λs)) = b·e^(−λs)(1 − λs) = 0 at s = 1/λ: calculus, exact up to rounding.
    const r = pulseFromTrace([{ startS: 2, durationS: 1, terms: [{ a: 0, b: 500, lambda: 10 }] }]);
    expectClose(r.peakTimeS, 2.1, { rel: 1e-15 });
    expectClose(r.peakPowerW, 500 / (10 * Math.E), { rel: 1e-15 });
  });

  test("a sum of terms: the peak matches dense sampling", () => {
    const terms = [
      { a: 100, b: 0, lambda: 0 },
      { a: -100, b: 0, lambda: 50 },
      { a: 0, b: 4000, lambda: 8 },
    ];
    const h = 1;
    let dense = 0;
    for (let i = 0; i <= 200_000; i++) dense = Math.max(dense, powerAt(terms, (h * i) / 200_000));
    const r = pulseFromTrace([{ startS: 0, durationS: h, terms }]);
    // the refined peak is at least the best sample (it maximises the same function), and a sample
    // spacing of 5e-6 s misses a smooth maximum by at most ~|P''|·(2.5e-6)²/2 ≈ 1e-7 W here.
    expect(r.peakPowerW).toBeGreaterThanOrEqual(dense - 1e-9);
    expectClose(r.peakPowerW, dense, { abs: 1e-6 });
  });

  test("no power: zero energy and peak, zero duration", () => {
    expect(pulseFromTrace([{ startS: 0, durationS: 1, terms: [] }])).toMatchObject({ energyJ: 0, peakPowerW: 0, durationS: 0 });
  });
});
