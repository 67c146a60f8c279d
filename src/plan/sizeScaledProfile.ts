import type { DutyProfile } from "../profile/DutyProfile.js";

/**
 * The profile with every heat capacity of one part's thermal network multiplied by `scale`, every
 * thermal resistance kept.
 *
 * Why this is a change of time constants only: a linear RC network obeys C·dT/dt = −G·T + P. With
 * C → k·C and G fixed, T_k(t) is the response of the original network to the time-stretched input,
 * and its transfer impedance is Z_k(s) = Z(k·s); in modal form every time constant becomes k·tau_m
 * and every gain (the Foster R_m) stays. So a Foster network gets tau_i → k·tau_i at fixed R_i,
 * and a Cauer ladder, a graph or a lumped element gets C_j → k·C_j at fixed R_j: the same thing.
 * Parts that share the network file (one heatsink) share the scaling, since they share the
 * capacities.
 * Source: linear-systems time scaling, Z(t/k) ↔ Z(k·s): Oppenheim & Willsky, Signals and Systems,
 * 2nd ed. (1997), §9.5.6 (time scaling property of the Laplace transform; section from memory).
 * Cost O(parts × modes).
 * @param partIndex the part whose network is scaled (profile order)
 * @param scale k > 0
 */
export function sizeScaledProfile(profile: DutyProfile, partIndex: number, scale: number): DutyProfile {
  const key = profile.parts[partIndex]!.networkKey;
  const parts = profile.parts.map((p) => (p.networkKey === key ? { ...p, model: { ...p.model, tauS: p.model.tauS.map((t) => t * scale) } } : p));
  return { ...profile, parts };
}
