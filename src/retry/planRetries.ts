import type { CircuitModels } from "../profile/CircuitModels.js";
import { inProfileFile } from "../profile/inProfileFile.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { type BackoffRuleAnswer, backoffRule, firstWaitCandidates } from "./backoffRule.js";
import { type FastestScheduleAnswer, fastestSchedule } from "./fastestSchedule.js";
import { type LockoutAnswer, lockoutAfterBurst } from "./lockoutAfterBurst.js";
import { type LockoutMap, lockoutMap } from "./lockoutMap.js";
import { type MaxAttemptsAnswer, maxAttempts } from "./maxAttempts.js";
import { type ForeverIntervalAnswer, minForeverInterval } from "./minForeverInterval.js";
import { type UniformIntervalAnswer, minUniformInterval } from "./minUniformInterval.js";
import { type ProfileRetrySetup, profileRetrySetup } from "./profileRetrySetup.js";
import { type RetryPolicyVerdict, retryPolicyVerdict } from "./retryPolicyVerdict.js";
import { scanGrid } from "./scanFeasibleBands.js";
import { InputError } from "../errors/InputError.js";

/** Every answer of the retry plan for one profile. */
export interface RetryPlanReport {
  readonly setup: ProfileRetrySetup;
  /** the profile's own retry policy, checked */
  readonly policy: RetryPolicyVerdict;
  /** item 1: shortest uniform interval for setup.attempts attempts */
  readonly uniformInterval: UniformIntervalAnswer;
  /** item 2: most attempts at setup.intervalS, or null when that interval is shorter than an attempt */
  readonly maxAttempts: MaxAttemptsAnswer | null;
  /** item 3: shortest interval for retrying for ever */
  readonly forever: ForeverIntervalAnswer;
  /** item 4: fastest safe schedule of setup.attempts attempts, and a back-off rule */
  readonly fastest: FastestScheduleAnswer;
  readonly backoff: BackoffRuleAnswer | null;
  /** item 5: lockout after the profile's own burst, and the return near ambient */
  readonly lockout: LockoutAnswer;
  /** item 6: the lockout map */
  readonly map: LockoutMap;
}

/**
 * Answer every retry-planning question for a profile's fault (the six answers of `heatledger retries`) over its
 * corner set, and check the profile's own policy. See profileRetrySetup for how the profile
 * becomes corners. No interval, wait or lockout proposed is shorter than the relay allows (the
 * corners' minWaitS), and each is a whole number of the firmware's timer steps, checked again by
 * simulation at that value (setup.timing). Cost: the sum of the solvers' costs (seconds at most for typical profiles).
 * @throws InputError for a profile the planner cannot work on (see profileRetrySetup)
 * @example
 * planRetries(profile("warehouse-robot-48v.yaml"), defaultCircuitModels).forever.minimumIntervalS // => 4.918
 */
export function planRetries(profile: DutyProfile, models: CircuitModels): RetryPlanReport {
  // a problem found while the answers are computed (a circuit model refusing a load) names the profile
  return inProfileFile(profile.file, () => planProfileRetries(profile, models));
}

function planProfileRetries(profile: DutyProfile, models: CircuitModels): RetryPlanReport {
  const setup = profileRetrySetup(profile, models);
  const corners = setup.scenarios;
  const policy = retryPolicyVerdict(corners, setup.policy, setup.lockoutS);
  const timerResolutionS = setup.timing.timerResolutionS;
  const uniformInterval = minUniformInterval(corners, setup.attempts, { spacing: setup.spacing, timerResolutionS });
  let max: MaxAttemptsAnswer | null = null;
  try {
    max = maxAttempts(corners, setup.intervalS, setup.spacing);
  } catch (error) {
    // an interval shorter than an attempt has no attempt count (max stays null); the report says so
    if (!(error instanceof InputError)) throw error;
  }
  const forever = minForeverInterval(corners, { spacing: setup.spacing, timerResolutionS });
  const fastest = fastestSchedule(corners, setup.attempts, { timerResolutionS });
  const candidates = firstWaitCandidates(fastest);
  const backoff = setup.attempts >= 2 && candidates.length > 0 ? backoffRule(corners, setup.attempts, candidates, { timerResolutionS }) : null;
  const lockout = lockoutAfterBurst(corners, setup.policy, { ambientReturnK: setup.nearAmbientK, timerResolutionS });
  const intervals = scanGrid(setup.map.fromS, setup.map.toS, setup.map.points, Math.log10(setup.map.toS / setup.map.fromS)).slice(-setup.map.points);
  const map = lockoutMap(corners, setup.map.attempts, intervals, setup.spacing);
  return { setup, policy, uniformInterval, maxAttempts: max, forever, fastest, backoff, lockout, map };
}
