import { InputError } from "../errors/InputError.js";
import { type Verdict, worstVerdict } from "../stress/Verdict.js";
import type { FleetHeader } from "./FleetHeader.js";
import type { FleetUnitRow } from "./FleetUnitRow.js";
import { compareFleetRows } from "./compareFleetRows.js";

/** A fleet's summary: the header, every unit's row ranked by risk, and the counts. */
export interface FleetSummary {
  readonly header: FleetHeader;
  /** ranked by compareFleetRows: most at risk first, broken logs last */
  readonly rows: readonly FleetUnitRow[];
  readonly counts: Readonly<Record<Verdict | "error", number>>;
  /** the worst verdict of the replayed units ("pass" when none was replayed) */
  readonly verdict: Verdict;
}

/** Where a row came from, for the message about a unit id seen twice. */
export interface FleetRowSource {
  readonly file: string;
  readonly line: number;
}

/**
 * The fleet summary of some rows: ranked by the total risk order (compareFleetRows), counted by
 * verdict. The result depends only on the set of rows, not on their order, so the summary of all
 * logs and the summary of partitions merged in any grouping are the same, bit for bit.
 * Source: ranking rule of our own (docs/fleet.md).
 * Cost O(rows × log rows × parts).
 * @param sources where each row came from (same index as rows), for messages; default the row's log
 * @throws InputError (bad-file) for a unit id found twice, naming both places
 */
export function fleetSummary(header: FleetHeader, rows: readonly FleetUnitRow[], sources?: readonly FleetRowSource[]): FleetSummary {
  const seen = new Map<string, number>();
  rows.forEach((row, i) => {
    const first = seen.get(row.unit);
    if (first === undefined) {
      seen.set(row.unit, i);
      return;
    }
    const at = (j: number): FleetRowSource => sources?.[j] ?? { file: rows[j]!.file, line: 0 };
    const before = at(first);
    const here = at(i);
    throw new InputError({
      code: "bad-file",
      file: here.file,
      line: here.line,
      field: "unit",
      expected: `each unit once in a fleet (unit "${row.unit}" is already ${before.file}${before.line > 0 ? ` line ${before.line}` : ""})`,
      found: `unit "${row.unit}" again`,
    });
  });
  const ranked = [...rows].sort(compareFleetRows);
  const counts = { fail: 0, warn: 0, pass: 0, error: 0 };
  for (const row of ranked) counts[row.verdict]++;
  const verdict = worstVerdict(ranked.flatMap((r) => (r.error === null ? [r.verdict] : [])));
  return { header, rows: ranked, counts, verdict };
}
