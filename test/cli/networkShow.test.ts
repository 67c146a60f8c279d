import { execFileSync, spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

const root = fileURLToPath(new URL("../..", import.meta.url));

describe("heatledger network show", () => {
  test("network show prints the Foster stages, total Rth and a Zth table", async () => {
    const io = memoryIo({ "n.yaml": "form: foster\nstages:\n  - { r: 1 K/W, tau: 1 s }\n  - { r: 2 K/W, tau: 10 s }\n" });
    expect(await runCli(["network", "show", "n.yaml"], io)).toBe(0);
    const text = io.stdout.join("");
    // Foster stages in series: total Rth = 1 + 2 K/W (steady state, common practice)
    expect(text).toContain("total Rth = 3.000 K/W");
    expect(text).toContain("Zth [K/W]");
  });

  test("network show --json gives Zth that approaches the total Rth", async () => {
    const io = memoryIo({ "n.json": JSON.stringify({ form: "cauer", stages: [{ r: 1, c: 1 }, { r: 2, c: 5 }] }) });
    expect(await runCli(["network", "show", "n.json", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { pairs: { totalRthKPerW: number; zth: { zthKPerW: number }[] }[] };
    // Cauer resistances in series: total Rth = 1 + 2 K/W (steady state of the ladder, common practice).
    expect(json.pairs[0]!.totalRthKPerW).toBeCloseTo(3, 12);
    expect(json.pairs[0]!.zth.at(-1)!.zthKPerW).toBeGreaterThan(0.99 * 3);
  });

  // A resistor's heated node is its element, a semiconductor's its junction; a network that does
  // not say which part it describes gets numbered nodes. Every report closes with the cautions,
  // and the JSON carries them as the list `cautions`.
  test.each([
    ["part: resistor\n", "element"],
    ["part: semiconductor\n", "junction"],
    ["", "node1"],
  ])("network show names the node by the part (%s): %s; the cautions close the text and travel in the JSON", async (partLine, node) => {
    const files = { "n.yaml": `form: foster\n${partLine}stages:\n  - { r: 1 K/W, tau: 1 s }\n` };
    const io = memoryIo(files);
    expect(await runCli(["network", "show", "n.yaml"], io)).toBe(0);
    const text = io.stdout.join("");
    expect(text).toContain(`Heat into "${node}", rise at "${node}"`);
    expect(text.replace(/\s+/g, " ")).toContain(GENERAL_CAUTION);
    const json = memoryIo(files);
    expect(await runCli(["network", "show", "n.yaml", "--json"], json)).toBe(0);
    const parsed = JSON.parse(json.stdout.join("")) as { pairs: { source: string }[]; cautions: string[] };
    expect(parsed.pairs[0]!.source).toBe(node);
    expect(parsed.cautions).toEqual([GENERAL_CAUTION]);
  });

  test("a part key in a graph network is refused: a graph names its own nodes", async () => {
    const io = memoryIo({ "g.yaml": "form: graph\npart: resistor\nnodes: [{ id: a, c: 1 J/K }]\nlinks: [{ from: a, to: ambient, r: 1 K/W }]\nsources: [a]\nobserved: [a]\n" });
    expect(await runCli(["network", "show", "g.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toBe('heatledger: g.yaml:2: part: expected no "part" in a graph network, found a value\n');
  });

  test("network show on a bad file exits 2 with file, line, field, expected and found", async () => {
    const io = memoryIo({ "b.yaml": "form: foster\nstages:\n  - { r: 0.35 K/W, tau: 40 mV }\n" });
    expect(await runCli(["network", "show", "b.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toBe('heatledger: b.yaml:3: stages[0].tau: expected a time such as "350 ms" (or a number in s), found "40 mV" (a voltage)\n');
  });

  test("the built bin runs network show on a bundled network and exits 2 on a missing file", () => {
    const ok = execFileSync(process.execPath, ["bin/heatledger.js", "network", "show", "profiles/networks/wirewound-resistor-foster.yaml"], { cwd: root, encoding: "utf8" });
    // the sum of the file's four stage resistances, 0.35 + 0.90 + 1.60 + 2.20 K/W (Foster stages in series, common practice)
    expect(ok).toContain("total Rth = 5.050 K/W");
    // the bundled wirewound resistor says `part: resistor`: its node is its element
    expect(ok).toContain('Heat into "element", rise at "element"');
    const bad = spawnSync(process.execPath, ["bin/heatledger.js", "network", "show", "missing.yaml"], { cwd: root, encoding: "utf8" });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toBe("heatledger: missing.yaml: expected a readable network file, found no such file\n");
  });
});
