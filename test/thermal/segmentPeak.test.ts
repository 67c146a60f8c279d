import { describe, expect, test, vi } from "vitest";
import fc from "fast-check";
import {
  type ModalModel,
  type PowerTerm,
  type SourcePowers,
  advanceModalState,
  cauerToModal,
  createModalState,
  fosterToModal,
  interiorPeaks,
  modalRise,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// interiorPeaks against dense brute-force sampling: the rise is evaluated exactly (closed form)
// at 200,001 evenly spaced points of the step and the largest is taken. The brute force's own
// error is below (h/200000)·max|slope|, about 1e-4 K in these cases, so agreement within 0.01 K
// (docs/design.md, "Peak accuracy") is a real check.
const foster = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.1, tauS: 5e-4 }, { rKPerW: 0.4, tauS: 0.01 }, { rKPerW: 0.8, tauS: 0.3 }, { rKPerW: 1.5, tauS: 6 }] });
const cauer = cauerToModal({ kind: "cauer", stages: [{ rKPerW: 0.2, cJPerK: 0.005 }, { rKPerW: 0.5, cJPerK: 0.1 }, { rKPerW: 1, cJPerK: 4 }] });

function bruteForcePeak(model: ModalModel, start: Float64Array, h: number, terms: PowerTerm[]): { atS: number; riseK: number } {
  const scratch = new Float64Array(start.length);
  let best = { atS: 0, riseK: -Infinity };
  const n = 200_000;
  for (let i = 0; i <= n; i++) {
    const s = (h * i) / n;
    const r = modalRise(model, advanceModalState(model, start, s, [terms], scratch));
    if (r > best.riseK) best = { atS: s, riseK: r };
  }
  return best;
}

/**
 * The largest rise of dense sampling over a step (linear samples plus log-spaced ones from h·1e-9,
 * so a fast mode's early turn is not stepped over), and the larger of the two step ends.
 */
function sampledMaximum(model: ModalModel, state: Float64Array, h: number, powers: SourcePowers): { best: number; endpoints: number } {
  const scratch = new Float64Array(state.length);
  let best = -Infinity;
  for (let i = 0; i <= 20_000; i++) {
    best = Math.max(best, modalRise(model, advanceModalState(model, state, (h * i) / 20_000, powers, scratch)));
    best = Math.max(best, modalRise(model, advanceModalState(model, state, h * 10 ** (-9 + (9 * i) / 20_000), powers, scratch)));
  }
  return { best, endpoints: Math.max(modalRise(model, state), modalRise(model, advanceModalState(model, state, h, powers, scratch))) };
}

/** A warm start: the state after 0.5 s at 30 W. */
function warm(model: ModalModel): Float64Array {
  return advanceModalState(model, createModalState(model), 0.5, [[{ a: 30, b: 0, lambda: 0 }]]);
}

const cases: [string, ModalModel, boolean, number, PowerTerm[]][] = [
  ["Foster, resistor-charging pulse from cold", foster, false, 0.2, [{ a: 400, b: 0, lambda: 50 }]],
  ["Foster, resistor-charging pulse from warm", foster, true, 0.2, [{ a: 400, b: 0, lambda: 50 }]],
  ["Foster, falling ramp", foster, false, 0.1, [{ a: 300, b: -3000, lambda: 0 }]],
  ["Cauer, charging pulse with a parallel load", cauer, false, 0.5, [{ a: 250, b: 0, lambda: 20 }, { a: 5, b: 0, lambda: 0 }]],
  ["Cauer, fast decay from warm", cauer, true, 0.05, [{ a: 2000, b: 0, lambda: 400 }]],
];

