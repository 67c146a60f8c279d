import type { Command } from "commander";
import {
  InputError,
  PULSE_RATING_ASSUMPTIONS,
  formatCautions,
  formatFosterFit,
  formatNumber,
  inputError,
  parseQuantity,
  parseQuantityTable,
  withLocation,
  wrapText,
  zthFromPulseRating,
} from "../../index.js";
import type { CliRun } from "../main.js";
import { readTextFile } from "../readInputFile.js";
import { type OutputFlags, addFitFlags, addOutputFlags, emitNetwork } from "./networkBuildFlags.js";
import { fitJson, fitTablePoints } from "./networkFit.js";

/** `heatledger network from-rating TABLE.csv`. */
export function registerNetworkFromRating(network: Command, run: CliRun): void {
  const command = network
    .command("from-rating")
    .argument("<table>", "CSV file of a single-pulse energy rating: pulse duration, energy")
    .description("turn a single-pulse energy rating table into Zth points and fit a Foster network")
    .option("--start-temperature <degC>", "element temperature the rating starts from (required), e.g. \"25 degC\"")
    .option("--max-temperature <degC>", "element temperature the rated pulse reaches (required), e.g. \"350 degC\"")
    .option("--duration-unit <unit>", "unit of the duration column when the header has none (s, ms)")
    .option("--energy-unit <unit>", "unit of the energy column when the header has none (J, mJ)");
  addFitFlags(command);
  addOutputFlags(command);
  command.addHelpText(
    "after",
    `
A pulse rating says how much energy one rectangular pulse of a given length may put into the part
when it starts at one temperature and may reach another. The table is a CSV file:
  # my resistor, single-pulse rating at 25 degC, element limit 350 degC
  duration [ms], energy [J]
  1,    12
  10,   40
  100,  150
  ...
Each row becomes a Zth point, Zth(t_p) = (T_max - T_start) * t_p / E_max(t_p), and the points are
fitted exactly as \`network fit\` does. The conversion assumes:
${PULSE_RATING_ASSUMPTIONS.map((a) => `  - ${a}`).join("\n")}
A table where a longer pulse is rated for less energy, or for more power, is rejected as misread.

Example:
  heatledger network from-rating rating.csv --start-temperature "25 degC" --max-temperature "350 degC" --out part.yaml`,
  );
  command.action((file: string, options: Record<string, unknown> & OutputFlags & { startTemperature?: string; maxTemperature?: string; durationUnit?: string; energyUnit?: string }) => {
    if (options.startTemperature === undefined) throw inputError("bad-option", "--start-temperature", "the temperature the rating starts from, such as \"25 degC\"", "nothing");
    if (options.maxTemperature === undefined) throw inputError("bad-option", "--max-temperature", "the element temperature the rated pulse reaches, such as \"350 degC\"", "nothing");
    const startC = parseQuantity(options.startTemperature, "temperature", "--start-temperature");
    const maxC = parseQuantity(options.maxTemperature, "temperature", "--max-temperature");
    const table = parseQuantityTable(
      readTextFile(run.io, file, "pulse rating table"),
      [
        { key: "duration", headerPattern: /^(t|time|t_?p|duration|pulse)\b/i, dimension: "time", unit: options.durationUnit, unitOption: "--duration-unit" },
        { key: "energy", headerPattern: /^(e|energy|e_?max|w)\b/i, dimension: "energy", unit: options.energyUnit, unitOption: "--energy-unit" },
      ],
      file,
    );
    let points;
    try {
      points = zthFromPulseRating(
        table.rows.map((r) => ({ durationS: r.values[0]!, energyJ: r.values[1]! })),
        { startC, maxC },
        "table",
      );
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      const flags: Record<string, string> = { maxTemperature: "--max-temperature", startTemperature: "--start-temperature" };
      const renamed = new InputError(error.problems.map((p) => ({ ...p, field: flags[p.field] ?? p.field })));
      if (error.problems.every((p) => p.field in flags)) throw renamed;
      throw withLocation(renamed, file, "", (field) => {
        const m = /^table\[(\d+)\]/.exec(field);
        return m === null ? 0 : (table.rows[Number(m[1])]?.line ?? 0);
      });
    }
    const fit = fitTablePoints(points, table, file, options);
    const emitted = emitNetwork(run, fit.network, options);
    const riseK = maxC - startC;
    if (options.json) {
      const extra = { startTemperatureC: startC, maxTemperatureC: maxC, allowedRiseK: riseK, assumptions: PULSE_RATING_ASSUMPTIONS, zthPoints: points };
      run.io.out(`${JSON.stringify(fitJson(fit, file, emitted.written, extra, options.name), null, 2)}\n`);
      return;
    }
    const head = [
      `Pulse rating ${file}: ${points.length} rows, from ${formatNumber(startC)} degC to ${formatNumber(maxC)} degC (allowed rise ${formatNumber(riseK)} K)`,
      `Zth(t_p) = ${formatNumber(riseK)} K * t_p / E_max(t_p), assuming:`,
      ...PULSE_RATING_ASSUMPTIONS.map((a) => wrapText(`  - ${a}`, 100).replace(/\n/g, "\n    ")),
      "",
    ].join("\n");
    run.io.out(`${head}\n${formatFosterFit(fit, points, Math.min(run.io.columns, 100))}\n${emitted.text}\n${formatCautions(false)}`);
  });
}
