import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { defaultCircuitModels, loadProfile, planRetries, simulateProfile } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { splitProfile } from "../helpers/adiabaticProfile.js";

const ROOT = join(import.meta.dirname, "..", "..");
const BUNDLED = "profiles/warehouse-robot-48v.yaml";
const NETWORK = "profiles/networks/wirewound-resistor-foster.yaml";

describe("compare", () => {
  test("A against A with a changed resistance equals the two single runs of simulate and retries, with B − A", async () => {
    const text = readFileSync(join(ROOT, BUNDLED), "utf8");
    const network = readFileSync(join(ROOT, NETWORK), "utf8");
    const io = memoryIo({ [BUNDLED]: text, [NETWORK]: network, "b.yaml": text.replace("resistance: 22 ohm\n", "resistance: 33 ohm\n"), "networks/wirewound-resistor-foster.yaml": network });
    expect(await runCli(["compare", BUNDLED, "--set", "circuit.resistance=33 ohm", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { differences: { answer: string; a: number; b: number; difference: number }[] };
    const read = (p: string) => (p === "networks/wirewound-resistor-foster.yaml" ? network : "");
    const single = (ohm: number) => {
      const profile = loadProfile(text.replace("resistance: 22 ohm\n", `resistance: ${ohm} ohm\n`), BUNDLED, read);
      return { peak: simulateProfile(profile, { models: defaultCircuitModels }).parts[0]!.peakTemperatureC, forever: planRetries(profile, defaultCircuitModels).forever.minimumIntervalS };
    };
    const [a, b] = [single(22), single(33)];
    const row = (name: string) => json.differences.find((d) => d.answer === name)!;
    expect(row("peak")).toEqual({ answer: "peak", unit: "°C", a: a.peak, b: b.peak, difference: b.peak - a.peak });
    expect(row("forever").b).toBe(b.forever);
    // two files give the same table as the override
    const files = memoryIo({ [BUNDLED]: text, [NETWORK]: network, "b.yaml": text.replace("resistance: 22 ohm\n", "resistance: 33 ohm\n"), "networks/wirewound-resistor-foster.yaml": network });
    expect(await runCli(["compare", BUNDLED, "b.yaml", "--json"], files)).toBe(0);
    expect((JSON.parse(files.stdout.join("")) as { differences: unknown }).differences).toEqual(json.differences);
    const neither = memoryIo({ [BUNDLED]: text, [NETWORK]: network });
    expect(await runCli(["compare", BUNDLED], neither)).toBe(2);
  });
});

// Energy per event against the closed form: charging C from 0 to f·Vs through a series resistor R
// and a source resistance Rs loses C·Vs²·(f − f²/2) whatever the resistances (the source gives
// C·Vs·f·Vs, the capacitor keeps C·(f·Vs)²/2: capacitor energy, Hayt, Kemmerly & Durbin,
// Engineering Circuit Analysis, 8th ed., §7.1, from memory), and one current through both splits
// it as R/(R + Rs) (Joule heating i²R in series: the same book, §2.4, from memory).
// C = 2 mF, Vs = 60 V, f = 0.95: E = 2e-3·3600·0.49875 = 3.591 J; R = 6, Rs = 2: 0.75·E; R = 2: 0.5·E.
const SPLIT = (maxC: number): string =>
  splitProfile(maxC, "  - repeat:\n      count: 3\n      period: 100 s\n      events:\n        - power-up: { label: start }\n        - power-down: { off: 10 s }\n", "{ kind: bleeder, resistance: 10 ohm }");

describe("compare: energy per event and exit status", () => {
  test("the resistor's energy per power-up is its share R/(R + Rs) of C·Vs²·(f − f²/2) in both designs", async () => {
    const io = memoryIo({ "s.yaml": SPLIT(200) });
    expect(await runCli(["compare", "s.yaml", "--set", "circuit.resistance=2 ohm", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { verdict: string; events: { field: string; a: { count: number; perEventJ: number; maxJ: number }; b: { perEventJ: number }; differenceJ: number }[] };
    const e = 2e-3 * 3600 * 0.49875;
    expect(json.events).toHaveLength(1);
    const row = json.events[0]!;
    expect(row.field).toBe("events[0].repeat.events[0].power-up");
    expect(row.a.count).toBe(3);
    expect(Math.abs(row.a.perEventJ / (0.75 * e) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(row.a.maxJ / (0.75 * e) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(row.b.perEventJ / (0.5 * e) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(row.differenceJ / (-0.25 * e) - 1)).toBeLessThan(1e-5);
    expect(json.verdict).toBe("pass");
  });

  test("the exit status is the worse of the two verdicts; --strict makes warn exit 1; the text keeps within 100 columns", async () => {
    // each power-up puts E_R into r = 1 K/W, tau = 1000 s (C = 1000 J/K) in ~40 ms, a rise of
    // E_R/1000 J/K that decays by e^(−0.1) per 100 s period (lumped capacitance: Incropera et al.,
    // Fundamentals of Heat and Mass Transfer, 7th ed., §5.3), so the third peak is
    // 25 °C + E_R/1000·(1 + e^(−0.1) + e^(−0.2)) = 25.00733 °C (R = 6, E_R = 2.693 J) and
    // 25.00489 °C (R = 2, E_R = 1.7955 J). A limit of 25.008 °C with 1 K margin warns for both.
    const warn = memoryIo({ "s.yaml": SPLIT(25.008) });
    expect(await runCli(["compare", "s.yaml", "--set", "circuit.resistance=2 ohm"], warn)).toBe(0);
    const text = warn.stdout.join("");
    expect(text).toContain("Verdict: warn (the worse of A (warn) and B (warn)");
    expect(text).toMatch(/events\[0\]\.repeat\.events\[0\]\.power-up +2\.693 ×3 +1\.795 ×3/);
    for (const line of text.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
    expect(await runCli(["compare", "s.yaml", "--set", "circuit.resistance=2 ohm", "--strict"], memoryIo({ "s.yaml": SPLIT(25.008) }))).toBe(1);
    // 25.006 °C: A (25.00733 °C) fails, B (25.00489 °C) warns: exit 1
    const fail = memoryIo({ "s.yaml": SPLIT(25.006) });
    expect(await runCli(["compare", "s.yaml", "--set", "circuit.resistance=2 ohm", "--json"], fail)).toBe(1);
    const json = JSON.parse(fail.stdout.join("")) as { verdict: string; a: { verdict: string }; b: { verdict: string } };
    expect([json.verdict, json.a.verdict, json.b.verdict]).toEqual(["fail", "fail", "warn"]);
  });
});
