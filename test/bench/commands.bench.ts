// Every command on every bundled profile (and each `network` subcommand on the bundled network
// files and tables), each run as a fresh process of the built CLI, as a user runs it: wall time
// from spawn to exit (start-up included), CPU time (user + system) and peak resident memory of the
// process. Printed as a Markdown table the README's performance section takes; nothing asserted.
// Run: npm run bench -- commands   (BENCH_REPEATS=n: runs per case, the least wall time is kept)
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { projectRoot } from "./projectRoot.js";

/** GNU time's program: it reports the child's own CPU time and peak RSS (absent: wall time only). */
const GNU_TIME = "/usr/bin/time";

/** One measured run. */
interface Measured {
  readonly wallS: number;
  readonly cpuS: number | null;
  readonly peakRssMB: number | null;
  readonly status: number | null;
}

/** Run the built CLI once with these arguments, output discarded, measured. */
function measure(args: readonly string[], scratch: string): Measured {
  const bin = join(projectRoot, "bin", "heatledger.js");
  const timed = existsSync(GNU_TIME);
  const report = join(scratch, "time.txt");
  const command = timed ? GNU_TIME : process.execPath;
  const argv = timed ? ["-f", "%U %S %M", "-o", report, process.execPath, bin, ...args] : [bin, ...args];
  const t0 = performance.now();
  const run = spawnSync(command, argv, { cwd: projectRoot, stdio: "ignore", env: { ...process.env, COLUMNS: "100" } });
  const wallS = (performance.now() - t0) / 1000;
  if (!timed) return { wallS, cpuS: null, peakRssMB: null, status: run.status };
  // GNU time: user and system seconds, peak RSS in KB (its last line; a killed child adds one before)
  const [user, system, rss] = readFileSync(report, "utf8").trim().split("\n").pop()!.split(" ").map(Number);
  return { wallS, cpuS: user! + system!, peakRssMB: rss! / 1024, status: run.status };
}

/** The cases: command words and arguments, relative to the project root. */
function cases(): { label: string; input: string; args: string[] }[] {
  const profiles = readdirSync(join(projectRoot, "profiles"))
    .filter((f) => f.endsWith(".yaml"))
    .sort();
  const networks = readdirSync(join(projectRoot, "profiles", "networks"))
    .filter((f) => f.endsWith(".yaml"))
    .sort();
  const list: { label: string; input: string; args: string[] }[] = [{ label: "--help", input: "", args: ["--help"] }];
  for (const command of ["simulate", "retries", "supervise", "size", "guard"]) {
    for (const p of profiles) list.push({ label: command, input: p, args: [command, `profiles/${p}`] });
  }
  list.push({ label: "replay", input: "logs/irrigation-pump-returned-unit.csv", args: ["replay", "profiles/logs/irrigation-pump-returned-unit.csv", "--profile", "profiles/irrigation-pump-decade.yaml"] });
  for (const n of networks) {
    list.push({ label: "network show", input: `networks/${n}`, args: ["network", "show", `profiles/networks/${n}`] });
    // a graph has several nodes: convert the first observed one's Zth (the file names it first)
    const graph = /^form:\s*graph/m.test(readFileSync(join(projectRoot, "profiles", "networks", n), "utf8"));
    const observe = graph ? ["--observe", /^observed:\s*\[\s*([\w-]+)/m.exec(readFileSync(join(projectRoot, "profiles", "networks", n), "utf8"))?.[1] ?? ""] : [];
    list.push({ label: "network convert", input: `networks/${n}`, args: ["network", "convert", `profiles/networks/${n}`, "--to", graph ? "foster" : "cauer", ...observe] });
  }
  list.push({ label: "network fit", input: "networks/example-zth.csv", args: ["network", "fit", "profiles/networks/example-zth.csv"] });
  list.push({
    label: "network from-rating",
    input: "networks/example-pulse-rating.csv",
    args: ["network", "from-rating", "profiles/networks/example-pulse-rating.csv", "--start-temperature", "25 degC", "--max-temperature", "350 degC"],
  });
  list.push({
    label: "network lumped",
    input: "(flags)",
    args: ["network", "lumped", "--mass", "0.5 g", "--material", "nichrome", "--r-body", "2 K/W", "--body-mass", "20 g", "--body-material", "alumina", "--r-ambient", "25 K/W"],
  });
  return list;
}

const seconds = (s: number): string => s.toFixed(2);

export async function run(print: (line: string) => void): Promise<void> {
  const repeats = Math.max(1, Number(process.env["BENCH_REPEATS"] ?? 3));
  const scratch = mkdtempSync(join(tmpdir(), "heatledger-bench-"));
  try {
    print(`fresh process per run, ${repeats} run(s) per case, least wall time kept; target: every case under 2 s wall, most under 1 s`);
    print(existsSync(GNU_TIME) ? `CPU and peak RSS from ${GNU_TIME}` : `${GNU_TIME} not found: wall time only`);
    print("");
    print("| command | input | wall [s] | CPU [s] | peak RSS [MB] | exit |");
    print("|---|---|---|---|---|---|");
    let over1 = 0;
    let over2 = 0;
    let count = 0;
    for (const c of cases()) {
      let best: Measured | null = null;
      for (let i = 0; i < repeats; i++) {
        const m = measure(c.args, scratch);
        if (best === null || m.wallS < best.wallS) best = m;
      }
      count++;
      if (best!.wallS > 1) over1++;
      if (best!.wallS > 2) over2++;
      const cpu = best!.cpuS === null ? "n/a" : seconds(best!.cpuS);
      const rss = best!.peakRssMB === null ? "n/a" : best!.peakRssMB.toFixed(0);
      print(`| ${c.label} | ${c.input} | ${seconds(best!.wallS)} | ${cpu} | ${rss} | ${best!.status ?? "killed"} |`);
    }
    print("");
    print(`${count} cases: ${count - over1} under 1 s, ${over1 - over2} from 1 to 2 s, ${over2} over 2 s (exit 1: a limit crossed, as the profile means; exit 2: the profile lacks what the command needs)`);
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}
