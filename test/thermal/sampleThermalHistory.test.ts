import { describe, expect, test } from "vitest";
import {
  InputError,
  type PowerSegment,
  type SampledPoint,
  type TimedStep,
  cauerToModal,
  constantPowerSegment,
  fosterToModal,
  sampleThermalHistory,
  traceSteps,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Single RC stage, R = 2 K/W, tau = 0.5 s: heating P·R·(1 − e^(−t/tau)), cooling θ0·e^(−t/tau).
// Source: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and §5.3
// (lumped capacitance).
const R = 2;
const TAU = 0.5;
const single = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: TAU }] });

describe("sampleThermalHistory at chosen times", () => {
  test("samples during a pulse, after it and after the last step follow the closed forms", () => {
    const P = 10;
    const tp = 0.3;
    const times = [0, 0.1, 0.3, 0.7, 1.5, 4];
    const points = [...sampleThermalHistory(single, traceSteps([[constantPowerSegment(0, tp, P)]], 0, 1), times, { findPeaks: false })];
    const top = P * R * -Math.expm1(-tp / TAU);
    const expected = times.map((t) => (t <= tp ? P * R * -Math.expm1(-t / TAU) : top * Math.exp(-(t - tp) / TAU)));
    expect(points.map((p) => p.timeS)).toEqual(times);
    expect(points.every((p) => p.kind === "sample" && p.node === -1)).toBe(true);
    // closed form in double precision: 1e-13 relative is rounding only
    points.forEach((p, i) => expectClose(p.riseK[0]!, expected[i]!, { rel: 1e-13, abs: 1e-300 }));
  });

  test.each([
    [[0.5, 0.2], "times[1]: expected times in ascending order (at or after 0.5 s), found 0.2"],
    [[-1], "times[0]: expected a time at or after the history's start (0 s), found -1"],
    [[Number.NaN], "times[0]: expected a finite time in s, found NaN"],
  ])("bad times are InputErrors (%#)", (times, message) => {
    const run = () => [...sampleThermalHistory(single, traceSteps([[constantPowerSegment(0, 1, 1)]]), times)];
    expect(run).toThrow(InputError);
    expect(run).toThrow(message);
  });
});

describe("sampleThermalHistory local maxima", () => {
  test("a rectangular train has one maximum per pulse, at its end, equal to the geometric partial sum", () => {
    // u_n = P·R·(1 − e^(−tp/tau))·(1 − q^n)/(1 − q), q = e^(−T/tau): see periodicSteadyState.test.ts
    const [P, tp, T, n] = [20, 0.1, 0.4, 6];
    const trace: PowerSegment[] = Array.from({ length: n }, (_, k) => constantPowerSegment(k * T, tp, P));
    const peaks = [...sampleThermalHistory(single, traceSteps([trace], 0, n * T), [])].filter((p) => p.kind === "peak");
    expect(peaks).toHaveLength(n);
    peaks.forEach((p, k) => {
      expectClose(p.timeS, k * T + tp, { rel: 1e-12 });
      const q = Math.exp(-T / TAU);
      // closed form: rounding only, 1e-12
      expectClose(p.riseK[0]!, P * R * -Math.expm1(-tp / TAU) * (1 - q ** (k + 1)) / (1 - q), { rel: 1e-12 });
    });
  });

  test("decaying pulses on a Cauer ladder: the maxima equal those of dense sampling within 0.01 K", () => {
    // Self-consistency, not an outside reference: 40,001 samples from the same engine with its
    // peak search off; each local maximum of the sampled sequence must have a reported peak
    // within 0.01 K (docs/design.md, "Peak accuracy") and vice versa. The outside checks of the
    // engine are ngspice.test.ts and the odex references of the closed-loop tests.
    const ladder = cauerToModal({ kind: "cauer", stages: [{ rKPerW: 0.2, cJPerK: 0.005 }, { rKPerW: 0.5, cJPerK: 0.1 }, { rKPerW: 1, cJPerK: 4 }] });
    const trace: PowerSegment[] = Array.from({ length: 4 }, (_, k) => ({ startS: k * 0.5, durationS: 0.25, terms: [{ a: 500, b: 0, lambda: 30 }] }));
    const end = 2;
    const dense = Array.from({ length: 40_001 }, (_, i) => (end * i) / 40_000);
    const samples = [...sampleThermalHistory(ladder, traceSteps([trace], 0, end), dense, { findPeaks: false })].map((p) => p.riseK[0]!);
    const sampledMaxima: number[] = [];
    for (let i = 1; i < samples.length - 1; i++) if (samples[i]! > samples[i - 1]! && samples[i]! >= samples[i + 1]!) sampledMaxima.push(samples[i]!);
    const peaks = [...sampleThermalHistory(ladder, traceSteps([trace], 0, end), [])].filter((p) => p.kind === "peak");
    expect(peaks).toHaveLength(sampledMaxima.length);
    expect(peaks.length).toBe(4);
    peaks.forEach((p, k) => expectClose(p.riseK[0]!, sampledMaxima[k]!, { abs: 0.01 }));
  });

  test("samples and peaks come in time order", () => {
    const trace = [constantPowerSegment(0, 0.2, 5), constantPowerSegment(0.5, 0.2, 5)];
    const points: SampledPoint[] = [...sampleThermalHistory(single, traceSteps([trace], 0, 1), [0.1, 0.2, 0.3, 0.6, 0.9])];
    const times = points.map((p) => p.timeS);
    expect(times).toEqual(times.slice().sort((a, b) => a - b));
    expect(points.filter((p) => p.kind === "peak").map((p) => p.timeS)).toEqual([0.2, 0.7]);
  });
});

describe("sampleThermalHistory streams", () => {
  test("it yields from an endless stream of steps without reading it all", () => {
    function* endless(): Generator<TimedStep> {
      for (let k = 0; ; k++) {
        yield { startS: 2 * k * 0.1, durationS: 0.1, powers: [[{ a: 3, b: 0, lambda: 0 }]] };
        yield { startS: (2 * k + 1) * 0.1, durationS: 0.1, powers: [[]] };
      }
    }
    const first: SampledPoint[] = [];
    for (const p of sampleThermalHistory(single, endless(), [])) {
      first.push(p);
      if (first.length === 5) break;
    }
    expect(first.map((p) => p.kind)).toEqual(["peak", "peak", "peak", "peak", "peak"]);
    expectClose(first[4]!.timeS, 0.9, { rel: 1e-12 });
  });
});
