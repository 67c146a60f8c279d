import { inputError } from "../errors/InputError.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { simulateProfile } from "../profile/simulateProfile.js";
import { adiabaticMass } from "../thermal/lumpedNetwork.js";
import type { MaterialPreset } from "../thermal/materials.js";
import { SIZE_DEFAULTS } from "./sizeDefaults.js";
import { sizeScaledProfile } from "./sizeScaledProfile.js";
import { sizeShortTimeCapacity } from "./sizeShortTimeCapacity.js";

/** Options of {@link sizeHeatCapacity}. */
export interface HeatCapacitySizingOptions {
  /** the electrical models (defaultCircuitModels in the CLI) */
  readonly models: CircuitModels;
  /** a material preset: the capacities are also given as a mass of it */
  readonly material?: MaterialPreset;
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
  /** k: every heat capacity of the part's network times k (Infinity for `none`, 0 for `any`) */
  readonly scale: number;
  /** the part's first capacity at that scale, k·C_first [J/K] */
  readonly capacityJPerK: number;
  /** that capacity as a mass of the chosen material [kg] */
  readonly massKg?: number;
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
  /** the part's first capacity as the profile gives it [J/K] (see sizeShortTimeCapacity) */
  readonly presentCapacityJPerK: number;
  /** the part's peak with its present network [°C] */
  readonly presentPeakC: number;
  /** other parts on the same network (one heatsink): scaling it scales theirs too, so each is held to its own target */
  readonly sharedWith: readonly string[];
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
 * 2. Inversion of the whole profile: every heat capacity of the part's network is scaled by k at
 *    fixed thermal resistances (sizeScaledProfile: tau_m → k·tau_m, gains kept), the profile is
 *    simulated (simulateProfile) and k is bracketed by factors of SIZE_DEFAULTS.bracketFactor, then
 *    bisected on ln k until the peak is within `temperatureToleranceK` below the target and the
 *    bracket narrower than `capacityRelativeWidth`. The answer is reported as k, as the part's
 *    first capacity k·C_first and, with a material, as the mass k·C_first/c.
 *    Parts that share the network (a MOSFET and its source resistor on one heatsink) share the
 *    scaling, so a scale is accepted only when every one of them stays at or under its own target;
 *    the part that binds is reported as governing.
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
 * @throws InputError `bad-option` for an unknown part or a negative margin; the simulation's own InputErrors
 */
export function sizeHeatCapacity(profile: DutyProfile, partIndex: number, options: HeatCapacitySizingOptions): HeatCapacitySizing {
  const part = profile.parts[partIndex];
  if (part === undefined) throw inputError("bad-option", "--part", `a part index below ${profile.parts.length}`, String(partIndex));
  const marginK = options.marginK ?? part.marginK;
  if (!Number.isFinite(marginK) || marginK < 0) throw inputError("bad-option", "--margin", "a margin ≥ 0 K", String(marginK));
  const targetC = part.limitC - marginK;
  const group = profile.parts.map((p, i) => ({ p, i })).filter(({ p }) => p.networkKey === part.networkKey);
  const targets = group.map(({ p }) => p.limitC - (options.marginK ?? p.marginK));
  /** how far the hottest part of the group is over its target [K], and which one it is */
  const excessOf = (peaks: readonly { peakTemperatureC: number }[]): { excess: number; governing: string } => {
    let excess = -Infinity;
    let governing = part.id;
    group.forEach(({ p, i }, j) => {
      const over = peaks[i]!.peakTemperatureC - targets[j]!;
      if (over > excess) {
        excess = over;
        governing = p.id;
      }
    });
    return { excess, governing };
  };
  const c = options.material?.specificHeatJPerKgK;
  const massOf = (capacity: number): number | undefined => (c === undefined || !Number.isFinite(capacity) ? undefined : capacity / c);
  const presentCapacity = sizeShortTimeCapacity(part.model, part.observedIndex, part.sourceIndex);

  let worst: SizingWorstEvent | undefined;
  const present = simulateProfile(profile, {
    models: options.models,
    onEvent: (event) => {
      const energy = event.energyJ[partIndex]!;
      if (energy > 0 && (worst === undefined || energy > worst.energyJ)) worst = { index: event.index, label: event.label, kind: event.kind, energyJ: energy };
    },
  });
  const presentPeakC = present.parts[partIndex]!.peakTemperatureC;
  const presentExcess = excessOf(present.parts);
  const sharedWith = group.filter(({ p }) => p.id !== part.id).map(({ p }) => p.id);
  const base = { partId: part.id, partIndex, ambientC: part.ambientC, limitC: part.limitC, marginK, targetC, presentCapacityJPerK: presentCapacity, presentPeakC, sharedWith, ...(worst === undefined ? {} : { worstEvent: worst }) };

  const riseK = targetC - part.ambientC;
  const cold = group.find(({ p }, j) => !(targets[j]! - p.ambientC > 0));
  if (cold !== undefined) {
    const t = targets[group.indexOf(cold)]!;
    const show = (x: number): number => Number(x.toPrecision(6)); // display only: no float noise in the sentence
    return {
      ...base,
      governingPartId: cold.p.id,
      inversion: { status: "none", scale: Infinity, capacityJPerK: Infinity, peakTemperatureC: presentPeakC, simulations: 1 },
      feasible: false,
      reason: `${cold.p.id === part.id ? "the" : `${cold.p.id}, on the same network: its`} target ${show(t)} °C (limit ${show(cold.p.limitC)} °C less ${show(options.marginK ?? cold.p.marginK)} K margin) is not above the ambient ${show(cold.p.ambientC)} °C, so no heat capacity keeps the part under it`,
    };
  }
  const adiabatic: AdiabaticBound =
    worst === undefined
      ? { riseK, capacityJPerK: 0, ...(c === undefined ? {} : { massKg: 0 }) }
      : { riseK, capacityJPerK: worst.energyJ / riseK, ...(c === undefined ? {} : { massKg: adiabaticMass(worst.energyJ, c, riseK) }) };

  let simulations = 1;
  const runAt = (scale: number): { excess: number; governing: string; peakC: number } => {
    simulations++;
    const parts = simulateProfile(sizeScaledProfile(profile, partIndex, scale), { models: options.models }).parts;
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
          inversion: { status: "any", scale: 0, capacityJPerK: 0, ...(c === undefined ? {} : { massKg: 0 }), peakTemperatureC: atHi.peakC, simulations },
          feasible: true,
          reason: `even ${hi.toExponential(1)} × the present capacity keeps the peak at ${atHi.peakC.toFixed(2)} °C, under the ${Number(targetC.toPrecision(6))} °C target: the resistance to ambient, not the heat capacity, sets this part's peak`,
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
          inversion: { status: "none", scale: Infinity, capacityJPerK: Infinity, peakTemperatureC: r.peakC, simulations },
          feasible: false,
          reason: `even ${lo.toExponential(1)} × the present capacity leaves ${r.governing} above its target`,
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
  const capacity = hi * presentCapacity;
  const mass = massOf(capacity);
  return {
    ...base,
    governingPartId: atHi.governing,
    adiabatic,
    inversion: { status: "sized", scale: hi, capacityJPerK: capacity, ...(mass === undefined ? {} : { massKg: mass }), peakTemperatureC: peakHi, crossingScale: lo, simulations },
    feasible: true,
    reason:
      atHi.governing === part.id
        ? `${hi.toPrecision(4)} × the present heat capacity keeps the peak at ${peakHi.toFixed(2)} °C, at or under the ${Number(targetC.toPrecision(6))} °C target`
        : `${hi.toPrecision(4)} × the present heat capacity of the shared network keeps ${atHi.governing} at its target; this part then peaks at ${peakHi.toFixed(2)} °C (target ${Number(targetC.toPrecision(6))} °C)`,
  };
}
