import { lazyCsv } from "../format/lazyCsv.js";
import type { FleetSummary } from "./fleetSummary.js";

/**
 * The fleet summary as CSV (RFC 4180, csv-stringify): a header row with units, then one row per
 * unit in rank order: rank, unit, log file, verdict, reason, log lines, span, start timestamp,
 * and per part its peak, margin, first exceedance (seconds, timestamp, log line), damage to date
 * and life left; a broken log leaves those empty and fills `problem` (file:line: field: ...).
 * Numbers are written in full (JavaScript's shortest round-trip form), empty when absent.
 * Cost O(rows × parts).
 */
export function formatFleetCsv(summary: FleetSummary): string {
  const partHeadings = summary.header.parts.flatMap((p) => [
    `${p.id} peak [°C]`,
    `${p.id} margin [K]`,
    `${p.id} first over limit [s]`,
    `${p.id} first over limit (timestamp)`,
    `${p.id} first over limit (log line)`,
    `${p.id} damage to date`,
    `${p.id} life left [yr]`,
  ]);
  const header = ["rank", "unit", "log", "verdict", "reason", "log lines", "span [s]", "start (timestamp)", ...partHeadings, "problem"];
  const text = (v: number | string | null): string => (v === null ? "" : String(v));
  const rows = summary.rows.map((row, i) => {
    if (row.error !== null) {
      const e = row.error;
      const where = e.file === "" ? "" : e.line > 0 ? `${e.file}:${e.line}: ` : `${e.file}: `;
      return [String(i + 1), row.unit, row.file, "error", "", "", "", "", ...partHeadings.map(() => ""), `${where}${e.field === "" ? "" : `${e.field}: `}expected ${e.expected}, found ${e.found}`];
    }
    return [
      String(i + 1),
      row.unit,
      row.file,
      row.verdict,
      row.reason,
      String(row.lines),
      String(row.spanS),
      text(row.startTimestamp),
      ...row.parts.flatMap((p) => [String(p.peakC), String(p.marginK), text(p.firstExceedanceS), text(p.firstExceedanceTimestamp), text(p.firstExceedanceLine), text(p.damageToDate), text(p.remainingLifeYears)]),
      "",
    ];
  });
  return lazyCsv.stringify([header, ...rows]);
}
