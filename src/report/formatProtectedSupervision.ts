import type { ProtectedSupervision } from "../supervise/superviseProtection.js";
import type { ForeverIntervalAnswer } from "../retry/minForeverInterval.js";
import { wrapText } from "../text/cautions.js";
import { formatDuration, formatNumber } from "../text/formatTable.js";

const interval = (a: ForeverIntervalAnswer): string => (a.minimumIntervalS === null ? "none scanned is safe" : formatDuration(a.minimumIntervalS));

/**
 * The supervise report's block on the recommended checks as profile protection: for each check the
 * energy before it fires into a hard short and into the weakest fault it catches, what a fault
 * it misses puts in until the timeout, the healthy margin, and the retry-for-ever interval into a
 * short without and with the checks (what `--checks` buys); the recommended limits (firmware I²t,
 * maximum on-time) with the healthy value each clears and what it lets a hard short put in.
 * Cost O(checks).
 */
export function formatProtectedSupervision(p: ProtectedSupervision, width: number): string[] {
  const out = ["Recommended checks and limits as profile protection (supervise --checks FILE writes them)"];
  for (const c of p.checks) {
    const what = c.kind === "early-abort" ? `bus below ${formatNumber(c.thresholdV, 4)} V at ${formatDuration(c.timeS)}` : `bus above ${formatNumber(c.thresholdV, 4)} V at ${formatDuration(c.timeS)}`;
    const parts = [`  ${c.kind}: ${what}.`];
    if (c.shortEnergyJ !== null) parts.push(`Into a hard short the part takes ${formatNumber(c.shortEnergyJ, 3)} J before it fires.`);
    if (c.partialFault !== null)
      parts.push(
        `The weakest fault it catches is ${formatNumber(c.partialFault.resistanceOhm, 3)} ohm across the bus: ${formatNumber(c.partialFault.energyBeforeFiringJ, 3)} J before it fires;` +
          ` a weaker fault runs until the timeout or a limit ends it: ${formatNumber(c.partialFault.missedEnergyJ, 3)} J.`,
      );
    if (c.currentFault !== null)
      parts.push(
        `The smallest constant current it catches is ${formatNumber(c.currentFault.currentA, 3)} A: ${formatNumber(c.currentFault.energyBeforeFiringJ, 3)} J before it fires;` +
          ` a smaller one: ${formatNumber(c.currentFault.missedEnergyJ, 3)} J.`,
      );
    parts.push(`Healthy margin: ${formatNumber(c.healthyMarginV, 3)} V (${formatNumber(c.healthyMarginFraction * 100, 3)} %) from corner ${c.healthyCorner}.`);
    out.push(wrapText(parts.join(" "), width));
  }
  for (const l of p.limits) {
    const what =
      l.kind === "firmware-i2t"
        ? `firmware I²t ${formatNumber(l.value, 4)} A²s (a healthy charge takes at most ${formatNumber(l.healthyValue, 4)} A²s, corner ${l.healthyCorner})`
        : `maximum on-time ${formatDuration(l.value)} (the slowest healthy charge completes in ${formatDuration(l.healthyValue)}, corner ${l.healthyCorner})`;
    out.push(wrapText(`  ${l.kind}: ${what}. Alone, it ends an attempt into a hard short at ${formatDuration(l.shortFiringS)}: ${formatNumber(l.shortEnergyJ, 3)} J into the part.`, width));
  }
  const limitsAlone = p.foreverWithLimits === null ? "" : `; ${interval(p.foreverWithLimits)} with the limits alone`;
  out.push(
    wrapText(
      `  retry for ever into a short (start to start): ${interval(p.foreverWithout)} at the timeout alone; ${interval(p.foreverWith)} with this protection (${p.foreverWith.governing.corner})${limitsAlone}.`,
      width,
    ),
  );
  return out;
}
