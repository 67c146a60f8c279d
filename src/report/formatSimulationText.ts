import { formatContactorLines } from "./formatContactorLines.js";
import { surroundingsLines } from "./surroundingsSummary.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import type { SimulationResult } from "../profile/simulateProfile.js";
import { formatCautions, wrapText } from "../text/cautions.js";
import { EVENT_DIGEST_DEFAULTS, type EventDigest, type EventRecord } from "../profile/EventDigest.js";
import { formatDuration, formatNumber } from "../text/formatTable.js";
import { fitTable } from "../text/fitTable.js";
import { wrapHanging } from "../text/wrapHanging.js";
import { lineChart } from "./lineChart.js";
import type { PeakEnvelope } from "./PeakEnvelope.js";
import { simulationVerdict } from "./simulationVerdict.js";
import type { RatingStatus } from "../stress/pulseEnergyRating.js";
import { verdictLine } from "../stress/Verdict.js";
import { LOOP_GAIN_WARNING_MARK, formatLoopGainText, loopGainCell } from "./formatLoopGainText.js";

/** A time on the profile's clock: "3 d 04:05:06.250" (milliseconds shown when not whole). */
function clock(seconds: number): string {
  if (!Number.isFinite(seconds)) return "n/a";
  const days = Math.floor(seconds / 86400);
  let rest = seconds - days * 86400;
  const h = Math.floor(rest / 3600);
  rest -= h * 3600;
  const m = Math.floor(rest / 60);
  const sec = rest - m * 60;
  const secText = Math.abs(sec - Math.round(sec)) < 5e-4 ? String(Math.round(sec)).padStart(2, "0") : sec.toFixed(3).padStart(6, "0");
  const text = `${String(h).padStart(2, "0")}:${String(m).padStart(2, "0")}:${secText}`;
  return days > 0 ? `${days} d ${text}` : text;
}

/** A bus voltage for the table: below 1 mV it prints as 0. */
function volts(v: number): string {
  return Math.abs(v) < 1e-3 ? "0" : formatNumber(v, 3);
}

/** Marks an attempt the timer ended whose bus had stalled below the threshold (busStalled), explained under the table. */
const STALLED_MARK = "*";

/** What a command other than `simulate` puts at the top of the report (`replay`: the log it read). */
export interface SimulationTextHeader {
  /** the command named in the first line (default "simulate") */
  readonly command?: string;
  /** lines printed after the profile line */
  readonly lines?: readonly string[];
}

/**
 * The terminal report of a simulation: a header, one row per part (peak, when, limit, margin,
 * verdict, first time over the limit), one row per event (all of them for a short profile, else
 * the events closest to a limit), a chart of each part's temperature with its limit line, the
 * verdict (simulationVerdict: the temperature verdict and `ratingStatus`, the stress layer's rating
 * checks), and the cautions (docs/design.md, "Cautions") at the end. Returns a string; the CLI
 * prints it.
 * `stressText` (optional, from formatProfileStress) goes just before the verdict; `header`
 * (optional) names another command and adds lines under the profile line.
 * Cost O(parts × (events kept + chart width)).
 * @example
 * const robot = profile("warehouse-robot-48v.yaml");
 * const digest = new EventDigest(robot.parts.map((p) => p.limitC));
 * const result = simulateProfile(robot, { models: defaultCircuitModels, onEvent: (e, t) => digest.add(e, t) });
 * formatSimulationText(robot, result, digest, undefined).split("\n")[1] // => "profile profiles/warehouse-robot-48v.yaml: 24 events over 17.4 h"
 */
