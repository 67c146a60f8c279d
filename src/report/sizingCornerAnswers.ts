import { type CornerAnswer, type CornerAnswers, cornerAnswer } from "../profile/CornerAnswers.js";
import { PROFILE_CORNER_FIELD } from "../profile/profileCorners.js";
import type { SizingReport } from "../size/sizeProfile.js";

/**
 * The answers of `size` over a corner set: each sized part's heat capacity (its element's C1 at
 * the sized scale; the highest governs, and a corner with no feasible size governs) and the
 * charging element's value (the largest resistance governs by its lowest value, the smallest
 * current or power by its highest; a corner where no value completes governs). The value that
 * holds at every corner is the governing one. Each corner's verdict is its sizing verdict.
 * Cost O(corners × parts).
 * @param names the profile as written, then the corners' names, in the order of reports
 * @param reports sizeProfile of the profile as written, then of each corner
 */
export function sizingCornerAnswers(names: readonly string[], reports: readonly SizingReport[]): CornerAnswers {
  const answers: CornerAnswer[] = [];
  const first = reports[0];
  first?.parts.forEach((part, i) => {
    const values = reports.map((r) => {
      const p = r.parts[i];
      return p === undefined || !p.feasible || !Number.isFinite(p.inversion.capacityJPerK) ? null : p.inversion.capacityJPerK;
    });
    answers.push(cornerAnswer(part.partId, "capacity", "J/K", "highest", names, values));
  });
  const knob = first?.circuit?.knob;
  if (knob !== undefined && first?.circuit?.status !== "not-applicable") {
    const values = reports.map((r) => (r.circuit?.status === "sized" && r.circuit.value !== undefined && Number.isFinite(r.circuit.value) ? r.circuit.value : null));
    answers.push(cornerAnswer("charging element", knob.field, knob.unit, knob.direction === "largest" ? "lowest" : "highest", names, values));
  }
  return { source: PROFILE_CORNER_FIELD, corners: names, verdicts: reports.map((r) => r.verdict), answers };
}
