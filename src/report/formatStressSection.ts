import { wrapText } from "../text/cautions.js";
import { CYCLE_QUANTITY_WORDS } from "../stress/LifetimeModel.js";
import { type EventRatingCheck, type StressReport, worseStatus } from "../stress/assessStress.js";
import type { PulseEnergyCheck, RatingStatus } from "../stress/pulseEnergyRating.js";
import { formatLimitLines } from "./formatLimitLines.js";

/** Most events with a failing or uncovered rating check the terminal section lists one by one. */
export const STRESS_SECTION_MAX_EVENTS = 8;

/** Width the section's prose (warnings, notes, cautions) is wrapped to. */
export const STRESS_SECTION_WIDTH = 100;

/**
 * Wrap a paragraph to the section width, the first line after `lead`, the rest indented to match
 * (or by `hang` more spaces than the lead's indentation, for list items).
 */
function paragraph(lead: string, text: string, hang?: number): string[] {
  const pad = hang === undefined ? " ".repeat(lead.length) : " ".repeat(lead.length - lead.trimStart().length + hang);
  return wrapText(text, STRESS_SECTION_WIDTH - Math.max(lead.length, pad.length))
    .split("\n")
    .map((line, i) => (i === 0 ? lead : pad) + line);
}

function num(x: number, digits = 3): string {
  if (x === Number.POSITIVE_INFINITY) return "unlimited";
  if (!Number.isFinite(x)) return "n/a";
  if (x !== 0 && (Math.abs(x) >= 1e6 || Math.abs(x) < 1e-3)) return x.toExponential(digits - 1);
  return String(Number(x.toPrecision(digits)));
}

/** An event's start time [s] to 7 significant digits, without exponent or trailing zeros (events seconds apart over days stay distinct). */
function seconds(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(7))) : "n/a";
}

/** How the damage lines name one pass of the history ("per repetition of the profile", "repetitions"). */
export interface StressHistoryWords {
  /** follows the damage figure: "per repetition of the profile" */
  readonly perRepetition: string;
  /** follows the count to end of life: "repetitions" */
  readonly repetitions: string;
}

/** The words of `simulate`: the history is one repetition of a duty profile. */
export const PROFILE_HISTORY_WORDS: StressHistoryWords = { perRepetition: "per repetition of the profile", repetitions: "repetitions" };

const STATUS_WORDS = { pass: "pass", fail: "FAIL", "outside-table": "not covered by the table" } as const;

/** ", from 151 °C" when the event's start temperature is known. */
function startWords(e: EventRatingCheck): string {
  return e.startTemperatureC === undefined ? "" : `, from ${num(e.startTemperatureC, 4)} °C`;
}

/** "62.6 % of 146 J allowed (150 J rated, derated to 97.4 %)", or that nothing is allowed at that start. */
function allowanceWords(pe: PulseEnergyCheck): string {
  const rated = `${num(pe.ratedEnergyJ ?? 0)} J rated`;
  if (pe.allowedEnergyJ === undefined || !(pe.allowedEnergyJ > 0)) return `no energy allowed at that start temperature (${rated}, derated to 0 %)`;
  const derated = pe.deratingFactor < 1 ? `${rated}, derated to ${num(pe.deratingFactor * 100)} %` : `${rated}, not derated`;
  return `${num((pe.utilisation ?? 0) * 100)} % of ${num(pe.allowedEnergyJ)} J allowed (${derated})`;
}

/**
 * The terminal "stress" section of one part: rating checks per event (only the failing or
 * uncovered ones listed, each with its start temperature and derated allowance, plus a count of
 * passes and the event with the highest pulse-energy use), the cycle summary, Miner damage with
 * its projections and the most damaging cycles, the cycles outside the model's validity range
 * ("extrapolated", per quantity), warnings, notes and cautions. Plain text, lines of at most
 * 100 characters; returns a string, prints nothing.
 * Cost O(events + top cycles + warnings).
 * @example
 * const history = [25, 125, 25].map((temperatureC, timeS) => ({ timeS, temperatureC }));
 * formatStressSection("R1", assessStress(resolveStressConfig({}), [], history)).split("\n")[1] // => "  ratings: no rating table applies"
 */
