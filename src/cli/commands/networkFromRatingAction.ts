import { InputError, describeFound, inputError, withLocation } from "../../errors/InputError.js";
import { parseStructuredText } from "../../format/parseStructuredText.js";
import { resolveStressConfig } from "../../stress/resolveStressConfig.js";
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

/** A rating read from its file: rows of the single-pulse energy table, each with its line, and what the file said of temperatures. */
interface ReadRating {
  readonly rows: readonly { readonly durationS: number; readonly energyJ: number }[];
  /** the rows as a quantity table (for the line of a row in messages) */
  readonly table: { readonly rows: readonly { readonly values: readonly number[]; readonly line: number }[]; readonly units: readonly string[] };
  /** the form the file gave the rating in, in words */
  readonly form: string;
  /** start and maximum temperature the file states (a family's pulse derating); undefined: not stated */
  readonly startC?: number;
  readonly maxC?: number;
}

/** A CSV rating table: duration and energy (the default form), or duration and peak power (--form power, E = P·t per row). */
function readCsvRating(run: CliRun, file: string, options: NetworkFromRatingFlags): ReadRating {
  const form = options.form ?? "energy";
  if (form !== "energy" && form !== "power") throw inputError("bad-option", "--form", "energy or power (a family file names its own form)", describeFound(form));
  const power = form === "power";
  const table = parseQuantityTable(
    readTextFile(run.io, file, "pulse rating table"),
    [
      { key: "duration", headerPattern: /^(t|time|t_?p|duration|pulse)\b/i, dimension: "time", unit: options.durationUnit, unitOption: "--duration-unit" },
      power
        ? { key: "power", headerPattern: /^(p|power|p_?max|peak)\b/i, dimension: "power", unit: options.powerUnit, unitOption: "--power-unit" }
        : { key: "energy", headerPattern: /^(e|energy|e_?max|w)\b/i, dimension: "energy", unit: options.energyUnit, unitOption: "--energy-unit" },
    ],
    file,
  );
  const rows = table.rows.map((r) => ({ durationS: r.values[0]!, energyJ: power ? r.values[1]! * r.values[0]! : r.values[1]! }));
  return { rows, table, form: power ? "peak pulse power against duration, E = P·t per row" : "single-pulse energy against duration" };
}

/**
 * A series of a resistor family file (the file profiles name in `ratings.series`): its
 * single-pulse rating in whichever form it has, read at `--resistance` for an energy-per-ohm
 * table, with its pulse derating's reference and maximum temperature as the defaults of the
 * temperature flags.
 */
function readFamilyRating(run: CliRun, file: string, options: NetworkFromRatingFlags): ReadRating {
  const doc = parseStructuredText(readTextFile(run.io, file, "resistor family file"), file);
  const list = (doc.data as { series?: { id?: unknown; ratings?: Record<string, unknown> }[] } | null)?.series;
  if (!Array.isArray(list)) throw withLocation(inputError("bad-file", "series", "a list of series, each { id, ratings }", describeFound(list)), file, "", doc.lineOf);
  const ids = list.map((s) => describeFound(s?.id)).join(", ");
  if (options.series === undefined) throw inputError("bad-option", "--series", `the id of a series in ${file}: ${ids}`, "nothing");
  const k = list.findIndex((s) => s?.id === options.series);
  if (k < 0) throw inputError("bad-option", "--series", `the id of a series in ${file}: ${ids}`, describeFound(options.series));
  const ratings = { ...(list[k]!.ratings ?? {}), ...(options.resistance === undefined ? {} : { resistance: options.resistance }) };
  let config;
  try {
    config = resolveStressConfig({ ratings }, { field: `series[${k}]` });
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    const renamed = new InputError(error.problems.map((p) => (p.field === `series[${k}].ratings.resistance` ? { ...p, field: "--resistance" } : p)));
    if (renamed.problems.every((p) => p.field === "--resistance")) throw renamed;
    throw withLocation(renamed, file, "", doc.lineOf);
  }
  if (config.pulseEnergy === undefined) throw inputError("bad-file", `series[${k}].ratings`, "a single-pulse rating: pulseEnergy, pulsePower or energyPerOhm", "none");
  const line = doc.lineOf(`series[${k}]`);
  const form =
    config.pulseEnergyForm === "energy-per-ohm"
      ? `energy per ohm of series ${options.series}, read log-log at ${config.resistanceOhm} ohm`
      : config.pulseEnergyForm === "power"
        ? `peak pulse power of series ${options.series}, E = P·t per row`
        : `single-pulse energy of series ${options.series}`;
  const derating = (list[k]!.ratings?.pulseEnergyDerating ?? {}) as { reference?: unknown; maxTemperature?: unknown };
  return {
    rows: config.pulseEnergy,
    table: { rows: config.pulseEnergy.map((r) => ({ values: [r.durationS, r.energyJ], line })), units: ["s", "J"] },
    form,
    ...(derating.reference === undefined ? {} : { startC: parseQuantity(derating.reference, "temperature", `series[${k}].ratings.pulseEnergyDerating.reference`) }),
    ...(derating.maxTemperature === undefined ? {} : { maxC: parseQuantity(derating.maxTemperature, "temperature", `series[${k}].ratings.pulseEnergyDerating.maxTemperature`) }),
  };
}

