import { sourceIndex } from "../thermal/ModalModel.js";
import { createModalState, modalRise } from "../thermal/modalStep.js";
import type { PowerTrace } from "../thermal/powerTrace.js";
import { runThermalHistory } from "../thermal/runThermalHistory.js";
import { traceSteps } from "../thermal/traceSteps.js";
import { AttemptCursor, type AttemptTrial } from "./AttemptCursor.js";
import type { AttemptOutcome, ResolvedScenario } from "./RetryScenario.js";

/** The periodic steady state of identical attempts repeated for ever. */
export interface AttemptPeriodicState {
  /** cycle length, start to start [s] */
  readonly periodS: number;
  /** wait from an attempt's end to the next start [s] */
  readonly waitS: number;
  /** modal state at the end of an attempt in the steady cycle */
  readonly endState: Float64Array;
  /** the steady cycle's attempt, simulated from the steady state (its own peak is the steady peak) */
  readonly attempt: AttemptTrial;
  /** temperature of the observed node at the start of a steady cycle's attempt [°C] */
  readonly startTemperatureC: number;
}

/**
 * The periodic steady state of an attempt repeated for ever with a fixed wait, in closed form.
 *
 * Let f_m be the state of mode m at the end of one attempt started from ambient (exact modal
 * integration of the attempt's trace), and P = duration + wait the period. In the steady cycle
 * the state at an attempt's end repeats: y_m = y_m·e^(−P/tau_m) + f_m, so
 *   y_m = f_m / (1 − e^(−P/tau_m)),
 * the sum of the geometric series f_m·Σ_k e^(−k·P/tau_m) (each earlier attempt's contribution
 * decayed by whole periods). The steady cycle's attempt is then simulated once from that state
 * (after the wait) to find its peak, interior peaks included.
 * Source: docs/design.md, "Periodic steady state" ( start-of-cycle state d_m/(1 − e^(−T/tau_m))); the
 * geometric series of decayed pulse responses is superposition in a linear time-invariant system
 * (Oppenheim & Willsky, Signals and Systems, 2nd ed. (1997), §2.2), mode by mode; the resulting
 * periodic-pulse-train form is common practice in power-semiconductor thermal design.
 * Validity: the attempt must be the same every cycle (same power trace and end voltage), which
 * holds once the capacitor's start voltage has settled (see retryForeverCheck).
 * Cost O(segments × sources × modes) plus one attempt's peak search; no long simulation.
 * @param outcome the repeated attempt (as the attempt model returned it)
 * @param waitS wait from the attempt's end to the next start [s], ≥ 0
 */
export function attemptPeriodicSteadyState(corner: ResolvedScenario, outcome: AttemptOutcome, waitS: number): AttemptPeriodicState {
  const model = corner.model;
  const traces: (PowerTrace | undefined)[] = model.sources.map((_, i) => (i === corner.sourceIndex ? outcome.trace : undefined));
  for (const [name, trace] of Object.entries(outcome.otherTraces ?? {})) traces[sourceIndex(model, name)] = trace;
  const single = runThermalHistory(model, traceSteps(traces, 0, outcome.durationS), { initialState: createModalState(model), findPeaks: false });
  const periodS = outcome.durationS + waitS;
  const modes = model.tauS.length;
  const endState = new Float64Array(single.endState.length);
  for (let m = 0; m < modes; m++) {
    const sum = 1 / -Math.expm1(-periodS / model.tauS[m]!);
    for (let s = 0; s < model.sources.length; s++) endState[s * modes + m] = single.endState[s * modes + m]! * sum;
  }
  // One steady cycle: the wait, then the same attempt (the cursor asks the attempt model again;
  // the voltage it sees is discharge(outcome.endVoltageV, waitS), the settled start voltage).
  const cursor = AttemptCursor.resume(corner, { state: endState, endS: 0, endVoltageV: outcome.endVoltageV, attempts: 1 });
  const attempt = cursor.tryAt(waitS)!;
  return { periodS, waitS, endState, attempt, startTemperatureC: corner.ambientC + riseAfter(corner, endState, waitS) };
}

function riseAfter(corner: ResolvedScenario, state: Float64Array, waitS: number): number {
  const model = corner.model;
  const modes = model.tauS.length;
  const decayed = new Float64Array(state.length);
  for (let m = 0; m < modes; m++) for (let s = 0; s < model.sources.length; s++) decayed[s * modes + m] = state[s * modes + m]! * Math.exp(-waitS / model.tauS[m]!);
  return modalRise(model, decayed, corner.observedIndex);
}
