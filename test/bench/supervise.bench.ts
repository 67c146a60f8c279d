// Supervision speed figures: the whole answer for the bundled electric-boat profile
// (16 healthy corners, two bus-voltage ends into a short, a 3-attempt retry policy with lockout)
// and its parts. Printed, never asserted (`npm run bench -- supervise`).
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { projectRoot } from "./projectRoot.js";
import { defaultCircuitModels, longestShortFromState, longestShortUnderPolicy, loadProfile, profileRetryPolicy, shortedScenario, supervisePrecharge } from "../../src/internal.js";

function time<T>(work: () => T): { ms: number; result: T } {
  const t0 = performance.now();
  const result = work();
  return { ms: performance.now() - t0, result };
}

export async function run(print: (line: string) => void): Promise<void> {
  const file = join(projectRoot, "profiles/electric-boat-72v-supervision.yaml");
  const profile = loadProfile(readFileSync(file, "utf8"), file, (p) => readFileSync(join(dirname(file), p), "utf8"));
  const part = profile.parts[0]!;
  const build = (t: number) => shortedScenario(profile, part, 84, t, defaultCircuitModels);
  const cold = time(() => longestShortFromState(build));
  print(`longest short from cold (bisection, 4-stage Foster): ${cold.ms.toFixed(0)} ms -> ${cold.result.longestS.toFixed(4)} s`);
  const policy = time(() => longestShortUnderPolicy(build, profileRetryPolicy(profile.events)!));
  print(`longest short through the retry policy (retryPolicyVerdict per step): ${policy.ms.toFixed(0)} ms -> ${policy.result.longestS.toFixed(4)} s`);
  const first = time(() => supervisePrecharge(profile, defaultCircuitModels));
  const second = time(() => supervisePrecharge(profile, defaultCircuitModels));
  print(`whole supervision answer, bundled profile: ${first.ms.toFixed(0)} ms first run, ${second.ms.toFixed(0)} ms second`);
}
