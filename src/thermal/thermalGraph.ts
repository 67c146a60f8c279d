import { describeFound, inputError } from "../errors/InputError.js";
import type { ModalModel } from "./ModalModel.js";
import { symmetricEigen } from "./symmetricEigen.js";

/** The reserved node name for the ambient (reference) temperature. */
export const AMBIENT_NODE = "ambient";

/** A node of a thermal graph with its heat capacity [J/K] to the thermal reference. */
export interface ThermalNode {
  readonly id: string;
  readonly cJPerK: number;
}

/** A thermal resistance [K/W] between two nodes, or from a node to "ambient". */
export interface ThermalLink {
  readonly from: string;
  readonly to: string;
  readonly rKPerW: number;
}

/**
 * A general lumped thermal network: nodes with heat capacity, resistances between them and to
 * ambient, the nodes heat is injected into (sources) and the nodes whose rise is reported.
 */
export interface ThermalGraph {
  readonly kind: "graph";
  readonly nodes: readonly ThermalNode[];
  readonly links: readonly ThermalLink[];
  readonly sources: readonly string[];
  readonly observed: readonly string[];
}

/**
 * Reduce a thermal graph to modal form by the symmetric eigenproblem.
 *
 * The network obeys C·dθ/dt = −G·θ + B·P (G: conductance matrix including links to ambient on
 * the diagonal, C: diagonal heat capacities). With M = C^-1/2·G·C^-1/2 = V·Λ·Vᵀ:
 *   tau_m = 1/λ_m,   gain[o][s][m] = V[o][m]·V[s][m] / (sqrt(C_o·C_s)·λ_m)   [K/W],
 * which is exactly the Foster expansion of every transfer impedance (the exact Cauer → Foster
 * conversion when the graph is a ladder).
 * Source: Ogata, System Dynamics, 4th ed. (2004), ch. 7 (thermal systems; chapter from memory) for
 * the RC equations; Golub & Van Loan, Matrix Computations, 4th ed. (2013), §8.1 for the symmetric
 * eigen-decomposition; JEDEC JESD51-14 (2010)
 * annex on Cauer/Foster equivalence.
 * Cost O(n³) in the number of nodes.
 * @throws InputError `bad-network` for unknown node names, non-positive values, or a node with no
 *   path to ambient (the network would have no steady state).
 * @example
 * const graph = { kind: "graph", nodes: [{ id: "die", cJPerK: 0.1 }], links: [{ from: "die", to: "ambient", rKPerW: 2 }], sources: ["die"], observed: ["die"] };
 * graphToModal(graph).tauS // => [0.2]
 */
export function graphToModal(graph: ThermalGraph, field = "network"): ModalModel {
  const n = graph.nodes.length;
  if (n === 0) throw inputError("bad-network", `${field}.nodes`, "at least one node", "none");
  const index = new Map<string, number>();
  graph.nodes.forEach((node, i) => {
    if (node.id === AMBIENT_NODE) throw inputError("bad-network", `${field}.nodes[${i}].id`, `a name other than "${AMBIENT_NODE}" (reserved)`, describeFound(node.id));
    if (index.has(node.id)) throw inputError("bad-network", `${field}.nodes[${i}].id`, "a unique node name", describeFound(node.id));
    if (!(node.cJPerK > 0) || !Number.isFinite(node.cJPerK))
      throw inputError("bad-network", `${field}.nodes[${i}].c`, "a heat capacity > 0 J/K", describeFound(node.cJPerK));
    index.set(node.id, i);
  });
  const lookup = (name: string, at: string): number => {
    if (name === AMBIENT_NODE) return -1;
    const i = index.get(name);
    if (i === undefined) throw inputError("bad-network", at, `a node name (${[...index.keys(), AMBIENT_NODE].join(", ")})`, describeFound(name));
    return i;
  };
  const g = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  graph.links.forEach((link, k) => {
    const at = `${field}.links[${k}]`;
    if (!(link.rKPerW > 0) || !Number.isFinite(link.rKPerW)) throw inputError("bad-network", `${at}.r`, "a thermal resistance > 0 K/W", describeFound(link.rKPerW));
    const i = lookup(link.from, `${at}.from`);
    const j = lookup(link.to, `${at}.to`);
    if (i === j) throw inputError("bad-network", `${at}.to`, "a node other than the link's own start", describeFound(link.to));
    const conductance = 1 / link.rKPerW;
    if (i >= 0) g[i]![i]! += conductance;
    if (j >= 0) g[j]![j]! += conductance;
    if (i >= 0 && j >= 0) {
      g[i]![j]! -= conductance;
      g[j]![i]! -= conductance;
    }
  });
  assertGrounded(graph, index, field);
  const sources = graph.sources.map((s, k) => lookup(s, `${field}.sources[${k}]`));
  const observed = graph.observed.map((o, k) => lookup(o, `${field}.observed[${k}]`));
  if (sources.some((i) => i < 0)) throw inputError("bad-network", `${field}.sources`, "heat sources at nodes, not at ambient", describeFound(graph.sources));
  if (observed.some((i) => i < 0)) throw inputError("bad-network", `${field}.observed`, "observed nodes, not ambient", describeFound(graph.observed));
  const rootC = graph.nodes.map((node) => Math.sqrt(node.cJPerK));
  const scaled = g.map((row, i) => row.map((value, j) => value / (rootC[i]! * rootC[j]!)));
  const { values, vectors } = symmetricEigen(scaled);
  const tauS = values.map((lambda) => 1 / lambda);
  const gainKPerW = observed.map((o) =>
    sources.map((s) => values.map((lambda, m) => (vectors[o]![m]! * vectors[s]![m]!) / (rootC[o]! * rootC[s]! * lambda))),
  );
  return { tauS, sources: graph.sources.slice(), observed: graph.observed.slice(), gainKPerW };
}

/** Every node must reach ambient through links, else G is singular. */
function assertGrounded(graph: ThermalGraph, index: Map<string, number>, field: string): void {
  const neighbours = new Map<string, string[]>();
  for (const link of graph.links) {
    neighbours.set(link.from, [...(neighbours.get(link.from) ?? []), link.to]);
    neighbours.set(link.to, [...(neighbours.get(link.to) ?? []), link.from]);
  }
  const reached = new Set<string>([AMBIENT_NODE]);
  const queue = [AMBIENT_NODE];
  while (queue.length > 0) {
    for (const next of neighbours.get(queue.pop()!) ?? []) {
      if (!reached.has(next)) {
        reached.add(next);
        queue.push(next);
      }
    }
  }
  for (const id of index.keys()) {
    if (!reached.has(id)) throw inputError("bad-network", `${field}.links`, `a path of resistances from node "${id}" to ambient`, "none");
  }
}
