import type { DutyProfile } from "../profile/DutyProfile.js";
import type { ProfileStressResult } from "../profile/ProfileStress.js";
import { STRESS_SECTION_WIDTH, type StressHistoryWords, formatStressSection } from "./formatStressSection.js";
import { LINEAR_MOSFET_CAUTION, wrapText } from "../text/cautions.js";

const RATING_WORDS = {
  pass: "every checked event is within its rating tables and limits",
  "outside-table": "some events fall outside the rating tables and were not checked (verdict warn)",
  fail: "an event exceeds a rating table or a limit (verdict fail)",
} as const;

/** Options of {@link formatProfileStress}, for a command whose history is not one profile repetition (`replay`). */
export interface ProfileStressTextOptions {
  /** how the damage lines name one pass of the history (default: a repetition of the profile) */
  readonly history?: StressHistoryWords;
  /** the closing sentence about what the damage is per (default: per repetition, with occursPerYear) */
  readonly damageNote?: string;
}

/**
 * The stress block of `simulate`'s terminal report: one section per part (formatStressSection:
 * rating checks, rainflow cycles, Miner damage, notes), a plain line for a part whose cycling
 * damage was not assessed (no lifetime model), and closing lines: the rating-check status (a
 * secondary check beside the temperature verdict; "no event was checked" when no part has a
 * table) and, when damage was computed, what one repetition is and how often it occurs. The linear-mode MOSFET caution is
 * left to the report's closing cautions when the circuit is a linear MOSFET, so it is not
 * printed twice. Returns a string; prints nothing.
 * Cost O(parts × (listed events + top cycles)).
 * @example
 * const robot = profile("warehouse-robot-48v.yaml");
 * const stress = new ProfileStress(robot);
 * const result = simulateProfile(robot, { models: defaultCircuitModels, onEvent: (e) => stress.addEvent(e), onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i) });
 * formatProfileStress(robot, stress.finish(result.endTimeS)).split("\n")[0] // => "Stress — precharge-resistor"
 */
export function formatProfileStress(profile: DutyProfile, stress: ProfileStressResult, options: ProfileStressTextOptions = {}): string {
  const closingHasMosfet = profile.circuit?.topology === "linear-mosfet";
  const blocks = stress.parts.map((part) => {
    const report = closingHasMosfet ? { ...part.report, cautions: part.report.cautions.filter((c) => c !== LINEAR_MOSFET_CAUTION) } : part.report;
    const notAssessed = report.damage === undefined ? "  damage: cycling damage was not assessed (no lifetime model for this part).\n" : "";
    return formatStressSection(part.id, report, options.history) + notAssessed;
  });
  const anyTable = profile.parts.some((p) => p.stress?.pulseEnergy !== undefined || (p.stress?.soa !== undefined && p.role === "mosfet")) || stress.parts.some((p) => p.report.limits.length > 0);
  const closing = [
    `Rating checks (secondary to the temperature verdict): ${anyTable ? RATING_WORDS[stress.ratingStatus] : "no part has a rating table or a limit (ratings: pulseEnergy, pulsePower, energyPerOhm, soa, voltage, ...), so no event was checked"}.`,
  ];
  if (stress.parts.some((p) => p.report.damage !== undefined))
    closing.push(
      options.damageNote ??
        `Damage is per repetition of the whole profile; ${
          profile.occursPerYear === undefined ? "the profile does not state how often it occurs (occursPerYear), so no calendar life" : `the profile occurs ${profile.occursPerYear} times a year`
        }.`,
    );
  return `${blocks.join("\n")}\n${closing.map((line) => wrapText(line, STRESS_SECTION_WIDTH)).join("\n")}\n`;
}
