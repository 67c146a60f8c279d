import { inputError } from "../errors/InputError.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile, ProfilePart } from "../profile/DutyProfile.js";
import { simulateProfile } from "../profile/simulateProfile.js";
import { adiabaticMass } from "../thermal/lumpedNetwork.js";
import type { MaterialPreset } from "../thermal/materials.js";
import type { ThermalNetwork } from "../thermal/ThermalNetwork.js";
import { SIZE_DEFAULTS, type SizeScaleScope } from "./sizeDefaults.js";
import { sizeScaledNetwork } from "./sizeScaledNetwork.js";
import { sizeScaledProfile } from "./sizeScaledProfile.js";
import { sizeShortTimeCapacity } from "./sizeShortTimeCapacity.js";

/** Options of {@link sizeHeatCapacity}. */
export interface HeatCapacitySizingOptions {
  /** the electrical models (defaultCircuitModels in the CLI) */
  readonly models: CircuitModels;
  /** a material preset: the adiabatic capacity, and the element capacity of `element` scaling, are also given as a mass of it */
  readonly material?: MaterialPreset;
  /** what is scaled: every capacity of the part's network or only its element's (default SIZE_DEFAULTS.scale) */
  readonly scope?: SizeScaleScope;
  /** margin below the limit to size to [K]; default: the part's own margin from the profile */
  readonly marginK?: number;
}

/** The event that puts the most energy into the part, as the profile runs with its present network. */
export interface SizingWorstEvent {
  readonly index: number;
  readonly label: string;
  readonly kind: string;
  readonly energyJ: number;
}

/** The adiabatic bound: no heat leaves during the worst event, which starts from ambient. */
export interface AdiabaticBound {
  /** allowed rise: target − ambient [K] */
  readonly riseK: number;
  /** C = E/ΔT [J/K] */
  readonly capacityJPerK: number;
  /** m = E/(c·ΔT) for the chosen material [kg] */
  readonly massKg?: number;
}

/** The whole-profile answer found by inverting the simulation. */
export interface CapacityInversion {
  /**
   * `sized`: the smallest scale found by bisection; `any`: even the smallest scale tried keeps the
   * peak under the target (the resistance, not the capacity, limits the part); `none`: no scale works
   */
  readonly status: "sized" | "any" | "none";
  /** what k multiplies: every heat capacity of the part's network (`whole`) or the element's only (`element`) */
  readonly scope: SizeScaleScope;
  /** k: the scaled capacities times k (Infinity for `none`, 0 for `any`) */
  readonly scale: number;
  /** the element's capacity (C1, see HeatCapacitySizing.presentCapacityJPerK) at that scale, k·C1 [J/K] */
  readonly capacityJPerK: number;
  /** `element` scaling only: that capacity as a mass of the chosen material, C1/c [kg] (a whole body is of several materials) */
  readonly massKg?: number;
  /** `sized` only, for a part given with its network: the sized network as a network file holds it (write it with formatNetworkFile) */
  readonly sizedNetwork?: ThermalNetwork;
  /** the sized part's peak at that scale [°C] (at the smallest scale tried for `any`, the largest for `none`) */
  readonly peakTemperatureC: number;
  /** the lower end of the final bracket: a scale whose peak is above the target (undefined for `any`/`none`) */
  readonly crossingScale?: number;
  /** simulations run */
  readonly simulations: number;
}

/** The heat-capacity sizing of one part. */
export interface HeatCapacitySizing {
  readonly partId: string;
  readonly partIndex: number;
  readonly ambientC: number;
  readonly limitC: number;
  readonly marginK: number;
  /** limit − margin: the temperature the part is sized to [°C] */
  readonly targetC: number;
  /**
   * the element's capacity C1 as the profile gives it [J/K]: C1 of a Cauer ladder, the part's
   * source node of a graph, 1/Σ(R_i/tau_i) of a Foster network (C1 of its exact Cauer ladder);
   * for a part built from a modal model alone, its short-time capacity (sizeShortTimeCapacity)
   */
  readonly presentCapacityJPerK: number;
  /** the part's peak with its present network [°C] */
  readonly presentPeakC: number;
  /** other parts on the same network (one heatsink): scaling it scales theirs too, so each is held to its own target */
  readonly sharedWith: readonly string[];
  /** what the inversion scales (the `scope` option) */
  readonly scope: SizeScaleScope;
  /** the part on the network that sets the answer (closest to its target at the sized scale) */
  readonly governingPartId: string;
  /** undefined when no event puts energy into the part */
  readonly worstEvent?: SizingWorstEvent;
  /** undefined when no capacity can help (target ≤ ambient) */
  readonly adiabatic?: AdiabaticBound;
  readonly inversion: CapacityInversion;
  /** a size exists */
  readonly feasible: boolean;
  /** one sentence on the answer, or why there is none */
  readonly reason: string;
}

