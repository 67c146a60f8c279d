import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile, ProfilePart } from "../profile/DutyProfile.js";
import type { PowerTrace } from "../thermal/powerTrace.js";
import type { RetryScenario } from "./RetryScenario.js";

/**
 * The retry planner's scenario for pre-charge attempts into a shorted output: every attempt runs
 * the profile's circuit with a short across the bus (the bus held at 0 V) until the timeout, at one
 * bus voltage. The observed part is `part`; parts of the same network heated by other circuit roles
 * (a MOSFET's source resistor on its heatsink) heat it through the network.
 * For a series resistor the part dissipates the constant Vs²·R/(R + Rsrc)² for the whole timeout.
 * Cost per attempt: one circuit run.
 */
export function shortedScenario(profile: DutyProfile, part: ProfilePart, busVoltageV: number, timeoutS: number, models: CircuitModels): RetryScenario {
  const circuit = { ...profile.circuit!, busVoltageV } as NonNullable<DutyProfile["circuit"]>;
  const role = part.role!;
  const neighbours = profile.parts.filter((q) => q !== part && q.networkKey === part.networkKey && q.role !== undefined && q.sourceIndex !== part.sourceIndex);
  const completion = { ...circuit.completion, timeoutS };
  delete (completion as { dwellS?: number }).dwellS;
  if (completion.fraction === undefined && completion.withinV === undefined) (completion as { fraction?: number }).fraction = 0.99;
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
      const partTemperatureC: Record<string, number> = { [role]: context.partTemperatureC };
      const run = models.charge(circuit, { kind: "short" }, { sourceVoltageV: busVoltageV, initialVoltageV: 0, completion, partTemperatureC });
      const otherTraces: Record<string, PowerTrace> = {};
      for (const q of neighbours) otherTraces[q.model.sources[q.sourceIndex]!] = run.traces[q.role!] ?? [];
      return { trace: run.traces[role] ?? [], durationS: run.durationS, endVoltageV: 0, ...(neighbours.length === 0 ? {} : { otherTraces }) };
    },
    discharge: () => 0,
  };
}
