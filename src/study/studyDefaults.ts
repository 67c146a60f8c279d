/**
 * The answers a study can report, by the name the user gives (`--answer peak,margin`), with
 * the command whose result holds it, its unit and what it is. Light on purpose: the commands'
 * help prints it without loading the library.
 * "The part" is the part the study follows: `--part`, else the part with the least margin.
 */
export const STUDY_ANSWERS = {
  peak: { command: "simulate", unit: "°C", words: "the part's highest temperature over the profile" },
  rise: { command: "simulate", unit: "K", words: "the part's peak rise over its ambient (peak − ambient)" },
  margin: { command: "simulate", unit: "K", words: "the part's limit less its peak (negative past the limit)" },
  energy: { command: "simulate", unit: "J", words: "energy put into the part over the profile" },
  damage: { command: "simulate", unit: "", words: "Miner damage of one repetition of the profile (needs a lifetime model)" },
  forever: { command: "retries", unit: "s", words: "shortest interval at which retrying for ever is safe" },
  uniform: { command: "retries", unit: "s", words: "shortest safe uniform interval for the profile's attempts" },
  "timeout-min": { command: "supervise", unit: "s", words: "shortest timeout that lets every healthy corner complete" },
  "timeout-max": { command: "supervise", unit: "s", words: "longest timeout a short allows" },
  "timeout-window": { command: "supervise", unit: "s", words: "timeout-max − timeout-min (negative: no safe timeout)" },
  capacity: { command: "size", unit: "J/K", words: "heat capacity the part needs to stay within limit − margin" },
} as const;

/** Name of a study answer. */
export type StudyAnswerName = keyof typeof STUDY_ANSWERS;

/** Every answer name, in the order help lists them. */
export const STUDY_ANSWER_NAMES = Object.keys(STUDY_ANSWERS) as StudyAnswerName[];

/** Defaults of the study commands, declared once (code, help and docs read them). */
export const STUDY_DEFAULTS = {
  /** answers a sweep reports when --answer is not given */
  sweepAnswers: ["peak", "margin"] as readonly StudyAnswerName[],
  /** answers a Monte Carlo run reports */
  monteCarloAnswers: ["peak", "margin"] as readonly StudyAnswerName[],
  /** answers whose sensitivity is reported: the peak rise and the retry-for-ever interval */
  sensitivityAnswers: ["rise", "forever"] as readonly StudyAnswerName[],
  /**
   * relative step h of the central difference: p·(1 ± h). The truncation error of the
   * normalised sensitivity is O(h²) (a smooth answer's third derivative times h²/6); 1 % keeps it
   * near 1e-4 and well above the engine's own rounding.
   */
  sensitivityStep: 0.01,
  /** Monte Carlo samples */
  samples: 1000,
  /** random seed */
  seed: 1,
  /** confidence level of the crossing probability's interval */
  confidence: 0.95,
  /** the standard normal quantile Φ⁻¹(0.975) of that two-sided 95 % level */
  confidenceZ: 1.959963984540054,
  /** most points of a sweep (a guard against a mistyped range) */
  maxPoints: 10_000,
  /** most draws a truncated distribution may reject in a row before it refuses */
  maxRejections: 1000,
} as const;
