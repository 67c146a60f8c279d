import type { RainflowCycle } from "./rainflowCounter.js";

/** What a lifetime model reads of a counted cycle (a {@link RainflowCycle} is one). */
export type CycleLoad = Pick<RainflowCycle, "rangeK" | "minC" | "maxC" | "meanC" | "heatingTimeS" | "durationS">;

/** The per-cycle quantities a model's fitted range can bound. */
export type CycleQuantity = "range" | "mean" | "min" | "max" | "heatingTime" | "frequency";

/** Unit words of each {@link CycleQuantity}, for messages. */
export const CYCLE_QUANTITY_UNITS: Readonly<Record<CycleQuantity, string>> = {
  range: "K",
  mean: "°C",
  min: "°C",
  max: "°C",
  heatingTime: "s",
  frequency: "Hz",
};

/** Words for each {@link CycleQuantity}, for messages. */
export const CYCLE_QUANTITY_WORDS: Readonly<Record<CycleQuantity, string>> = {
  range: "range",
  mean: "mean temperature",
  min: "minimum temperature",
  max: "maximum temperature",
  heatingTime: "heating time",
  frequency: "cycle frequency",
};

/** Read a {@link CycleQuantity} off a cycle: range [K], mean/min/max [°C], heating time [s], frequency 1/duration [Hz]. */
export function cycleQuantity(load: CycleLoad, quantity: CycleQuantity): number {
  switch (quantity) {
    case "range":
      return load.rangeK;
    case "mean":
      return load.meanC;
    case "min":
      return load.minC;
    case "max":
      return load.maxC;
    case "heatingTime":
      return load.heatingTimeS;
    case "frequency":
      return load.durationS > 0 ? 1 / load.durationS : Number.POSITIVE_INFINITY;
  }
}

/** The interval of one quantity a model was fitted on (inclusive: its validity range), and where that interval comes from. */
export interface FittedInterval {
  readonly min: number;
  readonly max: number;
  /** "Held et al. (1997), from memory", "user" ... */
  readonly origin: string;
}

/** Fitted intervals by quantity; quantities absent are not checked. */
export type FittedRange = Readonly<Partial<Record<CycleQuantity, FittedInterval>>>;

/**
 * A cycling-lifetime model: cycles to failure of one temperature cycle, the range of cycles it
 * was fitted on (its validity range; cycles outside it are still evaluated, and the damage
 * report lists them as extrapolated, see MinerAccumulator), and warnings
 * about fixed parameters (a current or voltage outside the fitted range, a recalled parameter
 * set).
 */
export interface LifetimeModel {
  /** short name for reports, e.g. "LESIT (Held et al., 1997)" */
  readonly name: string;
  /** cycles to failure N_f of a cycle repeated alone; Infinity for a cycle of zero range */
  cyclesToFailure(load: CycleLoad): number;
  readonly fitted: FittedRange;
  readonly parameterWarnings: readonly string[];
}

/** Merge a user's fitted intervals over a model's defaults (user wins, per quantity). */
export function mergeFittedRange(defaults: FittedRange, user: FittedRange | undefined): FittedRange {
  return { ...defaults, ...(user ?? {}) };
}

/**
 * Offset from degrees Celsius to kelvin: T[K] = T[°C] + 273.15 (SI brochure, 9th ed. (BIPM 2019),
 * §2.3.1, section from memory).
 */
export const CELSIUS_TO_KELVIN = 273.15;
