import { describeFound, inputError } from "../errors/InputError.js";
import type { ModalModel } from "./ModalModel.js";
import { type ThermalGraph, graphToModal } from "./thermalGraph.js";
import { type NetworkPart, ladderNodeName } from "./NetworkPart.js";

/** One Cauer stage: heat capacity C_k [J/K] from node k to the reference, then R_k [K/W] on to node k+1. */
export interface CauerStage {
  readonly rKPerW: number;
  readonly cJPerK: number;
}

/**
 * A Cauer (ladder) network: node 1 is where power enters (a junction, a resistor's element); each stage's capacity
 * goes from its node to the thermal reference and its resistance to the next node; the last
 * resistance goes to ambient. Unlike Foster stages, Cauer nodes are physical, so networks can be
 * chained and shared (see chainNetworks).
 */
export interface CauerLadder {
  readonly kind: "cauer";
  readonly stages: readonly CauerStage[];
  /** the part it describes, which names its nodes (ladderNodeName); optional */
  readonly part?: NetworkPart;
}

/**
 * The graph form of a Cauer ladder, observed and heated at its first node; nodes are named after
 * the part (ladderNodeName: "junction", "node2", ... for a semiconductor; "element", "body", ...
 * for a resistor; "node1", "node2", ... when the ladder does not say).
 * @throws InputError `bad-network`
 * @example
 * cauerToGraph({ kind: "cauer", stages: [{ rKPerW: 0.5, cJPerK: 0.02 }, { rKPerW: 1.5, cJPerK: 1 }] }).nodes.map((n) => n.id) // => ["node1", "node2"]
 */
export function cauerToGraph(ladder: CauerLadder, field = "network"): ThermalGraph {
  if (ladder.stages.length === 0) throw inputError("bad-network", `${field}.stages`, "at least one Cauer stage", "none");
  ladder.stages.forEach((s, i) => {
    if (!(s.rKPerW > 0) || !Number.isFinite(s.rKPerW)) throw inputError("bad-network", `${field}.stages[${i}].r`, "a thermal resistance > 0 K/W", describeFound(s.rKPerW));
    if (!(s.cJPerK > 0) || !Number.isFinite(s.cJPerK)) throw inputError("bad-network", `${field}.stages[${i}].c`, "a heat capacity > 0 J/K", describeFound(s.cJPerK));
  });
  const n = ladder.stages.length;
  const name = (k: number): string => ladderNodeName(k, ladder.part);
  return {
    kind: "graph",
    nodes: ladder.stages.map((s, k) => ({ id: name(k), cJPerK: s.cJPerK })),
    links: ladder.stages.map((s, k) => ({ from: name(k), to: k === n - 1 ? "ambient" : name(k + 1), rKPerW: s.rKPerW })),
    sources: [name(0)],
    observed: [name(0)],
  };
}

/**
 * The modal form of a Cauer ladder (equivalently its exact Foster form): see graphToModal.
 * Cost O(stages³).
 * @example
 * cauerToModal({ kind: "cauer", stages: [{ rKPerW: 0.5, cJPerK: 0.02 }, { rKPerW: 1.5, cJPerK: 1 }] }).tauS // => [1.530, 0.009803]
 */
export function cauerToModal(ladder: CauerLadder, field = "network"): ModalModel {
  return graphToModal(cauerToGraph(ladder, field), field);
}
