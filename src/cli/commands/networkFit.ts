import type { Command } from "commander";
import { FIT_DEFAULTS } from "../../thermal/fitDefaults.js";
import type { CliRun } from "../main.js";
import { type OutputFlags, addFitFlags, addOutputFlags } from "./networkBuildFlags.js";
import { REPORT_OPTION, SVG_OPTION } from "./chartOptions.js";

/** What the flags of `heatledger network fit` parse to (the fit flags are read by readFitFlags). */
export type NetworkFitFlags = Record<string, unknown> & OutputFlags & { readonly timeUnit?: string; readonly zthUnit?: string; readonly report?: string; readonly svg?: string };

/** `heatledger network fit POINTS.csv`: flags and help here; the run is loaded from networkFitAction.ts when it starts. */
export function registerNetworkFit(network: Command, run: CliRun): void {
  const command = network
    .command("fit")
    .argument("<points>", "CSV file of transient thermal impedance points: time, Zth")
    .description("fit a Foster network to Zth(t) points read off a datasheet curve or measured")
    .option("--time-unit <unit>", "unit of the time column when the header has none (s, ms, us)")
    .option("--zth-unit <unit>", "unit of the Zth column when the header has none (K/W)");
  addFitFlags(command);
  addOutputFlags(command);
  command.option(REPORT_OPTION.flags, `${REPORT_OPTION.help}: the points with the fitted curve, and the fit residuals (--force overwrites it)`).option(SVG_OPTION.flags, SVG_OPTION.help);
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
  command.action(async (file: string, options: NetworkFitFlags) => {
    const { networkFitAction } = await import("./networkFitAction.js");
    await networkFitAction(run, file, options);
  });
}
