import { describe, expect, test } from "vitest";
import { AttemptCursor, fosterToModal, lockoutAfterBurst, uniformBurst } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { rectangularFault } from "./scenarios.js";

// One RC stage (lumped capacitance, Incropera et al., 7th ed. (2011), §5.1 and §5.3). A burst of N
// pulses every T from ambient ends at θN = S·(1 − q^N)/(1 − q), S = P·R·(1 − e^(−t_on/τ)), q = e^(−T/τ).
// After a lockout L (from the end of the burst's last pulse) a second burst's k-th pulse ends at
//   θN·e^(−L/τ)·e^(−((k − 1)·T + t_on)/τ) + S·(1 − q^k)/(1 − q),
// so it is safe for L ≥ max over k of −τ·ln((ΔT − S_k)/(θN·e^(−((k − 1)·T + t_on)/τ))), and the part
// is back within δ of ambient after τ·ln(θN/δ).
describe("lockoutAfterBurst", () => {
  const R = 2;
  const tau = 10;
  const P = 50;
  const onS = 1;
  const T = 1.3;
  const N = 8;
  const dT = 60;
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });
  const corner = rectangularFault("one stage", model, P, onS, { ambientC: 25, limitC: 90, marginK: 5 });

  test("one stage: lockout and return to ambient match the closed forms", () => {
    const S = P * R * -Math.expm1(-onS / tau);
    const q = Math.exp(-T / tau);
    const Sk = (k: number): number => (S * (1 - q ** k)) / (1 - q);
    const thetaN = Sk(N);
    let expected = 0;
    for (let k = 1; k <= N; k++) expected = Math.max(expected, -tau * Math.log((dT - Sk(k)) / (thetaN * Math.exp(-((k - 1) * T + onS) / tau))));
    const answer = lockoutAfterBurst([corner], uniformBurst(N, T, "start-to-start"), { ambientReturnK: 2 });
    expect(answer.burstSafe).toBe(true);
    // bisection to a bracket of 1e-9 of the answer: measured 5.9e-10 relative when the tolerance was
    // set, so 2e-9 (twice the bracket); the return to within 2 K of ambient is closed form on both
    // sides (measured 0), rounding only
    expectClose(answer.minimumLockoutS!, expected, { rel: 2e-9 });
    expectClose(answer.ambientReturnS, tau * Math.log(thetaN / 2), { rel: 1e-14 });
    expect(answer.bands).toHaveLength(1);
    expect(answer.governing.corner).toBe("one stage");
    expectClose(answer.burstEndS, (N - 1) * T + onS, { rel: 1e-15 });
  });

  test("a cool burst needs no lockout", () => {
    const answer = lockoutAfterBurst([corner], uniformBurst(2, 5, "start-to-start"));
    expect(answer.minimumLockoutS).toBe(0);
  });
  test("a first burst that is itself unsafe: no lockout scanned", () => {
    const hot = rectangularFault("hot", model, 500, onS, { ambientC: 25, limitC: 90, marginK: 5 });
    const before = AttemptCursor.trialCount;
    const answer = lockoutAfterBurst([hot], uniformBurst(N, T, "start-to-start"));
    expect(answer.burstSafe).toBe(false);
    expect(answer.minimumLockoutS).toBeNull();
    expect(answer.bands).toEqual([]);
    expect(answer.evaluations).toBe(0);
    // the first burst (N attempts), then the second one at the top of the scan for the governing
    // corner, which stops at its first attempt (unsafe); a scan would take 240 evaluations or more
    expect(AttemptCursor.trialCount - before).toBe(N + 1);
  });
});

describe("lockoutAfterBurst with the capacitor's charge", () => {
  test("restarts after a trip: every band of safe lockouts agrees with whole-history brute force", async () => {
    const { chargeThenTrip } = await import("./scenarios.js");
    const { wholeTracePeak } = await import("./bruteForce.js");
    // Invented scenario (see chargeThenTrip): 400 V, 20 Ω, 1 mF, 95 %, trip 20 ms after closing,
    // bleeder 50 ms; a burst of 8 restarts 10 ms after each trip (the bus still charged: cheap),
    // then a lockout, then the burst again. A short lockout finds the bus charged, a medium one
    // finds it empty with the part still warm from the burst's first full charge, a long one a cool part.
    const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }, { rKPerW: 3, tauS: 60 }] });
    const circuit = { sourceV: 400, resistanceOhm: 20, capacitanceF: 1e-3, fraction: 0.95, tripS: 0.02, bleedS: 0.05 };
    const limits = { ambientC: 40, limitC: 85, marginK: 10 };
    const burst = { gapsS: new Array<number>(7).fill(0.01), spacing: "end-to-start" as const };
    const answer = lockoutAfterBurst([chargeThenTrip("trip", model, circuit, limits)], burst);
    expect(answer.burstSafe).toBe(true);

    // Brute force: the whole history (burst, lockout L, burst) written out again from the circuit
    // formulas and simulated in one piece.
    const safeAt = (lockoutS: number): boolean => {
      const trace: { startS: number; durationS: number; terms: { a: number; b: number; lambda: number }[] }[] = [];
      let t = 0;
      let v = 0;
      for (let k = 0; k < 16; k++) {
        const dv = circuit.sourceV - v;
        const target = (1 - circuit.fraction) * circuit.sourceV;
        const chargeS = dv > target ? circuit.resistanceOhm * circuit.capacitanceF * Math.log(dv / target) : 0;
        if (chargeS > 0) trace.push({ startS: t, durationS: chargeS, terms: [{ a: (dv * dv) / circuit.resistanceOhm, b: 0, lambda: 2 / (circuit.resistanceOhm * circuit.capacitanceF) }] });
        const wait = k === 7 ? lockoutS : 0.01;
        t += chargeS + circuit.tripS + wait;
        v = circuit.sourceV * Math.exp(-wait / circuit.bleedS);
      }
      return wholeTracePeak(model, trace, 600) <= limits.limitC - limits.marginK - limits.ambientC;
    };
    const grid = [0, ...Array.from({ length: 600 }, (_, i) => 1e-3 * 10 ** ((6 * i) / 599))];
    const flips: number[] = [];
    let previous = safeAt(0);
    for (let i = 1; i < grid.length; i++) {
      const now = safeAt(grid[i]!);
      if (now !== previous) flips.push(i);
      previous = now;
    }
    const edges = answer.bands.flatMap((b) => (b.openEnded ? [b.fromS] : [b.fromS, b.toS])).filter((x) => x > 0);
    expect(edges).toHaveLength(flips.length);
    // each solver edge lies in the grid cell where brute force flips (edges are on the safe side)
    edges.forEach((e, i) => {
      expect(e).toBeGreaterThanOrEqual(grid[flips[i]! - 1]! * (1 - 1e-9));
      expect(e).toBeLessThanOrEqual(grid[flips[i]!]! * (1 + 1e-9));
    });
    expect(answer.bands).toHaveLength(2);
    expect(answer.minimumLockoutS).toBe(0);
  });
});
