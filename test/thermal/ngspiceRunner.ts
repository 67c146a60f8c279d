// Runs ngspice (Debian package `ngspice`) on an RC netlist in the thermal analogy and reads back
// one node voltage: R in K/W as ohms, C in J/K as farads, power in W as a current source into the
// heated node, rise in K as the node voltage. Shared by test/thermal/ngspice.test.ts and
// test/bench/thermal.bench.ts. It throws (never skips) when ngspice is missing or its run aborts.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { FosterNetwork, ThermalGraph } from "../../src/internal.js";
import { requireNgspiceRan } from "../helpers/requireNgspice.js";

/** Plain exponent notation: SPICE reads "1M" as milli and "2F" as femto, so never emit suffixes. */
export function spiceNumber(x: number): string {
  return x.toExponential(15);
}

/** The SPICE tolerance options of every run here. */
export const NGSPICE_OPTIONS = ".options reltol=1e-5 abstol=1e-10 vntol=1e-8";

/** Netlist lines of a Foster network between node "j" and ground: stage i is R_i ∥ C_i from n(i) to n(i+1). */
export function fosterElements(network: FosterNetwork): string[] {
  const lines: string[] = [];
  network.stages.forEach((s, i) => {
    const a = i === 0 ? "j" : `f${i}`;
    const b = i === network.stages.length - 1 ? "0" : `f${i + 1}`;
    lines.push(`rf${i} ${a} ${b} ${spiceNumber(s.rKPerW)}`);
    lines.push(`cf${i} ${a} ${b} ${spiceNumber(s.tauS / s.rKPerW)}`);
  });
  return lines;
}

/** Netlist lines of a thermal graph: every node's capacity to ground, every link a resistor; "ambient" is ground. */
export function graphElements(graph: ThermalGraph): { lines: string[]; nodeName: (id: string) => string } {
  const names = new Map<string, string>();
  graph.nodes.forEach((n, i) => names.set(n.id, `g${i}`));
  const nodeName = (id: string): string => (id === "ambient" ? "0" : names.get(id)!);
  const lines: string[] = [];
  graph.nodes.forEach((n, i) => lines.push(`cg${i} ${nodeName(n.id)} 0 ${spiceNumber(n.cJPerK)}`));
  graph.links.forEach((l, i) => lines.push(`rg${i} ${nodeName(l.from)} ${nodeName(l.to)} ${spiceNumber(l.rKPerW)}`));
  return { lines, nodeName };
}

export interface NgspiceRun {
  readonly timeS: number[];
  readonly riseK: number[];
  readonly wallS: number;
  /** ngspice's own CPU time (user + system) [s] */
  readonly cpuS: number;
}

/** ngspice's own CPU time (user + system) from the `times` builtin of the bash that ran it [s]. */
function childCpuS(timesText: string | undefined): number {
  const childLine = (timesText ?? "").trim().split("\n")[1] ?? "";
  return [...childLine.matchAll(/(\d+)m([\d.]+)s/g)].reduce((sum, m) => sum + Number(m[1]) * 60 + Number(m[2]), 0);
}

/** Run `ngspice -b net.cir` in `dir` through bash, timed; throws on a missing ngspice or an aborted run. */
function spawnNgspice(dir: string, netlist: string): { log: string; wallS: number; cpuS: number } {
  writeFileSync(join(dir, "net.cir"), netlist);
  const started = process.hrtime.bigint();
  // Through bash so that its `times` builtin reports ngspice's own CPU time (the machine may be shared).
  const result = spawnSync("bash", ["-c", "ngspice -b net.cir; status=$?; echo '@@times'; times; exit $status"], { cwd: dir, encoding: "utf8", maxBuffer: 1 << 26 });
  const wallS = Number(process.hrtime.bigint() - started) / 1e9;
  requireNgspiceRan(result);
  const [output, timesText] = result.stdout.split("@@times");
  const log = `${output}\n${result.stderr}`;
  // ngspice exits with status 0 even when the run aborts: read the log.
  if (/error|abort|too small|singular/i.test(log)) throw new Error(`ngspice run failed:\n${log}`);
  return { log, wallS, cpuS: childCpuS(timesText) };
}

/**
 * The highest v(node) of a transient analysis, asked of ngspice with a measurement statement
 * (`.meas tran ... MAX`): no waveform is written, as a user after the peak alone would run it.
 * Same analysis and tolerances as {@link runNgspice}.
 */
export function measureNgspicePeak(elements: readonly string[], node: string, stopS: number, maxStepS: number, options = NGSPICE_OPTIONS): { peakK: number; wallS: number; cpuS: number } {
  const dir = mkdtempSync(join(tmpdir(), "heatledger-spice-"));
  try {
    const netlist = ["heatledger thermal network", ...elements, options, `.tran ${spiceNumber(maxStepS)} ${spiceNumber(stopS)} 0 ${spiceNumber(maxStepS)}`, `.meas tran peak max v(${node})`, ".end", ""].join("\n");
    const run = spawnNgspice(dir, netlist);
    const found = /^\s*peak\s*=\s*([-+\d.eE]+)/m.exec(run.log);
    if (found === null) throw new Error(`ngspice printed no measurement "peak":\n${run.log}`);
    return { peakK: Number(found[1]), wallS: run.wallS, cpuS: run.cpuS };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Run a transient analysis and return v(node) at every internal time point.
 * @param elements netlist element lines (network and source)
 * @param node the node to record
 * @param stopS end of the analysis [s]; maxStepS the largest internal step [s]
 * @param options SPICE tolerance options line
 */
export function runNgspice(elements: readonly string[], node: string, stopS: number, maxStepS: number, options = NGSPICE_OPTIONS): NgspiceRun {
  const dir = mkdtempSync(join(tmpdir(), "heatledger-spice-"));
  try {
    // ngspice lower-cases netlist lines, paths included: the output name is lower-case and relative.
    const netlist = [
      "heatledger thermal network",
      ...elements,
      options,
      `.tran ${spiceNumber(maxStepS)} ${spiceNumber(stopS)} 0 ${spiceNumber(maxStepS)}`,
      ".control",
      "set filetype=ascii",
      "set wr_singlescale",
      "set wr_vecnames",
      "run",
      `wrdata out.dat v(${node})`,
      ".endc",
      ".end",
      "",
    ].join("\n");
    const { wallS, cpuS } = spawnNgspice(dir, netlist);
    const rows = readFileSync(join(dir, "out.dat"), "utf8").trim().split("\n").slice(1);
    const timeS: number[] = [];
    const riseK: number[] = [];
    for (const row of rows) {
      const [t, v] = row.trim().split(/\s+/).map(Number);
      if (!Number.isFinite(t) || !Number.isFinite(v)) throw new Error(`ngspice output row not numeric: ${row}`);
      timeS.push(t!);
      riseK.push(v!);
    }
    if (timeS.length < 2 || timeS[timeS.length - 1]! < stopS * (1 - 1e-9)) throw new Error(`ngspice output stops at ${timeS[timeS.length - 1]} s before ${stopS} s`);
    return { timeS, riseK, wallS, cpuS };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
