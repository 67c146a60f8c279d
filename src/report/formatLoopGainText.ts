import type { SquareLawPoint } from "../circuits/mosfetSquareLaw.js";
import type { EventRecord } from "../profile/EventDigest.js";
import type { LoopGainEvent, LoopGainTally } from "../profile/LoopGainTally.js";
import { wrapText } from "../text/cautions.js";
import { formatDuration, formatNumber } from "../text/formatTable.js";

/** Marks an event whose loop gain passed the warning level, explained under the table. */
export const LOOP_GAIN_WARNING_MARK = "!";

/**
 * The events table's loop-gain cell: the largest loop gain of a charge solved with its parts'
 * temperatures ("0.49", "0.62!" past the warning level), "runaway" when the feedback ran away
 * (never a number then), empty for other events.
 */
export function loopGainCell(event: EventRecord): string {
  const s = event.electroThermal;
  if (s === undefined) return "";
  if (s.runaway !== undefined) return "runaway";
  return `${formatNumber(s.maxLoopGain, 2)}${s.maxLoopGain > s.warningLoopGain ? LOOP_GAIN_WARNING_MARK : ""}`;
}

/**
 * Where a square-law MOSFET runs against its zero-temperature-coefficient point: "square law at
 * 87.2 °C (the charge's hottest): gate overdrive 0.62 V, below the zero-temperature-coefficient
 * overdrive 2.36 V: the current rises as the die heats (+0.0123 A/K)".
 */
export function squareLawWords(p: SquareLawPoint): string {
  const where = `square law at ${formatNumber(p.temperatureC, 4)} °C (the charge's hottest): gate overdrive ${formatNumber(p.overdriveV, 3)} V`;
  const slope = `${p.tempcoAPerK > 0 ? "+" : ""}${formatNumber(p.tempcoAPerK, 3)} A/K`;
  if (p.capped) return `${where}; the saturation current caps it, so the current does not follow the temperature`;
  const ztc = p.zeroTempcoOverdriveV;
  const against = ztc === undefined ? ", no zero-temperature-coefficient point" : `, ${p.overdriveV < ztc ? "below" : "above"} the zero-temperature-coefficient overdrive ${formatNumber(ztc, 3)} V`;
  return `${where}${against}: the current ${p.tempcoAPerK > 0 ? "rises" : "falls"} as the die heats (${slope})`;
}

/** "event 12 (morning start: attempt 1 of 3)" */
function eventWords(e: LoopGainEvent): string {
  return `event ${e.index} (${e.label})`;
}

/**
 * The report's inrush line (the largest charging current, against the element's rating when
 * given) and electro-thermal block: the largest loop gain G = ∂P/∂T·Zth(t) of the charges whose
 * part follows its own temperature as a current source, how many passed the warning level, and
 * each runaway (up to the tally's keep) with its time and temperature. The block is empty when no
 * charge was coupled.
 * Cost O(runaways kept).
 */
export function formatLoopGainText(tally: LoopGainTally, width: number, ratingA?: number): string[] {
  const out: string[] = [];
  const inrush = tally.inrush;
  if (inrush !== undefined) {
    const rated = ratingA === undefined ? "" : inrush.peakCurrentA > ratingA ? `, ABOVE the element's rating of ${formatNumber(ratingA, 4)} A` : `, within the element's rating of ${formatNumber(ratingA, 4)} A`;
    out.push(wrapText(`Inrush: largest charging current ${formatNumber(inrush.peakCurrentA, 4)} A in event ${inrush.index} (${inrush.label})${rated}`, Math.min(width, 100)));
  }
  if (tally.coupled === 0) return out;
  out.push("Electro-thermal margin (loop gain ∂P/∂T·Zth(t) of each charge; 1 runs away)");
  const w = tally.worst;
  const lines: string[] = [];
  if (w !== undefined) {
    const s = w.summary;
    lines.push(
      `largest loop gain ${formatNumber(s.maxLoopGain, 3)} in ${eventWords(w)}, ${formatDuration(s.maxLoopGainAtS)} after its start; ` +
        `${tally.warnings} of ${tally.coupled} charges above the warning level ${formatNumber(s.warningLoopGain, 3)}`,
    );
  }
  const point = w?.summary.squareLaw;
  if (point !== undefined) lines.push(squareLawWords(point));
  for (const r of tally.runaways) {
    const run = r.summary.runaway!;
    lines.push(
      `THERMAL RUNAWAY in ${eventWords(r)}: the ${r.summary.role} lost its electro-thermal stability ${formatDuration(run.timeS)} after the start, ` +
        `at ${formatNumber(run.temperatureC, 4)} °C; temperatures after that are those of the lumped model, not of the part`,
    );
  }
  if (tally.runawayCount > tally.runaways.length) lines.push(`(${tally.runawayCount - tally.runaways.length} more charges ran away)`);
  for (const line of lines) out.push(wrapText(line, Math.min(width, 100)));
  return out;
}
