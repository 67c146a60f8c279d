import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { profileRetrySetup, defaultCircuitModels } from "../../src/internal.js";
import { bundledText, loadAs, planOf } from "../helpers/closedLoopFixtures.js";
import { type ShortedPart, shortedPart, si } from "../helpers/shortedPartByHand.js";

// An independent reference for the lockout map and for the planner's reading of a profile
// (profileRetrySetup): every value is worked out here from the bundled YAML by hand, with no
// project thermal, circuit or planner code.
//
// Into a shorted output every attempt is a rectangular pulse of P = I²·R for the completion
// timeout (test/helpers/shortedPartByHand.ts). A Foster stage (R_i, τ_i) is a first-order lag,
// so under constant power P its rise moves toward P·R_i as θ ← P·R_i + (θ − P·R_i)·e^(−t/τ_i) and
// with no power decays as θ ← θ·e^(−t/τ_i) (Incropera et al., Fundamentals of Heat and Mass
// Transfer, 7th ed. (2011), §5.1 and §5.3, lumped capacitance, one equation per stage). The rise
// only grows during a pulse and only falls between pulses, so a burst's highest temperature is
// the highest attempt end.

/** Highest temperature at the end of each of `n` attempts started `intervalS` apart (start to start) [°C]. */
function burstEndsC(part: ShortedPart, n: number, intervalS: number): number[] {
  const theta = part.stages.map(() => 0);
  const ends: number[] = [];
  for (let k = 0; k < n; k++) {
    if (k > 0) part.stages.forEach((s, i) => (theta[i] = theta[i]! * Math.exp(-(intervalS - part.timeoutS) / s.tau)));
    part.stages.forEach((s, i) => (theta[i] = part.powerW * s.r + (theta[i]! - part.powerW * s.r) * Math.exp(-part.timeoutS / s.tau)));
    ends.push(part.ambientC + theta.reduce((a, b) => a + b, 0));
  }
  return ends;
}

/** The verdict words by hand: within limit − margin, up to the limit, above it (common practice). */
function verdictOf(peakC: number, part: ShortedPart): "pass" | "warn" | "fail" {
  return peakC <= part.allowedC ? "pass" : peakC <= part.limitC ? "warn" : "fail";
}

const PROFILES = ["warehouse-robot-48v.yaml", "electric-boat-72v-supervision.yaml"];

describe("lockout map against a closed-form burst worked out in the test", () => {
  test.each(PROFILES.map((name) => ({ name })))("$name: every cell's peak, verdict and overlap", ({ name }) => {
    const part = shortedPart(name);
    const profile = parse(bundledText(name)) as Record<string, any>;
    // the relay's release and operate time (the profile's, else 10 ms + 20 ms, docs/profile-format.md)
    const relay = profile["circuit"].relay as { operate?: string; release?: string } | undefined;
    const shortestWaitS = si(relay?.operate ?? "20 ms") + si(relay?.release ?? "10 ms");
    const map = planOf(name).map;
    expect(map.spacing).toBe("start-to-start");
    let checked = 0;
    map.intervalsS.forEach((t, i) => {
      const possible = t - part.timeoutS >= shortestWaitS;
      const ends = possible ? burstEndsC(part, map.attempts.length, t) : burstEndsC(part, 1, t);
      map.attempts.forEach((n, a) => {
        const cell = map.cells[a]![i]!;
        expect(cell.attempts).toBe(n);
        expect(cell.intervalS).toBe(t);
        if (n > 1 && !possible) {
          expect(cell.status).toBe("impossible");
          return;
        }
        const peakC = Math.max(...ends.slice(0, n));
        expect(cell.status).toBe(verdictOf(peakC, part));
        if (cell.peakC === null) {
          // a longer burst than one already above the limit is not simulated: it fails with it
          expect(Math.max(...ends.slice(0, n - 1))).toBeGreaterThan(part.limitC);
        } else {
          // 1e-9 K: both sides sum the same closed forms in another order; measured within 3e-13 K
          expect(Math.abs(cell.peakC - peakC)).toBeLessThan(1e-9);
          expect(cell.usedFraction!).toBeCloseTo((peakC - part.ambientC) / (part.allowedC - part.ambientC), 12);
          checked++;
        }
      });
    });
    // the map is not empty of answers: most cells carry a compared peak, and it holds every verdict
    expect(checked).toBeGreaterThan(map.intervalsS.length);
    const statuses = new Set(map.cells.flat().map((c) => c.status));
    expect(statuses.has("pass") && statuses.has("fail") && statuses.has("impossible")).toBe(true);
  });
});

describe("profileRetrySetup against the profile read by hand", () => {
  test.each(PROFILES.map((name) => ({ name })))("$name: fault, timing, map grid and one attempt's energy", ({ name }) => {
    const part = shortedPart(name);
    const profile = parse(bundledText(name)) as Record<string, any>;
    const retry = (profile["events"] as Record<string, any>[]).find((e) => "retry" in e)!["retry"];
    const setup = profileRetrySetup(loadAs(bundledText(name), name), defaultCircuitModels);
    // the map defaults written in docs/profile-format.md: rows max(10, 2 × attempts), intervals
    // from a tenth of the smaller of the retry interval and the slowest τ, to 5 slowest τ, 40 points
    const slowest = Math.max(...part.stages.map((s) => s.tau));
    expect(setup.map.attempts).toBe(Math.max(10, 2 * retry.attempts));
    expect(setup.map.fromS).toBeCloseTo(Math.min(si(retry.interval), slowest) / 10, 12);
    expect(setup.map.toS).toBeCloseTo(5 * slowest, 9);
    expect(setup.map.points).toBe(40);
    expect(setup.attempts).toBe(retry.attempts);
    expect(setup.intervalS).toBeCloseTo(si(retry.interval), 12);
    expect(setup.lockoutS).toBeCloseTo(si(retry.lockout), 9);
    expect(setup.fault.load).toEqual({ kind: "short" });
    // relay 10 ms + 20 ms on a 1 ms timer
    expect(setup.shortestWaitS).toBeCloseTo(0.03, 12);
    expect(setup.scenarios).toHaveLength(1);
    // one attempt from an empty capacitor into the short: the timeout at P = I²·R, energy P·t
    const first = setup.scenarios[0]!.attempt({ capacitorVoltageV: 0, partTemperatureC: part.ambientC, attemptIndex: 0, waitS: Infinity });
    expect(first.durationS).toBeCloseTo(part.timeoutS, 12);
    let energyJ = 0;
    for (const seg of first.trace) {
      for (const term of seg.terms) {
        // ∫₀ᵀ (a + b·s)·e^(−λs) ds for the constant terms a short gives (λ = 0, b = 0)
        expect(term.lambda).toBe(0);
        expect(term.b).toBe(0);
        energyJ += term.a * seg.durationS;
      }
    }
    // 1e-9 relative: Ohm's law in the test against the series-resistor model's bus at 0 V
    expect(Math.abs(energyJ / (part.powerW * part.timeoutS) - 1)).toBeLessThan(1e-9);
  });
});
