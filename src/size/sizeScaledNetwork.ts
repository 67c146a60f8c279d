import { describeFound, inputError } from "../errors/InputError.js";
import type { CauerLadder } from "../thermal/cauerLadder.js";
import type { FosterNetwork } from "../thermal/fosterNetwork.js";
import { fosterToCauer } from "../thermal/fosterToCauer.js";
import type { ThermalNetwork } from "../thermal/ThermalNetwork.js";
import type { SizeScaleScope } from "./sizeDefaults.js";

/** A network with capacities scaled for sizing, and the element's capacity in it. */
export interface ScaledNetwork {
  /** the scaled network, in the form a network file holds (a Foster network scaled at its element becomes its Cauer ladder) */
  readonly network: ThermalNetwork;
  /** the element's heat capacity in it: C1 of the ladder (exact Cauer ladder of a Foster network), the source node of a graph [J/K] */
  readonly elementCapacityJPerK: number;
}

/** Foster → Cauer is exact but costs BigInt arithmetic: each Foster network is converted once. */
const ladders = new WeakMap<FosterNetwork, CauerLadder>();

function ladderOf(network: FosterNetwork, field: string): CauerLadder {
  let ladder = ladders.get(network);
  if (ladder === undefined) {
    ladder = fosterToCauer(network, field);
    ladders.set(network, ladder);
  }
  return ladder;
}

/**
 * A part's thermal network with its heat capacities multiplied by `scale` at fixed thermal
 * resistances, over the scope asked (SizeScaleScope):
 * - `whole`: every capacity. Foster: tau_i → k·tau_i at fixed R_i (C_i = tau_i/R_i → k·C_i);
 *   Cauer: every C_j → k·C_j; graph: every node's C → k·C. The element's capacity becomes k·C1.
 * - `element`: one capacity, the one the part's own power meets first. Cauer ladder: C1; graph:
 *   the node the part's power enters (`sourceNode`); Foster: a Foster network has no physical
 *   element capacity (its stages are a fit of Zth, not of the part's build), so it is first turned
 *   into its exact Cauer ladder (fosterToCauer, the continued-fraction expansion, unique for a
 *   given Zth) and C1 of that ladder is scaled; the result is that ladder. C1 of the ladder is the
 *   short-time capacity 1/Σ(R_i/tau_i) of the Foster form (the high-frequency limit of Y = s·C1).
 * Source: Cauer, Archiv für Elektrotechnik 17 (1926), continued-fraction synthesis of RC
 * one-ports; JEDEC JESD51-14 (2010), annex on Foster and Cauer networks (only Cauer nodes are
 * physical).
 * Validity: `scale` > 0 and finite. The Cauer ladder of a Foster fit is one ladder with that Zth;
 * the real part's build may differ, so its C1 is the element only as far as the fit is physical.
 * Cost O(size of the network); the first element scaling of a Foster network costs one exact
 * conversion (O(n²) fraction operations), cached for the network object.
 * @param sourceNode the graph node the part's power enters (ignored for Foster and Cauer)
 * @param field the network's field, for messages
 * @throws InputError `bad-option` for a scale that is not > 0; `bad-network` for a graph without
 *   `sourceNode`, or a Foster network whose Cauer ladder fails fosterToCauer's round-trip check
 * @example
 * const network = { kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] };
 * sizeScaledNetwork(network, "node1", "whole", 2).network.stages.map((s) => s.tauS) // => [0.02, 4]
 */
export function sizeScaledNetwork(network: ThermalNetwork, sourceNode: string, scope: SizeScaleScope, scale: number, field = "network"): ScaledNetwork {
  if (!(scale > 0) || !Number.isFinite(scale)) throw inputError("bad-option", "scale", "a capacity scale > 0", describeFound(scale));
  switch (network.kind) {
    case "foster": {
      if (scope === "whole") {
        let slope = 0;
        for (const s of network.stages) slope += s.rKPerW / s.tauS;
        return { network: { ...network, stages: network.stages.map((s) => ({ rKPerW: s.rKPerW, tauS: s.tauS * scale })) }, elementCapacityJPerK: scale / slope };
      }
      return sizeScaledNetwork(ladderOf(network, field), sourceNode, scope, scale, field);
    }
    case "cauer": {
      const stages = network.stages.map((s, j) => ({ rKPerW: s.rKPerW, cJPerK: scope === "whole" || j === 0 ? s.cJPerK * scale : s.cJPerK }));
      // the same part (its `part`, so its node names) with other capacities
      return { network: { ...network, stages }, elementCapacityJPerK: stages[0]?.cJPerK ?? 0 };
    }
    case "graph": {
      const element = network.nodes.find((n) => n.id === sourceNode);
      if (element === undefined) throw inputError("bad-network", `${field}.sources`, `a node named "${sourceNode}" (the part's heat source)`, "none");
      const nodes = network.nodes.map((n) => ({ id: n.id, cJPerK: scope === "whole" || n.id === sourceNode ? n.cJPerK * scale : n.cJPerK }));
      return { network: { ...network, nodes }, elementCapacityJPerK: element.cJPerK * scale };
    }
  }
}
