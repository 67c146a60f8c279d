/**
 * How soon one pre-charge attempt can follow another, as the hardware and the firmware allow: the
 * relay (or contactor) that starts and ends each attempt must open and close again between two
 * attempts, and the firmware can time a wait only in whole steps of its timer.
 */
export interface AttemptTiming {
  /** operate time: from the command to close the relay to its contacts closing [s] */
  readonly operateS: number;
  /** release time: from the command to open the relay to its contacts opening [s] */
  readonly releaseS: number;
  /** the firmware timer's resolution: every wait, interval and lockout it times is a whole number of these [s]; 0: no rounding */
  readonly timerResolutionS: number;
}

/**
 * Defaults of the profile keys `circuit.relay.operate`, `circuit.relay.release` and
 * `firmware.timerResolution`, declared once (code, README and `--help` read them here).
 * Operate 20 ms and release 10 ms are round figures of the order of the maximum operate and
 * release times of small power relays and contactors used to switch a pre-charge path (from
 * memory; no part's own data): state your own relay's values. A 1 ms timer is a common firmware
 * system tick (common practice).
 */
export const ATTEMPT_TIMING_DEFAULTS: AttemptTiming = Object.freeze({ operateS: 0.02, releaseS: 0.01, timerResolutionS: 0.001 });

/**
 * The shortest time from the end of one attempt to the start of the next that the relay allows:
 * it must open (release time) and close again (operate time). Attempts are counted from contact
 * closing to contact opening, so this is dead time between them.
 * Source: the relay's two switching times added (common practice). Cost O(1).
 */
export function shortestAttemptWaitS(timing: AttemptTiming): number {
  return timing.releaseS + timing.operateS;
}
