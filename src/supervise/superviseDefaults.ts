import { PLAN_DEFAULTS } from "../retry/planDefaults.js";

/**
 * Every default of the supervision answers (`heatledger supervise`), declared once. The solvers,
 * the CLI's help text and the README read these values.
 */
export const SUPERVISE_DEFAULTS = {
  /**
   * margin between a check threshold and the healthy envelope, as a fraction of the envelope's
   * voltage: an early-abort threshold is (1 − margin)·(lowest healthy bus voltage at the check),
   * a rise-too-fast threshold (1 + margin)·(highest). Common practice: 20 % covers a voltage
   * measurement error of a few percent plus part tolerances not in the corner set.
   */
  checkMarginFraction: 0.2,
  /**
   * the lowest threshold a check may use, as a fraction of the lowest bus voltage, when the
   * profile gives no minCheckVoltage: below it a measurement cannot tell a slow bus from a
   * shorted one (offset, noise, a partial short). Common practice: 10 %.
   */
  minCheckVoltageFraction: 0.1,
  /** automatic check times, as fractions of the slowest healthy completion time */
  autoCheckFractions: [0.05, 0.1, 0.2, 0.3, 0.5, 0.7] as readonly number[],
  /** a healthy charge is followed up to this multiple of the profile's timeout before it counts as never completing */
  healthyHorizonTimeoutMultiple: 1000,
  /** points of the healthy envelope and short-circuit energy curves */
  envelopePoints: 161,
  /** the longest survivable short is searched up to this many slowest thermal time constants; safe there counts as unbounded */
  enduranceSpanTauMultiple: PLAN_DEFAULTS.scanSpanTauMultiple,
  /** bisection of the longest survivable short stops at this fraction of the bracket's upper end */
  bisectionRelTol: PLAN_DEFAULTS.bisectionRelTol,
} as const;
