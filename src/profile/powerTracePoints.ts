import { lazyCsv } from "../format/lazyCsv.js";
import { InputError, type InputProblem, describeFound } from "../errors/InputError.js";
import type { PowerSegment } from "../thermal/powerTrace.js";

/** A measured power waveform: times [s] strictly increasing, powers [W] ≥ 0, at least two points. */
export interface PowerTracePoints {
  readonly timeS: readonly number[];
  readonly powerW: readonly number[];
}

/**
 * Read a measured power waveform from CSV text: two columns, time in s and power in W (plain SI
 * numbers), one point per row; an optional first row of headings is skipped, as are blank lines
 * and lines starting with `#`. Every bad row is reported at once with its line.
 * Source: RFC 4180 (2005), §2 (CSV format), parsed by csv-parse.
 * Cost O(rows).
 * @param text the CSV text
 * @param file the file name, for messages
 * @param field the profile field that named the file, for messages
 * @throws InputError `bad-trace` (bad rows) or `bad-file` (not CSV)
 */
export function powerTracePoints(text: string, file: string, field: string): PowerTracePoints {
  let rows: { record: unknown[]; info: { lines: number } }[];
  try {
    rows = lazyCsv.parse(text, { skip_empty_lines: true, trim: true, comment: "#", relax_column_count: true, info: true }) as unknown as { record: unknown[]; info: { lines: number } }[];
  } catch (error) {
    const line = typeof (error as { lines?: unknown }).lines === "number" ? ((error as { lines: number }).lines) : 0;
    throw new InputError({ code: "bad-file", file, line, field, expected: "CSV text with two columns (time in s, power in W)", found: error instanceof Error ? error.message.split("\n")[0]! : "unreadable text" });
  }
  const problems: InputProblem[] = [];
  const timeS: number[] = [];
  const powerW: number[] = [];
  rows.forEach(({ record, info }, i) => {
    const cells = record.map((c) => String(c));
    const numbers = cells.map((c) => (c === "" ? Number.NaN : Number(c)));
    if (i === 0 && numbers.some((n) => Number.isNaN(n))) return; // a heading row
    const fail = (expected: string, found: string): void => {
      problems.push({ code: "bad-trace", file, line: info.lines, field, expected, found });
    };
    if (cells.length !== 2) return fail("two columns: time in s, power in W", `${cells.length} column${cells.length === 1 ? "" : "s"}`);
    const [t, p] = numbers as [number, number];
    if (!Number.isFinite(t) || !Number.isFinite(p)) return fail("two plain numbers (time in s, power in W)", describeFound(cells.join(",")));
    if (p < 0) return fail("a power ≥ 0 W", describeFound(cells[1]));
    const previous = timeS[timeS.length - 1];
    if (previous !== undefined && !(t > previous)) return fail(`a time after the previous row's ${previous} s`, describeFound(cells[0]));
    timeS.push(t);
    powerW.push(p);
  });
  if (problems.length === 0 && timeS.length < 2) problems.push({ code: "bad-trace", file, line: 0, field, expected: "at least two (time, power) rows", found: `${timeS.length}` });
  if (problems.length > 0) throw new InputError(problems.slice(0, 20));
  return { timeS, powerW };
}

/**
 * Segments of a waveform that is linear between its points: segment k runs from t_k to t_(k+1)
 * with power p_k + (p_(k+1) − p_k)/(t_(k+1) − t_k)·s, times re-origined so the first point is 0.
 * Exact for the thermal engine (a ramp is a term a + b·s).
 * Cost O(points).
 * @param points the waveform
 * @param scale a factor applied to every power (default 1)
 */
export function pointsToSegments(points: PowerTracePoints, scale = 1): PowerSegment[] {
  const t0 = points.timeS[0]!;
  const segments: PowerSegment[] = [];
  for (let k = 0; k + 1 < points.timeS.length; k++) {
    const h = points.timeS[k + 1]! - points.timeS[k]!;
    const a = scale * points.powerW[k]!;
    const b = (scale * (points.powerW[k + 1]! - points.powerW[k]!)) / h;
    segments.push({ startS: points.timeS[k]! - t0, durationS: h, terms: a === 0 && b === 0 ? [] : [{ a, b, lambda: 0 }] });
  }
  return segments;
}
