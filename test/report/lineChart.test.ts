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
    expect(chart).toContain("flat line: limit = 80.00 °C");
    expect(chart).toContain("curve: R1 [°C]");
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
