import { inputError } from "../errors/InputError.js";
import { type FitCriterion, fitCriterion } from "./fitCriterion.js";
import { type FitOptions, resolveFitOptions } from "./fitDefaults.js";
import { fitNnlsSpectrum, nonNegativeResistances } from "./fitNnlsSpectrum.js";
import { refineFosterFit } from "./fitRefineFoster.js";
import { type FitRelativeErrors, fitRelativeErrors } from "./fitRelativeErrors.js";
import { type ZthPoint, validateZthPoints } from "./fitZthPoints.js";
import type { FosterNetwork, FosterStage } from "./fosterNetwork.js";
import { logSpacedTimes } from "./zth.js";

// The options, their defaults and their check live in fitDefaults.ts (no solver imports, so the
// CLI help can show the defaults without loading the fitting libraries); re-exported here.
export { FIT_DEFAULTS, resolveFitOptions } from "./fitDefaults.js";
export type { FitOptions, ResolvedFitOptions } from "./fitDefaults.js";

/** One stage count the fit tried. */
export interface FitCandidate {
  readonly stageCount: number;
  /** value of the information criterion (smaller is better) */
  readonly criterionValue: number;
  readonly maxRelativeError: number;
  readonly rmsRelativeError: number;
  /**
   * false when two of its time constants are closer than minTauRatio: the data cannot tell such
   * stages apart, so the count is not eligible however low its criterion value
   */
  readonly resolved: boolean;
}

/** A fitted Foster network with its statistics. */
export interface FosterFit {
  readonly network: FosterNetwork;
  /** errors of the chosen network against the points */
  readonly errors: FitRelativeErrors;
  /** "criterion": count chosen by `criterion`; "given": count fixed by the caller */
  readonly chosenBy: "criterion" | "given";
  readonly criterion: FitCriterion;
  /** every stage count tried, in increasing order */
  readonly candidates: readonly FitCandidate[];
  /** stages the NNLS spectrum found before refinement */
  readonly spectrumStageCount: number;
  readonly pointCount: number;
  /** sentences a user should read: where the network is an extrapolation of the data */
  readonly warnings: readonly string[];
}

/**
 * Fit a Foster network to transient thermal impedance points (t_i, Z_i).
 *
 * 1. A non-negative least-squares time-constant spectrum on a log-spaced grid, pruned into
 *    clusters (fitNnlsSpectrum), gives a first network.
 * 2. For each stage count n (the given one, or 1..maxStages limited by the points), start values are
 *    (a) the spectrum's clusters merged or split to n stages and (b) n log-spaced time constants
 *    over the data with NNLS resistances; each is refined by Levenberg-Marquardt on ln R, ln tau
 *    (refineFosterFit) and the better kept.
 * 3. The count with the smallest information criterion wins (fitCriterion), unless n was given,
 *    among counts whose neighbouring time constants differ by at least minTauRatio (closer ones
 *    are not resolved by the data);
 *    the search stops once two counts in a row score worse than the best so far.
 * Residuals are relative, (Zfit − Z)/Z, so every decade of the curve counts the same.
 * Sources: see fitNnlsSpectrum, refineFosterFit, fitCriterion; the Foster form itself: JEDEC
 * JESD51-14 (2010), annex on the Foster model.
 * Validity: the network reproduces Zth over the data range; beyond the last point the total
 * resistance is an extrapolation (the result warns when the slowest stage has not settled by the
 * last point, tau > t_last/3, or the fastest is faster than the first point, tau < t_first/3).
 * Needs at least 2n + 1 points for n stages (two parameters per stage, plus one); the criterion
 * tries at most (N − 1)/2 stages (BIC) or (N − 2)/2 (AICc). A fit that misses a point by more than
 * FIT_MISS_WARNING also warns.
 * Cost O(maxStages × iterations × points × stages²); about 0.1-0.5 s for 40 points, 8 stages.
 * @param points Zth points, times strictly increasing, all values > 0
 * @param options see {@link FIT_DEFAULTS}
 * @param onStageCount called before each stage count is tried, with the count (for a progress line)
 * @throws InputError `bad-network` for bad points or too few points; `bad-option` for bad options
 * @example
 * const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] });
 * const points = logSpacedTimes(1e-4, 20, 40).map((timeS) => ({ timeS, zthKPerW: zth(model, timeS) }));
 * fitFosterNetwork(points).network.stages.map((s) => s.tauS) // => [0.01, 2.00]
 */
