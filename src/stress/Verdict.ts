/**
 * The one verdict vocabulary of every command that judges a part against its temperature limit
 * (simulate, replay, retries, supervise, size) and the one exit-status rule, declared once: the
 * reports, the JSON `verdict` keys, every command's --help and the README read it from here.
 *
 * Rule (of our own): a peak at or below the part's limit less its design margin passes; a peak
 * inside the margin (above limit − margin, at or below the limit) warns; a peak above the limit
 * fails. A run's verdict is the worst of its parts' and answers'. Exit status 0 for pass and warn,
 * 1 for fail (and for warn under --strict, for CI gating); bad input exits 2 (src/cli/CliIo.ts).
 *
 * This module imports nothing, so the command definitions can print the rule in --help without
 * loading the library.
 */

/** pass: within limit − margin; warn: inside the margin, not above the limit; fail: above the limit. */
export type Verdict = "pass" | "warn" | "fail";

/** One verdict word: what it means and the exit status it sets, without and with --strict. */
export interface VerdictRule {
  readonly meaning: string;
  readonly exitStatus: number;
  readonly strictExitStatus: number;
}

/** The verdict words, mildest first, with their meaning and exit status. */
export const VERDICTS: Readonly<Record<Verdict, VerdictRule>> = {
  pass: { meaning: "every peak at or below its limit less its design margin", exitStatus: 0, strictExitStatus: 0 },
  warn: { meaning: "a peak inside the design margin: above limit − margin, at or below the limit", exitStatus: 0, strictExitStatus: 1 },
  fail: { meaning: "a peak above its limit", exitStatus: 1, strictExitStatus: 1 },
};

/** The verdict words in order of severity (index = severity). */
export const VERDICT_ORDER: readonly Verdict[] = ["pass", "warn", "fail"];

/**
 * The verdict of one peak against its limit and design margin:
 *   pass  peak ≤ limit − margin
 *   warn  limit − margin < peak ≤ limit
 *   fail  peak > limit (and a peak that is not a number, so a bad value never passes)
 * Source: rule of our own (module header). Cost O(1).
 * @param peakC highest temperature [°C]
 * @param limitC the part's maximum temperature [°C]
 * @param marginK the design margin kept below the limit [K]
 * @example
 * peakVerdict(190, 200, 25) // => "warn"
 */
export function peakVerdict(peakC: number, limitC: number, marginK: number): Verdict {
  if (peakC <= limitC - marginK) return "pass";
  return peakC <= limitC ? "warn" : "fail";
}

/**
 * The worst of some verdicts ("pass" for none). Cost O(n).
 * @example
 * worstVerdict(["pass", "warn", "pass"]) // => "warn"
 */
export function worstVerdict(verdicts: Iterable<Verdict>): Verdict {
  let worst = 0;
  for (const v of verdicts) worst = Math.max(worst, VERDICT_ORDER.indexOf(v));
  return VERDICT_ORDER[worst]!;
}

/**
 * The exit status a verdict sets: 0 for pass and warn, 1 for fail; with `strict`, warn is 1 too.
 * Cost O(1).
 * @example
 * verdictExitStatus("warn", true) // => 1
 */
export function verdictExitStatus(verdict: Verdict, strict: boolean): number {
  return strict ? VERDICTS[verdict].strictExitStatus : VERDICTS[verdict].exitStatus;
}

/**
 * A rating-table status as a verdict: an event over a rating fails; an event outside a table was
 * not checked, which warns; otherwise pass. Rating checks are secondary to the temperature
 * verdict and reported beside it. Cost O(1).
 * @example
 * ratingVerdict("outside-table") // => "warn"
 */
export function ratingVerdict(status: "pass" | "fail" | "outside-table"): Verdict {
  return status === "fail" ? "fail" : status === "outside-table" ? "warn" : "pass";
}

/**
 * The closing line of a report: `Verdict: warn (a peak inside the design margin: ...).`, with the
 * word's own meaning unless the report gives the reason in its own words.
 * @example
 * verdictLine("pass") // => "Verdict: pass (every peak at or below its limit less its design margin)."
 */
export function verdictLine(verdict: Verdict, reason: string = VERDICTS[verdict].meaning): string {
  return `Verdict: ${verdict} (${reason}).`;
}
