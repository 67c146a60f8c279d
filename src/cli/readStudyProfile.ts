import { describeFound, inputError } from "../errors/InputError.js";
import { StudyProfile } from "../study/StudyProfile.js";
import { STUDY_ANSWER_NAMES, type StudyAnswerName } from "../study/studyDefaults.js";
import { nearestKey } from "../errors/nearestKey.js";
import type { CliIo } from "./CliIo.js";
import { readProfileSource } from "./readProfileSource.js";

/**
 * Read a duty profile for a study: as readProfileFile (the files it names are read relative to
 * its folder, and named so in messages), but kept as text that the study can edit.
 * @throws InputError for an unreadable or invalid profile, or a file it names
 */
export function readStudyProfile(io: CliIo, file: string): StudyProfile {
  const source = readProfileSource(io, file);
  return new StudyProfile(source.text, source.name, source.readNamed);
}

/**
 * The answers named by --answer ("peak,margin"), checked against STUDY_ANSWER_NAMES.
 * @throws InputError `bad-option` naming the nearest answer for an unknown one
 */
export function parseAnswerNames(text: string | undefined, fallback: readonly StudyAnswerName[]): StudyAnswerName[] {
  if (text === undefined) return [...fallback];
  const names = text.split(",").map((s) => s.trim()).filter((s) => s !== "");
  for (const name of names) {
    if (!(STUDY_ANSWER_NAMES as readonly string[]).includes(name)) {
      const guess = nearestKey(name, STUDY_ANSWER_NAMES);
      throw inputError("bad-option", "--answer", `answer names among ${STUDY_ANSWER_NAMES.join(", ")}${guess === undefined ? "" : ` (did you mean "${guess}"?)`}`, describeFound(name));
    }
  }
  if (names.length === 0) throw inputError("bad-option", "--answer", `one or more of ${STUDY_ANSWER_NAMES.join(", ")}`, describeFound(text));
  return [...new Set(names)] as StudyAnswerName[];
}

/**
 * Check a --part option against the profile's part ids.
 * @throws InputError `bad-option` listing the ids
 */
export function checkPartOption(study: StudyProfile, part: string | undefined): void {
  if (part !== undefined && !study.nominal.parts.some((p) => p.id === part))
    throw inputError("bad-option", "--part", `a part id of the profile (${study.nominal.parts.map((p) => p.id).join(", ")})`, describeFound(part));
}
