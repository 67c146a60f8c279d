import type { CircuitOutcome } from "../circuits/CircuitResult.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { ProfileCircuit } from "../profile/DutyProfile.js";
import type { HealthyCorner } from "./superviseCorners.js";

/** A healthy corner's charge: when it completes, and its bus voltage at any time. */
export interface HealthyBus {
  readonly corner: HealthyCorner;
  /** time from the start of the pre-charge to the completion threshold [s]; Infinity when it never gets there */
  readonly completionS: number;
  /** "completed", or "timed-out" when the bus does not reach the threshold within the horizon */
  readonly outcome: CircuitOutcome;
  /** timed out with the bus stalled below the threshold (it would never get there) */
  readonly busStalled: boolean;
  /** the circuit model's one-sentence reason */
  readonly reason: string;
  /** bus (capacitor) voltage at a time after the start [V] */
  readonly voltageAt: (timeS: number) => number;
}

/**
 * Run one healthy corner through the profile's circuit model: the charge from the start voltage to
 * the corner's completion threshold (followed up to `horizonS`), and the bus voltage at any time
 * (the same model run with a fixed dwell ending at that time, so the value is the model's own,
 * exact for the linear circuits, to the ODE tolerance for the others).
 * For a series resistor with no load the completion time is τ·ln((Vs − V0)/((1 − k)·Vs)),
 * τ = (R + Rsrc)·C (textbook RC charging; see chargeSeriesResistor).
 * Cost: one circuit run per call (O(1) for linear circuits).
 */
export function healthyBus(models: CircuitModels, circuit: ProfileCircuit, corner: HealthyCorner, startVoltageV: number, horizonS: number): HealthyBus {
  const at = { ...circuit, capacitanceF: corner.capacitanceF, busVoltageV: corner.busVoltageV } as ProfileCircuit;
  const run = models.charge(at, corner.load, {
    sourceVoltageV: corner.busVoltageV,
    initialVoltageV: startVoltageV,
    completion: { ...corner.completion, timeoutS: horizonS },
  });
  const completed = run.outcome === "completed";
  return {
    corner,
    completionS: completed ? run.durationS : Infinity,
    outcome: run.outcome,
    busStalled: run.busStalled,
    reason: run.reason,
    voltageAt: (timeS) => {
      if (!(timeS > 0)) return startVoltageV;
      return models.charge(at, corner.load, { sourceVoltageV: corner.busVoltageV, initialVoltageV: startVoltageV, completion: { dwellS: timeS, timeoutS: timeS } }).endVoltageV;
    },
  };
}