/**
 * The run of `heatledger network from-rating TABLE.csv` (flags and help are in networkFromRating.ts,
 * which loads this module, and with it the fitting libraries, only when the command runs): turn the
 * rating table into Zth points, fit them as `network fit` does, print the report and write or print
 * the network file.
 * @throws InputError for missing or bad temperatures, a bad table, bad fit flags, or an --out file that exists without --force
 */
export function networkFromRatingAction(run: CliRun, file: string, options: NetworkFromRatingFlags): void {
  const family = /\.(ya?ml|json)$/i.test(file);
  if (!family && (options.series !== undefined || options.resistance !== undefined))
    throw inputError("bad-option", options.series !== undefined ? "--series" : "--resistance", "a resistor family file (.yaml or .json) to go with it", describeFound(file));
  if (family && options.form !== undefined) throw inputError("bad-option", "--form", "no --form with a family file (each series names its own form)", describeFound(options.form));
  const rating = family ? readFamilyRating(run, file, options) : readCsvRating(run, file, options);
  const startRaw = options.startTemperature;
  const maxRaw = options.maxTemperature;
  if (startRaw === undefined && rating.startC === undefined)
    throw inputError("bad-option", "--start-temperature", "the temperature the rating starts from, such as \"25 degC\"", "nothing");
  if (maxRaw === undefined && rating.maxC === undefined)
    throw inputError("bad-option", "--max-temperature", "the element temperature the rated pulse reaches, such as \"350 degC\"", "nothing");
  const startC = startRaw === undefined ? rating.startC! : parseQuantity(startRaw, "temperature", "--start-temperature");
  const maxC = maxRaw === undefined ? rating.maxC! : parseQuantity(maxRaw, "temperature", "--max-temperature");
  const table = rating.table;
  let points;
  try {
    points = zthFromPulseRating(rating.rows, { startC, maxC }, "table");
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
    const extra = { form: rating.form, startTemperatureC: startC, maxTemperatureC: maxC, allowedRiseK: riseK, assumptions: PULSE_RATING_ASSUMPTIONS, energyTable: rating.rows, zthPoints: points };
    run.io.out(`${JSON.stringify(fitJson(fit, file, emitted.written, extra, options.name), null, 2)}\n`);
    return;
  }
  const head = [
    ...wrapText(`Pulse rating ${file}: ${points.length} rows, from ${formatNumber(startC)} degC to ${formatNumber(maxC)} degC (allowed rise ${formatNumber(riseK)} K)`, 100).split("\n"),
    ...wrapText(`Form: ${rating.form}`, 100).split("\n"),
    `Zth(t_p) = ${formatNumber(riseK)} K * t_p / E_max(t_p), assuming:`,
    ...PULSE_RATING_ASSUMPTIONS.map((a) => wrapText(`  - ${a}`, 100).replace(/\n/g, "\n    ")),
    "",
  ].join("\n");
  run.io.out(`${head}\n${formatFosterFit(fit, points, Math.min(run.io.columns, 100))}\n${emitted.text}\n${formatCautions(false)}`);
}
