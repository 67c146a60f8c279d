import { describeFound, inputError } from "../errors/InputError.js";
import type { ModalModel } from "./ModalModel.js";
import { type NetworkPart, ladderNodeName } from "./NetworkPart.js";

/** One Foster stage: R [K/W] in parallel with C, given by tau = R·C [s]. */
export interface FosterStage {
  readonly rKPerW: number;
  readonly tauS: number;
}

/** A Foster network: parallel RC pairs in series, from the heated node (a junction, an element) to ambient (or case). */
export interface FosterNetwork {
  readonly kind: "foster";
  readonly stages: readonly FosterStage[];
  /** the part it describes, which names its node (ladderNodeName); optional */
  readonly part?: NetworkPart;
}

/**
 * The modal form of a Foster network: it already is one, with gain_i = R_i and tau_i = R_i·C_i.
 * Its one source and observed node is named after the part (ladderNodeName(0, network.part)).
 * Source: Foster, "A reactance theorem", Bell System Technical Journal 3 (1924); JEDEC JESD51-14
 * (2010), annex on the Foster model.
 * Cost O(stages).
 * @throws InputError `bad-network` for a non-positive R or tau
 * @example
 * fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] }).tauS // => [0.01, 2]
 */
export function fosterToModal(network: FosterNetwork, field = "network"): ModalModel {
  validateFoster(network, field);
  return {
    tauS: network.stages.map((s) => s.tauS),
    sources: [ladderNodeName(0, network.part)],
    observed: [ladderNodeName(0, network.part)],
    gainKPerW: [[network.stages.map((s) => s.rKPerW)]],
  };
}

/** Check Foster stages: at least one, R > 0 and tau > 0, finite. */
export function validateFoster(network: FosterNetwork, field = "network"): void {
  if (network.stages.length === 0) throw inputError("bad-network", `${field}.stages`, "at least one Foster stage", "none");
  network.stages.forEach((s, i) => {
    if (!(s.rKPerW > 0) || !Number.isFinite(s.rKPerW))
      throw inputError("bad-network", `${field}.stages[${i}].r`, "a thermal resistance > 0 K/W", describeFound(s.rKPerW));
    if (!(s.tauS > 0) || !Number.isFinite(s.tauS))
      throw inputError("bad-network", `${field}.stages[${i}].tau`, "a time constant > 0 s", describeFound(s.tauS));
  });
}