describe.each(cases)("interiorPeaks: %s", (_, model, isWarm, h, terms) => {
  const start = isWarm ? warm(model) : createModalState(model);
  test("finds the maximum of dense sampling within 0.01 K", () => {
    const peaks = interiorPeaks(model, start, h, [terms]);
    const brute = bruteForcePeak(model, start, h, terms);
    expect(peaks.length).toBeGreaterThanOrEqual(1);
    const best = peaks.reduce((a, b) => (b.riseK > a.riseK ? b : a));
    expect(brute.atS).toBeGreaterThan(0);
    expect(brute.atS).toBeLessThan(h);
    expectClose(best.riseK, brute.riseK, { abs: 0.01 });
    // the found maximum is never below the sampled one by more than sampling can explain
    expect(best.riseK).toBeGreaterThanOrEqual(brute.riseK - 1e-9);
  });
});

describe("interiorPeaks skips monotone steps", () => {
  test.each([
    ["constant power from cold", createModalState(foster), [{ a: 10, b: 0, lambda: 0 }]],
    ["cooling", advanceModalState(foster, createModalState(foster), 1, [[{ a: 10, b: 0, lambda: 0 }]]), []],
  ])("%s has no interior peak", (_, start, terms) => {
    expect(interiorPeaks(foster, start, 1, [terms as PowerTerm[]])).toEqual([]);
  });
});

describe("interiorPeaks with step ends covers the whole step (linear and decaying power, cold and warm)", () => {
  // The highest of {start, end, interior peaks} must match dense brute-force sampling within 0.01 K,
  // whichever path (monotone proof, single-turn bracket, grid) the search takes.
  const table: [string, ModalModel, boolean, number, PowerTerm[]][] = [
    ["rising ramp from cold", foster, false, 0.05, [{ a: 0, b: 4000, lambda: 0 }]],
    ["rising ramp from warm", foster, true, 0.05, [{ a: 0, b: 4000, lambda: 0 }]],
    ["falling ramp from warm", cauer, true, 0.3, [{ a: 200, b: -600, lambda: 0 }]],
    ["falling ramp ending below zero power", foster, true, 0.02, [{ a: 50, b: -2000, lambda: 0 }]],
    ["constant power below the warm state", foster, true, 0.4, [{ a: 5, b: 0, lambda: 0 }]],
    ["decay below the state", cauer, true, 0.2, [{ a: 5, b: 0, lambda: 10 }]],
    ["ramp times decay", cauer, false, 0.2, [{ a: 0, b: 5000, lambda: 25 }]],
  ];
  test.each(table)("%s", (_, model, isWarm, h, terms) => {
    const start = isWarm ? warm(model) : createModalState(model);
    const endRise = modalRise(model, advanceModalState(model, start, h, [terms], new Float64Array(start.length)));
    const found = Math.max(modalRise(model, start), endRise, ...interiorPeaks(model, start, h, [terms]).map((p) => p.riseK));
    expectClose(found, bruteForcePeak(model, start, h, terms).riseK, { abs: 0.01 });
  });
});

// Resistor-charging steps (constant, e^(−t/τ'), e^(−2t/τ') power) take the exponential-sum path
// (one turn by the rule of signs, Newton on the closed-form slope); the grid is only the fallback.
// Reference: brute-force dense sampling of the exact step solution (4·10^4 points), the same
// outside check as above; 0.01 K is the resolution the reports need.
describe("interiorPeaks on exponential power (resistor charging) against dense sampling", () => {
  test("random Foster networks, random warm states, charging-shaped power", () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ r: fc.double({ min: 0.05, max: 3, noNaN: true }), tau: fc.double({ min: 1e-4, max: 100, noNaN: true }) }), { minLength: 1, maxLength: 5 }),
        fc.double({ min: 1e-3, max: 10, noNaN: true }),
        fc.double({ min: 10, max: 2000, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (stages, rcTau, p0, warmth, constantShare) => {
          const model = fosterToModal({ kind: "foster", stages: stages.map((s) => ({ rKPerW: s.r, tauS: s.tau })) });
          const state = createModalState(model);
          model.tauS.forEach((tau, m) => {
            state[m] = p0 * warmth * (m % 2 === 0 ? 0.3 : 0.05) * (1 + tau / 100);
          });
          const powers = [[{ a: p0 * constantShare * 0.1, b: 0, lambda: 0 }, { a: p0 * (1 - constantShare) * 0.5, b: 0, lambda: 1 / rcTau }, { a: p0 * 0.5, b: 0, lambda: 2 / rcTau }]];
          const h = 6 * rcTau;
          const found = interiorPeaks(model, state, h, powers);
          const { best, endpoints } = sampledMaximum(model, state, h, powers);
          const searched = Math.max(endpoints, ...found.map((p) => p.riseK));
          expect(searched).toBeGreaterThanOrEqual(best - 0.01);
          expect(searched).toBeLessThanOrEqual(best + 0.01 + 1e-9 * Math.abs(best));
        },
      ),
      { numRuns: 150, seed: 20261202 },
    );
  });
});

