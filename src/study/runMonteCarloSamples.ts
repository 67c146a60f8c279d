import { InputError } from "../errors/InputError.js";
import { forgetPeakGuess } from "../thermal/segmentPeak.js";
import { type StudyAnswerOptions, type StudyAnswers, evaluateStudyAnswers } from "./evaluateStudyAnswers.js";
import { SeededRandom } from "./SeededRandom.js";
import { type StudyDistribution, drawStudyValue } from "./StudyDistribution.js";
import type { StudyProfile } from "./StudyProfile.js";
import type { StudyAnswerName } from "./studyDefaults.js";

/** One Monte Carlo sample: the values drawn (SI, one per distribution) and the answers there. */
export interface MonteCarloSample {
  readonly index: number;
  readonly values: readonly number[];
  readonly answers: StudyAnswers | null;
  /** why the profile refused the sample's values, else null */
  readonly problem: string | null;
}

/**
 * Run samples `from` ≤ index < `to` of a Monte Carlo run: each draws its values in the order of
 * the distributions from its own stream (SeededRandom.forSample(seed, index)), loads the profile
 * with them and works out the answers. The result of a sample depends only on the seed and its
 * index, so the samples can be split among workers in any way (the peak search's warm start
 * is forgotten before each sample, so not even the last bit depends on the sample before).
 * Cost: (to − from) × (one profile load + the answers' commands).
 * @param onSample called after each sample
 */
export function runMonteCarloSamples(
  study: StudyProfile,
  distributions: readonly StudyDistribution[],
  answers: readonly StudyAnswerName[],
  options: StudyAnswerOptions,
  seed: number,
  from: number,
  to: number,
  onSample?: () => void,
): MonteCarloSample[] {
  const out: MonteCarloSample[] = [];
  for (let index = from; index < to; index++) {
    forgetPeakGuess();
    const random = SeededRandom.forSample(seed, index);
    const values = distributions.map((d) => drawStudyValue(d, random));
    try {
      const profile = study.load(values.map((v, i) => [distributions[i]!.parameter, v] as const));
      out.push({ index, values, answers: evaluateStudyAnswers(profile, answers, options), problem: null });
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      out.push({ index, values, answers: null, problem: error.message.split("\n")[0]! });
    }
    onSample?.();
  }
  return out;
}
