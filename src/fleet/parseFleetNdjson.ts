import { InputError, type InputErrorCode, describeFound } from "../errors/InputError.js";
import { FLEET_FORMAT, type FleetHeader } from "./FleetHeader.js";
import type { FleetPartRow, FleetUnitRow } from "./FleetUnitRow.js";
import type { FleetRowSource } from "./fleetSummary.js";

/** A partition output read back: its header and its rows, each with the line it was on. */
export interface FleetPartition {
  readonly file: string;
  readonly header: FleetHeader;
  /** the header's line in the file */
  readonly headerLine: number;
  readonly rows: readonly FleetUnitRow[];
  readonly sources: readonly FleetRowSource[];
}

const VERDICT_WORDS = ["pass", "warn", "fail"] as const;
const ERROR_CODES: readonly InputErrorCode[] = ["bad-quantity", "wrong-dimension", "unknown-unit", "not-finite", "out-of-range", "bad-network", "bad-trace", "bad-file", "bad-profile", "bad-option"];

/** Reads the fields of one JSON object of one line, failing with the file, line and field. */
class LineReader {
  constructor(
    private readonly file: string,
    private readonly line: number,
  ) {}

  fail(field: string, expected: string, found: unknown): InputError {
    return new InputError({ code: "bad-file", file: this.file, line: this.line, field, expected, found: describeFound(found) });
  }

  object(value: unknown, field: string): Record<string, unknown> {
    if (typeof value !== "object" || value === null || Array.isArray(value)) throw this.fail(field, "a JSON object", value);
    return value as Record<string, unknown>;
  }

  string(o: Record<string, unknown>, key: string, field: string): string {
    const v = o[key];
    if (typeof v !== "string") throw this.fail(`${field}${key}`, "a string", v);
    return v;
  }

  number(o: Record<string, unknown>, key: string, field: string): number {
    const v = o[key];
    if (typeof v !== "number" || !Number.isFinite(v)) throw this.fail(`${field}${key}`, "a number", v);
    return v;
  }

  orNull<T>(o: Record<string, unknown>, key: string, field: string, read: (o: Record<string, unknown>, key: string, field: string) => T): T | null {
    return o[key] === null ? null : read.call(this, o, key, field);
  }

  array(o: Record<string, unknown>, key: string, field: string): unknown[] {
    const v = o[key];
    if (!Array.isArray(v)) throw this.fail(`${field}${key}`, "a JSON array", v);
    return v;
  }

  oneOf<T extends string>(o: Record<string, unknown>, key: string, field: string, words: readonly T[]): T {
    const v = o[key];
    if (!(words as readonly unknown[]).includes(v)) throw this.fail(`${field}${key}`, `one of ${words.join(", ")}`, v);
    return v as T;
  }
}

/** The header line's fields (the cautions it carries are the report's, rebuilt on output). */
function readHeader(r: LineReader, o: Record<string, unknown>): FleetHeader {
  if (o.kind !== "fleet-header") throw r.fail("kind", `the header line of a fleet partition ({"kind":"fleet-header",...}, written by heatledger fleet --ndjson)`, o.kind);
  if (o.format !== FLEET_FORMAT) throw r.fail("format", JSON.stringify(FLEET_FORMAT), o.format);
  const linearMosfet = o.linearMosfet;
  if (typeof linearMosfet !== "boolean") throw r.fail("linearMosfet", "true or false", linearMosfet);
  return {
    format: FLEET_FORMAT,
    profile: r.string(o, "profile", ""),
    profileDigest: r.string(o, "profileDigest", ""),
    parts: r.array(o, "parts", "").map((value, i) => {
      const p = r.object(value, `parts[${i}]`);
      const field = `parts[${i}].`;
      return { id: r.string(p, "id", field), limitC: r.number(p, "limitC", field), marginK: r.number(p, "marginK", field) };
    }),
    logsPerYear: r.orNull(o, "logsPerYear", "", r.number),
    linearMosfet,
  };
}

