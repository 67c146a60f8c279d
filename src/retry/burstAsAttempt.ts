import type { PowerSegment, PowerTrace } from "../thermal/powerTrace.js";
import type { AttemptOutcome, RetryScenario } from "./RetryScenario.js";
import type { BurstPlan } from "./RetrySchedule.js";

/**
 * A scenario whose single "attempt" is a whole burst of the given scenario's attempts, so that
 * the attempt solvers answer questions about bursts: retryForeverCheck on it with end-to-start
 * spacing and an interval L tells whether burst + lockout L repeated for as long as the fault
 * persists is safe, in closed form (the super-cycle's periodic steady state).
 *
 * Inside the burst, attempt k + 1 starts its gap after attempt k's start or end (plan.spacing,
 * plan.overrun; never sooner than the scenario's minWaitS after attempt k's end), the capacitor
 * discharging over each wait. The composite keeps the scenario's minWaitS: a lockout shorter
 * than it cannot follow the burst. The inner attempts are told the part
 * temperature at the burst's start (the composite cannot know the temperature between its own
 * attempts); attempt models that depend on temperature are therefore approximated here.
 * Cost per call O(attempts × cost of the inner attempt model).
 */
export function burstAsAttempt(scenario: RetryScenario, plan: BurstPlan): RetryScenario {
  const minWaitS = scenario.minWaitS ?? 0;
  const attempt = (context: { attemptIndex: number; waitS: number; capacitorVoltageV: number; partTemperatureC: number }): AttemptOutcome => {
    const own: PowerSegment[] = [];
    const others = new Map<string, PowerSegment[]>();
    let startS = 0;
    let endS = 0;
    let voltage = context.capacitorVoltageV;
    let wait = context.waitS;
    for (let k = 0; k <= plan.gapsS.length; k++) {
      if (k > 0) {
        let next = (plan.spacing === "start-to-start" ? startS : endS) + plan.gapsS[k - 1]!;
        // an attempt that outlasts its gap: the next one starts at its end and the relay's
        // shortest wait (a plan that forbids overruns is checked by the solvers' own burst runs,
        // which report it)
        if (next < endS + minWaitS) next = endS + minWaitS;
        wait = next - endS;
        voltage = scenario.discharge(voltage, wait);
        startS = next;
      }
      const outcome = scenario.attempt({ attemptIndex: context.attemptIndex * (plan.gapsS.length + 1) + k, waitS: wait, capacitorVoltageV: voltage, partTemperatureC: context.partTemperatureC });
      for (const seg of outcome.trace) own.push({ ...seg, startS: seg.startS + startS });
      for (const [name, trace] of Object.entries(outcome.otherTraces ?? {})) {
        const list = others.get(name) ?? [];
        for (const seg of trace) list.push({ ...seg, startS: seg.startS + startS });
        others.set(name, list);
      }
      endS = startS + outcome.durationS;
      voltage = outcome.endVoltageV;
    }
    const otherTraces: Record<string, PowerTrace> = Object.fromEntries(others);
    return { trace: own, durationS: endS, endVoltageV: voltage, ...(others.size === 0 ? {} : { otherTraces }) };
  };
  return { ...scenario, attempt };
}
