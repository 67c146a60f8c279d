import type { SupervisionReport } from "../supervise/supervisePrecharge.js";
import { formatCautions, wrapText } from "../text/cautions.js";
import { verdictLine } from "../stress/Verdict.js";
import { formatDuration, formatNumber, formatTable } from "../text/formatTable.js";
import { lineChart } from "./lineChart.js";
import { formatProtectedSupervision } from "./formatProtectedSupervision.js";
import { wrapHanging } from "../text/wrapHanging.js";

const dur = (s: number): string => (s === Infinity ? "unbounded" : formatDuration(s));
const volts = (v: number): string => `${formatNumber(v, 3)} V`;

/**
 * The answers a firmware engineer pastes into a design note: a Markdown table of the chosen
 * numbers (quantity, value, basis). When it is wider than `width`, the basis column leaves the
 * table and follows it as a Markdown list, one wrapped item per quantity (nothing is cut).
 */
export function supervisionSummaryTable(report: SupervisionReport, width = Infinity): string {
  const w = report.window;
  const rows: [string, string, string][] = [
    ["pre-charge timeout, lowest", dur(w.lowerS), `slowest healthy corner: ${w.lowerCorner}`],
    ["pre-charge timeout, highest (cold part)", dur(w.cold.longestS), `short at ${volts(report.shortBusVoltageV)}`],
  ];
  if (w.underRetry !== null)
    rows.push(["pre-charge timeout, highest (retry policy)", dur(w.underRetry.longestS), `${w.underRetry.binding ?? "policy"} bind; first burst's hottest attempt starts at ${formatNumber(w.underRetry.startTemperatureC, 4)} °C`]);
  rows.push(["timeout window", w.exists ? `${dur(w.lowerS)} to ${dur(w.upperS)}` : "none", w.exists ? `margin ${dur(w.marginS)}` : "NO SAFE TIMEOUT: the ends cross (see the report)"]);
  rows.push(["profile's timeout", dur(report.configuredTimeoutS), report.configuredInside ? "inside the window" : "OUTSIDE the window"]);
  const a = report.recommendedAbort;
  rows.push(["early abort", a === null ? "none usable" : `bus < ${volts(a.thresholdV)} at ${dur(a.timeS)}`, a === null ? "" : `short energy ${formatNumber(a.shortEnergyJ, 3)} J (${formatNumber(a.shareOfTimeoutEnergy * 100, 3)} % of a full timeout)`]);
  const r = report.recommendedRise;
  rows.push(["rise too fast", r === null ? "none usable" : `bus > ${volts(r.thresholdV)} at ${dur(r.timeS)}`, r === null ? "" : `fastest healthy corner ${volts(r.highestHealthyV)}`]);
  const s = report.storm;
  const count = (m: typeof s.backToBack): string => (m.unlimited ? "unlimited" : `${m.attempts}${m.capped ? "+" : ""}`);
  rows.push(["attempts back to back before the limit", count(s.backToBack), `at the ${dur(s.timeoutS)} timeout, ${dur(s.backToBackWaitS)} apart (relay)`]);
  if (s.atPolicyInterval !== null && report.policy !== null)
    rows.push([`attempts ${dur(report.policy.intervalS)} apart before the limit`, count(s.atPolicyInterval), `policy: ${report.policy.attempts} attempts, lockout ${dur(report.policy.lockoutS)}`]);
  const headings = ["quantity", "value", "basis"];
  const widths = [0, 1, 2].map((j) => Math.max(headings[j]!.length, ...rows.map((row) => row[j]!.length)));
  const wide = widths.reduce((a, b) => a + b, 0) + 3 * widths.length + 1 > width;
  const kept = wide ? 2 : 3;
  const line = (cells: readonly string[]): string => `| ${cells.slice(0, kept).map((c, j) => c.padEnd(widths[j]!)).join(" | ")} |`;
  const table = [line(headings), `|${widths.slice(0, kept).map((x) => "-".repeat(x + 2)).join("|")}|`, ...rows.map(line)];
  if (wide) table.push("", "Basis:", ...rows.filter((row) => row[2] !== "").map((row) => wrapHanging(`- ${row[0]}: ${row[2]}`, width)));
  return table.join("\n") + "\n";
}

