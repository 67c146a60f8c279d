import { describeFound, inputError } from "../errors/InputError.js";
import { type CauerLadder, cauerToGraph } from "./cauerLadder.js";
import type { FosterNetwork } from "./fosterNetwork.js";
import { fosterToCauer } from "./fosterToCauer.js";
import { AMBIENT_NODE, type ThermalGraph, type ThermalLink, type ThermalNode } from "./thermalGraph.js";

/** One part mounted on a shared heatsink. */
export interface MountedPart {
  /**
   * the part's name; its nodes become "<id>.<node>", named after the device network's `part`
   * ("<id>.junction", "<id>.node2", ... for a semiconductor; "<id>.element", "<id>.body", ... for
   * a resistor; "<id>.node1", ... when the network does not say)
   */
  readonly id: string;
  /** heated-node-to-case network; a Foster network is first converted to its Cauer ladder */
  readonly device: FosterNetwork | CauerLadder;
  /** case-to-heatsink interface resistance (pad, grease, insulator) [K/W], ≥ 0 */
  readonly interfaceRKPerW: number;
}

/** Devices on one heatsink. */
export interface HeatsinkAssembly {
  readonly parts: readonly MountedPart[];
  /** heatsink-to-ambient network: a Cauer ladder (entered at its first node, "mount" unless its `part` says otherwise) or a graph */
  readonly heatsink: CauerLadder | ThermalGraph;
  /** for a graph heatsink, the node the parts are mounted on (default: its first source, else its first node) */
  readonly mountNode?: string;
}

/** Prefix of the heatsink's node names in a chained graph. */
export const HEATSINK_PREFIX = "heatsink.";

/**
 * Chain device networks, interface resistances and one heatsink network into one thermal graph.
 *
 * Each device is taken in Cauer form (a Foster network through {@link fosterToCauer}), because
 * only Cauer nodes are physical: a Foster network's inner nodes mean nothing, and adding Foster
 * stages of a device and a heatsink in series gives a wrong Zth (the heatsink's capacity would be
 * charged through nothing). The device ladder's last resistance ends at its case; the case node
 * has no heat capacity of its own, so the last resistance and the interface resistance are one
 * series link from the device's last node to the heatsink's mount node:
 *   R_link = R_n(device) + R_interface.
 * The heatsink keeps its own nodes and links to ambient, renamed "heatsink.<node>" (a ladder's
 * first node is "heatsink.mount"). Several parts on one heatsink all link to the same mount node,
 * so they heat each other through it.
 * The result's sources are the parts' heated nodes (a semiconductor's "<id>.junction", a
 * resistor's "<id>.element"), in the order given; its observed nodes are those followed by the
 * mount node.
 * Source: JEDEC JESD51-14 (2010) (the heat-flow path as a Cauer ladder, whose nodes follow the
 * physical path); that only Cauer (or graph) nodes may be joined is common practice. The series
 * combination of resistances is Ohm's law in the thermal analogy, Incropera et al., Fundamentals
 * of Heat and Mass Transfer, 7th ed. (2011), §3.1.2.
 * Validity: linear, lumped networks; the case is taken as isothermal (one node).
 * Cost O(total stages) plus the Foster → Cauer conversions.
 * @throws InputError `bad-network` for no parts, repeated or empty part ids, a negative or
 *   non-finite interface resistance, an unknown mount node, or an invalid device or heatsink network
 * @example
 * const parts = [{ id: "r1", device: { kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] }, interfaceRKPerW: 0.2 }];
 * chainNetworks({ parts, heatsink: { kind: "cauer", stages: [{ rKPerW: 1, cJPerK: 50 }] } }).nodes.map((n) => n.id) // => ["r1.node1", "heatsink.mount"]
 */
export function chainNetworks(assembly: HeatsinkAssembly, field = "assembly"): ThermalGraph {
  if (assembly.parts.length === 0) throw inputError("bad-network", `${field}.parts`, "at least one part on the heatsink", "none");
  const nodes: ThermalNode[] = [];
  const links: ThermalLink[] = [];
  const { heatsinkNodes, heatsinkLinks, mount } = heatsinkPart(assembly, `${field}.heatsink`);
  const seen = new Set<string>();
  const junctions: string[] = [];
  assembly.parts.forEach((part, i) => {
    const at = `${field}.parts[${i}]`;
    if (typeof part.id !== "string" || part.id === "" || part.id === HEATSINK_PREFIX.slice(0, -1) || part.id === AMBIENT_NODE)
      throw inputError("bad-network", `${at}.id`, `a non-empty part name other than "heatsink" and "${AMBIENT_NODE}"`, describeFound(part.id));
    if (seen.has(part.id)) throw inputError("bad-network", `${at}.id`, "a part name used once", describeFound(part.id));
    seen.add(part.id);
    if (!(part.interfaceRKPerW >= 0) || !Number.isFinite(part.interfaceRKPerW))
      throw inputError("bad-network", `${at}.interfaceRKPerW`, "an interface resistance ≥ 0 K/W", describeFound(part.interfaceRKPerW));
    const ladder = part.device.kind === "foster" ? fosterToCauer(part.device, `${at}.device`) : part.device;
    const graph = cauerToGraph(ladder, `${at}.device`);
    const name = (id: string): string => `${part.id}.${id}`;
    for (const node of graph.nodes) nodes.push({ id: name(node.id), cJPerK: node.cJPerK });
    for (const link of graph.links) {
      if (link.to === AMBIENT_NODE) links.push({ from: name(link.from), to: mount, rKPerW: link.rKPerW + part.interfaceRKPerW });
      else links.push({ from: name(link.from), to: name(link.to), rKPerW: link.rKPerW });
    }
    junctions.push(name(graph.sources[0]!));
  });
  return {
    kind: "graph",
    nodes: [...nodes, ...heatsinkNodes],
    links: [...links, ...heatsinkLinks],
    sources: junctions,
    observed: [...junctions, mount],
  };
}

function heatsinkPart(assembly: HeatsinkAssembly, field: string): { heatsinkNodes: ThermalNode[]; heatsinkLinks: ThermalLink[]; mount: string } {
  const sink = assembly.heatsink;
  const graph = sink.kind === "cauer" ? cauerToGraph({ ...sink, part: sink.part ?? "heatsink" }, field) : sink;
  if (graph.nodes.length === 0) throw inputError("bad-network", `${field}.nodes`, "at least one heatsink node", "none");
  const rename = (id: string): string => (id === AMBIENT_NODE ? AMBIENT_NODE : `${HEATSINK_PREFIX}${id}`);
  const mountId = sink.kind === "cauer" ? graph.nodes[0]!.id : (assembly.mountNode ?? graph.sources[0] ?? graph.nodes[0]!.id);
  if (!graph.nodes.some((n) => n.id === mountId))
    throw inputError("bad-network", `${field}.mountNode`, `a heatsink node (${graph.nodes.map((n) => n.id).join(", ")})`, describeFound(mountId));
  return {
    heatsinkNodes: graph.nodes.map((n) => ({ id: rename(n.id), cJPerK: n.cJPerK })),
    heatsinkLinks: graph.links.map((l) => ({ from: rename(l.from), to: rename(l.to), rKPerW: l.rKPerW })),
    mount: rename(mountId),
  };
}
