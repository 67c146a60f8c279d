import { describeFound, inputError } from "../errors/InputError.js";
import { fleetCharts } from "../fleet/fleetCharts.js";
import { FLEET_DEFAULTS } from "../fleet/fleetDefaults.js";
import { fleetJson } from "../fleet/fleetJson.js";
import { fleetCautions, fleetNdjson } from "../fleet/fleetNdjson.js";
import type { FleetSummary } from "../fleet/fleetSummary.js";
import { formatFleetCsv } from "../fleet/formatFleetCsv.js";
import { formatFleetText } from "../fleet/formatFleetText.js";
import { verdictExitStatus } from "../stress/Verdict.js";
import { EXIT_INPUT } from "./CliIo.js";
import type { FleetOutputFlags } from "./commands/fleet.js";
import type { CliRun } from "./main.js";
import { refuseExistingOutput, refuseSharedOutputs, writeOutputFile } from "./readInputFile.js";

/** The --ndjson file, or undefined when NDJSON goes to stdout or not at all. */
function ndjsonFile(flags: FleetOutputFlags): string | undefined {
  return typeof flags.ndjson === "string" ? flags.ndjson : undefined;
}

/**
 * Check the output flags of `fleet` and `fleet merge` before the work: --top a whole number ≥ 0,
 * not both --json and NDJSON on stdout, output files that can be written (or --force) and not
 * the same path twice. Returns the table's row count.
 * @throws InputError (bad-option) naming the flag
 */
export function checkFleetOutputs(run: CliRun, flags: FleetOutputFlags): number {
  const top = flags.top === undefined ? FLEET_DEFAULTS.tableRows : Number(flags.top);
  if (!Number.isSafeInteger(top) || top < 0) throw inputError("bad-option", "--top", "a whole number of table rows ≥ 0", describeFound(flags.top));
  if (flags.json === true && flags.ndjson === true) throw inputError("bad-option", "--ndjson", "a file when --json prints to standard output (--ndjson FILE)", "--ndjson without a file");
  const force = flags.force === true;
  const outputs = [["--csv", flags.csv], ["--ndjson", ndjsonFile(flags)], ["--report", flags.report]] as const;
  refuseSharedOutputs(outputs);
  for (const [flag, path] of outputs) refuseExistingOutput(run.io, path, force, flag);
  return top;
}

/**
 * Write a fleet summary as the flags ask: the --csv, --ndjson and --report files, then on
 * standard output the JSON, the NDJSON or the text table with what was written. Sets the exit
 * status: 2 when a log could not be replayed, else the worst verdict's (verdictExitStatus).
 * @throws InputError when an output file cannot be written
 */
export async function writeFleetSummary(run: CliRun, summary: FleetSummary, flags: FleetOutputFlags, top: number): Promise<void> {
  const force = flags.force === true;
  const notes: string[] = [];
  const file = ndjsonFile(flags);
  if (flags.csv !== undefined) {
    writeOutputFile(run.io, flags.csv, formatFleetCsv(summary), force, "--csv");
    notes.push(`Units: ${summary.rows.length} rows written to ${flags.csv}`);
  }
  if (file !== undefined) {
    writeOutputFile(run.io, file, fleetNdjson(summary), force, "--ndjson");
    notes.push(`Partition: ${summary.rows.length} units written to ${file} (heatledger fleet merge reads it)`);
  }
  const text = formatFleetText(summary, run.io.columns, top);
  if (flags.report !== undefined) {
    const { writeChartReport } = await import("./writeChartReport.js");
    const { counts } = summary;
    const note = await writeChartReport(
      run.io,
      { report: flags.report, force },
      {
        title: `heatledger fleet: ${summary.header.profile}`,
        verdict: summary.verdict,
        verdictText:
          `${summary.rows.length} units: ${counts.fail} fail, ${counts.warn} warn, ${counts.pass} pass` + (counts.error > 0 ? `, ${counts.error} could not be replayed (listed in the text report)` : ""),
        cautions: fleetCautions(summary.header),
        text: formatFleetText(summary, 100, top),
      },
      fleetCharts(summary),
    );
    notes.push(note.trimEnd());
  }
  if (flags.json === true) run.io.out(`${JSON.stringify(fleetJson(summary), null, 2)}\n`);
  else if (flags.ndjson === true) run.io.out(fleetNdjson(summary));
  else run.io.out(`${text}${notes.map((n) => `${n}\n`).join("")}`);
  run.status = summary.counts.error > 0 ? EXIT_INPUT : verdictExitStatus(summary.verdict, flags.strict === true);
}
