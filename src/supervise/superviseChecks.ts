import type { PowerTrace } from "../thermal/powerTrace.js";
import { segmentEnergy } from "../thermal/powerTrace.js";
import type { HealthyBus } from "./superviseHealthyBus.js";

/** An early-abort check: "abort if the bus is still below thresholdV at timeS". */
export interface AbortCheck {
  /** time after the pre-charge starts [s] */
  readonly timeS: number;
  /** lowest bus voltage of any healthy corner at that time [V] */
  readonly lowestHealthyV: number;
  /** the healthy corner with that voltage */
  readonly slowestCorner: string;
  /** (1 − margin)·lowestHealthyV [V]: every healthy corner is above it */
  readonly thresholdV: number;
  /** threshold at or above the measurement floor (a lower threshold cannot tell slow from shorted) */
  readonly usable: boolean;
  /** energy a shorted output puts into the part before the check fires [J] */
  readonly shortEnergyJ: number;
  /** that energy as a fraction of what the short puts in until the timeout */
  readonly shareOfTimeoutEnergy: number;
}

/** A rise-too-fast check: "abort if the bus is already above thresholdV at timeS" (a bypassed pre-charge element). */
export interface RiseCheck {
  readonly timeS: number;
  /** highest bus voltage of any healthy corner at that time [V] */
  readonly highestHealthyV: number;
  /** the healthy corner with that voltage */
  readonly fastestCorner: string;
  /** max((1 + margin)·highestHealthyV, floor) [V]: no healthy corner reaches it */
  readonly thresholdV: number;
  /** threshold at or below (1 − margin)·(lowest bus voltage): a bypassed element, which takes the bus to the source voltage almost at once, trips it */
  readonly usable: boolean;
}

/** Energy of a power trace from its start to a time [J] (exact per segment). Cost O(segments). */
export function traceEnergyUntil(trace: PowerTrace, timeS: number): number {
  let sum = 0;
  for (const seg of trace) {
    const h = Math.min(seg.durationS, timeS - seg.startS);
    if (h > 0) sum += segmentEnergy(seg.terms, h);
  }
  return sum;
}

/**
 * Early-abort checks. At each check time t the lowest healthy bus voltage
 * V_min(t) over the corner set gives the threshold (1 − m)·V_min(t), which no healthy corner can
 * trip (each is at or above V_min(t) > threshold); a shorted output holds the bus at 0 V and trips
 * it. A check is usable when its threshold is at least the measurement floor. The energy a short
 * puts into the part before the check fires is the short-circuit power trace integrated to t;
 * for a series resistor (Vs²·R/(R + Rsrc)²)·t, the Joule heating of a constant current
 * (Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.4, Joule heating
 * p = i²R; section from memory). The recommended check is the usable one with the least
 * short-circuit energy (the
 * earliest: the energy grows with t).
 * Cost O(checks × corners × one circuit run).
 * @param shortTrace the part's power into a short until (at least) the last check
 * @param timeoutEnergyJ energy of the short until the timeout [J], for the share
 */
export function abortChecks(buses: readonly HealthyBus[], timesS: readonly number[], marginFraction: number, floorV: number, shortTrace: PowerTrace, timeoutEnergyJ: number): AbortCheck[] {
  return timesS.map((timeS) => {
    let lowest = Infinity;
    let slowest = "";
    for (const b of buses) {
      const v = b.voltageAt(timeS);
      if (v < lowest) {
        lowest = v;
        slowest = b.corner.name;
      }
    }
    const thresholdV = (1 - marginFraction) * lowest;
    const shortEnergyJ = traceEnergyUntil(shortTrace, timeS);
    return {
      timeS,
      lowestHealthyV: lowest,
      slowestCorner: slowest,
      thresholdV,
      usable: thresholdV >= floorV,
      shortEnergyJ,
      shareOfTimeoutEnergy: timeoutEnergyJ > 0 ? shortEnergyJ / timeoutEnergyJ : 0,
    };
  });
}

/**
 * Rise-too-fast checks (the mirror of the early-abort checks). At each time t the highest healthy bus voltage
 * V_max(t) gives the threshold max((1 + m)·V_max(t), floor), which no healthy corner reaches; a
 * bypassed or shorted pre-charge element charges the bus to the source voltage almost at once and
 * trips it when the threshold is at most (1 − m)·(lowest bus voltage) (usable). Recommended: the
 * earliest usable check.
 * Cost O(checks × corners × one circuit run).
 */
export function riseChecks(buses: readonly HealthyBus[], timesS: readonly number[], marginFraction: number, floorV: number, lowestBusV: number): RiseCheck[] {
  return timesS.map((timeS) => {
    let highest = -Infinity;
    let fastest = "";
    for (const b of buses) {
      const v = b.voltageAt(timeS);
      if (v > highest) {
        highest = v;
        fastest = b.corner.name;
      }
    }
    const thresholdV = Math.max((1 + marginFraction) * highest, floorV);
    return { timeS, highestHealthyV: highest, fastestCorner: fastest, thresholdV, usable: thresholdV <= (1 - marginFraction) * lowestBusV };
  });
}