/**
 * The text report of `heatledger supervise`: the timeout window with both ends and the margin
 * (or "no safe timeout exists" and why), the early-abort and rise-too-fast check tables with the
 * recommendation, the retry storm counts, the healthy corners, a chart of the healthy envelope and
 * the short-circuit energy, the summary table, the verdict and the cautions (docs/design.md,
 * "Cautions").
 * Cost O(corners + checks + chart width).
 * @example
 * const report = supervisePrecharge(profile("electric-boat-72v-supervision.yaml"), defaultCircuitModels);
 * formatSupervisionText(report).split("\n")[0] // => "Supervision answers: 72 V electric boat outboard, pre-charge supervision"
 */
export function formatSupervisionText(report: SupervisionReport, width = 100, chart = true): string {
  const out: string[] = [];
  const w = report.window;
  out.push(`Supervision answers: ${report.profile}`);
  out.push(`Part: ${report.part}; shorted output at the highest bus voltage, ${volts(report.shortBusVoltageV)}.`);
  out.push("");
  out.push("Timeout window");
  out.push(`  shortest timeout every healthy corner completes in: ${dur(w.lowerS)}  (${w.lowerCorner})`);
  out.push(`  longest timeout the part survives into a short, from cold: ${dur(w.cold.longestS)}  (${w.cold.corner})`);
  if (w.underRetry !== null && report.policy !== null)
    out.push(
      `  longest timeout through the retry policy (${report.policy.attempts} attempts, then ${dur(report.policy.lockoutS)} lockout, repeated; ${report.policy.field}): ${dur(w.underRetry.longestS)}` +
        `  (hottest attempt of the first burst starts at ${formatNumber(w.underRetry.startTemperatureC, 4)} °C${w.underRetry.binding === null ? "" : `; ${w.underRetry.binding} bind`})`,
    );
  else out.push("  the profile has no retry block: the upper end is the cold one");
  if (w.exists) out.push(`  window: ${dur(w.lowerS)} to ${dur(w.upperS)}; margin ${dur(w.marginS)}${Number.isFinite(w.marginRatio) ? ` (upper/lower ${formatNumber(w.marginRatio, 3)})` : ""}`);
  else out.push(`  NO SAFE TIMEOUT EXISTS: ${w.reason}.`);
  out.push(`  the profile's timeout, ${dur(report.configuredTimeoutS)}, is ${report.configuredInside ? "inside" : "OUTSIDE"} the window.`);
  out.push(`  into a short at that timeout${report.policy === null ? ", one attempt from cold" : ", through the retry policy"}: ${report.timeoutVerdict}.`);
  out.push("");
  out.push(`Early-abort checks: abort when the bus is still below the threshold at the check time`);
  out.push(`  (threshold = (1 − ${formatNumber(report.marginFraction, 3)})·lowest healthy bus voltage; usable when ≥ the ${volts(report.floorV)} measurement floor)`);
  out.push(
    indent(
      formatTable(
        [{ heading: "check", align: "right" }, { heading: "lowest healthy [V]", align: "right" }, { heading: "threshold [V]", align: "right" }, { heading: "short energy before [J]", align: "right" }, { heading: "of timeout", align: "right" }, { heading: "usable" }],
        report.abortChecks.map((c) => [dur(c.timeS), formatNumber(c.lowestHealthyV, 4), formatNumber(c.thresholdV, 4), formatNumber(c.shortEnergyJ, 4), `${formatNumber(c.shareOfTimeoutEnergy * 100, 3)} %`, c.usable ? "yes" : "no"]),
      ),
    ),
  );
  const a = report.recommendedAbort;
  out.push(a === null ? "  no usable early-abort check at these times." : `  recommended: abort if the bus is below ${volts(a.thresholdV)} at ${dur(a.timeS)}; a short then puts ${formatNumber(a.shortEnergyJ, 3)} J into the part instead of ${formatNumber(report.timeoutShortEnergyJ, 3)} J at the timeout.`);
  out.push("");
  out.push("Rise-too-fast checks: abort when the bus is already above the threshold (a bypassed or shorted pre-charge element)");
  out.push(
    indent(
      formatTable(
        [{ heading: "check", align: "right" }, { heading: "highest healthy [V]", align: "right" }, { heading: "threshold [V]", align: "right" }, { heading: "usable" }],
        report.riseChecks.map((c) => [dur(c.timeS), formatNumber(c.highestHealthyV, 4), formatNumber(c.thresholdV, 4), c.usable ? "yes" : "no"]),
      ),
    ),
  );
  const r = report.recommendedRise;
  out.push(r === null ? "  no usable rise-too-fast check at these times." : `  recommended: abort if the bus is above ${volts(r.thresholdV)} at ${dur(r.timeS)}.`);
  out.push("");
  if (report.protection !== null) out.push(...formatProtectedSupervision(report.protection, Math.min(width, 100)), "");
  out.push(`Retry storms into a short at the profile's ${dur(report.storm.timeoutS)} timeout (retry planner)`);
  const storm = (label: string, m: typeof report.storm.backToBack): string =>
    m.unlimited
      ? `  ${label}: unlimited (the part stays within limit − margin for ever; ${m.governing.corner})`
      : `  ${label}: ${m.attempts}${m.capped ? " or more" : ""} attempt(s) stay within limit − margin; the next reaches ${m.firstUnsafePeakC === null ? "n/a" : `${formatNumber(m.firstUnsafePeakC, 4)} °C`} (${m.governing.corner}). Lock out after at most that many.`;
  out.push(storm(`back to back (${dur(report.storm.backToBackWaitS)} apart: relay)`, report.storm.backToBack));
  if (report.storm.atPolicyInterval !== null && report.policy !== null) out.push(storm(`${dur(report.policy.intervalS)} apart (the policy's interval)`, report.storm.atPolicyInterval));
  out.push("");
  out.push("Healthy corners");
  out.push(
    indent(
      formatTable(
        [{ heading: "corner" }, { heading: "threshold [V]", align: "right" }, { heading: "completes in", align: "right" }],
        report.corners.map((c) => [c.name, formatNumber(c.thresholdV, 4), Number.isFinite(c.completionS) ? dur(c.completionS) : `never (${c.busStalled ? "the bus stalls below it" : c.outcome})`]),
      ),
    ),
  );
  if (chart) {
    const e = report.envelope;
    const points = (ys: readonly number[]) => e.timeS.map((x, i) => ({ x, y: ys[i]! }));
    out.push("Healthy bus voltage envelope");
    out.push(
      lineChart(
        [
          { label: "slowest healthy bus", points: points(e.lowV) },
          { label: "fastest healthy bus", points: points(e.highV) },
        ],
        { width: Math.min(width, 100), height: 10, yUnit: "V", lines: a === null ? [] : [{ label: `early-abort threshold at ${dur(a.timeS)}`, y: a.thresholdV }] },
      ),
    );
    out.push(`Energy a shorted output puts into ${report.part}, same time axis`);
    out.push(lineChart([{ label: "short-circuit energy", points: points(e.shortEnergyJ) }], { width: Math.min(width, 100), height: 6, yUnit: "J" }));
  }
  out.push("Summary (Markdown, for a design note)");
  out.push(supervisionSummaryTable(report, width));
  for (const p of report.problems) out.push(`Problem: ${p}`);
  out.push(wrapText(verdictLine(report.verdict, verdictReason(report)), Math.min(width, 100)));
  out.push("");
  out.push(formatCautions(report.linearMosfet, Math.min(width, 100)));
  // sentences longer than the width wrap under themselves (the tables and charts above fit already)
  return out
    .join("\n")
    .split("\n")
    .map((l) => wrapHanging(l, width))
    .join("\n");
}

/** Why the supervision verdict is what it is, in words. */
function verdictReason(report: SupervisionReport): string {
  const timeout = `the profile's timeout, ${dur(report.configuredTimeoutS)}`;
  if (!(report.configuredTimeoutS >= report.window.lowerS)) return `${timeout}, is shorter than the slowest healthy charge`;
  switch (report.verdict) {
    case "pass":
      return `${timeout}, is inside the window: attempts into a short stay at or below limit − margin`;
    case "warn":
      return `${timeout}, is longer than the window allows: a short takes the part inside its design margin, not above its limit`;
    case "fail":
      return `at ${timeout}, a short takes the part above its limit`;
  }
}

function indent(text: string): string {
  return text
    .trimEnd()
    .split("\n")
    .map((l) => `  ${l}`)
    .join("\n");
}
