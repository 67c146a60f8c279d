import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { AttemptCursor, FixedPointEstimator, advanceModalState, buildThermalGuard, constantPowerSegment, fixedPointGuard, resolveScenario } from "../../src/internal.js";
import { setupOf } from "./guardFixtures.js";

// The may-start rule after any heating history, not only whole attempts: random trains of
// constant-power pulses (attempts aborted early, a load that draws through the part, pulses of
// any length and gap; fast-check, fixed seed, bounded runs) heat the part; the fixed-point guard
// (the exported C source's twin) is fed each tick's energy; when it first allows an attempt, the
// profile's attempt (from an empty capacitor, the most energy) is started from the exact state
// of the network (AttemptCursor.resume, closed-form modal integration): its own peak must stay
// at or below limit − margin. This checks the superposition argument of the rule (docs/guard.md)
// with the guard's state above the exact one by whatever the history left.

const PROFILES = ["warehouse-robot-48v.yaml", "electric-boat-72v-supervision.yaml", "irrigation-pump-decade.yaml"];

describe("an attempt the guard allows after any pulse train stays within limit − margin", () => {
  test.each(PROFILES)("%s", (name) => {
    const setup = setupOf(name);
    const tickS = setup.timing.timerResolutionS;
    const guard = buildThermalGuard(setup, tickS);
    const fixed = fixedPointGuard(guard);
    const corner = resolveScenario(setup.scenarios[0]!);
    const model = corner.model;
    fc.assert(
      fc.property(
        fc.array(fc.record({ powerW: fc.double({ min: 0, max: 400, noNaN: true }), ticks: fc.integer({ min: 1, max: 1500 }), gapTicks: fc.integer({ min: 0, max: 3000 }) }), { minLength: 1, maxLength: 6 }),
        (pulses) => {
          const estimator = new FixedPointEstimator(fixed);
          const state = new Float64Array(model.sources.length * model.tauS.length);
          const powers: (ReturnType<typeof constantPowerSegment>["terms"] | undefined)[] = model.sources.map(() => undefined);
          const energy = guard.inputs.map(() => 0);
          for (const pulse of pulses) {
            powers[corner.sourceIndex] = constantPowerSegment(0, tickS, pulse.powerW).terms;
            energy[guard.channels[0]!.inputOfSource[corner.sourceIndex]!] = pulse.powerW * tickS;
            for (let k = 0; k < pulse.ticks; k++) {
              estimator.tick(energy);
              advanceModalState(model, state, tickS, powers);
            }
            powers[corner.sourceIndex] = undefined;
            energy.fill(0);
            for (let k = 0; k < pulse.gapTicks; k++) estimator.tick(energy);
            advanceModalState(model, state, pulse.gapTicks * tickS, powers);
          }
          let waited = 0;
          while (!estimator.mayStart()) {
            const wait = estimator.cooldownTicks();
            expect(wait).not.toBeNull();
            const n = Math.max(1, wait!);
            for (let k = 0; k < n; k++) estimator.tick(energy);
            waited += n;
          }
          advanceModalState(model, state, waited * tickS, powers);
          const cursor = AttemptCursor.resume(corner, { state, endS: 0, endVoltageV: 0, attempts: 0 });
          const trial = cursor.tryAt(0)!;
          expect(trial.headroomK).toBeGreaterThanOrEqual(0);
        },
      ),
      { numRuns: 25, seed: 1904 },
    );
  });
});
