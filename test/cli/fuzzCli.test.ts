import { describe, expect, test } from "vitest";
import { bundledFiles, fuzzCase, fuzzProblems, runFuzzCase, seededUniform } from "../helpers/cliFuzz.js";
import { projectRoot } from "../bench/projectRoot.js";

// The CLI under mutated input, in process through runCli (the bin's own entry): the bundled
// profiles, networks and field log, each with one to three seeded mutations (hostile numbers,
// lines deleted, doubled, swapped or re-indented, YAML and control fragments spliced in, text cut
// short, keys misspelt). Every run must exit 0, 1 or 2 with no stack trace, no internal error and
// no NaN, Infinity or undefined printed as a value. A fixed seed: the same cases every run.
// `npm run fuzz` runs a longer campaign with the same generator (test/bench/fuzz.ts).

const CASES = 200;
const SEED = 20261202;

describe("fuzzing the CLI with mutated bundled inputs", () => {
  test(`${CASES} seeded cases: exit 0, 1 or 2, nothing raw`, { timeout: 240_000 }, async () => {
    const files = bundledFiles(projectRoot);
    const random = seededUniform(SEED);
    const failures: string[] = [];
    const statuses = [0, 0, 0];
    for (let i = 0; i < CASES; i++) {
      const c = fuzzCase(files, random);
      const outcome = await runFuzzCase(c);
      const problems = fuzzProblems(outcome);
      if (problems.length > 0) failures.push(`case ${i} (${c.argv.join(" ")}): ${problems.join(", ")}\n${outcome.err.slice(0, 400)}`);
      else statuses[outcome.status]! += 1;
    }
    expect(failures).toEqual([]);
    // the mutations reach past the parser: some runs complete, most are refused
    expect(statuses[0]! + statuses[1]!).toBeGreaterThan(CASES / 20);
    expect(statuses[2]!).toBeGreaterThan(CASES / 4);
  });
});
