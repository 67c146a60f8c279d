import { describe, expect, test } from "vitest";
import { AttemptCursor, LOCKOUT_MAP_SYMBOLS, fosterToModal, lockoutMap, lockoutMapCsv, lockoutMapHeatmap, maxAttempts, resolveCorners, runBurst, uniformBurst } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { rectangularFault } from "./scenarios.js";

describe("lockoutMap", () => {
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }, { rKPerW: 3, tauS: 60 }] });
  const corners = [
    rectangularFault("25 °C", model, 200, 0.2, { ambientC: 25, limitC: 155, marginK: 10 }),
    rectangularFault("60 °C", model, 200, 0.2, { ambientC: 60, limitC: 155, marginK: 10 }),
  ];
  const intervals = [0.1, 0.3, 0.5, 1, 2, 5];
  const map = lockoutMap(corners, 30, intervals);

  test("each column passes exactly as many attempts as maxAttempts allows, governed by the hot corner", () => {
    intervals.forEach((T, i) => {
      const passing = map.cells.filter((row) => row[i]!.status === "pass").length;
      if (T < 0.2) {
        // shorter than an attempt: only a single attempt is possible
        expect(map.cells[1]![i]!.status).toBe("impossible");
        return;
      }
      const answer = maxAttempts(corners, T);
      expect(passing).toBe(answer.unlimited ? 30 : Math.min(30, answer.attempts!));
      expect(map.cells[29]![i]!.corner).toBe("60 °C");
    });
  });

  test("CSV has a header and one row per cell; the heat map has a row per burst length and a legend", () => {
    const csv = lockoutMapCsv(map).trim().split("\n");
    // temperatures in °C are suffixed _C, as in every CSV file heatledger writes
    expect(csv[0]).toBe("attempts,interval_s,spacing,worst_peak_C,allowed_C,limit_C,used_fraction,status,governing_corner");
    expect(csv).toHaveLength(1 + 30 * intervals.length);
    expect(csv[1]!.startsWith("1,0.1,start-to-start,")).toBe(true);
    const text = lockoutMapHeatmap(map);
    const rows = text.split("\n").filter((l) => /^\s*\d+ \| /.test(l));
    expect(rows).toHaveLength(30);
    for (const s of LOCKOUT_MAP_SYMBOLS) expect(text).toContain(`${s.symbol.repeat(2)}  ${s.status.padEnd(10)}  ${s.meaning}`);
    expect(text).not.toContain("NaN");
  });

  test("the heat map keeps within a narrow width: one character a cell, then blocks of intervals, every cell kept", () => {
    const many = lockoutMap(corners, 5, Array.from({ length: 60 }, (_, i) => 0.3 * 10 ** (i / 20)));
    const cellsOf = (text: string): Map<string, string> => {
      const rows = new Map<string, string>();
      for (const line of text.split("\n")) {
        const m = /^\s*(\d+) \| (.*)$/.exec(line);
        if (m !== null) rows.set(m[1]!, (rows.get(m[1]!) ?? "") + m[2]!);
      }
      return rows;
    };
    const wide = cellsOf(lockoutMapHeatmap(many, 400));
    expect(wide.get("1")).toHaveLength(120);
    // room for cells: the width less "5 | "; two characters a cell need 120, one 60
    for (const [width, cellWidth, blocks] of [[130, 2, 1], [100, 1, 1], [64, 1, 1], [60, 1, 2], [40, 1, 2]] as const) {
      const text = lockoutMapHeatmap(many, width);
      for (const line of text.split("\n").filter((l) => /^\s*\d+ \| |\^|\[s\]|\+-/.test(l))) expect(line.length, line).toBeLessThanOrEqual(width);
      expect(text.split("\n").filter((l) => l.startsWith("1 | "))).toHaveLength(blocks);
      const narrow = cellsOf(text);
      for (const [attempts, cells] of wide) expect(narrow.get(attempts)).toBe([...cells].filter((_, i) => i % 2 === 0).map((c) => c.repeat(cellWidth)).join(""));
    }
  });

  test("one word per status everywhere: the CSV's status words are the legend's, and the verdict words", () => {
    const statusColumn = 7;
    const used = new Set(lockoutMapCsv(map).trim().split("\n").slice(1).map((row) => row.split(",")[statusColumn]!));
    // the 0.1 s column (shorter than an attempt) is impossible past one attempt; the map also holds
    // safe cells, cells inside the margin and cells above the limit
    expect([...used].sort()).toEqual(["fail", "impossible", "pass", "warn"]);
    const legend = lockoutMapHeatmap(map);
    for (const word of used) expect(legend).toMatch(new RegExp(`^  \\S\\S  ${word} `, "m"));
    expect(legend).not.toContain("overlap");
  });

  test("a column stops at the first attempt above a limit; the cells above it are those of full bursts", () => {
    const resolved = resolveCorners(corners);
    const before = AttemptCursor.trialCount;
    const fresh = lockoutMap(corners, 30, intervals);
    const trials = AttemptCursor.trialCount - before;
    let full = 0;
    intervals.forEach((T, i) => {
      // the reference: every corner's whole 30-attempt burst, the worst corner per cell
      const bursts = resolved.map((c) => runBurst(new AttemptCursor(c), uniformBurst(30, T, "start-to-start"), 0).records);
      full += bursts.reduce((n, b) => n + b.length, 0);
      const crossed = fresh.cells.findIndex((row) => row[i]!.status === "fail" && row[i]!.peakC === null);
      fresh.cells.forEach((row, a) => {
        const cell = row[i]!;
        if (crossed >= 0 && a >= crossed) {
          // below the first attempt above a limit: a longer burst contains it, so it fails too
          expect(cell.status).toBe("fail");
          expect(bursts.some((b, ci) => b.slice(0, a + 1).some((r) => r.peakC > resolved[ci]!.limitC))).toBe(true);
          return;
        }
        if (cell.status === "impossible") {
          expect(bursts.some((b) => b.length < a + 1)).toBe(true);
          return;
        }
        // the worst corner's peak over the first a + 1 attempts, as a full burst gives it (the same
        // arithmetic in another order: 1e-9 K covers the rounding of the peak search's start)
        const worst = Math.max(...bursts.map((b, ci) => resolved[ci]!.allowedC - Math.max(...b.slice(0, a + 1).map((r) => r.peakC))).map((h) => -h));
        const ci = resolved.findIndex((c) => c.name === cell.corner);
        expectClose(cell.peakC! - resolved[ci]!.allowedC, worst, { abs: 1e-9 });
      });
    });
    // the 60 °C corner crosses its limit after a few attempts at the short intervals
    expect(fresh.cells[29]!.some((c) => c.peakC === null && c.status === "fail")).toBe(true);
    expect(trials).toBeLessThan(full);
  });
});
