import { type TableColumn, formatTable } from "./formatTable.js";

/** How {@link fitTable} may narrow a table. */
export interface FitTableOptions {
  /** the widest a line may be [columns] */
  readonly width: number;
  /** the leading columns repeated in every part when the table is split (default 1) */
  readonly keyColumns?: number;
  /** the column whose long cells may be cut with an ellipsis (a free-text column such as a label) */
  readonly cutColumn?: number;
  /** the narrowest the cut column gets (default 16) */
  readonly cutMin?: number;
}

/** What {@link fitTable} made: the text, and how many cells it cut (the report says so under the table). */
export interface FittedTable {
  readonly text: string;
  readonly cutCells: number;
}

const ELLIPSIS = "…";

/** Length in characters as a terminal shows them (code points). */
function textWidth(text: string): number {
  return [...text].length;
}

/**
 * An aligned table (formatTable) that fits a width: when narrowing the free-text column
 * `cutColumn` (down to `cutMin`) makes it fit, its longer cells are cut and ended with an
 * ellipsis; otherwise the table is split into several tables one above the other, each repeating
 * the first `keyColumns` columns, the other columns in their order, as many per part as fit (the
 * free-text column cut only if it does not fit beside the key columns). Nothing is
 * cut silently: `cutCells` counts the cut cells, for a note under the table.
 * Cost O(rows × columns).
 */
export function fitTable(columns: readonly TableColumn[], rows: readonly (readonly string[])[], options: FitTableOptions): FittedTable {
  const gap = 2;
  const widths = columns.map((c, j) => Math.max(textWidth(c.heading), ...rows.map((r) => textWidth(r[j] ?? ""))));
  const total = (ws: readonly number[]): number => ws.reduce((a, b) => a + b, 0) + gap * Math.max(0, ws.length - 1);
  let cells = rows;
  let cutCells = 0;
  const cut = options.cutColumn;
  const keys = Math.min(options.keyColumns ?? 1, columns.length);
  if (total(widths) > options.width && cut !== undefined && cut < columns.length) {
    const floor = Math.max(textWidth(columns[cut]!.heading), options.cutMin ?? 16);
    // cut only what makes the whole table fit; when even the floor cannot, the table is split and
    // the column is cut only as far as it must be to fit beside the key columns
    const whole = widths[cut]! - (total(widths) - options.width);
    const beside = options.width - total(widths.slice(0, keys)) - gap;
    const room = whole >= floor ? whole : Math.max(floor, Math.min(widths[cut]!, beside));
    if (room < widths[cut]!) {
      cells = rows.map((r) =>
        r.map((text, j) => {
          if (j !== cut || textWidth(text) <= room) return text;
          cutCells++;
          return [...text].slice(0, room - 1).join("").trimEnd() + ELLIPSIS;
        }),
      );
      widths[cut] = room;
    }
  }
  if (total(widths) <= options.width) return { text: formatTable(columns, cells), cutCells };
  const keyWidth = total(widths.slice(0, keys));
  const parts: number[][] = [];
  let current: number[] = [];
  for (let j = keys; j < columns.length; j++) {
    const next = [...current, j];
    if (current.length > 0 && keyWidth + gap + total(next.map((k) => widths[k]!)) > options.width) {
      parts.push(current);
      current = [j];
    } else current = next;
  }
  if (current.length > 0) parts.push(current);
  const text = parts
    .map((part) => {
      const pick = [...Array.from({ length: keys }, (_, k) => k), ...part];
      return formatTable(
        pick.map((j) => columns[j]!),
        cells.map((r) => pick.map((j) => r[j] ?? "")),
      );
    })
    .join("\n");
  return { text, cutCells };
}
