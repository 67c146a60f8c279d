import { type Node, isAlias, isMap, isPair, isScalar, isSeq } from "yaml";
import type { InputError } from "../errors/InputError.js";
import { inputLimit, limitWords } from "./inputLimits.js";

/** Depth and number of values of a node once its aliases are expanded. */
interface Measure {
  readonly depth: number;
  readonly nodes: number;
}

/**
 * Measure a parsed YAML document as the data it will become, before it becomes that data: its
 * nesting depth and its number of values (mappings, lists, scalars) with every alias expanded in
 * place, and refuse it when either passes its limit (INPUT_LIMITS.maxNestingDepth,
 * maxDocumentNodes). Each anchored node is measured once and every alias reuses that measure,
 * so an alias bomb ("billion laughs": each level a list of aliases of the one before) costs the
 * size of its text to measure, not the size it would expand to. An alias inside the node its
 * anchor names (a cycle) is refused too.
 * Source: YAML 1.2.2 specification (2021), §3.2.2.2 (anchors and aliases: an alias names the
 * most recent node with that anchor before it).
 * Cost O(nodes of the text); recursion depth at most the depth limit + 1.
 * @param root the document's contents
 * @param lineOf the 1-based line of a node (0 when unknown)
 * @param refuse builds the error for a line, what was expected and what was found
 * @throws the InputError `refuse` builds
 */
export function measureDocument(
  root: unknown,
  lineOf: (node: Node | null) => number,
  refuse: (line: number, expected: string, found: string) => InputError,
): void {
  const maxDepth = inputLimit("maxNestingDepth");
  const maxNodes = inputLimit("maxDocumentNodes");
  const anchors = new Map<string, Node>();
  const measured = new Map<Node, Measure>();
  const open = new Set<Node>();
  let total = 0;

  const visit = (node: unknown, level: number): Measure => {
    if (node === null || node === undefined) return { depth: 0, nodes: 0 };
    if (isPair(node)) {
      const key = visit(node.key, level);
      const value = visit(node.value, level);
      return { depth: Math.max(key.depth, value.depth), nodes: key.nodes + value.nodes };
    }
    const n = node as Node;
    if (isAlias(n)) {
      const source = anchors.get(n.source);
      if (source === undefined) return { depth: 0, nodes: 1 }; // the parser reports an unknown anchor
      if (open.has(source)) throw refuse(lineOf(n), "an alias that names a node outside itself", `the alias *${n.source} inside the node its anchor names`);
      const m = measured.get(source) ?? { depth: 0, nodes: 1 };
      count(m.nodes, n);
      if (level + m.depth > maxDepth) tooDeep(n, level + m.depth);
      return m;
    }
    if (n.anchor !== undefined) anchors.set(n.anchor, n);
    if (isScalar(n)) {
      count(1, n);
      return remember(n, { depth: 0, nodes: 1 });
    }
    if (!isMap(n) && !isSeq(n)) return { depth: 0, nodes: 1 };
    if (level + 1 > maxDepth) tooDeep(n, level + 1);
    count(1, n);
    open.add(n);
    let depth = 0;
    let nodes = 1;
    for (const item of n.items as unknown[]) {
      const m = visit(item, level + 1);
      depth = Math.max(depth, m.depth);
      nodes += m.nodes;
    }
    open.delete(n);
    return remember(n, { depth: depth + 1, nodes });
  };
  const remember = (node: Node, m: Measure): Measure => {
    if (node.anchor !== undefined) measured.set(node, m);
    return m;
  };
  const count = (nodes: number, at: Node): void => {
    total += nodes;
    if (total > maxNodes)
      throw refuse(lineOf(at), `a document that expands to at most ${limitWords("maxDocumentNodes", "values")}`, `more than ${maxNodes} values by this line`);
  };
  const tooDeep = (at: Node, depth: number): never => {
    throw refuse(lineOf(at), `a document nested at most ${limitWords("maxNestingDepth", "levels")}`, `${depth} levels by this line`);
  };
  visit(root, 0);
}
