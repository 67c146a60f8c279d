import { describeFound, inputError } from "../errors/InputError.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { ProfileStress } from "../profile/ProfileStress.js";
import { simulateProfile } from "../profile/simulateProfile.js";
import { planRetries } from "../retry/planRetries.js";
import { sizeProfile } from "../size/sizeProfile.js";
import type { Verdict } from "../stress/Verdict.js";
import { supervisePrecharge } from "../supervise/supervisePrecharge.js";
import { STUDY_ANSWERS, type StudyAnswerName } from "./studyDefaults.js";
import type { TimelineEvent } from "../profile/expandTimeline.js";

/** The answers of one profile: a number (SI; °C for peak) or null where the command has none. */
export interface StudyAnswers {
  /** the part whose peak, margin and damage the answers report */
  readonly partId: string;
  /** the verdict of simulate (the temperature verdict) when a simulate answer was asked, else of the first command run */
  readonly verdict: Verdict;
  readonly values: Readonly<Partial<Record<StudyAnswerName, number | null>>>;
}

/** Options of {@link evaluateStudyAnswers}. */
export interface StudyAnswerOptions {
  readonly models: CircuitModels;
  /** the part to follow; default the part with the least margin in the simulation (else the first) */
  readonly partId?: string;
  /** handed every event of the simulate run as its window closes (compare's energy per event) */
  readonly onEvent?: (event: TimelineEvent) => void;
}

const finite = (x: number | null | undefined): number | null => (x === null || x === undefined || !Number.isFinite(x) ? null : x);

/**
 * Work out the named answers of a loaded profile by running the commands that hold them, each
 * once, exactly as the CLI runs them: `simulate` (simulateProfile with the stress checks, for
 * peak, rise, margin, energy and damage), `retries` (planRetries: forever, uniform),
 * `supervise` (supervisePrecharge: the timeout window) and `size` (sizeProfile: capacity).
 * An answer the command cannot give (no safe interval, a corner that never completes, no
 * lifetime model) is null, never NaN or Infinity.
 * Cost: the sum of the commands run.
 * @throws InputError for an unknown --part, or what the commands throw for the profile
 */
export function evaluateStudyAnswers(profile: DutyProfile, answers: readonly StudyAnswerName[], options: StudyAnswerOptions): StudyAnswers {
  const wants = (command: string): boolean => answers.some((a) => STUDY_ANSWERS[a].command === command);
  if (options.partId !== undefined && !profile.parts.some((p) => p.id === options.partId))
    throw inputError("bad-option", "--part", `a part id of the profile (${profile.parts.map((p) => p.id).join(", ")})`, describeFound(options.partId));
  const values: Partial<Record<StudyAnswerName, number | null>> = {};
  let partId = options.partId ?? profile.parts[0]?.id ?? "";
  let verdict: Verdict | undefined;
  if (wants("simulate")) {
    const stress = answers.includes("damage") ? new ProfileStress(profile) : undefined;
    const onEvent = options.onEvent;
    const result = simulateProfile(profile, {
      models: options.models,
      wantSamples: stress?.wantsSamples ?? false,
      ...(stress === undefined && onEvent === undefined
        ? {}
        : {
            onEvent: (event) => {
              stress?.addEvent(event);
              onEvent?.(event);
            },
          }),
      ...(stress === undefined ? {} : { onPoint: (timeS, temperatureC, kind, eventIndex) => stress.addPoint(timeS, temperatureC, kind, eventIndex) }),
    });
    const index = options.partId === undefined ? result.parts.reduce((best, p, i) => (p.marginK < result.parts[best]!.marginK ? i : best), 0) : result.parts.findIndex((p) => p.id === options.partId);
    const part = result.parts[index]!;
    partId = part.id;
    verdict = result.verdict;
    values.peak = part.peakTemperatureC;
    values.rise = part.peakTemperatureC - profile.parts[index]!.ambientC;
    values.margin = part.marginK;
    values.energy = part.energyJ;
    if (stress !== undefined) values.damage = finite(stress.finish(result.endTimeS).parts[index]!.report.damage?.damagePerRepetition);
  }
  if (wants("retries")) {
    const report = planRetries(profile, options.models);
    verdict ??= report.policy.verdict;
    values.forever = finite(report.forever.minimumIntervalS);
    values.uniform = finite(report.uniformInterval.minimumIntervalS);
  }
  if (wants("supervise")) {
    const report = supervisePrecharge(profile, options.models);
    verdict ??= report.verdict;
    values["timeout-min"] = finite(report.window.lowerS);
    values["timeout-max"] = finite(report.window.upperS);
    values["timeout-window"] = finite(report.window.marginS);
  }
  if (wants("size")) {
    const report = sizeProfile(profile, { models: options.models, partIds: [partId] });
    verdict ??= report.verdict;
    values.capacity = finite(report.parts[0]?.inversion.capacityJPerK);
  }
  const picked: Partial<Record<StudyAnswerName, number | null>> = {};
  for (const a of answers) picked[a] = values[a] ?? null;
  return { partId, verdict: verdict ?? "pass", values: picked };
}
