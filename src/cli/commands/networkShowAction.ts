import { formatCautions, reportCautions } from "../../text/cautions.js";
import { describeNetwork } from "../../report/describeNetwork.js";
import { formatDuration, formatNumber, formatTable } from "../../text/formatTable.js";
import { lineChart } from "../../report/lineChart.js";
import { parseNetwork } from "../../thermal/parseNetwork.js";
import { networkToModal } from "../../thermal/ThermalNetwork.js";
import { logSpacedTimes, zth } from "../../thermal/zth.js";
import type { CliRun } from "../main.js";
import { readStructuredFile } from "../readInputFile.js";
import { type NetworkShowFlags, ZTH_TABLE_ROWS } from "./networkShow.js";
import { InputError } from "../../errors/InputError.js";

/** The table's row count from --rows: a whole number from 2 to 200 (the default when absent). */
function tableRows(text: string | undefined): number {
  if (text === undefined) return ZTH_TABLE_ROWS;
  const rows = /^\s*\d+\s*$/.test(text) ? Number(text) : Number.NaN;
  if (rows >= 2 && rows <= 200) return rows;
  throw new InputError({ code: "bad-option", file: "", line: 0, field: "--rows", expected: "a whole number of rows from 2 to 200", found: JSON.stringify(text) });
}

/**
 * The run of `heatledger network show FILE` (flags and help are in networkShow.ts, which loads
 * this module only when the command runs): print the network's Foster (modal) form, total Rth
 * and Zth(t) as a table and a chart for every source/observed pair, then the cautions; or one
 * JSON object with the same and `cautions`.
 * @throws InputError for an unreadable or invalid network file
 */
export function networkShowAction(run: CliRun, file: string, options: NetworkShowFlags): void {
  const rows = tableRows(options.rows);
  const parsed = readStructuredFile(run.io, file, "network file", (data) => parseNetwork(data, ""));
  const model = networkToModal(parsed);
  const description = describeNetwork(parsed, model, rows);
  if (options.json) {
    run.io.out(`${JSON.stringify({ ...description, cautions: reportCautions(false) }, null, 2)}\n`);
    return;
  }
  const out: string[] = [`Network ${file}: ${parsed.kind} form, ${model.tauS.length} modes`];
  for (const pair of description.pairs) {
    out.push("", `Heat into "${pair.source}", rise at "${pair.observed}": total Rth = ${formatNumber(pair.totalRthKPerW)} K/W`);
    out.push(
      formatTable(
        [{ heading: "mode" }, { heading: "R [K/W]", align: "right" }, { heading: "tau", align: "right" }, { heading: "C = tau/R [J/K]", align: "right" }],
        pair.foster.map((s, i) => [String(i + 1), formatNumber(s.rKPerW), formatDuration(s.tauS), s.rKPerW > 0 ? formatNumber(s.tauS / s.rKPerW) : "n/a"]),
      ),
    );
    out.push(
      formatTable(
        [{ heading: "t", align: "right" }, { heading: "Zth [K/W]", align: "right" }],
        pair.zth.map((p) => [formatDuration(p.timeS), formatNumber(p.zthKPerW)]),
      ),
    );
    const points = logSpacedTimes(pair.zth[0]!.timeS, pair.zth[pair.zth.length - 1]!.timeS, 400).map((t) => ({
      x: t,
      y: zth(model, t, model.observed.indexOf(pair.observed), model.sources.indexOf(pair.source)),
    }));
    out.push(lineChart([{ label: `Zth ${pair.source} -> ${pair.observed}`, points }], { logX: true, yUnit: "K/W", width: Math.min(run.io.columns, 100) }));
  }
  out.push("", formatCautions(false, Math.min(run.io.columns, 100)));
  run.io.out(out.join("\n"));
}