export function fitFosterNetwork(points: readonly ZthPoint[], options: FitOptions = {}, field = "points", onStageCount?: (stages: number) => void): FosterFit {
  const o = resolveFitOptions(options);
  const given = o.stages > 0;
  const minPoints = given ? 2 * o.stages + 1 : 3;
  if (points.length < minPoints) {
    throw inputError(
      "bad-network",
      field,
      given
        ? `at least ${minPoints} Zth points to fit ${o.stages} stages (two parameters per stage, plus one)`
        : `at least ${minPoints} Zth points`,
      `${points.length} point${points.length === 1 ? "" : "s"}`,
    );
  }
  validateZthPoints(points, field, minPoints);
  const spectrum = fitNnlsSpectrum(points, o);
  const counts = given
    ? [o.stages]
    : Array.from({ length: Math.min(o.maxStages, mostStages(points.length, o.criterion)) }, (_, i) => i + 1);
  let best: { stages: FosterStage[]; value: number; count: number } | undefined;
  const candidates: FitCandidate[] = [];
  for (const n of counts) {
    onStageCount?.(n);
    const starts = [resizeStages(spectrum, n), logSpacedStart(points, n)];
    let bestForN: { stages: FosterStage[]; sumSquares: number } | undefined;
    for (const start of starts) {
      const refined = refineFosterFit(points, start, o);
      if (bestForN === undefined || refined.sumSquares < bestForN.sumSquares) bestForN = refined;
    }
    const network: FosterNetwork = { kind: "foster", stages: bestForN!.stages };
    const errors = fitRelativeErrors(network, points);
    const value = fitCriterion(o.criterion, points.length, 2 * n, bestForN!.sumSquares, o.dataResolution);
    const resolved = given || n === 1 || smallestTauRatio(bestForN!.stages) >= o.minTauRatio;
    candidates.push({ stageCount: n, criterionValue: value, maxRelativeError: errors.maxRelativeError, rmsRelativeError: errors.rmsRelativeError, resolved });
    if (resolved && (best === undefined || value < best.value)) best = { stages: bestForN!.stages, value, count: n };
    // two counts in a row not better than the best: more stages only add parameters to an
    // already resolved curve, and every further count costs more than all before it
    if (best !== undefined && n - best.count >= 2) break;
  }
  const network: FosterNetwork = { kind: "foster", stages: best!.stages };
  return {
    network,
    errors: fitRelativeErrors(network, points),
    chosenBy: given ? "given" : "criterion",
    criterion: o.criterion,
    candidates,
    spectrumStageCount: spectrum.length,
    pointCount: points.length,
    warnings: [...extrapolationWarnings(network, points), ...missWarnings(fitRelativeErrors(network, points), o.stages > 0)],
  };
}

/** A fit that misses a point by more than this fraction gets a warning (far above read-off error). */
export const FIT_MISS_WARNING = 0.05;

/**
 * The most stages N points support: 2n + 1 ≤ N (two parameters per stage, plus one); AICc needs
 * N > 2n + 1 to be finite.
 */
function mostStages(pointCount: number, criterion: FitCriterion): number {
  return criterion === "aicc" ? Math.floor((pointCount - 2) / 2) : Math.floor((pointCount - 1) / 2);
}

