// `npm run fuzz`: a longer campaign of the CLI fuzzer (test/helpers/cliFuzz.ts) than the suite's
// test/cli/fuzzCli.test.ts. FUZZ_CASES (default 3000) cases from FUZZ_SEED (default 1); prints the
// exit statuses by command, the slowest case, the peak heap, and every case with a problem (exit
// outside 0-2, a stack trace, an internal error, NaN/Infinity/undefined printed), with the seed
// and index that reproduce it. Exits 1 when any case has a problem.
import { bundledFiles, fuzzCase, fuzzProblems, runFuzzCase, seededUniform } from "../helpers/cliFuzz.js";
import { projectRoot } from "./projectRoot.js";

const cases = Number(process.env.FUZZ_CASES ?? 3000);
const seed = Number(process.env.FUZZ_SEED ?? 1);
const files = bundledFiles(projectRoot);
const random = seededUniform(seed);
const byCommand = new Map<string, number[]>();
const problems: string[] = [];
let slowest = { ms: 0, index: -1, argv: "" };
let peakHeapMiB = 0;
const started = performance.now();
for (let i = 0; i < cases; i++) {
  const c = fuzzCase(files, random);
  const t0 = performance.now();
  const outcome = await runFuzzCase(c);
  const ms = performance.now() - t0;
  if (ms > slowest.ms) slowest = { ms, index: i, argv: c.argv.join(" ") };
  peakHeapMiB = Math.max(peakHeapMiB, process.memoryUsage().heapUsed / 1024 / 1024);
  const command = c.argv[0] === "network" ? `network ${c.argv[1]}` : c.argv[0]!;
  const counts = byCommand.get(command) ?? [0, 0, 0, 0];
  counts[Math.min(outcome.status, 3)]! += 1;
  byCommand.set(command, counts);
  const found = fuzzProblems(outcome);
  if (found.length > 0) problems.push(`seed ${seed} case ${i} (${c.argv.join(" ")}): ${found.join(", ")}\n  ${outcome.err.split("\n").slice(0, 3).join("\n  ")}`);
  if ((i + 1) % 500 === 0) process.stderr.write(`${i + 1} cases, ${problems.length} with problems\n`);
}
const totalS = (performance.now() - started) / 1000;
console.log(`CLI fuzz campaign: ${cases} cases, seed ${seed}, ${totalS.toFixed(1)} s (${((totalS * 1000) / cases).toFixed(0)} ms a case)`);
console.log("| command | exit 0 | exit 1 | exit 2 | other |");
console.log("|---|---|---|---|---|");
for (const [command, counts] of [...byCommand].sort()) console.log(`| ${command} | ${counts.join(" | ")} |`);
console.log(`slowest case: ${slowest.ms.toFixed(0)} ms (case ${slowest.index}: ${slowest.argv}); peak heap ${peakHeapMiB.toFixed(0)} MiB`);
console.log(`cases with a problem: ${problems.length}`);
for (const p of problems) console.log(p);
process.exitCode = problems.length > 0 ? 1 : 0;
