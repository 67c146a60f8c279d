import type { Command } from "commander";
import { describeNetwork, formatDuration, formatNumber, formatTable, lineChart, logSpacedTimes, networkToModal, parseNetwork, zth } from "../../index.js";
import type { CliRun } from "../main.js";
import { readStructuredFile } from "../readInputFile.js";

/** Default number of Zth table rows in `network show`. */
export const ZTH_TABLE_ROWS = 13;

/** `heatledger network show FILE`. */
export function registerNetworkShow(network: Command, run: CliRun): void {
  network
    .command("show")
    .argument("<file>", "network file (YAML or JSON)")
    .description("print a network's Foster (modal) form, total Rth and Zth(t) as a table and a chart")
    .option("--json", "print one JSON object instead of the text report")
    .option("--rows <n>", "rows of the Zth table", String(ZTH_TABLE_ROWS))
    .action((file: string, options: { json?: boolean; rows: string }) => {
      const parsed = readStructuredFile(run.io, file, "network file", (data) => parseNetwork(data, ""));
      const model = networkToModal(parsed);
      const rows = Math.max(2, Math.min(200, Number.parseInt(options.rows, 10) || ZTH_TABLE_ROWS));
      const description = describeNetwork(parsed, model, rows);
      if (options.json) {
        run.io.out(`${JSON.stringify(description, null, 2)}\n`);
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
      run.io.out(`${out.join("\n")}\n`);
    });
}
