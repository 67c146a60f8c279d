/**
 * What `heatledger size` scales to find the smallest heat capacity of a part:
 * - `whole`: every heat capacity of the part's network (element, housing, heatsink: the whole
 *   thermal body) times k, every thermal resistance kept, as if the whole part were built k times
 *   larger in mass with the same paths for heat;
 * - `element`: only the element's capacity, the one the part's own power meets first (C1 of a
 *   Cauer ladder or lumped element, the part's source node of a graph, C1 of the exact Cauer
 *   ladder of a Foster network), the rest of the network as it is.
 * The default is SIZE_DEFAULTS.scale; the list lives with the defaults so `--help` loads no solver.
 */
export const SIZE_SCALE_SCOPES = ["whole", "element"] as const;

/** One of {@link SIZE_SCALE_SCOPES}. */
export type SizeScaleScope = (typeof SIZE_SCALE_SCOPES)[number];

/**
 * Defaults of the sizing solvers (`heatledger size`), declared once: code, help text and README read
 * these. Bracketing steps by a factor, then bisection on the logarithm of the scale factor or the
 * circuit value; every number here is a choice of our own, with its reason.
 */
export const SIZE_DEFAULTS = {
  /**
   * what is scaled (SizeScaleScope): the whole thermal body, the answer that holds when a larger
   * part of the same construction is chosen (every capacity grows with the part's mass)
   */
  scale: "whole" as SizeScaleScope,
  /** bracketing step: the capacity scale or circuit value is multiplied or divided by this until the answer changes */
  bracketFactor: 4,
  /** smallest capacity scale tried: below it the capacity is taken not to matter (the peak is then R·P, set by the resistance) */
  minCapacityScale: 1e-6,
  /** largest capacity scale tried: a finite profile always fits below some scale, so reaching it means a pathological input */
  maxCapacityScale: 1e9,
  /** the sized peak lies at most this far below the target temperature [K] (the tests ask for 0.1 K) */
  temperatureToleranceK: 0.01,
  /** and the bracket [lo, hi] of the capacity scale is at most this wide, relative, so 1 % less crosses the target */
  capacityRelativeWidth: 1e-3,
  /** relative width at which the circuit-value bisection stops (the completion test is exact, so this is cheap) */
  circuitRelativeWidth: 1e-7,
  /** circuit values are searched within this factor of the profile's own value, either way */
  circuitSearchFactor: 1e9,
  /** most simulations one capacity sizing may run (bracketing plus bisection) */
  maxSimulations: 80,
} as const;
