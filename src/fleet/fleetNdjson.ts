import { reportCautions } from "../text/cautions.js";
import { LIFETIME_CAUTION } from "../text/stressCautions.js";
import type { FleetHeader } from "./FleetHeader.js";
import type { FleetUnitRow } from "./FleetUnitRow.js";
import type { FleetSummary } from "./fleetSummary.js";

/** The cautions of every fleet report: the general one (and the linear-mode MOSFET one) and the lifetime one. */
export function fleetCautions(header: FleetHeader): string[] {
  return [...reportCautions(header.linearMosfet), LIFETIME_CAUTION];
}

/**
 * A row as a plain object with its keys in one fixed order, whatever order the row was built or
 * read in: what NDJSON and --json print, so equal rows print equal text.
 * Cost O(parts).
 */
export function fleetRowJson(row: FleetUnitRow): Record<string, unknown> {
  if (row.error !== null) {
    const e = row.error;
    return { kind: "unit", unit: row.unit, file: row.file, verdict: "error", error: { code: e.code, file: e.file, line: e.line, field: e.field, expected: e.expected, found: e.found } };
  }
  return {
    kind: "unit",
    unit: row.unit,
    file: row.file,
    verdict: row.verdict,
    reason: row.reason,
    lines: row.lines,
    spanS: row.spanS,
    startTimestamp: row.startTimestamp,
    parts: row.parts.map((p) => ({
      id: p.id,
      peakC: p.peakC,
      marginK: p.marginK,
      firstExceedanceS: p.firstExceedanceS,
      firstExceedanceTimestamp: p.firstExceedanceTimestamp,
      firstExceedanceLine: p.firstExceedanceLine,
      damageToDate: p.damageToDate,
      remainingLifeYears: p.remainingLifeYears,
    })),
    error: null,
  };
}

/** The header line's object: the header's keys in a fixed order, and the cautions. */
export function fleetHeaderJson(header: FleetHeader): Record<string, unknown> {
  return {
    kind: "fleet-header",
    format: header.format,
    profile: header.profile,
    profileDigest: header.profileDigest,
    parts: header.parts.map((p) => ({ id: p.id, limitC: p.limitC, marginK: p.marginK })),
    logsPerYear: header.logsPerYear,
    linearMosfet: header.linearMosfet,
    cautions: fleetCautions(header),
  };
}

/**
 * A fleet summary as newline-delimited JSON (one JSON text per line, RFC 8259 each): the header
 * line, then one line per unit in rank order. This is both the output of a partition and of a
 * merge: `fleet merge` reads any number of these and writes the same text as one run over all
 * the logs (numbers print as JavaScript's shortest round-trip form, so reading and printing
 * again changes no bit).
 * Source: the NDJSON convention (one JSON value per line); ECMA-262 Number::toString.
 * Cost O(rows × parts).
 */
export function fleetNdjson(summary: FleetSummary): string {
  return [fleetHeaderJson(summary.header), ...summary.rows.map(fleetRowJson)].map((o) => `${JSON.stringify(o)}\n`).join("");
}
