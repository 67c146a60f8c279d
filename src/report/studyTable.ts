import { type TableColumn, formatTable } from "../text/formatTable.js";

/**
 * A table of study rows that stays within a width: the leading key columns (the parameters) are
 * kept on every part, and the other columns are split over as many tables as the width needs.
 * Cost O(rows × columns).
 * @param keys how many leading columns repeat in every part
 */
export function studyTable(columns: readonly TableColumn[], rows: readonly (readonly string[])[], keys: number, width: number): string {
  const widths = columns.map((c, j) => Math.max(c.heading.length, ...rows.map((r) => (r[j] ?? "").length)) + 2);
  const keyWidth = widths.slice(0, keys).reduce((a, b) => a + b, 0);
  const groups: number[][] = [];
  let current: number[] = [];
  let used = keyWidth;
  for (let j = keys; j < columns.length; j++) {
    if (current.length > 0 && used + widths[j]! > width) {
      groups.push(current);
      current = [];
      used = keyWidth;
    }
    current.push(j);
    used += widths[j]!;
  }
  if (current.length > 0 || groups.length === 0) groups.push(current);
  const keyColumns = Array.from({ length: keys }, (_, j) => j);
  return groups
    .map((group) => {
      const pick = [...keyColumns, ...group];
      return formatTable(
        pick.map((j) => columns[j]!),
        rows.map((r) => pick.map((j) => r[j] ?? "")),
      );
    })
    .join("\n");
}
