import { describeFound, inputError } from "../errors/InputError.js";
import { cauerToGraph } from "./cauerLadder.js";
import type { ThermalNetwork } from "./ThermalNetwork.js";
import { AMBIENT_NODE, type ThermalGraph, graphToModal } from "./thermalGraph.js";

/**
 * How the world outside a part's own power reaches the observed nodes of a network, on the same
 * modes (same order) as the network's own modal model (networkToModal):
 * - `ambientGain[o][m]` [K/K]: the response of observed node o to a unit step of the ambient is
 *   Σ_m ambientGain[o][m]·(1 − e^(−t/tau_m)); Σ_m ambientGain[o][m] = 1 (every node settles to
 *   the new ambient). Undefined for a Foster network: its stages are not physical nodes, the
 *   ambient is the reference its rise is counted from, so every node follows the ambient at once.
 * - `sourceGainKPerW[o][k][m]` [K/W]: the Foster gains from a heat source at node k.
 */
export interface NetworkDriveGains {
  readonly tauS: readonly number[];
  readonly ambientGain?: readonly (readonly number[])[];
  readonly sourceGainKPerW: readonly (readonly (readonly number[])[])[];
}

/**
 * The ambient and extra-heat-source gains of a network (see {@link NetworkDriveGains}).
 *
 * A physical network (graph, or a Cauer ladder: node heat capacities to the fixed thermal
 * reference) obeys C·dT/dt = −G·T + g·T_amb + B·P with g the conductances of the links to the
 * ambient (G·1 = g). The ambient therefore enters exactly like a heat flow T_amb/R_i,amb into
 * every node i linked to it, so its gain is Σ_i gain[o][i][m]/R_i,amb over those nodes (one more
 * input column of the same modal form), and Σ_m of it is (G⁻¹·g)_o = 1.
 * Source: the Norton equivalent of a source behind a resistance, Hayt, Kemmerly & Durbin,
 * Engineering Circuit Analysis, 8th ed. (2012), §5.3, applied to the thermal circuit of
 * Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §3.1.2 (the
 * electrical analogy); the modal form as in graphToModal.
 * Cost O(nodes³).
 * @param network the network as written (the one networkToModal reduced)
 * @param observed the observed node names the gains are wanted for
 * @param sourceNodes nodes that take extra heat (a graph or Cauer node name)
 * @param field the profile field, for messages
 * @throws InputError `bad-network` for a heat source on a Foster network or an unknown node
 */
export function networkDriveGains(network: ThermalNetwork, observed: readonly string[], sourceNodes: readonly string[], field = "network"): NetworkDriveGains {
  if (network.kind === "foster") {
    if (sourceNodes.length > 0)
      throw inputError("bad-network", field, "a graph or Cauer network (an extra heat source sits on a physical node; Foster stages are not nodes)", "a Foster network");
    return { tauS: network.stages.map((s) => s.tauS), sourceGainKPerW: observed.map(() => []) };
  }
  const graph: ThermalGraph = network.kind === "cauer" ? cauerToGraph(network, field) : network;
  const grounded = new Map<string, number>();
  for (const link of graph.links) {
    const node = link.from === AMBIENT_NODE ? link.to : link.to === AMBIENT_NODE ? link.from : undefined;
    if (node !== undefined) grounded.set(node, (grounded.get(node) ?? 0) + 1 / link.rKPerW);
  }
  const known = new Set(graph.nodes.map((n) => n.id));
  sourceNodes.forEach((node) => {
    if (!known.has(node)) throw inputError("bad-network", field, `a node of the network (${[...known].join(", ")})`, describeFound(node));
  });
  const inputs = [...grounded.keys(), ...sourceNodes];
  const modal = graphToModal({ ...graph, sources: inputs, observed: observed.slice() }, field);
  const ambientGain = modal.gainKPerW.map((row) =>
    modal.tauS.map((_, m) => {
      let sum = 0;
      [...grounded.values()].forEach((g, i) => (sum += row[i]![m]! * g));
      return sum;
    }),
  );
  const sourceGainKPerW = modal.gainKPerW.map((row) => sourceNodes.map((_, k) => row[grounded.size + k]!.slice()));
  return { tauS: modal.tauS, ambientGain, sourceGainKPerW };
}
