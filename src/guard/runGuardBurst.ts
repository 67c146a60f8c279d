import { AttemptCursor } from "../retry/AttemptCursor.js";
import type { ProfileRetrySetup } from "../retry/profileRetrySetup.js";
import { resolveScenario } from "../retry/RetryScenario.js";
import { advanceModalState, createModalState, modalRise } from "../thermal/modalStep.js";
import { sampleThermalHistory } from "../thermal/sampleThermalHistory.js";
import { traceSteps } from "../thermal/traceSteps.js";
import type { GuardEstimator } from "./GuardEstimator.js";
import { type ThermalGuard, tickEnergies, tracesBySource } from "./thermalGuard.js";

/** One attempt the guard admitted. */
export interface GuardAttempt {
  /** 1-based */
  readonly attempt: number;
  /** the tick it started at (its start is tick × Ts) */
  readonly startTick: number;
  /** wait after the previous attempt's end [s]; null for the first */
  readonly waitS: number | null;
  /** how long it lasted [s] */
  readonly durationS: number;
  /** per part, the exact own peak of the attempt (AttemptCursor) [°C] */
  readonly peakC: readonly number[];
  /** least allowed − peak over the parts [K] (negative would be a guard failure) */
  readonly headroomK: number;
}

/** One line of the test vectors: `ticks` ticks with the same energies, then what the guard says. */
export interface GuardVectorStep {
  readonly ticks: number;
  /** energy per input as fed (Q integers for fixed point, joules for floating point) */
  readonly energy: readonly (number | bigint)[];
  /** the guard's state after the ticks, [part][mode] */
  readonly state: readonly (readonly (number | bigint)[])[];
  /** the guard's rise estimate per part [K] */
  readonly riseK: readonly number[];
  /** the exact rise per part at the same tick instant (the engine, closed form) [K] */
  readonly exactRiseK: readonly number[];
  readonly mayStart: boolean;
  /** the cool-down answer, on idle lines only (null: never) */
  readonly cooldownTicks?: number | null;
}

/** Options of {@link runGuardBurst}. */
export interface GuardBurstOptions {
  /** keep the test vectors (default false) */
  readonly record?: boolean;
  /**
   * ticks the firmware waits after the guard allows attempt k (1-based) before starting it
   * (default 0: at once); a firmware that starts late, for the property tests
   */
  readonly extraWaitTicks?: (attempt: number) => number;
}

/** A burst run by the guard in one corner. */
export interface GuardBurst {
  readonly corner: string;
  readonly attempts: readonly GuardAttempt[];
  /** attempt end of the last attempt [s] */
  readonly burstEndS: number;
  /** the most the exact rise went above the guard's estimate at the end of the same tick, between tick instants, over the parts [K] (0: never) */
  readonly betweenTicksExcessK: number;
  /** the smallest estimate − exact at tick instants over the run and the parts [K] (never negative) */
  readonly leastTickMarginK: number;
  /** the largest estimate − exact at tick instants [K] */
  readonly largestTickMarginK: number;
  /** the vectors, when asked for */
  readonly steps: readonly GuardVectorStep[];
}

/**
 * Run the guard as firmware would in one corner of the retry setup: each attempt at the first tick at
 * which the guard allows it (the first one at tick 0 unless it is never allowed), no sooner than the relay's
 * shortest wait after the previous attempt's end. Each attempt is simulated exactly
 * (AttemptCursor: its own peak, and its power, which the guard is fed tick by tick as energies);
 * the exact rise at every tick instant is tracked beside the estimate (sampleThermalHistory, with
 * the maxima between ticks). Idle ticks between attempts are fed in runs, and the guard is
 * asked only from the tick its cool-down answer names on. Attempts the guard never allows end
 * the burst.
 * Cost O(ticks × parts × modes × inputs) plus the attempts' exact integration.
 */
