import { describe, expect, test } from "vitest";
import { GENERAL_CAUTION, fosterToModal, logSpacedTimes, networkToModal, parseNetwork, parseStructuredText, zth } from "../../src/internal.js";
import { runCli } from "../../src/cli/main.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";

describe("heatledger network convert", () => {
  const fosterText = "form: foster\nstages:\n  - { r: 0.35 K/W, tau: 40 ms }\n  - { r: 0.9 K/W, tau: 1.8 s }\n  - { r: 1.6 K/W, tau: 45 s }\n";

  test("network convert --to cauer writes a ladder with the same Zth", async () => {
    const io = memoryIo({ "f.yaml": fosterText });
    expect(await runCli(["network", "convert", "f.yaml", "--to", "cauer", "--out", "c.yaml"], io)).toBe(0);
    const ladder = parseNetwork(parseStructuredText(io.files["c.yaml"]!, "c.yaml").data);
    expect(ladder.kind).toBe("cauer");
    const a = fosterToModal(parseNetwork(parseStructuredText(fosterText, "f.yaml").data) as never);
    const b = networkToModal(ladder);
    // Exact conversion; the file keeps 10 significant digits, so 1e-8 relative is an honest bound.
    for (const t of logSpacedTimes(1e-4, 1e3, 30)) expectClose(zth(b, t), zth(a, t), { rel: 1e-8 });
  });

  test("network convert keeps the part (its node names) and closes with the cautions, in text and JSON", async () => {
    const io = memoryIo({ "f.yaml": `form: foster\npart: resistor\n${fosterText.slice("form: foster\n".length)}` });
    expect(await runCli(["network", "convert", "f.yaml", "--to", "cauer"], io)).toBe(0);
    const text = io.stdout.join("");
    expect(text).toContain("part: resistor");
    expect(text.replace(/\s+/g, " ")).toContain(GENERAL_CAUTION);
    const ladder = parseNetwork(parseStructuredText(text.slice(text.indexOf("# heatledger"), text.indexOf("Caution")), "c.yaml").data);
    expect(networkToModal(ladder).sources).toEqual(["element"]);
    const json = memoryIo({ "f.yaml": fosterText });
    expect(await runCli(["network", "convert", "f.yaml", "--to", "cauer", "--json"], json)).toBe(0);
    expect((JSON.parse(json.stdout.join("")) as { cautions: string[] }).cautions).toEqual([GENERAL_CAUTION]);
  });

  test("network convert refuses to overwrite without --force", async () => {
    const io = memoryIo({ "f.yaml": fosterText, "c.yaml": "keep me" });
    expect(await runCli(["network", "convert", "f.yaml", "--to", "cauer", "--out", "c.yaml"], io)).toBe(2);
    expect(io.files["c.yaml"]).toBe("keep me");
    expect(io.stderr.join("")).toBe("heatledger: c.yaml: --out: expected a path that does not exist yet (or add --force to overwrite), found an existing file\n");
    expect(await runCli(["network", "convert", "f.yaml", "--to", "cauer", "--out", "c.yaml", "--force"], io)).toBe(0);
    expect(io.files["c.yaml"]).toContain("form: cauer");
  });

  test.each([
    [["--to", "spice"], 'heatledger: --to: expected one of foster, cauer, found "spice"\n'],
    [[], "heatledger: --to: expected one of foster, cauer, found nothing\n"],
  ])("network convert with %j exits 2", async (flags, message) => {
    const io = memoryIo({ "f.yaml": fosterText });
    expect(await runCli(["network", "convert", "f.yaml", ...flags], io)).toBe(2);
    expect(io.stderr.join("")).toBe(message);
  });

  test("network convert of a graph with several observed nodes and no --observe names the file and the nodes", async () => {
    const graph = JSON.stringify({
      form: "graph",
      nodes: [{ id: "a", c: 1 }, { id: "b", c: 2 }],
      links: [{ from: "a", to: "b", r: 1 }, { from: "b", to: "ambient", r: 2 }],
      sources: ["a"],
      observed: ["a", "b"],
    });
    const io = memoryIo({ "g.json": graph });
    expect(await runCli(["network", "convert", "g.json", "--to", "foster"], io)).toBe(2);
    expect(io.stderr.join("")).toBe("heatledger: g.json: --observe: expected the node whose Zth to convert, one of a, b, found nothing\n");
  });
});