function missWarnings(errors: FitRelativeErrors, given: boolean): string[] {
  if (!(errors.maxRelativeError > FIT_MISS_WARNING)) return [];
  return [
    `the fit misses a point by ${Number((errors.maxRelativeError * 100).toPrecision(2))} % (at ${fmt(errors.worstTimeS)} s): ` +
      (given ? "try another stage count, or " : "") +
      "check that point and add points where the curve bends (4-8 per decade)",
  ];
}

/** Merge the two stages closest in ln tau, or split the largest-R stage, until there are n. */
function resizeStages(stages: readonly FosterStage[], n: number): FosterStage[] {
  const out = stages.map((s) => ({ ...s }));
  while (out.length > n) {
    let j = 0;
    for (let i = 1; i + 1 < out.length; i++) {
      if (Math.log(out[i + 1]!.tauS / out[i]!.tauS) < Math.log(out[j + 1]!.tauS / out[j]!.tauS)) j = i;
    }
    const a = out[j]!;
    const b = out[j + 1]!;
    const r = a.rKPerW + b.rKPerW;
    out.splice(j, 2, { rKPerW: r, tauS: Math.exp((a.rKPerW * Math.log(a.tauS) + b.rKPerW * Math.log(b.tauS)) / r) });
  }
  while (out.length < n) {
    let j = 0;
    for (let i = 1; i < out.length; i++) if (out[i]!.rKPerW > out[j]!.rKPerW) j = i;
    const s = out[j]!;
    // split a decade apart around the original tau: far enough for the solver to tell them apart
    out.splice(j, 1, { rKPerW: s.rKPerW / 2, tauS: s.tauS / Math.sqrt(10) }, { rKPerW: s.rKPerW / 2, tauS: s.tauS * Math.sqrt(10) });
  }
  return out;
}

/** n time constants log-spaced over the data, resistances by NNLS (zeros lifted to a small share). */
function logSpacedStart(points: readonly ZthPoint[], n: number): FosterStage[] {
  const first = points[0]!.timeS;
  const last = points[points.length - 1]!.timeS;
  const taus = n === 1 ? [Math.sqrt(first * last)] : logSpacedTimes(first, last, n);
  const r = nonNegativeResistances(points, taus);
  const total = r.reduce((a, b) => a + b, 0) || points[points.length - 1]!.zthKPerW;
  return taus.map((tauS, k) => ({ tauS, rKPerW: Math.max(r[k]!, total * 1e-3) }));
}

/** Smallest ratio of neighbouring time constants (stages sorted by tau); Infinity for one stage. */
function smallestTauRatio(stages: readonly FosterStage[]): number {
  let smallest = Number.POSITIVE_INFINITY;
  for (let i = 1; i < stages.length; i++) smallest = Math.min(smallest, stages[i]!.tauS / stages[i - 1]!.tauS);
  return smallest;
}

function extrapolationWarnings(network: FosterNetwork, points: readonly ZthPoint[]): string[] {
  const first = points[0]!.timeS;
  const last = points[points.length - 1]!.timeS;
  const slowest = network.stages[network.stages.length - 1]!;
  const fastest = network.stages[0]!;
  const warnings: string[] = [];
  if (slowest.tauS > last / 3) {
    warnings.push(
      `the data end at ${fmt(last)} s, before the slowest stage (tau ${fmt(slowest.tauS)} s) settles: ` +
        `the steady-state resistance ${fmt(network.stages.reduce((a, s) => a + s.rKPerW, 0))} K/W is an extrapolation; ` +
        `add points up to steady state or check it against the part's rated Rth`,
    );
  }
  if (fastest.tauS < first / 3) {
    warnings.push(`the fastest stage (tau ${fmt(fastest.tauS)} s) is faster than the first point (${fmt(first)} s): Zth below ${fmt(first)} s is an extrapolation`);
  }
  return warnings;
}

function fmt(x: number): string {
  return Number(x.toPrecision(3)).toString();
}
