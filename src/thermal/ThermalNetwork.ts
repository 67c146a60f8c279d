import type { CauerLadder } from "./cauerLadder.js";
import { cauerToModal } from "./cauerLadder.js";
import type { FosterNetwork } from "./fosterNetwork.js";
import { fosterToModal } from "./fosterNetwork.js";
import type { ModalModel } from "./ModalModel.js";
import type { ThermalGraph } from "./thermalGraph.js";
import { graphToModal } from "./thermalGraph.js";

/** Any thermal network heatledger reads: Foster, Cauer ladder or general graph. */
export type ThermalNetwork = FosterNetwork | CauerLadder | ThermalGraph;

/**
 * The modal form of any network (the one engine representation).
 * Cost O(stages) for Foster, O(nodes³) for Cauer and graphs.
 * @throws InputError `bad-network`
 * @example
 * networkToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] }).tauS // => [0.01]
 */
export function networkToModal(network: ThermalNetwork, field = "network"): ModalModel {
  switch (network.kind) {
    case "foster":
      return fosterToModal(network, field);
    case "cauer":
      return cauerToModal(network, field);
    case "graph":
      return graphToModal(network, field);
  }
}