export function formatSimulationText(
  profile: DutyProfile,
  result: SimulationResult,
  digest: EventDigest,
  envelope: PeakEnvelope | undefined,
  width = 100,
  stressText = "",
  header: SimulationTextHeader = {},
  ratingStatus: RatingStatus = "pass",
): string {
  const out: string[] = [];
  out.push(wrapText(`heatledger ${header.command ?? "simulate"}: ${profile.name}`, width).trimEnd());
  out.push(`profile ${profile.file}: ${result.eventCount} events over ${formatDuration(result.endTimeS)}`);
  if (header.lines !== undefined) out.push(...header.lines);
  out.push(...surroundingsLines(profile));
  const o = result.outcomes;
  const charges = o.completed + o["timed-out"] + o.tripped;
  if (charges > 0)
    out.push(
      `pre-charge attempts: ${charges} (${o.completed} completed, ${o["timed-out"]} timed out${o.tripped > 0 ? `, ${o.tripped} ended by a protection` : ""}` +
        `${o.busStalled > 0 ? `; the bus stalled in ${o.busStalled} of them` : ""})`,
    );
  out.push("");
  out.push("Parts");
  out.push(
    fitTable(
      [
        { heading: "part" },
        { heading: "peak [°C]", align: "right" },
        { heading: "at", align: "right" },
        { heading: "limit [°C]", align: "right" },
        { heading: "margin [K]", align: "right" },
        { heading: "wanted [K]", align: "right" },
        { heading: "verdict" },
        { heading: "first over limit", align: "right" },
        { heading: "energy [J]", align: "right" },
      ],
      result.parts.map((p) => [
        p.id,
        formatNumber(p.peakTemperatureC, 4),
        formatDuration(p.peakTimeS),
        formatNumber(p.limitC, 4),
        formatNumber(p.marginK, 3),
        formatNumber(p.requiredMarginK, 3),
        p.verdict,
        p.firstExceedanceS === undefined ? "never" : formatDuration(p.firstExceedanceS),
        formatNumber(p.energyJ, 4),
      ]),
      { width },
    ).text,
  );
  const short = digest.count <= EVENT_DIGEST_DEFAULTS.terminalAll && digest.all.length === digest.count;
  const shown: readonly EventRecord[] = short ? digest.all : [...digest.hottest].sort((a, b) => a.index - b.index);
  out.push(short ? "Events" : `Events: the ${shown.length} closest to a limit, of ${digest.count} (--json lists ${digest.count <= EVENT_DIGEST_DEFAULTS.keepAll ? "all" : `the first ${EVENT_DIGEST_DEFAULTS.keepAll}`})`);
  const ids = profile.parts.map((p) => p.id);
  const multi = ids.length > 1;
  const hasCircuit = profile.circuit !== undefined;
  const hasContactor = profile.circuit?.contactor !== undefined;
  const coupled = digest.loopGain.coupled > 0;
  const inrush = coupled || profile.circuit?.peakCurrentRatingA !== undefined || profile.circuit?.topology === "series-resistor" && profile.circuit.temperatureCurve !== undefined;
  const events = fitTable(
      [
        { heading: "#", align: "right" },
        { heading: "start [d h:m:s]", align: "right" },
        { heading: "event" },
        { heading: "outcome" },
        ...(hasCircuit ? [{ heading: "bus [V]", align: "right" as const }] : []),
        ...(hasContactor ? [{ heading: "close [A]", align: "right" as const }] : []),
        ...ids.map((id) => ({ heading: multi ? `${id} [J]` : "energy [J]", align: "right" as const })),
        ...ids.map((id) => ({ heading: multi ? `${id} [°C]` : "peak [°C]", align: "right" as const })),
        ...(inrush ? [{ heading: "inrush [A]", align: "right" as const }] : []),
        ...(coupled ? [{ heading: "loop gain", align: "right" as const }] : []),
      ],
      shown.map((e) => [
        String(e.index),
        clock(e.startS),
        e.label,
        e.outcome === "none" ? "" : e.busStalled ? `${e.outcome}${STALLED_MARK}` : e.outcome,
        ...(hasCircuit ? [volts(e.startVoltageV) === volts(e.endVoltageV) ? volts(e.endVoltageV) : `${volts(e.startVoltageV)}→${volts(e.endVoltageV)}`] : []),
        ...(hasContactor ? [e.closing === undefined ? "" : formatNumber(e.closing.peakCurrentA, 4)] : []),
        ...e.energyJ.map((j) => (j === 0 ? "" : formatNumber(j, 4))),
        ...e.peakTemperatureC.map((t) => formatNumber(t, 4)),
        ...(inrush ? [e.peakCurrentA === undefined ? "" : formatNumber(e.peakCurrentA, 4)] : []),
        ...(coupled ? [loopGainCell(e)] : []),
      ]),
      { width, keyColumns: 2, cutColumn: 2, cutMin: 24 },
    );
  out.push(events.text);
  if (events.cutCells > 0) out.push(`(${events.cutCells} event names cut to fit ${width} columns, ended with …; --width or --json shows them whole)`);
  if (shown.some((e) => e.busStalled)) out.push(`${STALLED_MARK} timed out with the bus stalled below the completion threshold: it would never have got there`);
  if (shown.some((e) => loopGainCell(e).endsWith(LOOP_GAIN_WARNING_MARK))) out.push(`${LOOP_GAIN_WARNING_MARK} loop gain above the warning level`);
  out.push(...formatLoopGainText(digest.loopGain, width, profile.circuit?.peakCurrentRatingA));
  if (envelope !== undefined) {
    profile.parts.forEach((p, i) => {
      out.push(`Temperature of ${p.id}`);
      out.push(
        lineChart([{ label: `${p.id} (peak in each time slice)`, points: envelope.points(i) }], {
          width: Math.min(width, 120),
          lines: [{ label: "limit", y: p.limitC }],
          yUnit: "°C",
        }),
      );
    });
  }
  // the stress layer's block (rating checks, cycles, damage; src/report/formatProfileStress.ts), before the verdict
  if (stressText !== "") out.push(stressText);
  if (result.contactor !== undefined) out.push(...formatContactorLines(result.contactor, Math.min(width, 100)));
  const verdict = simulationVerdict(result.verdict, ratingStatus, result.contactor?.verdict);
  out.push(wrapText(verdictLine(verdict.verdict, verdict.reason), Math.min(width, 100)));
  out.push("");
  out.push(formatCautions(profile.circuit?.topology === "linear-mosfet", Math.min(width, 100)));
  // sentences longer than the width wrap under themselves (the tables and charts above fit already)
  return out
    .join("\n")
    .split("\n")
    .map((l) => wrapHanging(l, width))
    .join("\n");
}
