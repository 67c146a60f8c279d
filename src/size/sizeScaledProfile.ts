import { inputError } from "../errors/InputError.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import { networkToModal } from "../thermal/ThermalNetwork.js";
import { SIZE_DEFAULTS, type SizeScaleScope } from "./sizeDefaults.js";
import { sizeScaledNetwork } from "./sizeScaledNetwork.js";

/**
 * The profile with one part's heat capacities multiplied by `scale`, every thermal resistance kept:
 * every capacity of its network (`whole`) or only its element's (`element`, see sizeScaledNetwork).
 * Each changed part carries the scaled network (`network`) with its modal model, so the sized
 * design can be written back as a network file (formatNetworkFile).
 *
 * `whole` is a change of time constants only: a linear RC network obeys C·dT/dt = −G·T + P. With
 * C → k·C and G fixed, T_k(t) is the response of the original network to the time-stretched input,
 * and its transfer impedance is Z_k(s) = Z(k·s); in modal form every time constant becomes k·tau_m
 * and every gain (the Foster R_m) stays. So a Foster network gets tau_i → k·tau_i at fixed R_i,
 * and a Cauer ladder, a graph or a lumped element gets C_j → k·C_j at fixed R_j: the same thing.
 * `element` changes one capacity, so the network's modes change shape: its modal form is computed
 * again from the scaled network (networkToModal).
 * Parts that share the network file (one heatsink) share the scaling, since they share the
 * capacities; with `element` only the scaled part's own source node changes.
 * Source: linear-systems time scaling, Z(t/k) ↔ Z(k·s): Oppenheim & Willsky, Signals and Systems,
 * 2nd ed. (1997), §9.5.6 (time scaling property of the Laplace transform; section from memory).
 * Cost O(parts × modes) for `whole`; one modal reduction (O(nodes³)) for `element`.
 * @param partIndex the part whose network is scaled (profile order)
 * @param scale k > 0
 * @param scope what is scaled (default SIZE_DEFAULTS.scale)
 * @throws InputError `bad-option` on `--scale` for `element` on a part built from a modal model
 *   alone (no network to take the element from); sizeScaledNetwork's errors
 */
export function sizeScaledProfile(profile: DutyProfile, partIndex: number, scale: number, scope: SizeScaleScope = SIZE_DEFAULTS.scale): DutyProfile {
  const part = profile.parts[partIndex]!;
  const key = part.networkKey;
  const scaled = part.network === undefined ? undefined : sizeScaledNetwork(part.network, part.model.sources[part.sourceIndex]!, scope, scale, key).network;
  if (scope === "whole") {
    const parts = profile.parts.map((p) => (p.networkKey === key ? { ...p, model: { ...p.model, tauS: p.model.tauS.map((t) => t * scale) }, ...(scaled === undefined ? {} : { network: scaled }) } : p));
    return { ...profile, parts };
  }
  if (scaled === undefined) throw inputError("bad-option", "--scale", `whole for part ${part.id} (element scaling needs its network as written: Foster, Cauer or graph)`, "element on a modal model alone");
  const model = networkToModal(scaled, key);
  const parts = profile.parts.map((p) => (p.networkKey === key ? { ...p, model, network: scaled } : p));
  return { ...profile, parts };
}
