import { describe, expect, test } from "vitest";
import {
  type CauerLadder,
  type FosterNetwork,
  type ThermalGraph,
  chainNetworks,
  fosterToCauer,
  fosterToModal,
  graphToModal,
  steadyStateResistance,
  zth,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Invented demo networks; the device is a semiconductor (its heated node is its junction).
const device: FosterNetwork = { kind: "foster", part: "semiconductor", stages: [{ rKPerW: 0.1, tauS: 1e-3 }, { rKPerW: 0.4, tauS: 0.03 }, { rKPerW: 0.3, tauS: 0.5 }] };
const sink: CauerLadder = { kind: "cauer", stages: [{ rKPerW: 0.3, cJPerK: 20 }, { rKPerW: 0.9, cJPerK: 300 }] };

describe("chainNetworks: one device on a heatsink", () => {
  const graph = chainNetworks({ parts: [{ id: "q1", device, interfaceRKPerW: 0.25 }], heatsink: sink });
  const model = graphToModal(graph);

  test("steady-state resistance is device + interface + heatsink", () => {
    // Series resistances add (Ohm's law in the thermal analogy, Incropera et al., Fundamentals of
    // Heat and Mass Transfer, 7th ed. (2011), §3.1.2); rounding only: 1e-12.
    expectClose(steadyStateResistance(model, 0, 0), 0.8 + 0.25 + 1.2, { rel: 1e-12 });
  });

  test("at times far below the heatsink's time constants the junction sees the device alone", () => {
    // At t = 1 µs the heat has not left the device (fastest device tau 1 ms): Zth equals the
    // device's own Foster Zth to within the heat that reached the case, which is below 1e-6 relative here.
    expectClose(zth(model, 1e-6), zth(fosterToModal(device), 1e-6), { rel: 1e-6 });
  });

  test("the graph has the device's Cauer nodes, the case merged into one link, and the heatsink's nodes", () => {
    const ladder = fosterToCauer(device);
    expect(graph.nodes.map((n) => n.id)).toEqual(["q1.junction", "q1.node2", "q1.node3", "heatsink.mount", "heatsink.node2"]);
    const toSink = graph.links.find((l) => l.from === "q1.node3")!;
    expect(toSink.to).toBe("heatsink.mount");
    expectClose(toSink.rKPerW, ladder.stages[2]!.rKPerW + 0.25, { rel: 1e-15 });
    expect(graph.sources).toEqual(["q1.junction"]);
    expect(graph.observed).toEqual(["q1.junction", "heatsink.mount"]);
  });

  test("a Foster device and its Cauer ladder chain to the same network", () => {
    const viaCauer = graphToModal(chainNetworks({ parts: [{ id: "q1", device: fosterToCauer(device), interfaceRKPerW: 0.25 }], heatsink: sink }));
    // Same graph built two ways: identical numbers.
    for (const t of [1e-4, 0.01, 1, 100, 1e4]) expect(zth(viaCauer, t)).toBe(zth(model, t));
  });

  test("adding Foster stages in series is not the same network (why chaining goes through Cauer)", () => {
    // Foster "addition" puts the interface resistance and the heatsink's response in series with a
    // device whose inner nodes are not physical; at 0.1 s the chained Zth is the physical one.
    // Measured: 0.541 K/W chained against 0.795 K/W summed, so a difference above 1 % is asserted.
    const sinkModel = graphToModal({ kind: "graph", nodes: [{ id: "a", cJPerK: 20 }, { id: "b", cJPerK: 300 }], links: [{ from: "a", to: "b", rKPerW: 0.3 }, { from: "b", to: "ambient", rKPerW: 0.9 }], sources: ["a"], observed: ["a"] });
    const summed = (t: number): number => zth(fosterToModal(device), t) + 0.25 * (t > 0 ? 1 : 0) + zth(sinkModel, t);
    const chained = zth(model, 0.1);
    expect(Math.abs(summed(0.1) - chained) / chained).toBeGreaterThan(0.01);
  });
});

describe("chainNetworks: parts sharing a heatsink", () => {
  const graph = chainNetworks({
    parts: [
      { id: "q1", device, interfaceRKPerW: 0.25 },
      { id: "r1", device: { kind: "cauer", part: "resistor", stages: [{ rKPerW: 0.5, cJPerK: 0.2 }] }, interfaceRKPerW: 0.1 },
    ],
    heatsink: sink,
  });
  const model = graphToModal(graph);

  test("each part heats the other only through the heatsink", () => {
    // Steady state, source r1 observed at q1: the heat of r1 raises the heatsink mount node by
    // R_heatsink per watt and no current flows through q1's own path (series/parallel rules,
    // Incropera §3.1.2), so the mutual resistance is the heatsink's 1.2 K/W.
    // nodes are named by part role: a resistor's heated node is its element, not a junction
    expect(model.sources).toEqual(["q1.junction", "r1.element"]);
    expectClose(steadyStateResistance(model, 0, 1), 1.2, { rel: 1e-12 });
    expectClose(steadyStateResistance(model, 1, 0), 1.2, { rel: 1e-12 });
    expectClose(steadyStateResistance(model, 1, 1), 0.5 + 0.1 + 1.2, { rel: 1e-12 });
  });

  test("the mutual Zth is symmetric (reciprocity of a passive RC network)", () => {
    // Reciprocity theorem for linear passive networks (any circuit-theory text); rounding: 1e-12.
    for (const t of [0.01, 1, 100]) expectClose(zth(model, t, 0, 1), zth(model, t, 1, 0), { rel: 1e-12, abs: 1e-15 });
  });
});

describe("chainNetworks on a graph heatsink", () => {
  const plate: ThermalGraph = {
    kind: "graph",
    nodes: [{ id: "base", cJPerK: 40 }, { id: "fins", cJPerK: 200 }],
    links: [{ from: "base", to: "fins", rKPerW: 0.2 }, { from: "fins", to: "ambient", rKPerW: 0.6 }, { from: "base", to: "ambient", rKPerW: 5 }],
    sources: ["base"],
    observed: ["base"],
  };
  test("the mount node defaults to the graph's first source", () => {
    const graph = chainNetworks({ parts: [{ id: "q1", device, interfaceRKPerW: 0 }], heatsink: plate });
    expect(graph.observed.at(-1)).toBe("heatsink.base");
    // base to ambient: 5 ∥ (0.2 + 0.6) = 4/5.8 K/W; plus the device's 0.8 K/W.
    expectClose(steadyStateResistance(graphToModal(graph)), 0.8 + (5 * 0.8) / 5.8, { rel: 1e-12 });
  });

  test.each([
    [{ parts: [], heatsink: sink }, "assembly.parts: expected at least one part on the heatsink, found none"],
    [{ parts: [{ id: "q1", device, interfaceRKPerW: -1 }], heatsink: sink }, "assembly.parts[0].interfaceRKPerW: expected an interface resistance ≥ 0 K/W, found -1"],
    [
      { parts: [{ id: "q1", device, interfaceRKPerW: 0 }, { id: "q1", device, interfaceRKPerW: 0 }], heatsink: sink },
      'assembly.parts[1].id: expected a part name used once, found "q1"',
    ],
    [{ parts: [{ id: "q1", device, interfaceRKPerW: 0 }], heatsink: plate, mountNode: "lid" }, 'assembly.heatsink.mountNode: expected a heatsink node (base, fins), found "lid"'],
  ])("bad assemblies are InputErrors naming the field (%#)", (assembly, message) => {
    expect(() => chainNetworks(assembly)).toThrow(message);
  });
});
