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
  /**
   * the main contactor's operate time (`circuit.contactor.operate`): from the command to close it
   * after a completed charge to its contacts closing; an attempt that completes and then trips
   * lasts this much longer [s]; undefined: 0
   */
  readonly contactorOperateS?: number;
  /**
   * the main contactor's release time (`circuit.contactor.release`): the next attempt may not
   * start before the contactor is open, or the pre-charge element would be bypassed [s];
   * undefined: 0
   */
  readonly contactorReleaseS?: number;
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
 * The shortest time from the end of one attempt to the start of the next that the switches allow:
 * the pre-charge relay must open (release time) and close again (operate time), and the main
 * contactor, commanded open with it, must be open before the relay closes again (a closed
 * contactor would bypass the pre-charge element): max(relay release, contactor release) + relay
 * operate. Attempts are counted from contact closing to contact opening, so this is dead time
 * between them.
 * Source: the switching times added along the sequence (common practice). Cost O(1).
 */
export function shortestAttemptWaitS(timing: AttemptTiming): number {
  return Math.max(timing.releaseS, timing.contactorReleaseS ?? 0) + timing.operateS;
}
