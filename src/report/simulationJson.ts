import type { ContactorSummary } from "../profile/ContactorTally.js";
import { type SurroundingsJson, surroundingsOf } from "./surroundingsSummary.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import type { SimulationResult } from "../profile/simulateProfile.js";
import { reportCautions } from "../text/cautions.js";
import type { EventDigest } from "../profile/EventDigest.js";
import type { Verdict } from "../stress/Verdict.js";
import { type InrushJson, type LoopGainJson, inrushJson, loopGainJson } from "./loopGainJson.js";

/** One event of one part in the JSON report (docs/design.md, "The JSON contract"). */
export interface JsonPartEvent {
  readonly index: number;
  readonly kind: string;
  readonly startS: number;
  readonly energyJ: number;
  readonly peakTemperatureC: number;
  /** circuit outcome of a charging event ("completed" or "timed-out"); "none" for events that charge nothing */
  readonly outcome: string;
  /** a timed-out charging event whose bus had stalled below the completion threshold */
  readonly busStalled: boolean;
  /** the protection that ended a tripped charging event */
  readonly trippedBy?: string;
  /** the contactor's closing after a completed charge: ΔV [V], energy [J], peak current [A] */
  readonly closing?: { readonly deltaV: number; readonly energyJ: number; readonly peakCurrentA: number; readonly peakTimeS: number; readonly loop: string };
}

/** The `simulate --json` object (docs/design.md, "The JSON contract", with additions that never rename its fields). */
export interface SimulationJson {
  /** pass | warn | fail (src/stress/Verdict.ts): here the temperature verdict, the worst part's */
  readonly verdict: Verdict;
  readonly profile: { readonly name: string; readonly file: string };
  readonly eventCount: number;
  /** events not listed per part because the profile is longer than the listing limit */
  readonly eventsOmitted: number;
  readonly endTimeS: number;
  readonly parts: readonly {
    readonly id: string;
    readonly peakTemperatureC: number;
    readonly peakTimeS: number;
    readonly limitC: number;
    readonly marginK: number;
    readonly requiredMarginK: number;
    readonly verdict: Verdict;
    readonly firstExceedanceS: number | null;
    readonly energyJ: number;
    readonly events: readonly JsonPartEvent[];
  }[];
  readonly cautions: readonly string[];
  /** the contactor's worst closing and its verdict, when the circuit gives `contactor` */
  readonly contactor?: ContactorSummary;
  /** the charges' electro-thermal margins, when the circuit follows its parts' temperatures */
  readonly electroThermal?: LoopGainJson;
  /** the largest charging current of the run, against the element's rating when given */
  readonly inrush?: InrushJson;
  /** an ambient that varies and extra heat sources, when the profile has them */
  readonly surroundings?: SurroundingsJson;
}

/**
 * The machine-readable result of a simulation, as docs/design.md ("The JSON contract") fixes it:
 * `verdict` (pass | warn | fail: the temperature verdict; simulationStressJson adds the rating
 * checks to it), and `parts`, each with id, peakTemperatureC, peakTimeS, limitC, marginK, its own
 * verdict and `events` [{index, kind, startS, energyJ, peakTemperatureC, outcome, busStalled}].
 * Cost O(parts × events listed).
 * @example
 * const robot = profile("warehouse-robot-48v.yaml");
 * const digest = new EventDigest(robot.parts.map((p) => p.limitC));
 * const result = simulateProfile(robot, { models: defaultCircuitModels, onEvent: (e, t) => digest.add(e, t) });
 * simulationJson(robot, result, digest).eventCount // => 24
 */
export function simulationJson(profile: DutyProfile, result: SimulationResult, digest: EventDigest): SimulationJson {
  return {
    verdict: result.verdict,
    profile: { name: profile.name, file: profile.file },
    eventCount: result.eventCount,
    eventsOmitted: digest.count - digest.all.length,
    endTimeS: result.endTimeS,
    parts: result.parts.map((p, i) => ({
      id: p.id,
      peakTemperatureC: p.peakTemperatureC,
      peakTimeS: p.peakTimeS,
      limitC: p.limitC,
      marginK: p.marginK,
      requiredMarginK: p.requiredMarginK,
      verdict: p.verdict,
      firstExceedanceS: p.firstExceedanceS ?? null,
      energyJ: p.energyJ,
      events: digest.all.map((e) => ({
        index: e.index,
        kind: e.kind,
        startS: e.startS,
        energyJ: e.energyJ[i]!,
        peakTemperatureC: e.peakTemperatureC[i]!,
        outcome: e.outcome,
        busStalled: e.busStalled,
        ...(e.trippedBy === undefined ? {} : { trippedBy: e.trippedBy }),
        ...(e.closing === undefined ? {} : { closing: { deltaV: e.closing.deltaV, energyJ: e.closing.energyJ, peakCurrentA: e.closing.peakCurrentA, peakTimeS: e.closing.peakTimeS, loop: e.closing.loop } }),
      })),
    })),
    cautions: reportCautions(profile.circuit?.topology === "linear-mosfet"),
    ...(result.contactor === undefined ? {} : { contactor: result.contactor }),
    ...electroThermalOf(digest),
    ...inrushOf(digest, profile.circuit?.peakCurrentRatingA),
    ...surroundingsOf(profile),
  };
}

/** The optional `electroThermal` key (absent when no charge followed its parts' temperatures). */
function electroThermalOf(digest: EventDigest): { electroThermal?: LoopGainJson } {
  const block = loopGainJson(digest);
  return block === undefined ? {} : { electroThermal: block };
}

/** The optional `inrush` key (absent when no charge reported its peak current). */
function inrushOf(digest: EventDigest, ratingA: number | undefined): { inrush?: InrushJson } {
  const block = inrushJson(digest, ratingA);
  return block === undefined ? {} : { inrush: block };
}
