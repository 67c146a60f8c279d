import { describeFound } from "../errors/InputError.js";
import { FieldReader, join } from "../format/FieldReader.js";
import type { CauerStage } from "./cauerLadder.js";
import type { FosterStage } from "./fosterNetwork.js";
import type { ThermalLink, ThermalNode } from "./thermalGraph.js";
import type { ThermalNetwork } from "./ThermalNetwork.js";
import { NETWORK_PARTS, type NetworkPart } from "./NetworkPart.js";

/** The forms a network file may take. */
export const NETWORK_FORMS = ["foster", "cauer", "graph"] as const;

const COMMON_KEYS = ["form", "name", "description"];

/**
 * Read a thermal network from plain data (a parsed YAML/JSON network file, or a part's inline
 * `network:` mapping). Every quantity is a number in SI or a unit string.
 *
 *   form: foster                      form: cauer                  form: graph
 *   stages:                           stages:                      nodes: [{ id: die, c: 0.02 J/K }, ...]
 *     - { r: 0.8 K/W, tau: 2 ms }       - { r: 0.3 K/W, c: 0.01 J/K }  links: [{ from: die, to: ambient, r: 2 K/W }]
 *     - { r: 1.2 K/W, c: 5 J/K }        - ...                      sources: [die]   observed: [die]
 *
 * A Foster stage gives its capacity either as tau (R·C) or as c. Optional `name` and
 * `description` are free text. A Foster or Cauer network may say which `part` it describes
 * (semiconductor, resistor or heatsink), which names its nodes (ladderNodeName: junction;
 * element, body; mount); a graph names its own nodes. Unknown keys are reported with the nearest valid key; all problems
 * are reported at once.
 * Cost O(size of the data).
 * @throws InputError listing every problem, with field paths under `field`
 * @example
 * parseNetwork({ form: "foster", stages: [{ r: "0.5 K/W", tau: "10 ms" }] }) // => { kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }] }
 */
export function parseNetwork(raw: unknown, field = "network"): ThermalNetwork {
  const reader = new FieldReader();
  const head = reader.record(raw, field, [...COMMON_KEYS, "part", "stages", "nodes", "links", "sources", "observed"], ["form"]);
  reader.done();
  const record = head!;
  const form = reader.choice(record.form, join(field, "form"), NETWORK_FORMS);
  reader.done();
  if (record.name !== undefined) reader.text(record.name, join(field, "name"), "a name (text)");
  if (record.description !== undefined && typeof record.description !== "string")
    reader.fail("bad-network", join(field, "description"), "text", describeFound(record.description));
  const network = form === "graph" ? readGraph(reader, record, field) : readLadder(reader, record, field, form!);
  reader.done();
  return network;
}

function rejectKeys(reader: FieldReader, record: Record<string, unknown>, field: string, keys: readonly string[], form: string): void {
  for (const key of keys) {
    if (record[key] !== undefined) reader.fail("bad-network", join(field, key), `no "${key}" in a ${form} network`, "a value");
  }
}

function readLadder(reader: FieldReader, record: Record<string, unknown>, field: string, form: "foster" | "cauer"): ThermalNetwork {
  rejectKeys(reader, record, field, ["nodes", "links", "sources", "observed"], form);
  const at = join(field, "stages");
  const stages = reader.list(record.stages, at, `${form} stages`, 1) ?? [];
  if (form === "foster") {
    const parsed: FosterStage[] = stages.map((raw, i) => {
      const f = join(at, i);
      const s = reader.record(raw, f, ["r", "tau", "c"], ["r"]);
      if (s === undefined) return { rKPerW: Number.NaN, tauS: Number.NaN };
      const r = reader.quantity(s.r, "thermalResistance", join(f, "r"), { exclusiveMin: 0 });
      if ((s.tau === undefined) === (s.c === undefined)) {
        reader.fail("bad-network", f, "exactly one of tau (time constant) or c (heat capacity)", s.tau === undefined ? "neither" : "both");
        return { rKPerW: r, tauS: Number.NaN };
      }
      const tau = s.tau !== undefined ? reader.quantity(s.tau, "time", join(f, "tau"), { exclusiveMin: 0 }) : r * reader.quantity(s.c, "heatCapacity", join(f, "c"), { exclusiveMin: 0 });
      return { rKPerW: r, tauS: tau };
    });
    return { kind: "foster", stages: parsed, ...readPart(reader, record, field) };
  }
  const parsed: CauerStage[] = stages.map((raw, i) => {
    const f = join(at, i);
    const s = reader.record(raw, f, ["r", "c"], ["r", "c"]);
    if (s === undefined) return { rKPerW: Number.NaN, cJPerK: Number.NaN };
    return {
      rKPerW: reader.quantity(s.r, "thermalResistance", join(f, "r"), { exclusiveMin: 0 }),
      cJPerK: reader.quantity(s.c, "heatCapacity", join(f, "c"), { exclusiveMin: 0 }),
    };
  });
  return { kind: "cauer", stages: parsed, ...readPart(reader, record, field) };
}

/** The optional `part` of a ladder network, as an object to spread. */
function readPart(reader: FieldReader, record: Record<string, unknown>, field: string): { part?: NetworkPart } {
  if (record.part === undefined) return {};
  const part = reader.choice(record.part, join(field, "part"), NETWORK_PARTS);
  return part === undefined ? {} : { part };
}

function readGraph(reader: FieldReader, record: Record<string, unknown>, field: string): ThermalNetwork {
  rejectKeys(reader, record, field, ["stages", "part"], "graph");
  const nodesAt = join(field, "nodes");
  const nodes: ThermalNode[] = (reader.list(record.nodes, nodesAt, "nodes", 1) ?? []).map((raw, i) => {
    const f = join(nodesAt, i);
    const n = reader.record(raw, f, ["id", "c"], ["id", "c"]);
    if (n === undefined) return { id: "", cJPerK: Number.NaN };
    return { id: reader.text(n.id, join(f, "id"), "a node name"), cJPerK: reader.quantity(n.c, "heatCapacity", join(f, "c"), { exclusiveMin: 0 }) };
  });
  const linksAt = join(field, "links");
  const links: ThermalLink[] = (reader.list(record.links, linksAt, "links", 1) ?? []).map((raw, i) => {
    const f = join(linksAt, i);
    const l = reader.record(raw, f, ["from", "to", "r"], ["from", "to", "r"]);
    if (l === undefined) return { from: "", to: "", rKPerW: Number.NaN };
    return {
      from: reader.text(l.from, join(f, "from"), "a node name"),
      to: reader.text(l.to, join(f, "to"), 'a node name or "ambient"'),
      rKPerW: reader.quantity(l.r, "thermalResistance", join(f, "r"), { exclusiveMin: 0 }),
    };
  });
  const names = (key: "sources" | "observed"): string[] =>
    (reader.list(record[key], join(field, key), "node names", 1) ?? []).map((raw, i) => reader.text(raw, join(join(field, key), i), "a node name"));
  return { kind: "graph", nodes, links, sources: names("sources"), observed: names("observed") };
}
