import type { AttemptProtection } from "../circuits/AttemptProtection.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile, ProfilePart } from "../profile/DutyProfile.js";
import type { PowerTrace } from "../thermal/powerTrace.js";
import { ATTEMPT_TIMING_DEFAULTS, shortestAttemptWaitS } from "../profile/attemptTiming.js";
import { circuitReadsTemperature } from "../profile/circuitReadsTemperature.js";
import type { AttemptOutcome, RetryScenario } from "../retry/RetryScenario.js";

/**
 * The retry planner's scenario for pre-charge attempts into a shorted output: every attempt runs
 * the profile's circuit with a short across the bus (the bus held at 0 V) until the timeout, at one
 * bus voltage. The observed part is `part`; parts of the same network heated by other circuit roles
 * (a MOSFET's source resistor on its heatsink) heat it through the network.
 * For a series resistor the part dissipates the constant Vs²·R/(R + Rsrc)² for the whole timeout.
 * Attempts cannot follow each other sooner than the relay's release plus operate time
 * (`circuit.relay`, the scenario's minWaitS). With `protection`, each attempt also ends where
 * a protection fires (the profile's own protection is not used: the answers judge the timeout).
 * Cost: one circuit run (per attempt when the model reads the part temperature).
 */
export function shortedScenario(profile: DutyProfile, part: ProfilePart, busVoltageV: number, timeoutS: number, models: CircuitModels, protection?: AttemptProtection): RetryScenario {
  const circuit = { ...profile.circuit!, busVoltageV } as NonNullable<DutyProfile["circuit"]>;
  const role = part.role!;
  const neighbours = profile.parts.filter((q) => q !== part && q.networkKey === part.networkKey && q.role !== undefined && q.sourceIndex !== part.sourceIndex);
  // The short never completes, so only the timeout matters; the circuit models still want a
  // completion rule, so the circuit's own threshold is kept (a dwell is dropped: it would end
  // the attempt early) and a dwell-only rule gets a threshold the short can never reach.
  const own = circuit.completion;
  const completion = {
    timeoutS,
    ...(own.fraction === undefined ? {} : { fraction: own.fraction }),
    ...(own.withinV === undefined ? {} : { withinV: own.withinV }),
    ...(own.fraction === undefined && own.withinV === undefined ? { fraction: 0.5 } : {}),
    ...(protection === undefined ? {} : { protection }),
  };
  // A short always starts from 0 V: the attempt is the same every time unless the model reads the
  // part temperature (circuitReadsTemperature), so it is computed once.
  const readsTemperature = circuitReadsTemperature(circuit);
  let cached: AttemptOutcome | undefined;
  return {
    name: `${part.id}, short at ${busVoltageV} V`,
    model: part.model,
    source: part.model.sources[part.sourceIndex]!,
    observe: part.model.observed[part.observedIndex]!,
    ambientC: part.ambientC,
    limitC: part.limitC,
    marginK: part.marginK,
    initialVoltageV: 0,
    attempt: (context) => {
      if (cached !== undefined && !readsTemperature) return cached;
      const partTemperatureC: Record<string, number> = { [role]: context.partTemperatureC };
      const run = models.charge(circuit, { kind: "short" }, { sourceVoltageV: busVoltageV, initialVoltageV: 0, completion, partTemperatureC });
      const otherTraces: Record<string, PowerTrace> = {};
      for (const q of neighbours) otherTraces[q.model.sources[q.sourceIndex]!] = run.traces[q.role!] ?? [];
      cached = { trace: run.traces[role] ?? [], durationS: run.durationS, endVoltageV: 0, ...(neighbours.length === 0 ? {} : { otherTraces }) };
      return cached;
    },
    discharge: () => 0,
    minWaitS: shortestAttemptWaitS(profile.timing ?? ATTEMPT_TIMING_DEFAULTS),
  };
}