export function runGuardBurst(guard: ThermalGuard, setup: ProfileRetrySetup, cornerIndex: number, estimator: GuardEstimator, attempts: number, options: GuardBurstOptions = {}): GuardBurst {
  const record = options.record === true;
  const parts = setup.parts.length;
  const corners = setup.parts.map((_, p) => resolveScenario(setup.scenarios[cornerIndex * parts + p]!, `corners[${cornerIndex}]`));
  const cursors = corners.map((c) => new AttemptCursor(c));
  const tickS = guard.tickS;
  const exact = corners.map((c) => createModalState(c.model));
  const scratch = corners.map((c) => createModalState(c.model));
  const steps: GuardVectorStep[] = [];
  const out: GuardAttempt[] = [];
  let tick = 0;
  let excess = 0;
  let least = Infinity;
  let largest = -Infinity;
  const zero = guard.inputs.map(() => 0);
  const exactRises = (): number[] => corners.map((c, p) => modalRise(c.model, exact[p]!, c.observedIndex));
  const note = (ticks: number, energyJ: readonly number[], idle: boolean): void => {
    const riseK = estimator.riseK();
    const exactRiseK = exactRises();
    riseK.forEach((r, p) => {
      least = Math.min(least, r - exactRiseK[p]!);
      largest = Math.max(largest, r - exactRiseK[p]!);
    });
    if (record) {
      const mayStart = estimator.mayStart();
      steps.push({ ticks, energy: estimator.quantiseEnergy(energyJ), state: estimator.state(), riseK, exactRiseK, mayStart, ...(idle ? { cooldownTicks: estimator.cooldownTicks() } : {}) });
    }
  };
  const idle = (ticks: number): void => {
    if (ticks <= 0) return;
    for (let k = 0; k < ticks; k++) estimator.tick(zero);
    corners.forEach((c, p) => advanceModalState(c.model, exact[p]!, ticks * tickS, [], exact[p]!));
    tick += ticks;
    note(ticks, zero, true);
  };
  let lastEndS = 0;
  for (let k = 0; k < attempts; k++) {
    if (k > 0) idle(Math.ceil((lastEndS + corners[0]!.minWaitS) / tickS - 1e-9) - tick);
    while (!estimator.mayStart()) {
      const wait = estimator.cooldownTicks();
      if (wait === null) {
        note(0, zero, true); // the vectors end on the "never" answer
        return finish();
      }
      idle(Math.max(1, wait));
    }
    idle(options.extraWaitTicks?.(k + 1) ?? 0);
    const startS = tick * tickS;
    const trials = cursors.map((c) => c.tryAt(startS));
    if (trials.some((t) => t === null)) return finish();
    trials.forEach((t, p) => cursors[p]!.keep(t!));
    const first = trials[0]!;
    out.push({
      attempt: k + 1,
      startTick: tick,
      waitS: k === 0 ? null : startS - lastEndS,
      durationS: first.record.durationS,
      peakC: trials.map((t) => t!.record.peakC),
      headroomK: Math.min(...trials.map((t) => t!.headroomK)),
    });
    lastEndS = startS + first.record.durationS;
    // energies per input and tick, and the exact rise at each tick instant with the maxima between
    const perInput: number[][] = guard.inputs.map(() => []);
    const traces = guard.channels.map((ch, p) => tracesBySource(corners[p]!.model, corners[p]!, trials[p]!.outcome));
    guard.channels.forEach((ch, p) =>
      traces[p]!.forEach((trace, s) => {
        if (trace !== undefined) perInput[ch.inputOfSource[s]!] = tickEnergies(trace, tickS);
      }),
    );
    const ticks = Math.max(0, ...perInput.map((e) => e.length));
    const tickRises = corners.map((c, p) => {
      const rises: number[] = [];
      const peaks: { atS: number; riseK: number }[] = [];
      const times = Array.from({ length: ticks }, (_, i) => (i + 1) * tickS);
      for (const point of sampleThermalHistory(c.model, traceSteps(traces[p]!, 0, ticks * tickS), times, { initialState: exact[p]! })) {
        if (point.kind === "sample") rises.push(point.riseK[c.observedIndex]!);
        else if (point.node === c.observedIndex) peaks.push({ atS: point.timeS, riseK: point.riseK[point.node]! });
      }
      for (const step of traceSteps(traces[p]!, 0, ticks * tickS)) {
        advanceModalState(c.model, exact[p]!, step.durationS, step.powers, scratch[p]!);
        exact[p]!.set(scratch[p]!);
      }
      return { rises, peaks };
    });
    const estimates: number[][] = [];
    for (let i = 0; i < ticks; i++) {
      const energyJ = perInput.map((e) => e[i] ?? 0);
      estimator.tick(energyJ);
      tick++;
      const riseK = estimator.riseK();
      estimates.push(riseK);
      tickRises.forEach((t, p) => {
        least = Math.min(least, riseK[p]! - t.rises[i]!);
        largest = Math.max(largest, riseK[p]! - t.rises[i]!);
      });
      if (record) steps.push({ ticks: 1, energy: estimator.quantiseEnergy(energyJ), state: estimator.state(), riseK, exactRiseK: tickRises.map((t) => t.rises[i]!), mayStart: estimator.mayStart() });
    }
    // how far the exact rise went between tick instants above the estimate at the end of that tick
    tickRises.forEach((t, p) => {
      for (const peak of t.peaks) {
        const i = Math.min(ticks - 1, Math.max(0, Math.ceil(peak.atS / tickS - 1e-9) - 1));
        excess = Math.max(excess, peak.riseK - estimates[i]![p]!);
      }
    });
  }
  // the last attempt may outlast its power (a trip delay): run on to the tick of its end
  idle(Math.ceil(lastEndS / tickS - 1e-9) - tick);
  return finish();

  function finish(): GuardBurst {
    return {
      corner: setup.corners[cornerIndex]!,
      attempts: out,
      burstEndS: lastEndS,
      betweenTicksExcessK: excess,
      leastTickMarginK: least === Infinity ? 0 : least,
      largestTickMarginK: largest === -Infinity ? 0 : largest,
      steps,
    };
  }
}
