import { InputError } from "../errors/InputError.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { ProfileStress } from "../profile/ProfileStress.js";
import type { TextSource } from "../replay/EventLogScanner.js";
import { replayLog, replayShell } from "../replay/replayLog.js";
import { textPieces } from "../replay/textPieces.js";
import { logReplaySummary } from "../report/replaySummary.js";
import { simulationVerdict } from "../report/simulationVerdict.js";
import { SECONDS_PER_YEAR } from "../stress/minerDamage.js";
import { forgetPeakGuess } from "../thermal/segmentPeak.js";
import type { FleetPartRow, FleetUnitRow } from "./FleetUnitRow.js";

/**
 * One unit of a fleet to replay: its id, its log's name and the log, either as its whole text or
 * read piece by piece (`source`: a file in blocks, memory flat in the log's length).
 */
export type FleetLog = { readonly unit: string; readonly file: string } & ({ readonly text: string; readonly source?: undefined } | { readonly source: TextSource; readonly text?: undefined });

/** What every unit of a fleet run shares besides the profile. */
export interface FleetUnitOptions {
  readonly models: CircuitModels;
  /**
   * how many logs like each unit's a unit goes through in a year (the stated rate of remaining
   * life); undefined: the log's own span, one log every `spanS` seconds
   */
  readonly logsPerYear?: number;
}

/**
 * Replay one unit's field log on the fleet's profile and reduce it to its summary row: per part
 * the peak, the margin to the limit, the first exceedance (seconds, timestamp, log line: from
 * logReplaySummary), the damage to date (Miner's rule over the log as a one-off history) and the
 * remaining life at the stated rate,
 *   remaining life [years] = (1 − D) / (D · r),
 * with D the damage to date and r the logs per year (given, else one log per span of the log:
 * r = 365.25 d / span); 0 once D ≥ 1. The verdict is replay's (simulationVerdict).
 * A log the replay refuses (replayLog: a bad line, an unknown word, times out of order) becomes a broken
 * row carrying the first problem (file, line, field, expected, found): one bad log never stops a
 * fleet. The thermal engine's warm start is forgotten first, so the row depends only on this log,
 * bit for bit, whichever units ran before it in the same thread.
 * Source: wiring of our own over replay (docs/fleet.md); Miner's rule (Miner 1945).
 * Cost that of replay on the log: O(lines × steps per event × parts × modes).
 * @throws only errors that are not bad input (a bug)
 */
export function replayFleetUnit(profile: DutyProfile, log: FleetLog, options: FleetUnitOptions): FleetUnitRow {
  forgetPeakGuess();
  try {
    const stress = new ProfileStress(replayShell(profile), { mode: "open", keepChecks: 0 });
    const replay = replayLog(profile, log.source ?? textPieces(log.text), log.file, {
      models: options.models,
      wantSamples: stress.wantsSamples,
      onEvent: (event) => stress.addEvent(event),
      onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i),
    });
    const result = replay.simulation;
    const stressResult = stress.finish(result.endTimeS);
    const summary = logReplaySummary(replay, stressResult);
    const verdict = simulationVerdict(result.verdict, stressResult.ratingStatus, result.contactor?.verdict);
    const logsPerYear = options.logsPerYear ?? (summary.spanS > 0 ? SECONDS_PER_YEAR / summary.spanS : undefined);
    const parts: FleetPartRow[] = result.parts.map((p, i) => {
      const s = summary.parts[i]!;
      return {
        id: p.id,
        peakC: p.peakTemperatureC,
        marginK: p.limitC - p.peakTemperatureC,
        firstExceedanceS: s.firstExceedanceS,
        firstExceedanceTimestamp: s.firstExceedanceTimestamp,
        firstExceedanceLine: s.firstExceedanceLine?.line ?? null,
        damageToDate: s.damageToDate,
        remainingLifeYears: remainingLifeYears(s.damageToDate, logsPerYear),
      };
    });
    return {
      unit: log.unit,
      file: log.file,
      verdict: verdict.verdict,
      reason: verdict.reason,
      lines: summary.lines,
      spanS: summary.spanS,
      startTimestamp: summary.startTimestamp,
      parts,
      error: null,
    };
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    const problem = error.problems[0]!;
    return { unit: log.unit, file: log.file, verdict: "error", error: { ...problem, file: problem.file === "" ? log.file : problem.file } };
  }
}

/** (1 − D) / (D · r) years; 0 for D ≥ 1; null without damage, without a model or without a rate. */
function remainingLifeYears(damage: number | null, logsPerYear: number | undefined): number | null {
  if (damage === null || logsPerYear === undefined || !(damage > 0)) return null;
  if (damage >= 1) return 0;
  const years = (1 - damage) / (damage * logsPerYear);
  return Number.isFinite(years) ? years : null;
}
