import { describe, expect, test } from "vitest";
import { cauerToGraph, fosterToCauer, fosterToModal, formatNetworkFile, ladderNodeName, loadProfile, networkToModal, parseNetwork, parseStructuredText } from "../../src/internal.js";
import { InputError } from "../../src/errors/InputError.js";

// Nodes are named by the part a network describes: a semiconductor's heated node is its junction,
// a resistor's its element then its body, a heatsink's the mount; unknown parts get numbers.
describe("ladderNodeName and the networks that use it", () => {
  test.each([
    [0, "semiconductor", "junction"],
    [1, "semiconductor", "node2"],
    [0, "resistor", "element"],
    [1, "resistor", "body"],
    [2, "resistor", "node3"],
    [0, "heatsink", "mount"],
    [0, undefined, "node1"],
    [3, undefined, "node4"],
  ] as const)("node %d of a %s ladder: %s", (k, part, name) => {
    expect(ladderNodeName(k, part)).toBe(name);
  });

  test("a resistor's Cauer ladder and Foster network are named element, body; the conversion keeps the part", () => {
    const graph = cauerToGraph({ kind: "cauer", part: "resistor", stages: [{ rKPerW: 1, cJPerK: 0.1 }, { rKPerW: 2, cJPerK: 5 }, { rKPerW: 3, cJPerK: 50 }] });
    expect(graph.nodes.map((n) => n.id)).toEqual(["element", "body", "node3"]);
    expect(graph.sources).toEqual(["element"]);
    const foster = { kind: "foster" as const, part: "resistor" as const, stages: [{ rKPerW: 1, tauS: 0.1 }, { rKPerW: 2, tauS: 10 }] };
    expect(fosterToModal(foster).observed).toEqual(["element"]);
    expect(fosterToCauer(foster).part).toBe("resistor");
  });

  test("a network file's part key is read, written back, and checked", () => {
    const network = parseNetwork(parseStructuredText("form: cauer\npart: semiconductor\nstages: [{ r: 1 K/W, c: 1 J/K }]\n", "n.yaml").data);
    expect(network).toMatchObject({ kind: "cauer", part: "semiconductor" });
    expect(formatNetworkFile(network)).toContain("part: semiconductor");
    expect(networkToModal(parseNetwork(parseStructuredText(formatNetworkFile(network), "back.yaml").data)).sources).toEqual(["junction"]);
    expect(() => parseNetwork({ form: "foster", part: "diode", stages: [{ r: 1, tau: 1 }] })).toThrow('part: expected one of semiconductor, resistor, heatsink, found "diode"');
  });
});

describe("a profile names a network's nodes after the part's role", () => {
  const profile = (role: string, networkPart = "") => `name: roles
ambient: 25 degC
parts:
  - id: p
    role: ${role}
    network: { form: foster, ${networkPart}stages: [{ r: 1 K/W, tau: 1 s }] }
    limits: { maxTemperature: 150 degC }
circuit:
  topology: linear-mosfet
  busVoltage: 48 V
  capacitance: 1 mF
  mosfet: { gateVoltage: 10 V, thresholdVoltage: 4 V, sourceResistor: 10 ohm, rdsOn: 0.1 ohm }
  completion: { fraction: 0.9, timeout: 1 s }
  discharge: { kind: none }
events:
  - power-up: {}
`;
  test.each([
    ["mosfet", "junction"],
    ["source-resistor", "element"],
  ])("role %s: %s", (role, node) => {
    expect(loadProfile(profile(role), "p.yaml").parts[0]!.model.sources).toEqual([node]);
  });

  test("a network that says another part than the role is refused, naming the field", () => {
    try {
      loadProfile(profile("mosfet", "part: resistor, "), "p.yaml");
      throw new Error("no InputError");
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      expect(error.problems.map((p) => `${p.field}: expected ${p.expected}, found ${p.found}`)).toEqual([
        'parts[0].network.part: expected part: semiconductor (the network of a part whose role is mosfet), or no part key, found "resistor"',
      ]);
    }
  });
});
