import type { ProfileStressResult } from "../profile/ProfileStress.js";
import { type EventLog, logLineAt, logTimestamp } from "../replay/EventLog.js";
import type { MeasuredComparison } from "../replay/MeasuredResiduals.js";
import type { ReplayResult } from "../replay/replayEventLog.js";
import type { LogReplay } from "../replay/replayLog.js";
import { formatDuration, formatNumber } from "../text/formatTable.js";

/** One part's findings from a field log: when it first went above its limit (and on which log line), and its damage to date. */
export interface ReplayPartSummary {
  readonly id: string;
  /** seconds from the log's first line; null when the part never went above its limit */
  readonly firstExceedanceS: number | null;
  /** the same moment on the unit's clock (ISO 8601, UTC) for a timestamped log; null otherwise */
  readonly firstExceedanceTimestamp: string | null;
  /** the log line in effect then (the last line at or before it) */
  readonly firstExceedanceLine: { readonly line: number; readonly event: string; readonly note: string } | null;
  /** Miner damage of the whole log (open history, ASTM E1049 §5.4.4); null without a lifetime model */
  readonly damageToDate: number | null;
}

/** What `replay --json` adds under `replay`, and what the text report's header says. */
export interface ReplaySummary {
  readonly log: string;
  readonly lines: number;
  /** seconds from the first line to the last */
  readonly spanS: number;
  readonly timeKind: "seconds" | "timestamp";
  /** the first line's time on the unit's clock (ISO 8601, UTC) for a timestamped log; null otherwise */
  readonly startTimestamp: string | null;
  /** events the profile states itself, ignored by the replay */
  readonly ignoredProfileEvents: number;
  readonly parts: readonly ReplayPartSummary[];
  /** the log's measured columns against the replay (residual statistics); null when it has none */
  readonly measured: MeasuredComparison | null;
}

/**
 * The replay's own findings, from the simulation and the stress layer: the log, per part the
 * first exceedance mapped back onto the log (line, event word, note, timestamp) and the damage to
 * date (Miner's rule over the log counted as a one-off history).
 * Cost O(parts × log (lines)).
 * @example
 * const pump = profile("irrigation-pump-decade.yaml");
 * const log = parseEventLog(bundled("logs/irrigation-pump-returned-unit.csv"), "returned-unit.csv");
 * const stress = new ProfileStress(pump);
 * const replay = replayEventLog(pump, log, { models: defaultCircuitModels, onEvent: (e) => stress.addEvent(e), onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i) });
 * replaySummary(log, replay, stress.finish(replay.simulation.endTimeS)).parts[0].firstExceedanceLine.line // => 80
 */
export function replaySummary(log: EventLog, replay: ReplayResult, stress: ProfileStressResult): ReplaySummary {
  const last = log.lines[log.lines.length - 1]!;
  return {
    log: log.file,
    lines: log.lines.length,
    spanS: last.timeS,
    timeKind: log.timeKind,
    startTimestamp: logTimestamp(log, 0) ?? null,
    ignoredProfileEvents: replay.ignoredProfileEvents,
    parts: replay.simulation.parts.map((p, i) => {
      const t = p.firstExceedanceS;
      const line = t === undefined ? undefined : logLineAt(log, t);
      const damage = stress.parts[i]?.report.damage;
      return {
        id: p.id,
        firstExceedanceS: t ?? null,
        firstExceedanceTimestamp: t === undefined ? null : (logTimestamp(log, t) ?? null),
        firstExceedanceLine: line === undefined ? null : { line: line.line, event: line.word, note: line.note },
        damageToDate: damage === undefined ? null : damage.damagePerRepetition,
      };
    }),
    measured: null,
  };
}

/**
 * The same findings from a streamed replay (replayLog): the first exceedance's log line was placed
 * during the run, so no list of lines is needed; the measured comparison is carried over.
 * Cost O(parts).
 * @example
 * const pump = profile("irrigation-pump-decade.yaml");
 * const stress = new ProfileStress(replayShell(pump), { mode: "open" });
 * const replay = replayLog(pump, textPieces(bundled("logs/irrigation-pump-returned-unit.csv")), "returned-unit.csv", { models: defaultCircuitModels, onEvent: (e) => stress.addEvent(e), onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i) });
 * logReplaySummary(replay, stress.finish(replay.simulation.endTimeS)).parts[0].firstExceedanceLine.line // => 80
 */
