import { formatInputProblem } from "../errors/InputError.js";
import { studyTable } from "../report/studyTable.js";
import { formatCautions, wrapText } from "../text/cautions.js";
import { formatDuration, formatNumber } from "../text/formatTable.js";
import { LIFETIME_CAUTION } from "../text/stressCautions.js";
import { wrapHanging } from "../text/wrapHanging.js";
import type { FleetReplayedRow } from "./FleetUnitRow.js";
import { greatestDamage, leastMarginK } from "./compareFleetRows.js";
import { FLEET_DEFAULTS } from "./fleetDefaults.js";
import type { FleetSummary } from "./fleetSummary.js";

/** The earliest first exceedance over a unit's parts, with its log line; undefined: never above a limit. */
export function earliestExceedance(row: FleetReplayedRow): { readonly timeS: number; readonly line: number; readonly timestamp: string | null } | undefined {
  let best: { timeS: number; line: number; timestamp: string | null } | undefined;
  for (const p of row.parts)
    if (p.firstExceedanceS !== null && (best === undefined || p.firstExceedanceS < best.timeS)) best = { timeS: p.firstExceedanceS, line: p.firstExceedanceLine!, timestamp: p.firstExceedanceTimestamp };
  return best;
}

/** The least remaining life over a unit's parts [years]; null when no part has one. */
export function leastRemainingLifeYears(row: FleetReplayedRow): number | null {
  const lives = row.parts.flatMap((p) => (p.remainingLifeYears === null ? [] : [p.remainingLifeYears]));
  return lives.length === 0 ? null : Math.min(...lives);
}

/** "how the life left is worked out", for the report and the CSV note. */
export function remainingLifeWords(logsPerYear: number | null): string {
  return logsPerYear === null
    ? "life left: years until Miner damage reaches 1 if the unit goes on as its log shows (its damage over its span)"
    : `life left: years until Miner damage reaches 1 at the stated rate of ${formatNumber(logsPerYear)} logs like the unit's a year`;
}

/**
 * The text report of `heatledger fleet` (and `fleet merge`): the profile, the counts by verdict,
 * the ranked table (most at risk first: rank, unit, verdict, each part's peak, the least margin,
 * the first time above a limit and its log line, the greatest damage to date, the least life
 * left; split into several tables to stay within the width; the first `tableRows` units), the
 * logs that could not be replayed with their problem (file, line, field), what the columns mean,
 * and the cautions.
 * Cost O(rows × parts).
 */
export function formatFleetText(summary: FleetSummary, width: number, tableRows: number = FLEET_DEFAULTS.tableRows): string {
  const w = Math.min(width, 100);
  const { header, counts, rows } = summary;
  const total = rows.length;
  const out: string[] = [
    `heatledger fleet: ${header.profile}`,
    `${total} unit${total === 1 ? "" : "s"}: ${counts.fail} fail, ${counts.warn} warn, ${counts.pass} pass` + (counts.error > 0 ? `, ${counts.error} could not be replayed` : ""),
    ...header.parts.map((p) => wrapHanging(`  part ${p.id}: limit ${formatNumber(p.limitC)} °C, design margin ${formatNumber(p.marginK)} K`, w)),
    "",
  ];
  const replayed = rows.filter((r): r is FleetReplayedRow => r.error === null);
  const shown = replayed.slice(0, tableRows);
  if (shown.length > 0) {
    const columns = [
      { heading: "rank", align: "right" as const },
      { heading: "unit" },
      { heading: "verdict" },
      ...header.parts.map((p) => ({ heading: header.parts.length === 1 ? "peak [°C]" : `peak ${p.id} [°C]`, align: "right" as const })),
      { heading: "margin [K]", align: "right" as const },
      { heading: "first over", align: "right" as const },
      { heading: "line", align: "right" as const },
      { heading: "damage", align: "right" as const },
      { heading: "life left [yr]", align: "right" as const },
    ];
    const cells = shown.map((row, i) => {
      const first = earliestExceedance(row);
      const damage = greatestDamage(row);
      const life = leastRemainingLifeYears(row);
      return [
        String(i + 1),
        row.unit,
        row.verdict,
        ...row.parts.map((p) => formatNumber(p.peakC)),
        formatNumber(leastMarginK(row)),
        first === undefined ? "never" : formatDuration(first.timeS),
        first === undefined ? "-" : String(first.line),
        damage < 0 ? "none" : formatNumber(damage, 3),
        life === null ? (damage === 0 ? "no end" : "none") : formatNumber(life, 3),
      ];
    });
    out.push(studyTable(columns, cells, 2, w));
    if (replayed.length > shown.length) out.push(`... and ${replayed.length - shown.length} more units (every unit is in --csv, --ndjson and --json)`, "");
    const judged = shown.filter((r) => r.verdict !== "pass");
    if (judged.length > 0) {
      out.push("Why:");
      for (const row of judged) out.push(wrapHanging(`  ${row.unit}: ${row.reason}`, w));
      out.push("");
    }
  }
  const broken = rows.filter((r) => r.error !== null);
  if (broken.length > 0) {
    out.push(`Logs that could not be replayed (${broken.length}):`);
    for (const row of broken) if (row.error !== null) out.push(wrapHanging(`  ${row.unit}: ${formatInputProblem(row.error)}`, w));
    out.push("");
  }
  out.push(
    ...[
      "margin: the part's limit less its peak, least over the parts (negative: above the limit)",
      "first over: time from the log's first line when a part first went above its limit, and the log line in effect then",
      "damage: Miner's rule over the whole log as a one-off history (ASTM E1049 §5.4.4), greatest over the parts; none: no lifetime model",
      `${remainingLifeWords(header.logsPerYear)}; no end: no damage`,
      "rank: verdict first (fail, warn, pass), then least margin, then most damage, then unit id",
    ].map((l) => wrapHanging(l, w)),
    "",
  );
  return `${out.join("\n")}\n${formatCautions(header.linearMosfet, w)}${wrapText(LIFETIME_CAUTION, w)}\n`;
}
