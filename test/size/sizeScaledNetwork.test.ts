import { describe, expect, test } from "vitest";
import { fosterToCauer, logSpacedTimes, networkToModal, sizeScaledNetwork, zth } from "../../src/internal.js";
import type { CauerLadder, FosterNetwork, ThermalGraph } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { inputErrorMessage } from "../helpers/inputErrorMessage.js";

// What `heatledger size --scale whole|element` does to a network. Invented networks; the Foster
// and Cauer ones describe a semiconductor, so their heated node is named "junction".
const foster: FosterNetwork = { kind: "foster", part: "semiconductor", stages: [{ rKPerW: 0.35, tauS: 0.04 }, { rKPerW: 0.9, tauS: 1.8 }, { rKPerW: 1.6, tauS: 45 }] };
const ladder: CauerLadder = { kind: "cauer", part: "semiconductor", stages: [{ rKPerW: 0.4, cJPerK: 0.8 }, { rKPerW: 1.5, cJPerK: 6 }, { rKPerW: 2.5, cJPerK: 60 }] };
const graph: ThermalGraph = {
  kind: "graph",
  nodes: [{ id: "die", cJPerK: 0.012 }, { id: "case", cJPerK: 0.9 }, { id: "resistor", cJPerK: 0.6 }, { id: "sink", cJPerK: 85 }],
  links: [{ from: "die", to: "case", rKPerW: 0.45 }, { from: "case", to: "sink", rKPerW: 0.5 }, { from: "resistor", to: "sink", rKPerW: 3 }, { from: "sink", to: "ambient", rKPerW: 1.1 }],
  sources: ["die", "resistor"],
  observed: ["die", "resistor", "sink"],
};
const slope = foster.stages.reduce((sum, s) => sum + s.rKPerW / s.tauS, 0);

describe("sizeScaledNetwork: whole body", () => {
  test.each([0.05, 0.7, 3.3, 250])("k = %f: every capacity × k is Zth stretched in time by k, for every form", (k) => {
    // Z_k(t) = Z(t/k): C → k·C at fixed G is the time-scaling property of the Laplace transform
    // (Oppenheim & Willsky, Signals and Systems, 2nd ed., §9.5.6, from memory). Both sides come from
    // the same eigen-solver on matrices that differ by k, so they agree to its rounding (1e-9 relative).
    for (const network of [foster, ladder, graph]) {
      const scaled = sizeScaledNetwork(network, "die", "whole", k).network;
      expect(scaled.kind).toBe(network.kind);
      const [before, after] = [networkToModal(network), networkToModal(scaled)];
      for (const t of logSpacedTimes(1e-4 * k, 1e3 * k, 25)) expectClose(zth(after, t), zth(before, t / k), { rel: 1e-9 });
    }
  });

  test("the element capacity is k·C1: the Foster short-time capacity 1/Σ(R/tau), the ladder's C1, the graph's source node", () => {
    // C1 of a Foster network's Cauer ladder is 1/Σ(R_i/tau_i) (the high-frequency limit Y ≈ s·C1 of
    // the continued fraction; Cauer 1926). Exact arithmetic on the inputs: 1e-15 relative.
    expectClose(sizeScaledNetwork(foster, "junction", "whole", 2).elementCapacityJPerK, 2 / slope, { rel: 1e-15 });
    expect(sizeScaledNetwork(ladder, "junction", "whole", 2).elementCapacityJPerK).toBe(1.6);
    expect(sizeScaledNetwork(graph, "resistor", "whole", 2).elementCapacityJPerK).toBe(1.2);
  });
});