export function logReplaySummary(replay: LogReplay, stress: ProfileStressResult): ReplaySummary {
  const { log } = replay;
  const stamp = (timeS: number): string | null => (log.startEpochMs === undefined ? null : new Date(log.startEpochMs + Math.round(timeS * 1000)).toISOString());
  return {
    log: log.file,
    lines: log.lines,
    spanS: log.spanS,
    timeKind: log.timeKind,
    startTimestamp: stamp(0),
    ignoredProfileEvents: replay.ignoredProfileEvents,
    parts: replay.simulation.parts.map((p, i) => {
      const t = p.firstExceedanceS;
      const line = replay.exceedanceLines[i] ?? null;
      const damage = stress.parts[i]?.report.damage;
      return {
        id: p.id,
        firstExceedanceS: t ?? null,
        firstExceedanceTimestamp: t === undefined ? null : stamp(t),
        firstExceedanceLine: t === undefined || line === null ? null : { line: line.line, event: line.event, note: line.note },
        damageToDate: damage === undefined ? null : damage.damagePerRepetition,
      };
    }),
    measured: replay.measured,
  };
}

/**
 * The header lines of `replay`'s text report: the log (lines, span, start), the ignored profile
 * events, and per part the first exceedance on the log and the damage to date.
 * Cost O(parts).
 */
export function formatReplayHeader(summary: ReplaySummary, limitsC: readonly number[]): string[] {
  const out = [
    // "entries": the events the log holds; "line N" elsewhere is a line of the file (header and comments counted)
    `log ${summary.log}: ${summary.lines} entr${summary.lines === 1 ? "y" : "ies"} over ${formatDuration(summary.spanS)}` +
      (summary.startTimestamp === null ? " (times in seconds from its first line)" : `, from ${summary.startTimestamp}`),
    `the profile's own ${summary.ignoredProfileEvents} event${summary.ignoredProfileEvents === 1 ? " is" : "s are"} ignored: its parts, circuit and limits replay the log`,
  ];
  summary.parts.forEach((p, i) => {
    const limit = `${formatNumber(limitsC[i]!, 4)} °C`;
    if (p.firstExceedanceS === null) out.push(`${p.id}: never above its limit (${limit})`);
    else {
      const line = p.firstExceedanceLine!;
      out.push(`${p.id}: first above its limit (${limit}) during line ${line.line} (${line.event}${line.note === "" ? "" : `: ${line.note}`})`);
      out.push(
        `  at ${p.firstExceedanceS.toFixed(3)} s from the first line (${formatDuration(p.firstExceedanceS)})` +
          (p.firstExceedanceTimestamp === null ? "" : `, ${p.firstExceedanceTimestamp}`),
      );
    }
    out.push(p.damageToDate === null ? "  damage to date not assessed (no lifetime model)" : `  damage to date ${formatNumber(p.damageToDate, 3)} (Miner's rule; 1 = end of cycling life)`);
  });
  if (summary.measured !== null) out.push(...formatMeasured(summary.measured));
  return out;
}

/** The comparison lines: per measured part the residual statistics (replayed − measured), and the measured ambient. */
function formatMeasured(m: MeasuredComparison): string[] {
  const kelvin = (k: number): string => `${k >= 0 ? "+" : "−"}${formatNumber(Math.abs(k), 3)} K`;
  const out = [
    m.ambient === "measured"
      ? "measured temperatures against the replay, on the log's measured ambient"
      : "measured temperatures against the replay, on the profile's ambient",
  ];
  if (m.ambient === "measured") out.push("  (the replay's peaks, limits and damage keep the profile's ambient)");
  if (m.measuredAmbient !== null) {
    const a = m.measuredAmbient;
    out.push(`  ambient measured on ${a.count} line${a.count === 1 ? "" : "s"}: mean ${formatNumber(a.meanC, 4)} °C, from ${formatNumber(a.minC, 4)} to ${formatNumber(a.maxC, 4)} °C`);
  }
  for (const p of m.parts) {
    if (p.count === 0 || p.maxAt === null) {
      out.push(`  ${p.id}: no measured value in the log`);
      continue;
    }
    out.push(`  ${p.id}: ${p.count} value${p.count === 1 ? "" : "s"}, replayed − measured: mean ${kelvin(p.meanK!)}, RMS ${formatNumber(p.rmsK!, 3)} K`);
    out.push(
      `    largest ${kelvin(p.maxAbsK!)} at line ${p.maxAt.line} (${formatDuration(p.maxAt.timeS)} from the first line: ` +
        `replayed ${formatNumber(p.maxAt.replayedC, 4)} °C, measured ${formatNumber(p.maxAt.measuredC, 4)} °C)`,
    );
  }
  return out;
}
