import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { defaultCircuitModels, loadProfile, planRetries, simulateProfile } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

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