describe("sizeScaledNetwork: element only", () => {
  test("a Cauer ladder: C1 × k, every other capacity and every resistance kept", () => {
    const scaled = sizeScaledNetwork(ladder, "junction", "element", 3).network as CauerLadder;
    expect(scaled.stages).toEqual([{ rKPerW: 0.4, cJPerK: 0.8 * 3 }, { rKPerW: 1.5, cJPerK: 6 }, { rKPerW: 2.5, cJPerK: 60 }]);
  });

  test("a graph: only the node the part's power enters", () => {
    const scaled = sizeScaledNetwork(graph, "die", "element", 10);
    expect((scaled.network as ThermalGraph).nodes.map((n) => n.cJPerK)).toEqual([0.12, 0.9, 0.6, 85]);
    expect(scaled.elementCapacityJPerK).toBe(0.12);
    expect((scaled.network as ThermalGraph).links).toEqual(graph.links);
  });

  test("a Foster network becomes its exact Cauer ladder with C1 × k; at k = 1 its Zth is the Foster Zth", () => {
    const ladderOfFoster = fosterToCauer(foster);
    const same = sizeScaledNetwork(foster, "junction", "element", 1);
    expect(same.network.kind).toBe("cauer");
    // fosterToCauer's round trip is checked to 1e-6 relative (FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE)
    for (const t of logSpacedTimes(1e-4, 1e3, 25)) expectClose(zth(networkToModal(same.network), t), zth(networkToModal(foster), t), { rel: 1e-6 });
    // C1 = 1/Σ(R_i/tau_i) (Cauer 1926, high-frequency limit); the ladder's doubles are rounded once: 1e-12
    expectClose(same.elementCapacityJPerK, 1 / slope, { rel: 1e-12 });
    const scaled = sizeScaledNetwork(foster, "junction", "element", 5).network as CauerLadder;
    expect(scaled.stages.map((s) => s.cJPerK)).toEqual(ladderOfFoster.stages.map((s, j) => (j === 0 ? s.cJPerK * 5 : s.cJPerK)));
    expect(scaled.stages.map((s) => s.rKPerW)).toEqual(ladderOfFoster.stages.map((s) => s.rKPerW));
  });

  test("a scaled ladder or Foster network is the same part: its part key, so its node names, are kept", () => {
    for (const scope of ["whole", "element"] as const) for (const network of [foster, ladder]) expect(sizeScaledNetwork(network, "junction", scope, 2).network).toHaveProperty("part", "semiconductor");
  });

  test("the scaled element sets the initial slope of Zth: dZ/dt(0) = 1/(k·C1)", () => {
    // At t → 0 no heat has left the first lump: dT/dt = P/C1 (Incropera et al., Fundamentals of Heat
    // and Mass Transfer, 7th ed., §5.2, lumped capacitance). The slope of the modal form at 0 is
    // Σ gain/tau; modal rounding of the eigen-solver, 1e-9 relative.
    for (const [network, source] of [[ladder, "junction"], [graph, "die"], [foster, "junction"]] as const) {
      const scaled = sizeScaledNetwork(network, source, "element", 7);
      const model = networkToModal(scaled.network);
      const s = model.sources.indexOf(source);
      const o = model.observed.indexOf(source);
      const initialSlope = model.gainKPerW[o]![s]!.reduce((sum, g, m) => sum + g / model.tauS[m]!, 0);
      expectClose(initialSlope, 1 / scaled.elementCapacityJPerK, { rel: 1e-9 });
    }
  });

  test("one lump: scaling the element is scaling the whole body (a single RC has one capacity)", () => {
    const lump: CauerLadder = { kind: "cauer", stages: [{ rKPerW: 2, cJPerK: 0.5 }] };
    expect(sizeScaledNetwork(lump, "junction", "element", 4)).toEqual(sizeScaledNetwork(lump, "junction", "whole", 4));
  });
});

describe("sizeScaledNetwork: bad input", () => {
  test.each([
    { name: "a scale of zero", run: () => sizeScaledNetwork(ladder, "junction", "whole", 0), expected: "scale: expected a capacity scale > 0, found 0" },
    { name: "an infinite scale", run: () => sizeScaledNetwork(ladder, "junction", "element", Infinity), expected: "scale: expected a capacity scale > 0, found Infinity" },
    { name: "a graph without the source node", run: () => sizeScaledNetwork(graph, "gate", "element", 2, "parts[0].network"), expected: 'parts[0].network.sources: expected a node named "gate" (the part\'s heat source), found none' },
  ])("$name", ({ run, expected }) => {
    expect(inputErrorMessage(run)).toBe(expected);
  });
});
