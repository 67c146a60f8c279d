import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  InputError,
  type ModalModel,
  type PowerSegment,
  cauerToModal,
  chainNetworks,
  constantPowerSegment,
  fosterToModal,
  graphToModal,
  referenceSuperposition,
  sampleThermalHistory,
  traceSteps,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// The fast path (closed-form modal stepping, sampleThermalHistory) against the reference path
// (plain superposition of step responses, O(N²)). They share only Zth's gains and taus, so a
// wrong decay factor, a wrong forced response or a lost state would break the agreement.
// Tolerance: 1e-12 relative to the largest rise of the history, or the reference's own rounding
// floor when that is larger (see below; it matters only for rises of 1e-20 K and less). Measured:
// the random trains below agree within 1e-15 of the scale (the test passes at 1e-15). The
// reference sums up to 2N terms ΔP·Zth of size up to P·Rth, so its rounding can reach 2N·1e-16
// of the scale on longer histories: 1e-12 covers that on any platform and still catches any
// error of the method, which shows at 1e-6 or more.

const models: [string, ModalModel][] = [
  ["Foster", fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.05, tauS: 2e-4 }, { rKPerW: 0.3, tauS: 0.01 }, { rKPerW: 0.7, tauS: 0.4 }, { rKPerW: 1.2, tauS: 9 }] })],
  ["Cauer", cauerToModal({ kind: "cauer", stages: [{ rKPerW: 0.1, cJPerK: 0.002 }, { rKPerW: 0.4, cJPerK: 0.05 }, { rKPerW: 1, cJPerK: 3 }] })],
  [
    "two parts on a heatsink",
    graphToModal(
      chainNetworks({
        parts: [
          { id: "a", device: { kind: "foster", stages: [{ rKPerW: 0.2, tauS: 0.003 }, { rKPerW: 0.5, tauS: 0.1 }] }, interfaceRKPerW: 0.2 },
          { id: "b", device: { kind: "cauer", stages: [{ rKPerW: 0.6, cJPerK: 0.5 }] }, interfaceRKPerW: 0.1 },
        ],
        heatsink: { kind: "cauer", stages: [{ rKPerW: 0.4, cJPerK: 10 }] },
      }),
    ),
  ],
];

/** Random pulse trains: consecutive pieces with random gaps, lengths and powers (0 or 1 mW..200 W:
 * powers near the smallest doubles would take rises into subnormal numbers, which carry no relative precision). */
const pulses = fc.array(fc.tuple(fc.double({ min: 0, max: 0.5, noNaN: true }), fc.double({ min: 1e-5, max: 0.5, noNaN: true }), fc.oneof(fc.constant(0), fc.double({ min: 1e-3, max: 200, noNaN: true }))), {
  minLength: 1,
  maxLength: 40,
});
function toTrace(pieces: [number, number, number][]): PowerSegment[] {
  let t = 0;
  return pieces.map(([gap, length, power]) => {
    const seg = constantPowerSegment(t + gap, length, power);
    t += gap + length;
    return seg;
  });
}

describe.each(models)("fast path equals the reference superposition, %s", (_, model) => {
  test("on random pulse trains, at every segment end and at random times (relative 1e-12)", () => {
    fc.assert(
      fc.property(pulses, pulses, fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 20 }), (first, second, fractions) => {
        const traces = model.sources.map((__, s) => toTrace(s === 0 ? first : second));
        const end = Math.max(...traces.map((tr) => tr.at(-1)!.startS + tr.at(-1)!.durationS)) * 1.5;
        const times = [...traces.flatMap((tr) => tr.map((seg) => seg.startS + seg.durationS)), ...fractions.map((f) => f * end)].sort((a, b) => a - b);
        for (let o = 0; o < model.observed.length; o++) {
          const reference = referenceSuperposition(model, traces, times, o);
          const fast = [...sampleThermalHistory(model, traceSteps(traces, 0, end), times, { findPeaks: false })].map((p) => p.riseK[o]!);
          const scale = Math.max(...reference.map(Math.abs), 1e-300);
          // The reference's own rounding floor: each of its ΔP·Zth terms carries up to a few ulps of
          // |ΔP|·Σ|gain| (a transfer Zth between two parts is a sum of gains of both signs, so a
          // small cross rise is all cancellation). 1e-13 = 450 ulps of that sum covers it.
          const gains = model.gainKPerW[o]!.flat().reduce((a, g) => a + Math.abs(g), 0);
          const swing = traces.flat().reduce((a, seg) => a + 2 * Math.abs(seg.terms[0]?.a ?? 0), 0);
          const floor = 1e-13 * swing * gains;
          expect(fast).toHaveLength(reference.length);
          fast.forEach((value, i) => expectClose(value, reference[i]!, { abs: Math.max(1e-12 * scale, floor) }));
        }
      }),
      { numRuns: 40 },
    );
  });
});

describe("referenceSuperposition", () => {
  const model = models[0]![1];
  test("a single step is P·Zth (the definition of Zth, JEDEC JESD51-1 (1995))", () => {
    const [rise] = referenceSuperposition(model, [[constantPowerSegment(0, 10, 5)]], [3]);
    // rounding only: 1e-14 relative
    expectClose(rise!, 5 * (0.05 + 0.3 + 0.7 * -Math.expm1(-3 / 0.4) + 1.2 * -Math.expm1(-3 / 9)), { rel: 1e-14 });
  });
  test("refuses non-constant power", () => {
    const ramp = [{ startS: 0, durationS: 1, terms: [{ a: 0, b: 2, lambda: 0 }] }];
    expect(() => referenceSuperposition(model, [ramp], [1])).toThrow(InputError);
    expect(() => referenceSuperposition(model, [ramp], [1])).toThrow(
      'traces[0][0].terms[0]: expected constant power (b = 0, lambda = 0) for the reference superposition, found {"a":0,"b":2,"lambda":0}',
    );
  });
});