/** One unit line's fields, checked against the header's parts. */
function readRow(r: LineReader, o: Record<string, unknown>, header: FleetHeader): FleetUnitRow {
  if (o.kind !== "unit") throw r.fail("kind", `a unit line ({"kind":"unit",...})`, o.kind);
  const unit = r.string(o, "unit", "");
  const file = r.string(o, "file", "");
  if (o.verdict === "error") {
    const e = r.object(o.error, "error");
    return {
      unit,
      file,
      verdict: "error",
      error: {
        code: r.oneOf(e, "code", "error.", ERROR_CODES),
        file: r.string(e, "file", "error."),
        line: r.number(e, "line", "error."),
        field: r.string(e, "field", "error."),
        expected: r.string(e, "expected", "error."),
        found: r.string(e, "found", "error."),
      },
    };
  }
  const verdict = r.oneOf(o, "verdict", "", VERDICT_WORDS);
  const parts = r.array(o, "parts", "");
  if (parts.length !== header.parts.length) throw r.fail("parts", `${header.parts.length} parts, as the header names`, `${parts.length}`);
  return {
    unit,
    file,
    verdict,
    reason: r.string(o, "reason", ""),
    lines: r.number(o, "lines", ""),
    spanS: r.number(o, "spanS", ""),
    startTimestamp: r.orNull(o, "startTimestamp", "", r.string),
    parts: parts.map((value, i): FleetPartRow => {
      const p = r.object(value, `parts[${i}]`);
      const field = `parts[${i}].`;
      const id = r.string(p, "id", field);
      if (id !== header.parts[i]!.id) throw r.fail(`${field}id`, JSON.stringify(header.parts[i]!.id), id);
      return {
        id,
        peakC: r.number(p, "peakC", field),
        marginK: r.number(p, "marginK", field),
        firstExceedanceS: r.orNull(p, "firstExceedanceS", field, r.number),
        firstExceedanceTimestamp: r.orNull(p, "firstExceedanceTimestamp", field, r.string),
        firstExceedanceLine: r.orNull(p, "firstExceedanceLine", field, r.number),
        damageToDate: r.orNull(p, "damageToDate", field, r.number),
        remainingLifeYears: r.orNull(p, "remainingLifeYears", field, r.number),
      };
    }),
    error: null,
  };
}

/**
 * Read a fleet partition output (fleetNdjson's text): a header line, then one line per unit.
 * Blank lines are skipped; every other line must be one JSON object of the expected shape.
 * Source: format of our own (docs/fleet.md); JSON per RFC 8259.
 * Cost O(size of the text).
 * @throws InputError naming the file, the line and the field for a line that is not JSON, a
 *   missing header, a field of the wrong kind or a row whose parts differ from the header's
 */
export function parseFleetNdjson(text: string, file: string): FleetPartition {
  let header: FleetHeader | undefined;
  let headerLine = 0;
  const rows: FleetUnitRow[] = [];
  const sources: FleetRowSource[] = [];
  const lines = text.split("\n");
  for (let i = 0; i < lines.length; i++) {
    const source = lines[i]!.trim();
    if (source === "") continue;
    const r = new LineReader(file, i + 1);
    let value: unknown;
    try {
      value = JSON.parse(source);
    } catch {
      throw r.fail("", "one JSON object per line (a fleet partition written by heatledger fleet --ndjson)", source.length > 60 ? `${source.slice(0, 57)}...` : source);
    }
    const o = r.object(value, "");
    if (header === undefined) {
      header = readHeader(r, o);
      headerLine = i + 1;
    }
    else {
      rows.push(readRow(r, o, header));
      sources.push({ file, line: i + 1 });
    }
  }
  if (header === undefined) throw new InputError({ code: "bad-file", file, line: 0, field: "", expected: "a fleet partition: a header line, then one line per unit", found: "an empty file" });
  return { file, header, headerLine, rows, sources };
}