/**
 * Smallest heat capacity that keeps one part of a duty profile at or below its limit less its
 * margin, two ways.
 *
 * 1. Adiabatic bound for the worst event: the event with the most energy E into the part, from
 *    ambient, with no heat leaving: C = E/ΔT, m = E/(c·ΔT) (adiabaticMass), ΔT = target − ambient.
 *    Quick, and for one event from cold it is enough whatever the pulse shape (the rise is at most
 *    E/C_first, see sizeShortTimeCapacity); it knows nothing of heat left over from earlier events.
 * 2. Inversion of the whole profile: the part's heat capacities are scaled by k at fixed thermal
 *    resistances, over the scope asked (sizeScaledProfile): every capacity of its network
 *    (`whole`: tau_m → k·tau_m, gains kept) or only its element's (`element`: C1 → k·C1, the rest
 *    as it is). The profile is simulated (simulateProfile) and k is bracketed by factors of
 *    SIZE_DEFAULTS.bracketFactor, then bisected on ln k until the peak is within
 *    `temperatureToleranceK` below the target and the bracket narrower than
 *    `capacityRelativeWidth`. The answer is reported as k, as the element capacity k·C1 and the
 *    sized network; with a material and `element` scaling, as the element's mass k·C1/c. Under
 *    `whole` scaling k·C1 is the element's share of a body whose every capacity is k times larger:
 *    on the original body it is not enough when k > 1.
 *    Parts that share the network (a MOSFET and its source resistor on one heatsink) share a
 *    `whole` scaling, so a scale is accepted only when every one of them stays at or under its own
 *    target; under `element` scaling only the part's own source node changes, and a scale is
 *    accepted when the part and every neighbour that meets its target now stay at or under their
 *    targets (a neighbour already over its target is sized in its own row). The part that binds
 *    is reported as governing.
 *    Monotonicity: more capacity at the same resistances lowers the peak for a one-stage network
 *    exactly (a first-order low-pass with a longer time constant is an average of the shorter
 *    one's output); for several stages it holds for steps and pulse trains but is not proven for
 *    every power shape, so the answer keeps its bracket: `crossingScale` is a scale that was
 *    simulated and crosses the target.
 * Source: the adiabatic bound Q = m·c·ΔT, Incropera et al., Fundamentals of Heat and Mass Transfer,
 * 7th ed. (2011), §1.3.1; time scaling of linear RC networks (sizeScaledProfile); bisection on a
 * bracket, Press et al., Numerical Recipes, 3rd ed. (2007), §9.1.
 * Validity: the profile's power does not depend on the part's capacity (a MOSFET with a threshold
 * temperature coefficient makes it depend weakly; the inversion still runs the full model).
 * Cost: up to SIZE_DEFAULTS.maxSimulations runs of simulateProfile, usually about 20.
 * @throws InputError `bad-option` for an unknown part or a negative margin, or `element` scaling of
 *   a part with no network as written; the simulation's own InputErrors
 * @example
 * sizeHeatCapacity(profile("warehouse-robot-48v.yaml"), 0, { models: defaultCircuitModels }).inversion.scale // => 0.3574
 */
