import { describe, expect, test } from "vitest";
import { formatDuration, formatNumber, formatTable, lineChart } from "../../src/internal.js";

describe("report primitives", () => {
  test("lineChart keeps a one-sample peak when resampling 10,000 points to 80 columns", () => {
    const points = Array.from({ length: 10_000 }, (_, i) => ({ x: i, y: i === 4321 ? 100 : 1 }));
    const chart = lineChart([{ label: "T", points }], { width: 80, height: 8 });
    expect(chart).toContain("100.0");
    expect(chart.split("\n")[0]).toMatch(/╭|╮|┼/);
  });

  test("lineChart draws a limit line and a legend with units", () => {
    const chart = lineChart([{ label: "R1", points: [{ x: 0, y: 20 }, { x: 10, y: 60 }] }], { lines: [{ label: "limit", y: 80 }], yUnit: "°C" });
    expect(chart).toContain("line (┄): limit = 80.00 °C");
    expect(chart).toContain("curve (─): R1 [°C]");
  });

  /** The axis label of the row a mark is drawn on, and the labels of all rows. */
  const rowLabels = (chart: string): { label: number; body: string }[] =>
    chart
      .split("\n")
      .filter((l) => /[┤┼]/.test(l))
      .map((l) => ({ label: Number(l.slice(0, l.search(/[┤┼]/)).trim()), body: l.slice(l.search(/[┤┼]/) + 1) }));

  test.each([
    [155, [20, 60, 148]],
    [200, [40, 125.3, 56]],
    [0.37, [0.01, 0.2, 0.9]],
    [-12.5, [-40, 3, 18]],
    [80, [79.99, 80.01]],
  ])("the first line (%d) sits on a row labelled with its own value, curves within half a row of theirs", (limit, ys) => {
    const points = ys.map((y, i) => ({ x: i, y }));
    const chart = lineChart([{ label: "T", points }], { width: 40, height: 9, lines: [{ label: "limit", y: limit }] });
    const rows = rowLabels(chart);
    const lineRows = rows.filter((r) => r.body.includes("┄"));
    expect(lineRows).toHaveLength(1);
    // the label is the value to the 4 significant digits formatNumber prints
    expect(Math.abs(lineRows[0]!.label - limit)).toBeLessThanOrEqual(Math.abs(limit) * 5e-4 + 1e-12);
    // the rows are evenly spaced; every point's row is the nearest one to its value
    const step = rows[0]!.label - rows[1]!.label;
    for (const y of ys) {
      const nearest = rows.reduce((a, b) => (Math.abs(b.label - y) < Math.abs(a.label - y) ? b : a));
      expect(Math.abs(nearest.label - y)).toBeLessThanOrEqual(step / 2 + Math.abs(step) * 1e-3);
    }
  });

  test("curves after the first get their own marks and the legend names each; a second line says where it is drawn", () => {
    const a = Array.from({ length: 50 }, (_, i) => ({ x: i, y: i }));
    const b = Array.from({ length: 50 }, (_, i) => ({ x: i, y: 49 - i }));
    const c = Array.from({ length: 50 }, (_, i) => ({ x: i, y: 25 }));
    const chart = lineChart(
      [
        { label: "rising", points: a },
        { label: "falling", points: b },
        { label: "flat", points: c },
      ],
      { width: 70, height: 10, lines: [{ label: "limit", y: 45 }, { label: "warning", y: 41.3 }], yUnit: "°C" },
    );
    const body = rowLabels(chart).map((r) => r.body).join("\n");
    for (const mark of ["─", "*", "+", "┄", "╌"]) expect(body).toContain(mark);
    expect(chart).toContain("curve (─): rising [°C]");
    expect(chart).toContain("curve 2 (*): falling [°C]");
    expect(chart).toContain("curve 3 (+): flat [°C]");
    expect(chart).toContain("line (╌): warning = 41.30 °C, on the nearest row");
    // the falling curve starts at the top-left and ends at the bottom-right
    const rows = rowLabels(chart);
    const top = rows.findIndex((r) => r.body.startsWith("*"));
    const bottom = rows.length - 1 - [...rows].reverse().findIndex((r) => r.body.trimEnd().endsWith("*"));
    expect(rows[top]!.label).toBeGreaterThan(rows[bottom]!.label);
    for (const line of chart.split("\n")) expect(line.length).toBeLessThanOrEqual(70);
  });

  test("formatNumber never prints NaN", () => {
    expect(formatNumber(Number.NaN)).toBe("n/a");
    expect(formatNumber(123.456)).toBe("123.5");
    expect(formatNumber(0.000012345)).toBe("1.234e-5");
  });

  test.each([
    [3.5e-4, "350 µs"],
    [0.0125, "12.5 ms"],
    [4.2, "4.20 s"],
    [600, "10.0 min"],
    [7200, "2.00 h"],
    [86400 * 5, "5.00 d"],
  ])("formatDuration(%d) is %s", (s, text) => {
    expect(formatDuration(s)).toBe(text);
  });

  test("formatTable aligns columns", () => {
    expect(formatTable([{ heading: "a" }, { heading: "bb", align: "right" }], [["xyz", "1"]])).toBe("a    bb\n---  --\nxyz   1\n");
  });
});
