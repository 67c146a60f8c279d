import type { RetryPlanReport } from "../retry/planRetries.js";
import { reportCautions } from "../text/cautions.js";

/**
 * The machine form of `heatledger retries --json`: every answer as plain data (the corners'
 * attempt models are left out; numbers that are not finite become null), with the policy's
 * `verdict` (pass | warn | fail) first and the `cautions` last. Cost O(report size).
 * @example
 * const plan = planRetries(profile("warehouse-robot-48v.yaml"), defaultCircuitModels);
 * retryPlanJson(plan).forever.minimumIntervalS // => 4.918
 */
export function retryPlanJson(report: RetryPlanReport): unknown {
  const { setup } = report;
  const plain = {
    verdict: report.policy.verdict,
    fault: { type: setup.fault.type, field: setup.retry.field },
    corners: setup.corners,
    parts: setup.parts,
    timing: { ...setup.timing, shortestWaitS: setup.shortestWaitS },
    policy: {
      attempts: setup.retry.attempts,
      intervalS: setup.retry.intervalS,
      backoff: setup.retry.backoff,
      maxIntervalS: setup.retry.maxIntervalS,
      lockoutS: setup.lockoutS,
      ...report.policy,
    },
    uniformInterval: report.uniformInterval,
    maxAttempts: report.maxAttempts,
    forever: report.forever,
    fastest: { ...report.fastest, perCorner: undefined },
    backoff: report.backoff === null ? null : { ...report.backoff, perCorner: undefined },
    lockout: report.lockout,
    map: report.map,
    cautions: reportCautions(setup.linearMosfet),
  };
  return JSON.parse(JSON.stringify(plain, (_key, value: unknown) => (typeof value === "number" && !Number.isFinite(value) ? null : value)));
}
