import { networkDriveGains } from "../thermal/networkDriveGains.js";
import type { DutyProfile, ProfilePart } from "./DutyProfile.js";

/** Each part's bound of the surroundings' effect, split in its two causes. */
export interface SurroundingsBound {
  /** the hottest ambient of the series [°C] (the constant ambient without one) */
  readonly hottestAmbientC: number;
  /** per part (profile order): the steady rise the heat sources give at their highest powers [K] */
  readonly heatRiseK: readonly number[];
}

/**
 * An upper bound of what the surroundings do to every part, for the planners that answer with
 * one constant ambient (retries, supervise, guard): the hottest ambient of the series, plus each
 * heat source's highest power times its steady transfer resistance to the part (Σ of its gains).
 * It is a bound, not an estimate: in a network of heat capacities and resistances every node's
 * response to a step at another node, or of the ambient, is non-negative and never above its
 * steady value (the system matrix −C⁻¹G has non-negative off-diagonal entries, so e^(−C⁻¹G·t) is
 * entrywise non-negative), so no history of ambient ≤ max and power ≤ max heats a node more.
 * Source: non-negativity of the exponential of a Metzler matrix, e.g. Berman & Plemmons,
 * Nonnegative Matrices in the Mathematical Sciences (1994), ch. 6 (M-matrices; chapter from memory).
 * Cost O(heat sources × nodes³).
 */
export function surroundingsBound(profile: DutyProfile): SurroundingsBound {
  const parts = profile.parts;
  const surroundings = profile.surroundings;
  const hottestAmbientC = surroundings?.ambientC === undefined ? largest(parts.map((p) => p.ambientC)) : largest(surroundings.ambientC.values);
  const heatRiseK = parts.map((p) => {
    let sum = 0;
    for (const h of surroundings?.heatSources ?? []) {
      const host = parts[h.partIndex]!;
      if (host.networkKey !== p.networkKey || p.network === undefined) continue;
      const gains = networkDriveGains(p.network, [p.model.observed[p.observedIndex]!], [h.node], h.field);
      sum += largest(h.powerW.values) * gains.sourceGainKPerW[0]![0]!.reduce((a, g) => a + g, 0);
    }
    return sum;
  });
  return { hottestAmbientC, heatRiseK };
}

/**
 * The profile at the constant ambient that bounds its surroundings (see {@link surroundingsBound}):
 * every part's ambient is the hottest ambient plus its steady heat-source rise, and the
 * surroundings are dropped. A profile without surroundings comes back unchanged (same object).
 * Cost as surroundingsBound.
 */
export function hottestSteadySurroundings(profile: DutyProfile): DutyProfile {
  if (profile.surroundings === undefined) return profile;
  const bound = surroundingsBound(profile);
  const parts: ProfilePart[] = profile.parts.map((p, i) => ({ ...p, ambientC: bound.hottestAmbientC + bound.heatRiseK[i]! }));
  const { surroundings: _dropped, ...rest } = profile;
  return { ...rest, parts };
}

/** The largest value of a list (a loop: a long trace would overflow Math.max's argument list). */
export function largest(values: readonly number[]): number {
  let max = -Infinity;
  for (const v of values) if (v > max) max = v;
  return max;
}
