import { parse } from "csv-parse/sync";
import { InputError, describeFound } from "../errors/InputError.js";
import { type Dimension, expectedWords } from "../units/dimensions.js";
import { parseQuantity } from "../units/parseQuantity.js";

/** One column a table must provide. */
export interface QuantityColumn {
  /** name used in messages and results ("time") */
  readonly key: string;
  /** header names that select this column (case-insensitive, matched against the name part) */
  readonly headerPattern: RegExp;
  /** physical dimension of the column's values */
  readonly dimension: Dimension;
  /** unit given outside the file (a command-line option); overrides the header's unit */
  readonly unit?: string;
  /** how to give the unit outside the file, for the message when no unit is known ("--time-unit") */
  readonly unitOption: string;
}

/** A parsed table: one row of SI values per data line, in column order, with its line number. */
export interface QuantityTable {
  readonly rows: readonly { readonly values: readonly number[]; readonly line: number }[];
  /** the unit each column was read in, as written */
  readonly units: readonly string[];
}

/** Header cell: a name, then optionally a unit in [..], (..) or after " / " ("time [ms]", "Zth (K/W)", "t / s"). */
const HEADER_CELL = /^(.*?)\s*(?:\[([^\]]*)\]|\(([^)]*)\)|\s\/\s*(.+))?\s*$/;

/**
 * Read a small CSV table of physical quantities, such as datasheet Zth points or a pulse rating.
 *
 * Lines starting with # are comments; cells may be separated by commas, semicolons or tabs. The
 * first row is a header when any of its cells is not a number: each header cell is a name with an
 * optional unit, `time [ms]`, `Zth (K/W)`, `t / s`. Columns are found by name (headerPattern) or,
 * without a match or a header, by position. A column's unit comes from its option (QuantityColumn.unit)
 * or else the header; a column with neither is an error (a unit is never guessed: datasheets mix
 * ms and s). Every value is scaled to SI by its unit (units/parseQuantity). Every data row must
 * have as many cells as the header: a decimal comma would otherwise shift the columns silently.
 * Source: RFC 4180 (CSV); SI brochure, 9th ed. (BIPM 2019), §2.3 (units) and §3, Table 7 (unit
 * prefixes) (section and table numbers from memory).
 * Cost O(cells); the first unit parsed loads mathjs (about 1 s).
 * @param text the file's text
 * @param columns the columns wanted, in order
 * @param file the file name, for messages
 * @throws InputError `bad-file` with file and line for a missing unit, a bad cell or an empty table
 */
export function parseQuantityTable(text: string, columns: readonly QuantityColumn[], file: string): QuantityTable {
  const fail = (line: number, field: string, expected: string, found: string): never => {
    throw new InputError({ code: "bad-file", file, line, field, expected, found });
  };
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, { comment: "#", skip_empty_lines: true, trim: true, relax_column_count: true, delimiter: [",", ";", "\t"], info: true }) as unknown as typeof records;
  } catch (error) {
    const e = error as { message?: string; lines?: number };
    return fail(e.lines ?? 0, "", "a CSV table", describeFound(e.message ?? String(error)));
  }
  records = records.filter((r) => r.record.some((c) => c !== ""));
  if (records.length === 0) return fail(0, "", `a table with the columns ${columns.map((c) => c.key).join(", ")}`, "no rows");
  const isNumber = (cell: string): boolean => cell !== "" && Number.isFinite(Number(cell));
  const first = records[0]!;
  const hasHeader = first.record.some((c) => !isNumber(c));
  const header = hasHeader ? first.record.map((cell) => parseHeaderCell(cell)) : [];
  const taken = new Set<number>();
  const indices = columns.map((column, position) => {
    const byName = header.findIndex((h, i) => !taken.has(i) && column.headerPattern.test(h.name));
    const index = byName >= 0 ? byName : position;
    taken.add(index);
    return index;
  });
  const units = columns.map((column, j) => {
    const unit = column.unit ?? header[indices[j]!]?.unit ?? "";
    if (unit.trim() === "") {
      return fail(
        hasHeader ? first.info.lines : 0,
        column.key,
        `a unit for the ${column.key} column, in the header ("${column.key} [${unitExample(column.dimension)}]") or as ${column.unitOption}`,
        hasHeader ? describeFound(first.record[indices[j]!] ?? "") : "no header",
      );
    }
    return unit.trim();
  });
  const scales = columns.map((column, j) => {
    try {
      return parseQuantity(`1 ${units[j]!}`, column.dimension, column.key);
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      return fail(hasHeader && column.unit === undefined ? first.info.lines : 0, `${column.key} unit`, `a unit of ${expectedWords(column.dimension)}`, describeFound(units[j]!));
    }
  });
  const data = hasHeader ? records.slice(1) : records;
  if (data.length === 0) return fail(first.info.lines, "", "data rows below the header", "none");
  const width = hasHeader ? first.record.length : columns.length;
  const rows = data.map(({ record, info }) => ({
    line: checkWidth(record, info.lines, width, hasHeader, fail),
    values: columns.map((column, j) => {
      const cell = record[indices[j]!];
      if (cell === undefined || !isNumber(cell)) return fail(info.lines, column.key, `a number (in ${units[j]!})`, cell === undefined ? "nothing" : describeFound(cell));
      return Number(cell) * scales[j]!;
    }),
  }));
  return { rows, units };
}

/**
 * Every data row has as many cells as the header (or as the columns wanted, without a header):
 * a decimal comma ("1,5;0,2") would otherwise split one number into two and shift the columns.
 */
function checkWidth(record: readonly string[], line: number, width: number, hasHeader: boolean, fail: (line: number, field: string, expected: string, found: string) => never): number {
  if (record.length === width) return line;
  return fail(
    line,
    "",
    `${width} cells like the ${hasHeader ? "header" : "columns wanted"} (numbers use a decimal point; cells are separated by commas, semicolons or tabs)`,
    `${record.length} cells: ${describeFound(record.join(" | "))}`,
  );
}

function parseHeaderCell(cell: string): { name: string; unit: string } {
  const m = HEADER_CELL.exec(cell);
  return { name: (m?.[1] ?? cell).trim(), unit: (m?.[2] ?? m?.[3] ?? m?.[4] ?? "").trim() };
}

function unitExample(dimension: Dimension): string {
  const examples: Partial<Record<Dimension, string>> = { time: "ms", thermalResistance: "K/W", energy: "J" };
  return examples[dimension] ?? "unit";
}
