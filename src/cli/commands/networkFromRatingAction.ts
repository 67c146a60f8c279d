import { InputError, inputError, withLocation } from "../../errors/InputError.js";
import { parseQuantityTable } from "../../format/parseQuantityTable.js";
import { formatCautions, wrapText } from "../../text/cautions.js";
import { formatFosterFit } from "../../report/formatFosterFit.js";
import { formatNumber } from "../../text/formatTable.js";
import { PULSE_RATING_ASSUMPTIONS, zthFromPulseRating } from "../../thermal/zthFromPulseRating.js";
import { parseQuantity } from "../../units/parseQuantity.js";
import type { CliRun } from "../main.js";
import { readTextFile } from "../readInputFile.js";
import { emitNetwork } from "./emitNetwork.js";
import type { NetworkFromRatingFlags } from "./networkFromRating.js";
import { fitJson, fitTablePoints } from "./networkFitAction.js";

/**
 * The run of `heatledger network from-rating TABLE.csv` (flags and help are in networkFromRating.ts,
 * which loads this module, and with it the fitting libraries, only when the command runs): turn the
 * rating table into Zth points, fit them as `network fit` does, print the report and write or print
 * the network file.
 * @throws InputError for missing or bad temperatures, a bad table, bad fit flags, or an --out file that exists without --force
 */
export function networkFromRatingAction(run: CliRun, file: string, options: NetworkFromRatingFlags): void {
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
  // a single-pulse energy rating is a resistor's: the network's node is its element
  const fitted = fitTablePoints(run.io, "network from-rating", points, table, file, options);
  const fit = { ...fitted, network: { ...fitted.network, part: "resistor" as const } };
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
}
