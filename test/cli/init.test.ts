import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION, LINEAR_MOSFET_CAUTION, STARTER_CIRCUITS, profileKeyRows, starterProfileText } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// `heatledger init` writes a commented starter profile; each must run with `simulate` as written.


describe("heatledger init", () => {
  test.each(STARTER_CIRCUITS)("%s: init then simulate exits 0 with a pass", async (circuit) => {
    const io = memoryIo({});
    expect(await runCli(["init", "dir/start.yaml", "--circuit", circuit], io)).toBe(0);
    expect(io.files["dir/start.yaml"]).toBe(starterProfileText(circuit));
    expect(io.stdout.join("")).toContain("heatledger simulate dir/start.yaml");
    expect(io.stdout.join("")).toContain(GENERAL_CAUTION.slice(0, 40));
    expect(io.stdout.join("").includes(LINEAR_MOSFET_CAUTION.slice(0, 40))).toBe(circuit === "linear-mosfet");
    const status = await runCli(["simulate", "dir/start.yaml", "--json"], io);
    expect(status, io.stderr.join("")).toBe(0);
    const json = JSON.parse(io.stdout.at(-1)!) as { verdict: string };
    expect(json.verdict).toBe("pass");
  });

  test.each(STARTER_CIRCUITS)("%s: every key the starter writes is a key of the profile reference, and it explains them", (circuit) => {
    const text = starterProfileText(circuit);
    const known = new Set(profileKeyRows().map((r) => r.path.replace(/\[[a-z0-9-]+\]/g, "[]")));
    const used: string[] = [];
    const walk = (value: unknown, path: string): void => {
      if (Array.isArray(value)) {
        if (value.every((v) => typeof v === "object" && v !== null && !Array.isArray(v))) for (const v of value) walk(v, `${path}[]`);
        return;
      }
      if (typeof value !== "object" || value === null) return;
      for (const [key, child] of Object.entries(value)) {
        const at = path === "" ? key : `${path}.${key}`;
        if (!/^parts\[\]\.network\./.test(at)) used.push(at);
        walk(child, at);
      }
    };
    walk(parse(text), "");
    // a section the reference lists once ("as `events[].fault`") is looked up where it is listed
    const aliases = profileKeyRows().flatMap((r) => {
      const target = /as `([^`]+)`$/.exec(r.type)?.[1];
      return target === undefined ? [] : [[r.path, target] as const];
    });
    const resolve = (path: string): string => {
      for (const [from, to] of aliases) if (path.startsWith(`${from}.`) || path.startsWith(`${from}[]`)) return resolve(to + path.slice(from.length));
      return path;
    };
    expect(used.map(resolve).filter((p) => !known.has(p))).toEqual([]);
    // commented: most lines carry an explanation
    const lines = text.split("\n").filter((l) => l.trim() !== "");
    expect(lines.filter((l) => l.includes("#")).length / lines.length).toBeGreaterThan(0.7);
  });

  test("the numbers in the series-resistor starter's comments are the simulation's", async () => {
    // Driven RC circuit (Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed., §8.8,
    // from memory): charging from 0 to f·V through R + Rs, the source gives C·V·(f·V) and the
    // capacitor keeps C·(f·V)²/2 (§7.1), so the resistors take C·V²·(f − f²/2), shared in
    // proportion R/(R + Rs) (§3.3: one current through a single loop). C = 3.3 mF, V = 51.2 V,
    // f = 0.95, R = 22 ohm, Rs = 50 mohm: 8.6508 J·0.49875·(22/22.05) = 4.3048 J.
    // The inrush current is V/(R + Rs) = 2.3220 A (§2.4).
    const io = memoryIo({});
    await runCli(["init", "s.yaml"], io);
    await runCli(["simulate", "s.yaml", "--json"], io);
    const json = JSON.parse(io.stdout.at(-1)!) as { parts: { events: { energyJ: number; startS: number }[] }[] };
    const events = json.parts[0]!.events;
    expect(events[0]!.energyJ).toBeCloseTo(3.3e-3 * 51.2 ** 2 * (0.95 - 0.95 ** 2 / 2) * (22 / 22.05), 6);
    // the charge reaches 0.95·V after (R + Rs)·C·ln(1/0.05) = 0.21798 s (§8.8), when the run starts
    expect(events[1]!.startS).toBeCloseTo(22.05 * 3.3e-3 * Math.log(20), 6);
    expect(io.stdout.at(-1)!).toContain(`"peakCurrentA": ${51.2 / 22.05}`.slice(0, 24));
  });

  test("refuses to overwrite without --force, overwrites with it; - writes to standard output", async () => {
    const io = memoryIo({ "p.yaml": "mine" });
    expect(await runCli(["init", "p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toBe("heatledger: p.yaml: --force: expected a path that does not exist yet (or add --force to overwrite), found an existing file\n");
    expect(io.files["p.yaml"]).toBe("mine");
    expect(await runCli(["init", "p.yaml", "--force", "--circuit", "converter"], io)).toBe(0);
    expect(io.files["p.yaml"]).toBe(starterProfileText("converter"));
    const out = memoryIo({});
    expect(await runCli(["init", "-", "--circuit", "linear-mosfet"], out)).toBe(0);
    expect(out.stdout.join("")).toBe(starterProfileText("linear-mosfet"));
  });

  test("an unknown circuit is refused with the choices", async () => {
    const io = memoryIo({});
    expect(await runCli(["init", "p.yaml", "--circuit", "buck"], io)).toBe(2);
    expect(io.stderr.join("")).toBe('heatledger: --circuit: expected one of series-resistor, linear-mosfet, converter, found "buck"\n');
    expect(io.files["p.yaml"]).toBeUndefined();
  });
});
