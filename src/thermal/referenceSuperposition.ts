import { describeFound, inputError } from "../errors/InputError.js";
import type { ModalModel } from "./ModalModel.js";
import { type PowerTrace, validatePowerTrace } from "./powerTrace.js";
import { zth } from "./zth.js";

/**
 * The reference path: the rise of an observed node under piecewise-constant power, by plain
 * superposition of step responses,
 *   rise_o(t) = Σ_src Σ_k ΔP_k·Zth_{o,src}(t − t_k)   over all power changes with t_k ≤ t,
 * every segment contributing a step +P at its start and −P at its end.
 * Deliberately naive: no recursion, no state, no shared arithmetic with the modal stepper beyond
 * Zth itself, so it can check the fast path (advanceModalState / runThermalHistory).
 * Its rounding grows with the number of steps and with how far the sample is from the pulses
 * (a late, small rise is the difference of large Zth values): use it as a reference, not a tool.
 * Source: superposition and time invariance of a linear system (the convolution integral),
 * Oppenheim & Willsky, Signals and Systems, 2nd ed. (1997), §2.2; JEDEC JESD51-1 (1995) for Zth.
 * Cost O(segments × times × sources × modes), i.e. O(N²) when times scale with the segments.
 * @param traces one trace per model source (undefined: no power); constant power only
 * @param timesS times at which to evaluate [s], any order
 * @param o observed node index
 * @throws InputError `bad-trace` for a segment whose power is not constant
 */
export function referenceSuperposition(model: ModalModel, traces: readonly (PowerTrace | undefined)[], timesS: readonly number[], o = 0, field = "traces"): number[] {
  const steps: { atS: number; deltaW: number; source: number }[] = [];
  traces.forEach((trace, s) => {
    if (trace === undefined) return;
    validatePowerTrace(trace, `${field}[${s}]`);
    trace.forEach((seg, i) => {
      let watts = 0;
      seg.terms.forEach((t, k) => {
        if (t.b !== 0 || t.lambda !== 0)
          throw inputError("bad-trace", `${field}[${s}][${i}].terms[${k}]`, "constant power (b = 0, lambda = 0) for the reference superposition", describeFound(t));
        watts += t.a;
      });
      if (watts === 0) return;
      steps.push({ atS: seg.startS, deltaW: watts, source: s });
      steps.push({ atS: seg.startS + seg.durationS, deltaW: -watts, source: s });
    });
  });
  return timesS.map((t) => {
    let rise = 0;
    for (const step of steps) if (step.atS <= t) rise += step.deltaW * zth(model, t - step.atS, o, step.source);
    return rise;
  });
}
