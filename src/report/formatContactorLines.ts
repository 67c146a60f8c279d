import type { ContactorSummary } from "../profile/ContactorTally.js";
import { formatDuration, formatNumber } from "../text/formatTable.js";
import { wrapText } from "../text/cautions.js";

/**
 * The contactor block of a simulation report: how often it closed, the worst closing (residual
 * voltage difference, energy C·ΔV²/2, peak current and the loop's damping) against the
 * making-current rating, and its verdict line. Cost O(1).
 */
export function formatContactorLines(c: ContactorSummary, width: number): string[] {
  const w = c.worst;
  const when = w.peakTimeS > 0 ? ` ${formatDuration(w.peakTimeS)} after closing` : " at the instant of closing";
  return [
    "Contactor at close",
    wrapText(
      `${c.closes} closing(s); the worst after event ${c.worstEventIndex}: ${formatNumber(w.deltaV, 3)} V left across it, ` +
        `${formatNumber(w.energyJ, 3)} J into the loop, peak ${formatNumber(w.peakCurrentA, 4)} A${when} (${w.loop} loop) ` +
        `against a making-current rating of ${formatNumber(c.makingCurrentA, 4)} A (${formatNumber(w.ratingRatio * 100, 3)} %).`,
      width,
    ),
    `contactor verdict: ${c.verdict}`,
    "",
  ];
}
