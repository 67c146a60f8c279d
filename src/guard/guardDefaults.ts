/**
 * Every default of the firmware thermal guard (`heatledger guard`), declared once: the library,
 * the command's help and docs/guard.md read these values. A light module (no imports), so the
 * command's help can print them without loading the library.
 */
export const GUARD_DEFAULTS = {
  /** fractional bits of the fixed-point temperature states and thresholds (Q15.16 in 32 bits) */
  fractionBits: 16,
  /** fractional bits of the fixed-point energy the firmware feeds per tick [J] */
  energyFractionBits: 16,
  /** spans of the headroom table inside the longest attempt (equal lengths) */
  attemptSpans: 16,
  /** spans of the headroom table after the longest attempt (log-spaced up to tailTauMultiple slowest time constants) */
  tailSpans: 8,
  /** the table's last finite breakpoint: the longest attempt plus this many slowest time constants */
  tailTauMultiple: 5,
  /** start voltages sampled between 0 V and the highest end voltage when the worst attempt is sought */
  startVoltagePoints: 5,
  /** the fixed-point range must hold this many times the largest rise the guard tracks */
  rangeFactor: 2,
  /** relative padding of the floating-point gains (covers double rounding, see docs/guard.md) */
  floatGainPad: 1e-9,
  /** the floating-point rounding allowance is sized for states up to this many times the largest allowed rise */
  floatStateCapFactor: 4,
  /** attempts the guard runs in the conservatism comparison and the test vectors (at most the profile's) */
  vectorAttempts: 6,
  /** C identifier prefix of the exported functions and tables */
  cName: "hl_guard",
} as const;

/** The number types of the export: fixed point (integers, Q format) or double-precision floating point. */
export const GUARD_NUMERICS = ["fixed", "float"] as const;

/** One of {@link GUARD_NUMERICS}. */
export type GuardNumeric = (typeof GUARD_NUMERICS)[number];
