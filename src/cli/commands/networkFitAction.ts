import { InputError, withLocation } from "../../errors/InputError.js";
import { type QuantityTable, parseQuantityTable } from "../../format/parseQuantityTable.js";
import { formatCautions, reportCautions } from "../../text/cautions.js";
import { formatFosterFit } from "../../report/formatFosterFit.js";
import { type FosterFit, fitFosterNetwork } from "../../thermal/fitFosterNetwork.js";
import type { ZthPoint } from "../../thermal/fitZthPoints.js";
import { networkToDocument } from "../../thermal/formatNetworkFile.js";
import type { CliIo } from "../CliIo.js";
import { commandProgress } from "../commandProgress.js";
import type { CliRun } from "../main.js";
import { readTextFile, refuseExistingOutput, refuseSharedOutputs } from "../readInputFile.js";
import { emitNetwork } from "./emitNetwork.js";
import { readFitFlags } from "./networkBuildFlags.js";
import type { NetworkFitFlags } from "./networkFit.js";

/**
 * Fit `points`, re-homing point errors onto the file's lines ("points[3].time" → line of row 3),
 * with the progress line of a long fit (commandProgress: the stage count being tried).
 * Shared by `network fit` and `network from-rating`.
 */
export function fitTablePoints(io: CliIo, verb: string, points: readonly ZthPoint[], table: QuantityTable, file: string, options: Record<string, unknown>): FosterFit {
  const fitOptions = readFitFlags(options);
  const progress = commandProgress(io, verb);
  try {
    const fit = fitFosterNetwork(points, fitOptions, "points", (stages) => progress.tick(() => `, trying ${stages} stage${stages === 1 ? "" : "s"}`));
    progress.finish();
    return fit;
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    const lineOf = (field: string): number => {
      const m = /^points\[(\d+)\]/.exec(field);
      return m === null ? 0 : (table.rows[Number(m[1])]?.line ?? 0);
    };
    throw withLocation(error, file, "", lineOf);
  } finally {
    progress.done();
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
    cautions: reportCautions(false),
  };
}

/**
 * The run of `heatledger network fit POINTS.csv` (flags and help are in networkFit.ts, which loads
 * this module, and with it the fitting libraries, only when the command runs): read the points,
 * fit a Foster network, print the report and write or print the network file; with --report or
 * --svg, the page of the fit's charts (fosterFitCharts: the points and the curve, the residuals).
 * @throws InputError for a bad points file, bad fit flags, or an --out, --report or --svg file that exists without --force
 */
export async function networkFitAction(run: CliRun, file: string, options: NetworkFitFlags): Promise<void> {
  refuseSharedOutputs([["--out", options.out], ["--report", options.report], ["--svg", options.svg]]);
  refuseExistingOutput(run.io, options.report, options.force === true, "--report");
  refuseExistingOutput(run.io, options.svg, options.force === true, "--svg");
  const table = parseQuantityTable(
    readTextFile(run.io, file, "Zth points file"),
    [
      { key: "time", headerPattern: /^(t|time|t_?p|duration|pulse)\b/i, dimension: "time", unit: options.timeUnit, unitOption: "--time-unit" },
      { key: "zth", headerPattern: /^(z|zth|z_?th|impedance)\b/i, dimension: "thermalResistance", unit: options.zthUnit, unitOption: "--zth-unit" },
    ],
    file,
  );
  const points = table.rows.map((r) => ({ timeS: r.values[0]!, zthKPerW: r.values[1]! }));
  const fit = fitTablePoints(run.io, "network fit", points, table, file, options);
  const emitted = emitNetwork(run, fit.network, options);
  if (options.json) {
    run.io.out(`${JSON.stringify(fitJson(fit, file, emitted.written, {}, options.name), null, 2)}\n`);
    return;
  }
  const text = `Fit of ${file} (${table.units[0]}, ${table.units[1]})\n${formatFosterFit(fit, points, Math.min(run.io.columns, 100))}\n${emitted.text}\n`;
  let chartNote = "";
  if (options.report !== undefined || options.svg !== undefined) {
    const [{ writeChartReport }, { fosterFitCharts }] = await Promise.all([import("../writeChartReport.js"), import("../../report/fosterFitCharts.js")]);
    const quality = `max relative error ${Number((fit.errors.maxRelativeError * 100).toPrecision(2))} %, RMS ${Number((fit.errors.rmsRelativeError * 100).toPrecision(2))} % over ${fit.pointCount} points`;
    chartNote = await writeChartReport(
      run.io,
      options,
      {
        title: `heatledger network fit: ${file}`,
        verdict: fit.warnings.length > 0 ? "warn" : "pass",
        verdictText: `Fit quality (not a judgement of the part): ${quality}${fit.warnings.length > 0 ? `; ${fit.warnings.join("; ")}` : ""}.`,
        cautions: reportCautions(false),
        text,
      },
      fosterFitCharts(fit, points),
    );
  }
  run.io.out(`${text}${chartNote}${chartNote === "" ? "" : "\n"}${formatCautions(false, Math.min(run.io.columns, 100))}`);
}
