// Helpers of the electro-thermal tests (not a test file): the outside references they share (the
// references themselves use no project thermal or circuit code). odex (the npm package, Hairer & Wanner's ODEX) typed as the
// tests call it; ngspice (Debian package `ngspice`) run in batch on a netlist that writes its
// vectors with wrdata; and the single thermal RC the closed forms are worked on.
import { spawnSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { join } from "node:path";
import { expect } from "vitest";
import { type ChargeThermalContext, type CircuitResult, runThermalHistory, traceSteps } from "../../src/internal.js";
import { requireNgspiceRan } from "./requireNgspice.js";

/** odex's Solver, as the electro-thermal tests use it. */
export interface OdexSolver {
  relativeTolerance: number;
  absoluteTolerance: number;
  denseOutput: boolean;
  maxSteps: number;
  solve(
    f: (x: number, y: number[]) => number[],
    x0: number,
    y0: number[],
    xEnd: number,
    out?: (n: number, xOld: number, x: number, y: number[], dense?: (c: number, x: number) => number) => boolean | void,
  ): { y: number[] };
}

const { Solver } = createRequire(import.meta.url)("odex") as { Solver: new (n: number) => OdexSolver };

/** An odex solver of n equations at tolerances 1e-12, dense output on. */
export function odexSolver(n: number): OdexSolver {
  const solver = new Solver(n);
  solver.relativeTolerance = 1e-12;
  solver.absoluteTolerance = 1e-12;
  solver.denseOutput = true;
  solver.maxSteps = 1e6;
  return solver;
}

/** One thermal RC seen by the MOSFET alone, starting at ambient. */
export function singleRc(rthKPerW: number, tauS: number, ambientC: number): ChargeThermalContext {
  return { roles: ["mosfet"], ambientC: [ambientC], tauS: [tauS], gainKPerW: [[[rthKPerW]]], startRiseK: [[0]] };
}

/**
 * Run `name`.cir in `work` with ngspice in batch and read the table its `wrdata name.dat ...`
 * wrote (one header line, then numeric rows): the columns by vector name ("time", "v(j)", ...).
 * ngspice's exit status says nothing reliable (1 after a good batch run with a .control block, 0
 * after some aborts): this checks that it ran and its log; the caller checks the data reach tstop.
 */
export function runNgspiceBatch(work: string, name: string, netlist: string): Record<string, number[]> {
  writeFileSync(join(work, `${name}.cir`), netlist);
  const run = spawnSync("ngspice", ["-b", `${name}.cir`], { cwd: work, encoding: "utf8" });
  requireNgspiceRan(run);
  expect(`${run.stdout}${run.stderr}`).not.toMatch(/error|abort|too small|singular/i);
  const [header, ...rows] = readFileSync(join(work, `${name}.dat`), "utf8").trim().split("\n");
  const names = header!.trim().split(/\s+/);
  const columns: Record<string, number[]> = Object.fromEntries(names.map((n) => [n, [] as number[]]));
  for (const row of rows) row.trim().split(/\s+/).forEach((cell, i) => columns[names[i]!]!.push(Number(cell)));
  return columns;
}

/**
 * The netlist of a charging element into the bus capacitor whose power heats a two-stage Foster
 * network from node j (its voltage: the rise over ambient), with a third B-source integrating the
 * power into 1 F (node en: the energy); `current` and `power` are B-source expressions that may
 * read v(j) and v(bus). Writes v(j), v(en) and v(bus) to `name`.dat.
 */
export function fosterChargeNetlist(o: { title: string; name: string; current: string; power: string; capacitanceF: number; rf: readonly number[]; tauS: readonly number[]; tstopS: number }): string {
  return `* ${o.title}, Foster network from node j (rise over ambient)
b1 0 bus i=${o.current}
c1 bus 0 ${o.capacitanceF} ic=0
b2 0 j i=${o.power}
r1 j n2 ${o.rf[0]}
c1t j n2 ${o.tauS[0]! / o.rf[0]!} ic=0
r2 n2 0 ${o.rf[1]}
c2t n2 0 ${o.tauS[1]! / o.rf[1]!} ic=0
b3 0 en i=${o.power}
cen en 0 1 ic=0
.options reltol=1e-6 abstol=1e-12 vntol=1e-9
.tran 1e-5 ${o.tstopS} 0 1e-4 uic
.control
set filetype=ascii
set wr_singlescale
set wr_vecnames
run
wrdata ${o.name}.dat v(j) v(en) v(bus)
.endc
.end
`;
}

/**
 * A MOSFET charge's result against ngspice on fosterChargeNetlist (run until the result's end):
 * the relative errors of our peak junction rise (the result's MOSFET trace through the thermal
 * engine on the same Foster network) and of the MOSFET energy, and ngspice's columns.
 */
export function mosfetChargeAgainstNgspice(work: string, r: CircuitResult, o: Omit<Parameters<typeof fosterChargeNetlist>[0], "tstopS">) {
  const cols = runNgspiceBatch(work, o.name, fosterChargeNetlist({ ...o, tstopS: r.durationS }));
  expect(cols.time!.at(-1)).toBeCloseTo(r.durationS, 9);
  const spicePeak = Math.max(...cols["v(j)"]!);
  const spiceEnergy = cols["v(en)"]!.at(-1)!;
  const model = { tauS: o.tauS, sources: ["mosfet"], observed: ["mosfet"], gainKPerW: [[o.rf]] };
  const ours = runThermalHistory(model, traceSteps([r.traces.mosfet!]));
  return { peakError: ours.peakRiseK[0]! / spicePeak - 1, energyError: r.energy.partsJ.mosfet! / spiceEnergy - 1, spicePeak, cols, model };
}
