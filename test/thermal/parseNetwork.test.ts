import { describe, expect, test } from "vitest";
import { InputError, formatNetworkFile, networkToModal, parseNetwork, parseStructuredText, zth, logSpacedTimes } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

describe("parseNetwork", () => {
  test("parseNetwork reads a Foster network with tau or c and unit strings", () => {
    const network = parseNetwork({ form: "foster", stages: [{ r: "0.5 K/W", tau: "2 ms" }, { r: 1.5, c: "4 J/K" }] });
    expect(network).toEqual({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.002 }, { rKPerW: 1.5, tauS: 6 }] });
  });

  test("parseNetwork reads a Cauer ladder and a graph", () => {
    expect(parseNetwork({ form: "cauer", stages: [{ r: "0.3 K/W", c: "0.01 J/K" }] })).toEqual({ kind: "cauer", stages: [{ rKPerW: 0.3, cJPerK: 0.01 }] });
    const graph = parseNetwork({
      form: "graph",
      nodes: [{ id: "die", c: "0.02 J/K" }],
      links: [{ from: "die", to: "ambient", r: "2 K/W" }],
      sources: ["die"],
      observed: ["die"],
    });
    expect(graph.kind).toBe("graph");
  });

  test("parseNetwork reports every problem at once with its field", () => {
    const bad = { form: "foster", stages: [{ r: "0.35 K/W", tau: "40 mV" }, { r: "-1 K/W", tua: "3 s" }] };
    try {
      parseNetwork(bad, "network");
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(InputError);
      expect((error as InputError).problems.map((p) => `${p.field}: ${p.expected} | ${p.found}`)).toEqual([
        'network.stages[0].tau: a time such as "350 ms" (or a number in s) | "40 mV" (a voltage)',
        'network.stages[1].tua: one of the keys r, tau, c (did you mean "tau"?) | an unknown key',
        'network.stages[1].r: a value > 0 | "-1 K/W"',
        "network.stages[1]: exactly one of tau (time constant) or c (heat capacity) | neither",
      ]);
    }
  });

  test.each([
    [{ form: "fostr", stages: [] }, "network.form: expected one of foster, cauer, graph, found \"fostr\""],
    [{ stages: [] }, "network.form: expected this key (required), found nothing"],
    [{ form: "cauer", stages: [] }, "network.stages: expected at least 1 cauer stages, found 0"],
    [{ form: "cauer", stages: [{ r: 1, c: 1 }], nodes: [] }, 'network.nodes: expected no "nodes" in a cauer network, found a value'],
    [[1, 2], "network: expected a mapping with keys form, name, description, part, stages, nodes, links, sources, observed, found [1,2]"],
  ])("parseNetwork rejects %j", (raw, message) => {
    expect(() => parseNetwork(raw, "network")).toThrow(message);
  });

  test("formatNetworkFile round-trips through parseStructuredText and parseNetwork", () => {
    const original = parseNetwork({ form: "foster", stages: [{ r: 0.123456789, tau: 1.23456789e-4 }, { r: 2.5, tau: 30 }] });
    for (const format of ["yaml", "json"] as const) {
      const back = parseNetwork(parseStructuredText(formatNetworkFile(original, format), "x").data);
      const a = networkToModal(original);
      const b = networkToModal(back);
      // 10 significant digits are written, so Zth agrees to about 1e-10 relative; 1e-9 is an honest bound.
      for (const t of logSpacedTimes(1e-6, 1e3, 20)) expectClose(zth(b, t), zth(a, t), { rel: 1e-9 });
    }
  });
});

describe("parseStructuredText", () => {
  const text = ["name: x", "parts:", "  - id: R1", "    network:", "      form: foster", "      stages:", "        - { r: 1 K/W, tau: 2 s }", ""].join("\n");

  test.each([
    ["name", 1],
    ["parts[0].id", 3],
    ["parts[0].network.form", 5],
    ["parts[0].network.stages[0].tau", 7],
    ["parts[0].missing", 3],
  ])("lineOf(%s) is line %d", (field, line) => {
    expect(parseStructuredText(text, "p.yaml").lineOf(field)).toBe(line);
  });

  test("parseStructuredText reports a syntax error with its line", () => {
    expect(() => parseStructuredText("a: 1\nb: [1, 2\n", "p.yaml")).toThrow(/^p\.yaml:\d+: expected valid YAML or JSON, found /);
  });
});
