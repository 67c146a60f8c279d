/**
 * What part a Foster or Cauer network describes, so that its nodes are named after the part's
 * role: a semiconductor's heated node is its junction, a resistor's its element (then its body),
 * a heatsink's the mount where parts sit. Graph networks name their own nodes. A network that does
 * not say gets plain numbered nodes ("node1", "node2", ...).
 */
export type NetworkPart = "semiconductor" | "resistor" | "heatsink";

/** The values of a network file's `part` key. */
export const NETWORK_PARTS: readonly NetworkPart[] = ["semiconductor", "resistor", "heatsink"];

/** The named nodes of a ladder by part, from the heated node on; deeper nodes are "node<k>". */
export const LADDER_NODE_NAMES: Readonly<Record<NetworkPart, readonly string[]>> = {
  semiconductor: ["junction"],
  resistor: ["element", "body"],
  heatsink: ["mount"],
};

/**
 * The name of node k (0-based, the heated node first) of a ladder network of a part: its role's
 * name where LADDER_NODE_NAMES has one, else "node<k+1>". A Foster network has one physical node,
 * k = 0. Cost O(1).
 * @example
 * ladderNodeName(0, "resistor") // "element"
 * ladderNodeName(2, "resistor") // "node3"
 */
export function ladderNodeName(k: number, part?: NetworkPart): string {
  return (part === undefined ? undefined : LADDER_NODE_NAMES[part][k]) ?? `node${k + 1}`;
}