export function sizeHeatCapacity(profile: DutyProfile, partIndex: number, options: HeatCapacitySizingOptions): HeatCapacitySizing {
  const part = profile.parts[partIndex];
  if (part === undefined) throw inputError("bad-option", "--part", `a part index below ${profile.parts.length}`, String(partIndex));
  const marginK = options.marginK ?? part.marginK;
  if (!Number.isFinite(marginK) || marginK < 0) throw inputError("bad-option", "--margin", "a margin ≥ 0 K", String(marginK));
  const targetC = part.limitC - marginK;
  const scope = options.scope ?? SIZE_DEFAULTS.scale;
  const targetOf = (p: ProfilePart): number => p.limitC - (options.marginK ?? p.marginK);

  let worst: SizingWorstEvent | undefined;
  const present = simulateProfile(profile, {
    models: options.models,
    onEvent: (event) => {
      const energy = event.energyJ[partIndex]!;
      if (energy > 0 && (worst === undefined || energy > worst.energyJ)) worst = { index: event.index, label: event.label, kind: event.kind, energyJ: energy };
    },
  });
  const presentPeakC = present.parts[partIndex]!.peakTemperatureC;
  const group = profile.parts.map((p, i) => ({ p, i })).filter(({ p }) => p.networkKey === part.networkKey);
  // the parts a scale must keep at or under their targets: the whole network's for `whole`; for
  // `element` the part and the neighbours that meet their targets now (a neighbour already over
  // its target is not this element's to mend: its own row sizes it)
  const held = group.filter(({ p, i }) => scope === "whole" || i === partIndex || present.parts[i]!.peakTemperatureC <= targetOf(p));
  /** how far the hottest held part is over its target [K], and which one it is */
  const excessOf = (peaks: readonly { peakTemperatureC: number }[]): { excess: number; governing: string } => {
    let excess = -Infinity;
    let governing = part.id;
    for (const { p, i } of held) {
      const over = peaks[i]!.peakTemperatureC - targetOf(p);
      if (over > excess) {
        excess = over;
        governing = p.id;
      }
    }
    return { excess, governing };
  };
  const c = options.material?.specificHeatJPerKgK;
  const massOf = (capacity: number): number | undefined => (c === undefined || !Number.isFinite(capacity) ? undefined : capacity / c);
  const sourceNode = part.model.sources[part.sourceIndex]!;
  const presentCapacity =
    part.network === undefined ? sizeShortTimeCapacity(part.model, part.observedIndex, part.sourceIndex) : sizeScaledNetwork(part.network, sourceNode, "whole", 1, part.networkKey).elementCapacityJPerK;
  const show = (x: number): number => Number(x.toPrecision(4)); // display only: no float noise in the sentences
  /** what k multiplies, in the words of the reasons */
  const scaled = scope === "whole" ? "every heat capacity of the part's network" : "the element capacity C1";
  const presentExcess = excessOf(present.parts);
  const sharedWith = group.filter(({ p }) => p.id !== part.id).map(({ p }) => p.id);
  const base = { partId: part.id, partIndex, ambientC: part.ambientC, limitC: part.limitC, marginK, targetC, presentCapacityJPerK: presentCapacity, presentPeakC, sharedWith, scope, ...(worst === undefined ? {} : { worstEvent: worst }) };

  const riseK = targetC - part.ambientC;
  const cold = held.find(({ p }) => !(targetOf(p) - p.ambientC > 0));
  if (cold !== undefined) {
    const t = targetOf(cold.p);
    const show6 = (x: number): number => Number(x.toPrecision(6)); // display only: no float noise in the sentence
    return {
      ...base,
      governingPartId: cold.p.id,
      inversion: { status: "none", scope, scale: Infinity, capacityJPerK: Infinity, peakTemperatureC: presentPeakC, simulations: 1 },
      feasible: false,
      reason: `${cold.p.id === part.id ? "the" : `${cold.p.id}, on the same network: its`} target ${show6(t)} °C (limit ${show6(cold.p.limitC)} °C less ${show6(options.marginK ?? cold.p.marginK)} K margin) is not above the ambient ${show6(cold.p.ambientC)} °C, so no heat capacity keeps the part under it`,
    };
  }
  const adiabatic: AdiabaticBound =
    worst === undefined
      ? { riseK, capacityJPerK: 0, ...(c === undefined ? {} : { massKg: 0 }) }
      : { riseK, capacityJPerK: worst.energyJ / riseK, ...(c === undefined ? {} : { massKg: adiabaticMass(worst.energyJ, c, riseK) }) };

  let simulations = 1;
  const runAt = (scale: number): { excess: number; governing: string; peakC: number } => {
    simulations++;
    const parts = simulateProfile(sizeScaledProfile(profile, partIndex, scale, scope), { models: options.models }).parts;
    return { ...excessOf(parts), peakC: parts[partIndex]!.peakTemperatureC };
  };
  const d = SIZE_DEFAULTS;
  // bracket: lo puts a part of the network over its target, hi keeps every one at or under it
  let lo: number;
  let hi = 1;
  let atHi = { ...presentExcess, peakC: presentPeakC };
  if (presentExcess.excess <= 0) {
    for (;;) {
      const k = hi / d.bracketFactor;
      if (k < d.minCapacityScale) {
        return {
          ...base,
          governingPartId: atHi.governing,
          adiabatic,
          inversion: { status: "any", scope, scale: 0, capacityJPerK: 0, ...(c === undefined || scope === "whole" ? {} : { massKg: 0 }), peakTemperatureC: atHi.peakC, simulations },
          feasible: true,
          reason: `even ${hi.toExponential(1)} × ${scaled} keeps the peak at ${atHi.peakC.toFixed(2)} °C, under the ${Number(targetC.toPrecision(6))} °C target: ${scope === "whole" ? "the resistance to ambient, not the heat capacity," : "the rest of the network, not the element's capacity,"} sets this part's peak`,
        };
      }
      const r = runAt(k);
      if (r.excess > 0) {
        lo = k;
        break;
      }
      hi = k;
      atHi = r;
    }
  } else {
    lo = 1;
    for (;;) {
      const k = lo * d.bracketFactor;
      if (k > d.maxCapacityScale) {
        const r = runAt(lo);
        return {
          ...base,
          governingPartId: r.governing,
          adiabatic,
          inversion: { status: "none", scope, scale: Infinity, capacityJPerK: Infinity, peakTemperatureC: r.peakC, simulations },
          feasible: false,
          reason: `even ${lo.toExponential(1)} × ${scaled} leaves ${r.governing} above its target${scope === "whole" ? "" : ": the rest of the network sets its peak (scale the whole body instead)"}`,
        };
      }
      const r = runAt(k);
      if (r.excess <= 0) {
        hi = k;
        atHi = r;
        break;
      }
      lo = k;
    }
  }
  while (simulations < d.maxSimulations && (hi / lo - 1 > d.capacityRelativeWidth || -atHi.excess > d.temperatureToleranceK)) {
    const mid = Math.sqrt(lo * hi);
    if (mid <= lo || mid >= hi) break;
    const r = runAt(mid);
    if (r.excess > 0) lo = mid;
    else {
      hi = mid;
      atHi = r;
    }
  }
  const peakHi = atHi.peakC;
  const sized = part.network === undefined ? undefined : sizeScaledNetwork(part.network, sourceNode, scope, hi, part.networkKey);
  const capacity = sized?.elementCapacityJPerK ?? hi * presentCapacity;
  const mass = scope === "element" ? massOf(capacity) : undefined;
  const what =
    scope === "whole"
      ? `${show(hi)} × every heat capacity of the ${sharedWith.length === 0 ? "part's" : "shared"} network (whole body; C1 then ${show(capacity)} J/K)`
      : `an element capacity C1 = ${show(capacity)} J/K (${show(hi)} × the present ${show(presentCapacity)} J/K, the rest of the network as it is)`;
  return {
    ...base,
    governingPartId: atHi.governing,
    adiabatic,
    inversion: { status: "sized", scope, scale: hi, capacityJPerK: capacity, ...(mass === undefined ? {} : { massKg: mass }), ...(sized === undefined ? {} : { sizedNetwork: sized.network }), peakTemperatureC: peakHi, crossingScale: lo, simulations },
    feasible: true,
    reason:
      atHi.governing === part.id
        ? `${what} keeps the peak at ${peakHi.toFixed(2)} °C, at or under the ${Number(targetC.toPrecision(6))} °C target`
        : `${what} keeps ${atHi.governing} at its target; this part then peaks at ${peakHi.toFixed(2)} °C (target ${Number(targetC.toPrecision(6))} °C)`,
  };
}