describe("the peak search's caches keyed by the terms object give the answers of a fresh search", () => {
  // interiorPeaks keeps the state-free part of the slope sum for the last terms object, and starts
  // Newton from the last turn when the step length repeats. Property: one terms object used from a
  // sequence of different states gives the same peaks as a fresh copy of the terms (new identity,
  // so nothing cached applies) from each state, to the root tolerance (1e-12·h in time).
  test("one charging step from many states (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 400, noNaN: true }), { minLength: 2, maxLength: 8 }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (warmths, rcTau) => {
          const terms: PowerTerm[] = [{ a: 200, b: 0, lambda: 1 / rcTau }, { a: 300, b: 0, lambda: 2 / rcTau }];
          const h = 5 * rcTau;
          const states = warmths.map((w) => advanceModalState(foster, createModalState(foster), 0.05, [[{ a: w, b: 0, lambda: 0 }]]));
          // all searches with the one terms object first (the caches then apply from the second on)
          const cached = states.map((state) => interiorPeaks(foster, state, h, [terms]));
          states.forEach((state, k) => {
            const fresh = interiorPeaks(foster, state, h, [terms.map((t) => ({ ...t }))]);
            expect(cached[k]!.length).toBe(fresh.length);
            cached[k]!.forEach((p, i) => {
              expectClose(p.atS, fresh[i]!.atS, { abs: 1e-10 * h });
              expectClose(p.riseK, fresh[i]!.riseK, { rel: 1e-12, abs: 1e-12 });
            });
          });
        },
      ),
      { numRuns: 60, seed: 20261202 },
    );
  });
});

describe("interiorPeaks when the slope-sum scratch grows mid-build", () => {
  // The closed-form paths keep their sums in module scratch arrays grown on demand. Here, in a
  // fresh copy of the module (16 entries), a first charging source from a warm state fills 9
  // entries (its decay rate and 8 modes) and a second one then needs room for 16 more: the growth
  // must keep the first source's coefficients. With every tau below 1/lambda the sum's
  // coefficients change sign once (the one-turn path applies). Checked against dense sampling as
  // above (0.01 K).
  test("two charging sources sharing eight modes", async () => {
    vi.resetModules();
    const fresh = (await import("../../src/thermal/segmentPeak.js")) as typeof import("../../src/thermal/segmentPeak.js");
    const tauS = Array.from({ length: 8 }, (_, m) => 1e-4 * 2 ** m);
    const model: ModalModel = {
      tauS,
      sources: ["first", "second"],
      observed: ["first"],
      gainKPerW: [[tauS.map(() => 0.3), tauS.map(() => 0.2)]],
    };
    const state = createModalState(model);
    for (let m = 0; m < 8; m++) state[m] = 60; // the first source's modes start warm
    const powers = [[{ a: 300, b: 0, lambda: 10 }], [{ a: 500, b: 0, lambda: 10 }]];
    const h = 0.3;
    const found = fresh.interiorPeaks(model, state, h, powers);
    const { best, endpoints } = sampledMaximum(model, state, h, powers);
    expect(best).toBeGreaterThan(endpoints + 0.1);
    expect(found.length).toBe(1);
    expectClose(found[0]!.riseK, best, { abs: 0.01 });
  });
});
