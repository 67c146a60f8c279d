import { stringify } from "yaml";
import type { ThermalNetwork } from "./ThermalNetwork.js";

/** Shortest exact-enough text for a number: 10 significant digits, trailing zeros dropped. */
function number(value: number): number {
  return Number(value.toPrecision(10));
}

/**
 * The plain-data form of a network, with units on every quantity, as {@link parseNetwork} reads
 * it back: `{ form: foster, stages: [{ r: "0.8 K/W", tau: "0.002 s" }] }`.
 * Values keep 10 significant digits (a round trip changes Zth by less than 1e-9 relative).
 * Cost O(size).
 * @example
 * networkToDocument({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] }) // => { form: "foster", stages: [{ r: "0.5 K/W", tau: "0.01 s" }] }
 */
export function networkToDocument(network: ThermalNetwork, name?: string): Record<string, unknown> {
  const head: Record<string, unknown> = name === undefined ? {} : { name };
  switch (network.kind) {
    case "foster":
      return { ...head, form: "foster", ...(network.part === undefined ? {} : { part: network.part }), stages: network.stages.map((s) => ({ r: `${number(s.rKPerW)} K/W`, tau: `${number(s.tauS)} s` })) };
    case "cauer":
      return { ...head, form: "cauer", ...(network.part === undefined ? {} : { part: network.part }), stages: network.stages.map((s) => ({ r: `${number(s.rKPerW)} K/W`, c: `${number(s.cJPerK)} J/K` })) };
    case "graph":
      return {
        ...head,
        form: "graph",
        nodes: network.nodes.map((n) => ({ id: n.id, c: `${number(n.cJPerK)} J/K` })),
        links: network.links.map((l) => ({ from: l.from, to: l.to, r: `${number(l.rKPerW)} K/W` })),
        sources: [...network.sources],
        observed: [...network.observed],
      };
  }
}

/**
 * A network file's text, YAML or JSON, that parseNetwork reads back.
 * @param format "yaml" (default) or "json"
 * @example
 * formatNetworkFile({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] }).split("\n")[1] // => "form: foster"
 */
export function formatNetworkFile(network: ThermalNetwork, format: "yaml" | "json" = "yaml", name?: string): string {
  const document = networkToDocument(network, name);
  if (format === "json") return `${JSON.stringify(document, null, 2)}\n`;
  return `# heatledger thermal network (${network.kind})\n${stringify(document, { flowCollectionPadding: true, collectionStyle: "block" })}`;
}
