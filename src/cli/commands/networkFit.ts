import type { Command } from "commander";
import {
  FIT_DEFAULTS,
  type FosterFit,
  InputError,
  type QuantityTable,
  type ZthPoint,
  fitFosterNetwork,
  formatCautions,
  formatFosterFit,
  GENERAL_CAUTION,
  networkToDocument,
  parseQuantityTable,
  withLocation,
} from "../../index.js";
import type { CliRun } from "../main.js";
import { readTextFile } from "../readInputFile.js";
import { type OutputFlags, addFitFlags, addOutputFlags, emitNetwork, readFitFlags } from "./networkBuildFlags.js";

/**
 * Fit `points`, re-homing point errors onto the file's lines ("points[3].time" → line of row 3).
 * Shared by `network fit` and `network from-rating`.
 */
export function fitTablePoints(points: readonly ZthPoint[], table: QuantityTable, file: string, options: Record<string, unknown>): FosterFit {
  const fitOptions = readFitFlags(options);
  try {
    return fitFosterNetwork(points, fitOptions, "points");
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    const lineOf = (field: string): number => {
      const m = /^points\[(\d+)\]/.exec(field);
      return m === null ? 0 : (table.rows[Number(m[1])]?.line ?? 0);
    };
    throw withLocation(error, file, "", lineOf);
  }
}

/** The JSON object of a fit, shared by `network fit` and `network from-rating`. */
export function fitJson(fit: FosterFit, source: string, written: string | null, extra: Record<string, unknown> = {}, name?: string): Record<string, unknown> {
  return {
    source,
    ...extra,
    network: networkToDocument(fit.network, name),
    stages: fit.network.stages.map((s) => ({ rKPerW: s.rKPerW, tauS: s.tauS, cJPerK: s.tauS / s.rKPerW })),
    totalRthKPerW: fit.network.stages.reduce((a, s) => a + s.rKPerW, 0),
    pointCount: fit.pointCount,
    errors: fit.errors,
    chosenBy: fit.chosenBy,
    criterion: fit.criterion,
    candidates: fit.candidates,
    warnings: fit.warnings,
    written,
    caution: GENERAL_CAUTION,
  };
}

/** `heatledger network fit POINTS.csv`. */
export function registerNetworkFit(network: Command, run: CliRun): void {
  const command = network
    .command("fit")
    .argument("<points>", "CSV file of transient thermal impedance points: time, Zth")
    .description("fit a Foster network to Zth(t) points read off a datasheet curve or measured")
    .option("--time-unit <unit>", "unit of the time column when the header has none (s, ms, us)")
    .option("--zth-unit <unit>", "unit of the Zth column when the header has none (K/W)");
  addFitFlags(command);
  addOutputFlags(command);
  command.addHelpText(
    "after",
    `
The points file is a CSV table, one point per line, time first, with units in the header:
  # my part, read off the single-pulse Zth curve (duty 0)
  time [ms], Zth [K/W]
  0.01, 0.0021
  0.1,  0.0150
  ...
Columns are found by name (time / t / duration, zth / z), else by position. Units may instead be
given with --time-unit and --zth-unit. Times must increase; every value must be > 0. Read 4-8
points per decade, from the shortest time you care about to where the curve is flat.

How the fit works: a non-negative least-squares spectrum on a grid of ${FIT_DEFAULTS.pointsPerDecade} time constants per
decade gives a first network; Levenberg-Marquardt then refines ln R and ln tau of every stage,
minimising relative errors (each decade counts the same). Without --stages, counts 1 to
${FIT_DEFAULTS.maxStages} are tried and the smallest information criterion (BIC by default) wins: more stages
only when the data really need them; a count whose time constants crowd within a factor of
${FIT_DEFAULTS.minTauRatio} is skipped, as no Zth curve can tell such stages apart. The report gives the max and RMS relative error, every
count tried, a chart of the points against the fit, and warnings where the network extrapolates.

Examples:
  heatledger network fit profiles/networks/example-zth.csv
  heatledger network fit part-zth.csv --stages 4 --out part.yaml
  heatledger network fit part-zth.csv --time-unit s --zth-unit K/W --json`,
  );
  command.action((file: string, options: Record<string, unknown> & OutputFlags & { timeUnit?: string; zthUnit?: string }) => {
    const table = parseQuantityTable(
      readTextFile(run.io, file, "Zth points file"),
      [
        { key: "time", headerPattern: /^(t|time|t_?p|duration|pulse)\b/i, dimension: "time", unit: options.timeUnit, unitOption: "--time-unit" },
        { key: "zth", headerPattern: /^(z|zth|z_?th|impedance)\b/i, dimension: "thermalResistance", unit: options.zthUnit, unitOption: "--zth-unit" },
      ],
      file,
    );
    const points = table.rows.map((r) => ({ timeS: r.values[0]!, zthKPerW: r.values[1]! }));
    const fit = fitTablePoints(points, table, file, options);
    const emitted = emitNetwork(run, fit.network, options);
    if (options.json) {
      run.io.out(`${JSON.stringify(fitJson(fit, file, emitted.written, {}, options.name), null, 2)}\n`);
      return;
    }
    run.io.out(`Fit of ${file} (${table.units[0]}, ${table.units[1]})\n${formatFosterFit(fit, points, Math.min(run.io.columns, 100))}\n${emitted.text}\n${formatCautions(false)}`);
  });
}