export function formatStressSection(partId: string, report: StressReport, history: StressHistoryWords = PROFILE_HISTORY_WORDS): string {
  const lines: string[] = [`Stress — ${partId}`];
  const checked = report.events.filter((e) => e.pulseEnergy !== undefined || e.soa !== undefined);
  if (checked.length > 0) {
    const passes = checked.filter((e) => e.status === "pass").length;
    // the pulse tables' own status: the limits beside temperature print their own lines below
    const tableStatus = checked.reduce<RatingStatus>((s, e) => worseStatus(s, e.status), "pass");
    lines.push(`  ratings: ${STATUS_WORDS[tableStatus]} (${passes} of ${checked.length} events within ratings)`);
    const flagged = checked.filter((e) => e.status !== "pass");
    for (const e of flagged.slice(0, STRESS_SECTION_MAX_EVENTS)) {
      const pe = e.pulseEnergy;
      if (pe !== undefined && pe.status !== "pass")
        lines.push(
          ...paragraph(
            "    ",
            `event ${e.index} at ${seconds(e.startS)} s${startWords(e)}: pulse energy ${num(pe.energyJ)} J at t_eq ${num(pe.equivalentDurationS)} s: ` +
              (pe.ratedEnergyJ === undefined ? `${STATUS_WORDS[pe.status]} (${pe.position})` : `${allowanceWords(pe)}, ${STATUS_WORDS[pe.status]}`),
            2,
          ),
        );
      const soa = e.soa;
      if (soa !== undefined && soa.status !== "pass") {
        const w = soa.worst;
        lines.push(
          ...paragraph(
            "    ",
            `event ${e.index} at ${seconds(e.startS)} s${startWords(e)}: SOA ${STATUS_WORDS[soa.status]}: ${soa.pointsOutside} of ${soa.pointsChecked} points past the boundary, ` +
              `${soa.pointsNotCovered} not covered` +
              (w === undefined ? "" : `; worst ${num(w.idA)} A at ${num(w.vdsV)} V (allowed ${num(w.allowedA)} A for ${num(soa.durationS)} s)`) +
              (soa.deratingFactor < 1 ? `, boundaries derated to ${num(soa.deratingFactor * 100)} %` : ""),
            2,
          ),
        );
      }
    }
    if (flagged.length > STRESS_SECTION_MAX_EVENTS)
      lines.push(`    ... and ${flagged.length - STRESS_SECTION_MAX_EVENTS} more events outside their ratings (all of them in the JSON report)`);
    const worstEnergy = checked.reduce<EventRatingCheck | undefined>(
      (w, e) => ((e.pulseEnergy?.utilisation ?? 0) > (w?.pulseEnergy?.utilisation ?? 0) ? e : w),
      undefined,
    );
    const pe = worstEnergy?.pulseEnergy;
    if (worstEnergy !== undefined && pe !== undefined)
      lines.push(
        ...paragraph("    ", `highest pulse-energy use: event ${worstEnergy.index} at ${seconds(worstEnergy.startS)} s${startWords(worstEnergy)}: ${num(pe.energyJ)} J, ${allowanceWords(pe)}`, 2),
      );
    const worstSoa = Math.max(0, ...checked.map((e) => e.soa?.worst?.utilisation ?? 0));
    if (worstSoa === Number.POSITIVE_INFINITY) lines.push("    highest SOA use: no current allowed (an event starts at or above the maximum junction temperature)");
    else if (worstSoa > 0) lines.push(`    highest SOA use: ${num(worstSoa * 100)} % of the allowed current`);
  } else lines.push(report.limits.length > 0 ? "  ratings: no pulse rating table applies" : "  ratings: no rating table applies");
  lines.push(...formatLimitLines(report.limits, STRESS_SECTION_WIDTH));
  const c = report.cycleSummary;
  lines.push(
    ...paragraph(
      "  ",
      `cycles (${c.mode === "repeating" ? "repeating history, ASTM E1049 §5.4.5" : "open history, ASTM E1049 §5.4.4"}, hysteresis ${num(c.hysteresisK)} K): ` +
        `${c.fullCycles} full, ${c.halfCycles} half from ${c.turningPoints} turning points; largest range ${num(c.largestRangeK)} K` +
        (c.lowestC === undefined || c.highestC === undefined ? "" : `, ${num(c.lowestC)} to ${num(c.highestC)} °C`),
      2,
    ),
  );
  const d = report.damage;
  if (d !== undefined) {
    lines.push(`  damage (${d.model}, Miner's rule): ${num(d.damagePerRepetition)} ${history.perRepetition}`);
    lines.push(
      `    end of life after ${num(d.repetitionsToEndOfLife)} ${history.repetitions}` + (d.yearsToEndOfLife === undefined ? "" : ` (${num(d.yearsToEndOfLife)} years at the stated rate)`),
    );
    if (d.topCycles.length > 0) {
      lines.push("    most damaging cycles:");
      // cycles that print the same are listed once with their summed count and share
      const grouped = new Map<string, { count: number; share: number; cyclesToFailure: number }>();
      for (const t of d.topCycles) {
        const key = `${num(t.cycle.rangeK)} K (${num(t.cycle.minC)} to ${num(t.cycle.maxC)} °C, heating ${num(t.cycle.heatingTimeS)} s)`;
        const entry = grouped.get(key) ?? { count: 0, share: 0, cyclesToFailure: t.cyclesToFailure };
        entry.count += t.cycle.count;
        entry.share += t.share;
        grouped.set(key, entry);
      }
      for (const [key, g] of grouped) lines.push(`      ${key} ×${g.count}: N_f ${num(g.cyclesToFailure)}, ${num(g.share * 100)} % of the damage`);
    }
    for (const x of d.extrapolated)
      lines.push(
        ...paragraph(
          "  extrapolated: ",
          `${num(x.cycles)} of ${num(d.cyclesCounted)} counted cycles have a ${CYCLE_QUANTITY_WORDS[x.quantity]} of ${num(x.found[0], 4)}-${num(x.found[1], 4)} ${x.unit}, ` +
            `outside the model's validity range ${num(x.range[0], 4)}-${num(x.range[1], 4)} ${x.unit} (${x.origin}); they carry ${num(x.damageShare * 100)} % of the damage`,
        ),
      );
    for (const w of d.warnings) lines.push(...paragraph("  warning: ", w));
  }
  for (const n of report.notes) lines.push(...paragraph("  note: ", n));
  for (const caution of report.cautions) lines.push(...paragraph("  ", caution));
  return `${lines.join("\n")}\n`;
}
