import { describe, expect, test } from "vitest";
import { InputError, type QuantityColumn, parseQuantityTable } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

const COLUMNS: readonly QuantityColumn[] = [
  { key: "time", headerPattern: /^(t|time)\b/i, dimension: "time", unitOption: "--time-unit" },
  { key: "zth", headerPattern: /^(z|zth)\b/i, dimension: "thermalResistance", unitOption: "--zth-unit" },
];

describe("parseQuantityTable", () => {
  // Unit factors per the SI brochure, 9th ed. (BIPM 2019), §3, Table 7 (prefixes m = 1e-3, µ = 1e-6;
  // table number from memory);
  // 1e-15 relative: one multiplication's rounding.
  test.each([
    ["brackets", "time [ms], Zth [K/W]\n1, 0.5\n", 1e-3],
    ["parentheses", "time (us), Zth (K/W)\n1, 0.5\n", 1e-6],
    ["a slash", "t / s; Zth / K/W\n1; 0.5\n", 1],
    ["tabs and a comment", "# read off a curve\ntime [ms]\tZth [K/W]\n1\t0.5\n", 1e-3],
  ])("parseQuantityTable reads units written in %s", (_, text, timeScale) => {
    const table = parseQuantityTable(text, COLUMNS, "f.csv");
    expectClose(table.rows[0]!.values[0]!, timeScale, { rel: 1e-15 });
    expect(table.rows[0]!.values[1]).toBe(0.5);
  });

  test("parseQuantityTable finds columns by name in any order and keeps the file's line numbers", () => {
    const table = parseQuantityTable("# note\nZth [K/W], time [s]\n\n0.5, 2\n0.7, 3\n", COLUMNS, "f.csv");
    expect(table.rows).toEqual([
      { values: [2, 0.5], line: 4 },
      { values: [3, 0.7], line: 5 },
    ]);
    expect(table.units).toEqual(["s", "K/W"]);
  });

  test("parseQuantityTable without a header takes columns by position and units from the options", () => {
    const table = parseQuantityTable("1, 0.5\n10, 0.9\n", [{ ...COLUMNS[0]!, unit: "ms" }, { ...COLUMNS[1]!, unit: "K/W" }], "f.csv");
    expect(table.rows.map((r) => r.values[0])).toEqual([0.001, 0.01]);
  });

  test.each([
    ["", "f.csv: expected a table with the columns time, zth, found no rows"],
    ["time [s], Zth [K/W]\n", "f.csv:1: expected data rows below the header, found none"],
    ["1, 0.5\n", "f.csv: time: expected a unit for the time column, in the header (\"time [ms]\") or as --time-unit, found no header"],
    ["time [s], Zth [K/W]\n1\n", 'f.csv:2: expected 2 cells like the header (numbers use a decimal point; cells are separated by commas, semicolons or tabs), found 1 cells: "1"'],
    ["time [s]; Zth [K/W]\n1,5; 0,2\n", 'f.csv:2: expected 2 cells like the header (numbers use a decimal point; cells are separated by commas, semicolons or tabs), found 4 cells: "1 | 5 | 0 | 2"'],
    ["time [s], Zth [K/W]\n1, \n", 'f.csv:2: zth: expected a number (in K/W), found ""'],
  ])("parseQuantityTable rejects %j with file and line", (text, message) => {
    expect(() => parseQuantityTable(text, COLUMNS, "f.csv")).toThrow(InputError);
    expect(() => parseQuantityTable(text, COLUMNS, "f.csv")).toThrow(message);
  });
});
