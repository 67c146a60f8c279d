/**
 * A power as a quadratic in the bus voltage V: c0 + c1·V + c2·V² [W]. Every power in the circuit
 * models (source, load, each dissipating part) has this form, so that over an exact exponential
 * or ramp stretch of V it becomes a sum of power-trace terms, and under an ODE it is integrated
 * from ∫V dt and ∫V² dt.
 */
export interface Quadratic {
  readonly c0: number;
  readonly c1: number;
  readonly c2: number;
}

/** The zero power. */
export const ZERO_QUADRATIC: Quadratic = { c0: 0, c1: 0, c2: 0 };

/** Evaluate a {@link Quadratic} at V. Cost O(1). */
export function evalQuadratic(q: Quadratic, voltageV: number): number {
  return q.c0 + voltageV * (q.c1 + voltageV * q.c2);
}

/** A bus voltage whose crossing ends a regime (a load switching, a feed changing mode). */
export interface BusLevel {
  /** the voltage [V] */
  readonly voltageV: number;
  /** true: crossed while rising; false: while falling */
  readonly rising: boolean;
  /** what happens there: "complete", "load-on", "load-off", "load-clamp", or a feed's own key */
  readonly key: string;
}

/**
 * What the charging element feeds into the bus in one of its modes, as functions of the bus
 * voltage V: its current g0 − g1·V + h/V [A] (h: a constant output power [W]), the power drawn
 * from the source and the power dissipated in each of its parts (quadratics in V), and the
 * voltages at which it changes mode.
 */
export interface FeedTerms {
  /** current at V = 0 from the affine part [A] */
  readonly g0: number;
  /** conductance toward the source [S] */
  readonly g1: number;
  /** constant output power [W] (a constant-power converter); 0 for a linear feed */
  readonly h: number;
  /** power taken from the source [W] */
  readonly sourcePower: Quadratic;
  /** power dissipated in each part, by key (trace roles and other loss keys) [W] */
  readonly partPower: Readonly<Record<string, Quadratic>>;
  /** voltages where the feed changes mode (the model's `nextMode` says into which) */
  readonly levels: readonly BusLevel[];
  /** words for reasons and errors: "current-source mode" */
  readonly description: string;
}

/**
 * One stretch of the bus dynamics: the capacitor current is i(V) = g0 − g1·V + h/V [A] (feed
 * minus load), and every power is a quadratic in V. Linear when h = 0 (exact exponential or
 * ramp); otherwise solved by an adaptive ODE method.
 */
export interface BusRegime {
  /** identifies the regime (feed mode, load state) for caching and cycle detection */
  readonly key: string;
  readonly g0: number;
  readonly g1: number;
  readonly h: number;
  /** the feed's own current into the bus, same form as i(V) [A] */
  readonly feed: { readonly g0: number; readonly g1: number; readonly h: number };
  readonly sourcePower: Quadratic;
  readonly loadPower: Quadratic;
  readonly partPower: Readonly<Record<string, Quadratic>>;
  readonly levels: readonly BusLevel[];
  /** the feed mode this regime belongs to */
  readonly mode: string;
  readonly loadOn: boolean;
  /** the bus is held at 0 V by a load the feed cannot supply (or a short) */
  readonly clamped: boolean;
}

/**
 * A charging element, described so that the shared event runner ({@link runChargeEvent}) can
 * integrate it against any bus load. See DEVELOPERS.md, "How to add a circuit model".
 */
export interface ChargeModel {
  /** link capacitance [F] */
  readonly capacitanceF: number;
  /** part keys that get a power trace (roles) */
  readonly traceRoles: readonly string[];
  /** the feed's terms in a mode, with the bus load on or off (a feed that regulates the bus
   *  voltage mirrors the load it supplies) */
  feed(mode: string, loadOn: boolean): FeedTerms;
  /** the feed's mode at the start of an event with the bus at V */
  initialMode(voltageV: number): string;
  /** the feed's mode after crossing one of its own levels */
  nextMode(mode: string, levelKey: string): string;
}
