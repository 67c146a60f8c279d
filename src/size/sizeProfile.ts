import { describeFound, inputError } from "../errors/InputError.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import type { MaterialPreset } from "../thermal/materials.js";
import { type ChargingElementSizing, sizeChargingElement } from "./sizeChargingElement.js";
import { SIZE_DEFAULTS, type SizeScaleScope } from "./sizeDefaults.js";
import { type HeatCapacitySizing, sizeHeatCapacity } from "./sizeHeatCapacity.js";
import { type Verdict, peakVerdict, worstVerdict } from "../stress/Verdict.js";

/** Options of {@link sizeProfile}. */
export interface SizeProfileOptions {
  readonly models: CircuitModels;
  /** express capacities as masses of this material */
  readonly material?: MaterialPreset;
  /** size to this margin below each limit instead of each part's own [K] */
  readonly marginK?: number;
  /** size only these parts (ids); default every part */
  readonly partIds?: readonly string[];
  /** what the capacity inversion scales: every capacity of each part's network, or its element's (default SIZE_DEFAULTS.scale) */
  readonly scope?: SizeScaleScope;
}

/** Everything `heatledger size` answers for one profile. */
export interface SizingReport {
  readonly profileName: string;
  readonly file: string;
  readonly material?: MaterialPreset;
  /** what the capacity inversion scaled */
  readonly scope: SizeScaleScope;
  readonly parts: readonly HeatCapacitySizing[];
  /** undefined when the profile has no circuit */
  readonly circuit?: ChargingElementSizing;
  /** a linear-mode MOSFET is in the circuit (its caution goes into the report) */
  readonly linearMosfet: boolean;
  /**
   * the verdict rule (src/stress/Verdict.ts) applied to the answers: "fail" when a part or the
   * circuit question has no answer; "warn" when a part's size holds it above its own limit less
   * the margin the profile wants (sized with a smaller --margin), not above the limit; "pass"
   * when every sized part peaks at or below its limit less its own margin
   */
  readonly verdict: Verdict;
  /** why not, one sentence per failed answer */
  readonly infeasibleReasons: readonly string[];
}

/**
 * Size a duty profile: the heat capacity of each part (sizeHeatCapacity: adiabatic bound and
 * inversion of the whole profile, scaling the whole body or the element as `scope` says) and the slowest charging element that still completes a healthy
 * power-up (sizeChargingElement). Parts are sized one at a time, the others kept as they are.
 * The verdict judges the answers: each sized part's peak against its own limit and the margin
 * its profile wants (peakVerdict), and fail when a question has no answer.
 * Cost: parts × (up to SIZE_DEFAULTS.maxSimulations simulations) plus one circuit search.
 * @throws InputError `bad-option` on `--part` naming an unknown part
 * @example
 * sizeProfile(profile("warehouse-robot-48v.yaml"), { models: defaultCircuitModels }).verdict // => "pass"
 */
export function sizeProfile(profile: DutyProfile, options: SizeProfileOptions): SizingReport {
  const ids = profile.parts.map((p) => p.id);
  const wanted = options.partIds ?? ids;
  const scope = options.scope ?? SIZE_DEFAULTS.scale;
  for (const id of wanted) if (!ids.includes(id)) throw inputError("bad-option", "--part", `one of the profile's parts (${ids.join(", ")})`, describeFound(id));
  const parts = profile.parts
    .map((p, i) => ({ p, i }))
    .filter(({ p }) => wanted.includes(p.id))
    .map(({ i }) =>
      sizeHeatCapacity(profile, i, {
        models: options.models,
        scope,
        ...(options.material === undefined ? {} : { material: options.material }),
        ...(options.marginK === undefined ? {} : { marginK: options.marginK }),
      }),
    );
  const circuit = profile.circuit === undefined ? undefined : sizeChargingElement(profile.circuit, options.models);
  const infeasibleReasons = [
    ...parts.filter((p) => !p.feasible).map((p) => `${p.partId}: ${p.reason}`),
    ...(circuit?.status === "none" ? [`circuit: ${circuit.reason}`] : []),
  ];
  return {
    profileName: profile.name,
    file: profile.file,
    ...(options.material === undefined ? {} : { material: options.material }),
    scope,
    parts,
    ...(circuit === undefined ? {} : { circuit }),
    linearMosfet: profile.circuit?.topology === "linear-mosfet",
    verdict:
      infeasibleReasons.length > 0
        ? "fail"
        : worstVerdict(parts.map((p) => peakVerdict(p.inversion.peakTemperatureC, p.limitC, profile.parts[p.partIndex]!.marginK))),
    infeasibleReasons,
  };
}
