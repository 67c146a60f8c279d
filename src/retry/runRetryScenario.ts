import { describeFound, inputError } from "../errors/InputError.js";
import { AttemptCursor, type AttemptRecord } from "./AttemptCursor.js";
import { type RetryScenario, resolveScenario } from "./RetryScenario.js";

/** One corner's history for a list of attempt start times. */
export interface ScenarioRun {
  readonly corner: string;
  /** each attempt with its own peak [°C] */
  readonly attempts: readonly AttemptRecord[];
  /** highest temperature of the history [°C] */
  readonly peakC: number;
  /** limit − margin [°C] */
  readonly allowedC: number;
  /** temperature of the observed node at a time at or after the last attempt's end [°C] (free cooling) */
  readonly temperatureAtC: (timeS: number) => number;
  /** end of the last attempt [s] */
  readonly endS: number;
}

/**
 * Simulate one corner for given attempt start times (one burst, or bursts separated by a lockout):
 * each attempt's own peak, and the temperature at any time after the last one. The capacitor
 * discharges between attempts (the scenario's discharge model); the first attempt starts from the
 * initial voltage and from ambient.
 * Cost O(attempts × cost of one attempt).
 * @param startTimesS absolute start times [s], increasing, each at or after the previous attempt's end
 * @throws InputError `out-of-range` naming the start time that comes before the previous attempt ends
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * runRetryScenario(scenario, [0, 1, 2]).peakC // => 127.35
 */
export function runRetryScenario(scenario: RetryScenario, startTimesS: readonly number[]): ScenarioRun {
  const corner = resolveScenario(scenario);
  const cursor = new AttemptCursor(corner);
  startTimesS.forEach((t, i) => {
    if (!Number.isFinite(t)) throw inputError("not-finite", `startTimesS[${i}]`, "a finite start time in s", describeFound(t));
    const trial = cursor.tryAt(t);
    if (trial === null) throw inputError("out-of-range", `startTimesS[${i}]`, `a start at or after the previous attempt's end (${cursor.endS} s)`, `${t} s`);
    cursor.keep(trial);
  });
  const attempts = cursor.history;
  const final = cursor.clone();
  return {
    corner: corner.name,
    attempts,
    peakC: attempts.reduce((p, a) => Math.max(p, a.peakC), corner.ambientC),
    allowedC: corner.allowedC,
    temperatureAtC: (timeS) => {
      if (!(timeS >= final.endS) || !Number.isFinite(timeS))
        throw inputError("out-of-range", "timeS", `a finite time at or after the last attempt's end (${final.endS} s)`, describeFound(timeS));
      return corner.ambientC + final.riseAtK(timeS);
    },
    endS: cursor.endS,
  };
}
