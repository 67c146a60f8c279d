/**
 * Every default of the retry and lockout planner, declared once. Solvers, the CLI's help text and
 * the README read these values; nothing else in the planners hard-codes them.
 */
export const PLAN_DEFAULTS = {
  /** points of the log-spaced scan that brackets feasible bands before bisection */
  scanPoints: 240,
  /** the scan covers this many decades below its upper end (plus the lower end itself) */
  scanDecades: 6,
  /** upper end of interval, wait and lockout scans, as a multiple of the slowest thermal time constant */
  scanSpanTauMultiple: 20,
  /** bisection stops when a bracket is below this fraction of its upper end */
  bisectionRelTol: 1e-9,
  /** after the last attempt the free cooling is searched for a late peak over this many slowest time constants */
  tailTauMultiple: 10,
  /** attempts simulated at most when counting attempts or proving that retrying for ever is safe */
  attemptCap: 10_000,
  /** attempts simulated at most while the capacitor's start voltage settles to its periodic value */
  voltageSettleAttempts: 200,
  /** the start voltage counts as settled when it moves by less than this fraction of the largest voltage seen (or 1 µV) */
  voltageSettleRelTol: 1e-9,
  /** "back near ambient" means a rise of at most this many kelvin */
  ambientReturnK: 2,
  /** upper end of the growth factor scan of the firmware back-off rule */
  maxGrowthFactor: 10,
  /** points of the growth factor scan of the firmware back-off rule */
  growthScanPoints: 120,
  /**
   * timer resolution of the solvers when none is given [s]: 0, answers on a continuous time axis
   * (a profile always gives one: ATTEMPT_TIMING_DEFAULTS.timerResolutionS unless it says otherwise)
   */
  timerResolutionS: 0,
  /** timer steps tried above a rounded-up answer before its band is given up (each is one check by simulation) */
  timerAlignSteps: 64,
  /** default spacing of a uniform retry policy: measured from one attempt's start to the next one's */
  spacing: "start-to-start" as const,
} as const;
