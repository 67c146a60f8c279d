/** Defaults of the profile format, declared once (code, docs and help read them here). */
export const PROFILE_DEFAULTS = {
  /** warning band below a part's maximum temperature when `limits.margin` is absent [K] (common practice: 10 K) */
  marginK: 10,
  /** retry back-off factor when absent: a fixed interval */
  backoff: 1,
  /** converter-early: the converter stops below this fraction of its start voltage when `disableAt` is absent */
  converterDisableRatio: 0.9,
  /** the longest profile the simulator accepts [s] (about 31,700 years): guards against runaway sums */
  maxProfileTimeS: 1e12,
  /** the most events a profile may expand to: guards against runaway repeat counts */
  maxExpandedEvents: 50_000_000,
} as const;
