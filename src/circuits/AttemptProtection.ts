import { describeFound, inputError } from "../errors/InputError.js";

/*
 * Protection that ends a pre-charge attempt before its timeout: firmware checks of the bus voltage
 * at set times, an over-current trip with a delay, an I²t limit (a fuse or a firmware integral)
 * and a maximum on-time. Part of the completion rule (CompletionRule.protection), so every caller
 * that runs an attempt with the profile's rule (simulate, retries, replay, size) honours it.
 * The event runner finds the exact moment one fires (findProtectionFiring.ts) and ends the attempt
 * there with the outcome "tripped".
 */

/** "End the attempt when the bus is below minV (or above maxV) at atS": an early-abort or a rise-too-fast check. */
export interface BusVoltageCheck {
  /** time after the attempt starts [s] */
  readonly atS: number;
  /** fires when the bus is below this [V] (a bus too slow: shorted or overloaded) */
  readonly minV?: number;
  /** fires when the bus is above this [V] (a bus too fast: a bypassed pre-charge element) */
  readonly maxV?: number;
}

/** "End the attempt when the bus rose slower than minRateVPerS between fromS and toS"; fires at toS. */
export interface BusRiseCheck {
  readonly fromS: number;
  readonly toS: number;
  /** least mean rise rate [V/s] */
  readonly minRateVPerS: number;
}

/** Trip when the current the pre-charge path draws stays above currentA for delayS. */
export interface OverCurrentTrip {
  readonly currentA: number;
  readonly delayS: number;
}

/** Trip when ∫i² dt of the pre-charge path's current reaches limitA2s (a fuse's melting I²t or a firmware integral). */
export interface I2tLimit {
  readonly limitA2s: number;
  /** words for the report: "fuse" or "firmware I²t" */
  readonly kind: "fuse" | "firmware";
}

/** Every protection of one attempt (all optional; the first to fire ends the attempt). */
export interface AttemptProtection {
  readonly busChecks?: readonly BusVoltageCheck[];
  readonly riseChecks?: readonly BusRiseCheck[];
  readonly overCurrent?: OverCurrentTrip;
  readonly i2t?: readonly I2tLimit[];
  /** end the attempt this long after it starts, whatever the bus does [s] */
  readonly maxOnTimeS?: number;
}

/** Which protection ended an attempt, when, and why in one sentence. */
export interface ProtectionFiring {
  /** "bus-check", "rise-check", "over-current", "fuse", "firmware-i2t" or "max-on-time" */
  readonly kind: "bus-check" | "rise-check" | "over-current" | "fuse" | "firmware-i2t" | "max-on-time";
  /** the moment it fired, from the start of the attempt [s] */
  readonly timeS: number;
  /** one sentence: "bus check at 10 ms: bus at 0 V, below 45 V" */
  readonly words: string;
}

/**
 * Validate an attempt's protection: every time, voltage, current and I²t finite and in range.
 * Cost O(checks).
 * @throws InputError naming `completion.protection.<key>` and what was expected
 * @example
 * const protection = { busChecks: [{ atS: 0.01, minV: 5 }] };
 * validateProtection(protection) // => undefined
 * const completion = { fraction: 0.95, timeoutS: 1, protection };
 * const into = { sourceVoltageV: 48, initialVoltageV: 0, completion };
 * chargeSeriesResistor({ resistanceOhm: 10, capacitanceF: 0.002, load: { kind: "short" } }, into).trippedBy.timeS // => 0.01
 */
export function validateProtection(p: AttemptProtection): void {
  const field = "completion.protection";
  const need = (ok: boolean, key: string, expected: string, found: unknown): void => {
    if (!ok) throw inputError("out-of-range", `${field}.${key}`, expected, describeFound(found));
  };
  const finite = (x: number): boolean => Number.isFinite(x);
  (p.busChecks ?? []).forEach((b, i) => {
    need(finite(b.atS) && b.atS >= 0, `busChecks[${i}].atS`, "a check time ≥ 0 s", b.atS);
    need(b.minV !== undefined || b.maxV !== undefined, `busChecks[${i}]`, "a minV or a maxV", "neither");
    if (b.minV !== undefined) need(finite(b.minV) && b.minV > 0, `busChecks[${i}].minV`, "a voltage > 0 V", b.minV);
    if (b.maxV !== undefined) need(finite(b.maxV) && b.maxV > 0, `busChecks[${i}].maxV`, "a voltage > 0 V", b.maxV);
  });
  (p.riseChecks ?? []).forEach((r, i) => {
    need(finite(r.fromS) && r.fromS >= 0, `riseChecks[${i}].fromS`, "a start time ≥ 0 s", r.fromS);
    need(finite(r.toS) && r.toS > r.fromS, `riseChecks[${i}].toS`, `an end time after fromS (${r.fromS} s)`, r.toS);
    need(finite(r.minRateVPerS) && r.minRateVPerS > 0, `riseChecks[${i}].minRateVPerS`, "a rise rate > 0 V/s", r.minRateVPerS);
  });
  if (p.overCurrent !== undefined) {
    need(finite(p.overCurrent.currentA) && p.overCurrent.currentA > 0, "overCurrent.currentA", "a trip current > 0 A", p.overCurrent.currentA);
    need(finite(p.overCurrent.delayS) && p.overCurrent.delayS >= 0, "overCurrent.delayS", "a delay ≥ 0 s", p.overCurrent.delayS);
  }
  (p.i2t ?? []).forEach((l, i) => need(finite(l.limitA2s) && l.limitA2s > 0, `i2t[${i}].limitA2s`, "an I²t > 0 A²s", l.limitA2s));
  if (p.maxOnTimeS !== undefined) need(finite(p.maxOnTimeS) && p.maxOnTimeS > 0, "maxOnTimeS", "a maximum on-time > 0 s", p.maxOnTimeS);
}
