import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { shortedBusProfile, shortedRetry } from "../helpers/shortedBusProfile.js";

// One peak, three commands, one verdict. An invented 48 V pre-charge resistor (48 Ω, so 48 W into
// a shorted bus, the bus held at 0 V) retries 17 times every 0.6 s (start to start) for the 0.5 s
// timeout, then locks out for 10 min. On one Foster stage (2 K/W, τ = 5 s) the burst's last
// attempt ends at a rise of S·(1 − q^17)/(1 − q), S = P·R·(1 − e^(−t_on/τ)), q = e^(−T/τ)
// (lumped capacitance, Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011),
// §5.2, summed as a geometric series): 70.27 K, 95.27 °C. The limit is 100 °C with a 10 K margin,
// so the peak is inside the margin, 5 K from either end: warn. Before one rule, `simulate` passed
// this peak (exit 0) while `retries` called it unsafe (exit 1).
const PROFILE = shortedBusProfile(
  shortedRetry("      attempts: 17\n      interval: 0.6 s\n      lockout: 10 min"),
  "supervision:\n  corners:\n    capacitance: [0.9 mF, 1.1 mF]\n",
);

const S = 48 * 2 * -Math.expm1(-0.5 / 5);
const q = Math.exp(-0.6 / 5);
const PEAK_C = 25 + (S * (1 - q ** 17)) / (1 - q);

describe("one verdict and one exit rule across commands", () => {
  test("the closed-form peak is inside the margin, at least 4 K from either end", () => {
    expect(PEAK_C).toBeGreaterThan(90 + 4);
    expect(PEAK_C).toBeLessThan(100 - 4);
  });

  test.each([["simulate"], ["retries"], ["supervise"]])("%s: warn in the JSON and the text, exit 0, exit 1 with --strict", async (command) => {
    const json = memoryIo({ "p.yaml": PROFILE });
    expect(await runCli([command, "p.yaml", "--json"], json)).toBe(0);
    const result = JSON.parse(json.stdout.join("")) as Record<string, any>;
    expect(result["verdict"]).toBe("warn");
    const text = memoryIo({ "p.yaml": PROFILE });
    expect(await runCli([command, "p.yaml", "--strict"], text)).toBe(1);
    expect(text.stdout.join("")).toMatch(/Verdict: warn \(/);
  });

  test("simulate and retries see the same peak (both exact: 1e-9 relative)", async () => {
    const sim = memoryIo({ "p.yaml": PROFILE });
    await runCli(["simulate", "p.yaml", "--json"], sim);
    const retries = memoryIo({ "p.yaml": PROFILE });
    await runCli(["retries", "p.yaml", "--json"], retries);
    expectClose((JSON.parse(sim.stdout.join("")) as Record<string, any>)["parts"][0].peakTemperatureC, PEAK_C, { rel: 1e-9 });
    expectClose((JSON.parse(retries.stdout.join("")) as Record<string, any>)["policy"].burst.peakC, PEAK_C, { rel: 1e-9 });
  });
});
