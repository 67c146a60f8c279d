// Benchmark: `heatledger replay` of generated field logs of 1e5, 1e6 and 1e7 lines (BENCH_REPLAY_LINES
// overrides, comma-separated), each a fresh process of the built CLI, and `heatledger simulate` of a
// profile stating the same events (the same one-count repeats a replay makes of its charging
// lines) for comparison. Wall time from spawn to exit, CPU time and peak RSS from GNU
// /usr/bin/time. Targets, read by people and never asserted: peak RSS under 200 MB at 1e7 lines
// and flat in the log's length (1e5 and 1e6 within 30 MB), replay at least as fast as simulate.
import { spawnSync } from "node:child_process";
import { closeSync, mkdtempSync, openSync, readFileSync, rmSync, writeFileSync, writeSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { projectRoot } from "./projectRoot.js";
import { CART_PARTS } from "../helpers/cartParts.js";

const GNU_TIME = "/usr/bin/time";

/** An invented 48 V cart: one resistor with a cycling model, no rating table. */
const PARTS = `ambient: 30 degC
${CART_PARTS}`;

/** The log's cycle: a start, a status line, a switch-off and a pause (seconds to the next line). */
const CYCLE = [
  ["power-up", 900],
  ["note", 300],
  ["power-down", 600],
  ["note", 1200],
] as const;

function writeLog(path: string, lines: number): void {
  const fd = openSync(path, "w");
  let chunk = "time,event,note\n";
  let t = 0;
  for (let i = 0; i < lines; i++) {
    const [word, gap] = CYCLE[i % 4]!;
    chunk += `${t},${word},\n`;
    t += gap;
    if (chunk.length > 1 << 16) {
      writeSync(fd, chunk);
      chunk = "";
    }
  }
  writeSync(fd, chunk);
  closeSync(fd);
}

/** The same events as a profile `simulate` runs: the replay's one-count repeat around each start, then the gaps. */
function sameEventsProfile(lines: number): string {
  return `name: bench, the events of a generated log of ${lines} lines
${PARTS}events:
  - repeat:
      count: ${lines / 4}
      events:
        - repeat: { count: 1, period: 900 s, events: [{ power-up: {} }] }
        - wait: 300 s
        - power-down: { off: 600 s }
        - wait: 1200 s
`;
}

interface Measured {
  readonly wallS: number;
  readonly cpuS: number;
  readonly peakRssMB: number;
  readonly status: number | null;
}

function measure(args: readonly string[], scratch: string): Measured {
  const report = join(scratch, "time.txt");
  const t0 = performance.now();
  const run = spawnSync(GNU_TIME, ["-o", report, "-f", "%U %S %M", process.execPath, join(projectRoot, "bin", "heatledger.js"), ...args], { stdio: "ignore" });
  const wallS = (performance.now() - t0) / 1000;
  const [user, system, rss] = readFileSync(report, "utf8").trim().split("\n").pop()!.split(" ").map(Number);
  return { wallS, cpuS: user! + system!, peakRssMB: rss! / 1024, status: run.status };
}

export async function run(print: (line: string) => void): Promise<void> {
  const sizes = (process.env.BENCH_REPLAY_LINES ?? "100000,1000000,10000000").split(",").map(Number);
  const scratch = mkdtempSync(join(tmpdir(), "heatledger-replay-bench-"));
  try {
    const profile = join(scratch, "cart.yaml");
    writeLog(join(scratch, "warm.csv"), 100);
    writeFileSync(profile, `name: bench cart\n${PARTS}events: [{ wait: 1 s }]\n`);
    measure(["replay", join(scratch, "warm.csv"), "--profile", profile], scratch); // warm the file cache
    print("| lines | replay wall [s] | replay CPU [s] | replay peak RSS [MB] | simulate (same events) wall [s] | simulate CPU [s] | simulate peak RSS [MB] |");
    print("|---:|---:|---:|---:|---:|---:|---:|");
    for (const lines of sizes) {
      const log = join(scratch, `log-${lines}.csv`);
      writeLog(log, lines);
      const same = join(scratch, `same-${lines}.yaml`);
      writeFileSync(same, sameEventsProfile(lines));
      const replay = measure(["replay", log, "--profile", profile], scratch);
      rmSync(log);
      const simulate = measure(["simulate", same], scratch);
      print(
        `| ${lines.toExponential(0)} | ${replay.wallS.toFixed(1)} | ${replay.cpuS.toFixed(1)} | ${replay.peakRssMB.toFixed(0)} | ` +
          `${simulate.wallS.toFixed(1)} | ${simulate.cpuS.toFixed(1)} | ${simulate.peakRssMB.toFixed(0)} |` +
          (replay.status === simulate.status ? "" : ` (exit ${replay.status} vs ${simulate.status})`),
      );
    }
    print("targets: peak RSS < 200 MB at 1e7 lines, 1e5 and 1e6 within 30 MB; replay CPU ≤ simulate CPU (wall time follows the load of the machine)");
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}
