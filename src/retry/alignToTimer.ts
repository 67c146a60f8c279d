import { PLAN_DEFAULTS } from "./planDefaults.js";
import type { FeasibleBand } from "./scanFeasibleBands.js";

/**
 * Firmware times waits in whole steps of its timer, so every interval, wait and lockout the
 * planner proposes is a whole number of timer steps, rounded up from the continuous answer and
 * then checked again by simulation (a rounded value is never taken on trust: peak against wait is
 * not monotone once the capacitor's charge matters).
 *
 * A value within 1e-6 of a step above a whole step counts as on it: this absorbs bisection and
 * floating-point noise (the value proposed may then sit a hair below the continuous edge, which is
 * why it is re-checked). Results are tidied to 15 significant digits so 7 × 0.01 s prints as 0.07 s.
 * Resolution 0 (or less) means no rounding. Cost O(1).
 */
export function ceilToTimer(valueS: number, resolutionS: number): number {
  if (!(resolutionS > 0)) return valueS;
  return tidy(Math.max(0, Math.ceil(valueS / resolutionS - 1e-6)) * resolutionS);
}

/**
 * `valueS` rounded down to a whole number of timer steps, with no slack: used for the upper ends
 * of bands, which are not re-checked, so the result never lies above `valueS` (a value a hair
 * below a step goes down a whole step: the safe side). Cost O(1).
 */
export function floorToTimer(valueS: number, resolutionS: number): number {
  if (!(resolutionS > 0)) return valueS;
  const steps = Math.max(0, Math.floor(valueS / resolutionS));
  const down = tidy(steps * resolutionS);
  return down > valueS ? tidy((steps - 1) * resolutionS) : down;
}

/** The timer step after `valueS` (a whole number of steps). Cost O(1). */
function nextStep(valueS: number, resolutionS: number): number {
  return tidy((Math.round(valueS / resolutionS) + 1) * resolutionS);
}

function tidy(x: number): number {
  return Number(x.toPrecision(15));
}

/** Bands on the timer's grid, with the predicate evaluations spent re-checking them. */
export interface TimerBands {
  readonly bands: readonly FeasibleBand[];
  readonly evaluations: number;
}

/**
 * Bands of a continuous scan moved onto the timer's grid: each band's lower end is rounded up to
 * a whole timer step and re-checked with the predicate (stepping up one timer step at a time, at
 * most PLAN_DEFAULTS.timerAlignSteps times, while it fails); its upper end is rounded down. A band
 * that holds no whole timer step that passes the check is dropped. An open-ended band keeps its
 * upper end (the top of the scan). Resolution 0 returns the bands unchanged.
 * Cost O(bands × checks until one passes) predicate evaluations.
 */
export function alignBandsToTimer(bands: readonly FeasibleBand[], resolutionS: number, feasible: (valueS: number) => boolean): TimerBands {
  if (!(resolutionS > 0)) return { bands, evaluations: 0 };
  let evaluations = 0;
  const out: FeasibleBand[] = [];
  for (const b of bands) {
    let fromS = ceilToTimer(b.fromS, resolutionS);
    const toS = b.openEnded ? Math.max(b.toS, fromS) : floorToTimer(b.toS, resolutionS);
    let ok = false;
    for (let step = 0; step < PLAN_DEFAULTS.timerAlignSteps && fromS <= toS; step++) {
      evaluations++;
      if (feasible(fromS)) {
        ok = true;
        break;
      }
      fromS = nextStep(fromS, resolutionS);
    }
    if (ok) out.push({ fromS, toS, openEnded: b.openEnded });
  }
  return { bands: out, evaluations };
}

/**
 * The earliest value on the timer's grid, at or after a continuous answer, that passes the check:
 * `continuousS` rounded up, then one timer step at a time (at most PLAN_DEFAULTS.timerAlignSteps
 * checks, none beyond `upToS`); null when none passes. Resolution 0 returns `continuousS` itself
 * (already checked by the caller).
 * Cost O(checks) predicate evaluations.
 */
export function earliestOnTimer(continuousS: number, resolutionS: number, upToS: number, feasible: (valueS: number) => boolean): number | null {
  if (!(resolutionS > 0)) return continuousS;
  let valueS = ceilToTimer(continuousS, resolutionS);
  for (let step = 0; step < PLAN_DEFAULTS.timerAlignSteps && valueS <= upToS; step++) {
    if (feasible(valueS)) return valueS;
    valueS = nextStep(valueS, resolutionS);
  }
  return null;
}
