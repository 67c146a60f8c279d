import { lazyCsv } from "../format/lazyCsv.js";
import type { LockoutMap, LockoutMapCell } from "../retry/lockoutMap.js";

/**
 * The heat map's cell characters, darkest last, each with the cell status it shows (the word in
 * the CSV and JSON); the legend is built from this table.
 */
export const LOCKOUT_MAP_SYMBOLS = [
  { symbol: ".", status: "pass", meaning: "safe, uses under 50 % of the allowed rise" },
  { symbol: ":", status: "pass", meaning: "safe, uses 50-80 % of the allowed rise" },
  { symbol: "=", status: "pass", meaning: "safe, uses 80-100 % of the allowed rise" },
  { symbol: "!", status: "warn", meaning: "inside the design margin (above limit - margin, not above the limit)" },
  { symbol: "#", status: "fail", meaning: "above the part's limit" },
  { symbol: "~", status: "impossible", meaning: "an attempt would start before the previous one ends and the relay has cycled" },
] as const;

function symbolOf(cell: LockoutMapCell): string {
  switch (cell.status) {
    case "impossible":
      return "~";
    case "fail":
      return "#";
    case "warn":
      return "!";
    default: {
      const f = cell.usedFraction ?? 0;
      return f < 0.5 ? "." : f < 0.8 ? ":" : "=";
    }
  }
}

/** A duration in s with 3 significant digits, for axis labels. */
function seconds(s: number): string {
  if (s === 0) return "0";
  return Number(s.toPrecision(3)).toString();
}

/**
 * The lockout map as CSV, one row per cell: attempts, interval_s, spacing, worst_peak_C,
 * allowed_C, limit_C, used_fraction, status (pass, warn, fail or impossible), governing_corner.
 * Impossible cells, and failing cells below a shorter burst that already crosses a limit (not
 * simulated), leave the peak and used fraction empty. Cost O(cells).
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * lockoutMapCsv(lockoutMap([scenario], 3, [0.6, 2, 10])).split("\n").length // => 11
 */
export function lockoutMapCsv(map: LockoutMap): string {
  const rows: (string | number)[][] = [["attempts", "interval_s", "spacing", "worst_peak_C", "allowed_C", "limit_C", "used_fraction", "status", "governing_corner"]];
  for (const row of map.cells) {
    for (const c of row) {
      rows.push([c.attempts, c.intervalS, map.spacing, c.peakC ?? "", c.allowedC, c.limitC, c.usedFraction ?? "", c.status, c.corner]);
    }
  }
  return lazyCsv.stringify(rows);
}

/**
 * The lockout map as a terminal heat map within `width` columns: one row per burst length (1 at
 * the top), one column per interval (two characters each, or one when two do not fit; blocks of
 * intervals one above the other when one does not), the interval axis labelled below, and a
 * legend of the symbols (LOCKOUT_MAP_SYMBOLS). Cost O(cells).
 * @example
 * const scenario = {
 *   name: "short", model: fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 2 }] }),
 *   ambientC: 40, limitC: 150, marginK: 20, initialVoltageV: 0,
 *   attempt: () => ({ trace: [constantPowerSegment(0, 0.5, 400)], durationS: 0.5, endVoltageV: 0 }),
 *   discharge: () => 0,
 * };
 * lockoutMapHeatmap(lockoutMap([scenario], 3, [0.6, 2, 10])).split("\n").slice(1, 4) // => ["1 | ......", "2 | ==::..", "3 | !!::.."]
 */
export function lockoutMapHeatmap(map: LockoutMap, width = 100): string {
  const labelWidth = String(map.attempts[map.attempts.length - 1] ?? 1).length;
  const room = Math.max(10, width - labelWidth - 3);
  // two characters a cell when the whole map fits, else one; else blocks of intervals one above the other
  const cellWidth = map.intervalsS.length * 2 <= room ? 2 : 1;
  const perBlock = Math.max(1, Math.floor(room / cellWidth));
  const lines: string[] = [];
  for (let from = 0; from < map.intervalsS.length; from += perBlock) {
    const to = Math.min(map.intervalsS.length, from + perBlock);
    if (from > 0) lines.push("");
    lines.push(`${"".padStart(labelWidth)}   interval (${map.spacing}) ->${from === 0 && to === map.intervalsS.length ? "" : ` ${from + 1} to ${to} of ${map.intervalsS.length}`}`);
    map.cells.forEach((row, a) => {
      const cells = row
        .slice(from, to)
        .map((c) => symbolOf(c).repeat(cellWidth))
        .join("");
      lines.push(`${String(map.attempts[a]).padStart(labelWidth)} | ${cells}`);
    });
    lines.push(`${"".padStart(labelWidth)} +-${"-".repeat((to - from) * cellWidth)}`);
    // Interval labels: place a label at a column when it fits after the previous one and the line ends within the width.
    let axis = "";
    let ticks = "";
    map.intervalsS.slice(from, to).forEach((t, i) => {
      const at = i * cellWidth;
      const text = seconds(t);
      if (at >= axis.length + (axis.length === 0 ? 0 : 1) && at + text.length <= room - 5) {
        axis = axis.padEnd(at) + text;
        ticks = ticks.padEnd(at) + "^";
      }
    });
    lines.push(`${"".padStart(labelWidth)}   ${ticks}`);
    lines.push(`${"".padStart(labelWidth)}   ${axis}  [s]`);
  }
  lines.push("attempts in a burst down the side; each cell is the worst corner's highest temperature:");
  for (const s of LOCKOUT_MAP_SYMBOLS) lines.push(`  ${s.symbol.repeat(cellWidth).padEnd(2)}  ${s.status.padEnd(10)}  ${s.meaning}`);
  return `${lines.join("\n")}\n`;
}
