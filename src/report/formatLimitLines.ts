import { wrapText } from "../text/cautions.js";
import { LIMIT_WORDS, type LimitCheck, limitMargin } from "../stress/LimitCheck.js";

const LIMIT_STATUS_WORDS = { pass: "pass", fail: "FAIL", "outside-table": "not covered by the rule (warn)" } as const;

function num(x: number): string {
  if (!Number.isFinite(x)) return "n/a";
  if (x !== 0 && (Math.abs(x) >= 1e6 || Math.abs(x) < 1e-3)) return x.toExponential(2);
  return String(Number(x.toPrecision(3)));
}

/** A paragraph wrapped to `width`, its first line after `first`, the rest after `rest`. */
function indented(text: string, first: string, rest: string, width: number): string[] {
  return wrapText(text, width - rest.length)
    .split("\n")
    .map((line, i) => (i === 0 ? first : rest) + line);
}

/**
 * The verdict lines of the limits beside temperature, one per limit: its words, the verdict,
 * the worst case found (and in which event), what was allowed there and the margin
 * allowed − found in the limit's unit and as a share of the allowance, then the basis of the
 * allowance and how many events crossed it, wrapped to `width` columns. Returns lines; prints
 * nothing. Cost O(limits).
 * @example
 * formatLimitLines([{ limit: "voltage", status: "fail", found: 400, allowed: 300, unit: "V", eventIndex: 3, eventStartS: 12, basis: "limiting-element voltage", checked: 1, crossed: 1 }])[0]
 * // "  limit, voltage across the part: FAIL: 400 V in event 3 at 12 s, allowed 300 V; margin -100 V (-33.3 %)"
 */
export function formatLimitLines(limits: readonly LimitCheck[], width = 100): string[] {
  const lines: string[] = [];
  for (const l of limits) {
    const where = l.eventIndex === undefined ? "" : ` in event ${l.eventIndex} at ${String(Number((l.eventStartS ?? 0).toPrecision(7)))} s`;
    const { margin, share } = limitMargin(l);
    const found = l.limit === "adiabatic" ? `rise ${num(l.found)} K` : l.limit === "continuous-power" ? `mean ${num(l.found)} W` : `${num(l.found)} ${l.unit}`;
    const allowed =
      l.allowed === undefined
        ? "no allowance from the rule"
        : `allowed ${num(l.allowed)} ${l.unit}; margin ${num(margin ?? 0)} ${l.unit}${share === undefined ? "" : ` (${num(share * 100)} %)`}`;
    const head = l.checked === 0 ? `limit, ${LIMIT_WORDS[l.limit]}: ${LIMIT_STATUS_WORDS[l.status]}: no case to check` : `limit, ${LIMIT_WORDS[l.limit]}: ${LIMIT_STATUS_WORDS[l.status]}: ${found}${where}, ${allowed}`;
    lines.push(...indented(head, "  ", "      ", width));
    const crossed = l.checked > 1 ? `; ${l.crossed} of ${l.checked} events crossed it` : "";
    lines.push(...indented(`basis: ${l.basis}${crossed}`, "    ", "      ", width));
  }
  return lines;
}
