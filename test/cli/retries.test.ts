import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { shortedBusProfile, shortedRetry } from "../helpers/shortedBusProfile.js";

// In-process runs of `heatledger retries` on an invented profile: a 48 Ω pre-charge resistor
// into a shorted bus at 48 V dissipates Vs²/R = 48 W until the 0.5 s timeout (series-resistor
// model with the bus held at 0 V), on one Foster stage R = 2 K/W, τ = 5 s; limit 100 °C, margin
// 10 K, ambient 25 °C, so ΔT_max = 65 K. One-stage closed form (lumped capacitance, Incropera
// et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and §5.3, summed as a geometric
// series; derivation in test/retry/minForeverInterval.test.ts): retrying for ever is safe from
// T_min = −τ·ln(1 − P·R·(1 − e^(−t_on/τ))/ΔT_max) ≈ 0.757 s.
const PROFILE = (retry: string, plan = ""): string => shortedBusProfile(shortedRetry(retry), plan);

const SAFE = "      attempts: 3\n      interval: 2 s\n      lockout: 60 s";
const UNSAFE = "      attempts: 20\n      interval: 0.6 s\n      lockout: 1 s";

describe("heatledger retries (in process)", () => {
  test("a safe policy exits 0 and --json carries every answer, the retry-forever interval matching the closed form", async () => {
    const io = memoryIo({ "p.yaml": PROFILE(SAFE) });
    expect(await runCli(["retries", "p.yaml", "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as Record<string, any>;
    expect(json["verdict"]).toBe("pass");
    expect(json["policy"].burstVerdict).toBe("pass");
    expect(json["cautions"]).toEqual([GENERAL_CAUTION]);
    // One stage (2 K/W, τ = 5 s), 48 W pulses of 0.5 s repeated every T (start to start): the
    // periodic steady state peaks at P·R·(1 − e^(−tp/τ))/(1 − e^(−T/τ)) (geometric series of the
    // stage's pulse responses, as derived in test/thermal/periodicSteadyState.test.ts); equal to the
    // allowed 65 K rise at T = −τ·ln(1 − P·R·(1 − e^(−tp/τ))/65 K). The solver bisects to a bracket
    // of 1e-9 of the answer (PLAN_DEFAULTS.bisectionRelTol): measured 4.4e-10 relative when the
    // tolerance was set; 2e-9 is twice the bracket. The answer is that edge rounded up to the
    // firmware's default 1 ms timer: the edge (0.75730 s) is 0.3 ms from a timer step, far more
    // than the bracket, so the rounded answer is the next whole millisecond.
    const expected = -5 * Math.log(1 - (48 * 2 * -Math.expm1(-0.5 / 5)) / 65);
    expect(json["timing"].timerResolutionS).toBe(0.001);
    expect(json["forever"].minimumIntervalS).toBeCloseTo(Math.ceil(expected / 0.001) * 0.001, 12);
    expect(json["forever"].governing.corner).toBe("nominal");
    for (const key of ["uniformInterval", "maxAttempts", "fastest", "backoff", "lockout", "map"]) expect(json[key]).toBeDefined();
    expect(json["fastest"].schedule).toHaveLength(3);
    expect(JSON.stringify(json)).not.toContain("NaN");
  });

  // The burst alone: 20 pulses of 48 W × 0.5 s every 0.6 s on one stage (2 K/W, 5 s) rise by
  // S·(1 − q^20)/(1 − q), S = 96·(1 − e^(−0.1)) K, q = e^(−0.12): 73.4 K, 98.4 °C, inside the 10 K
  // margin (warn); the same burst repeated after a 1 s lockout settles higher, above 100 °C (fail).
  test("a policy above its limit exits 1 and the text report names the reason, each answer and the cautions", async () => {
    const io = memoryIo({ "p.yaml": PROFILE(UNSAFE) });
    expect(await runCli(["retries", "p.yaml"], io)).toBe(1);
    const text = io.stdout.join("");
    expect(text).toContain("Verdict: fail (a peak above its limit).");
    const flat = text.replace(/\s+/g, " ");
    expect(flat).toContain("One burst from a cold part: warn;");
    expect(flat).toContain("Burst + lockout repeated while the fault persists: fail;");
    expect(flat).toMatch(/corner "nominal": attempt \d+ of the burst reaches [\d.]+ °C, above limit − margin 90\.0 °C, not above the limit 100\.0 °C/);
    for (const heading of ["1. Shortest uniform retry interval", "2. Most attempts", "3. Shortest interval for retrying for ever", "4. Fastest safe schedule", "5. Lockout after", "6. Lockout map"])
      expect(text).toContain(heading);
    expect(text.replace(/\s+/g, " ")).toContain(GENERAL_CAUTION);
  });

  test("corners: the hot corner governs, and a corner with an unknown parameter is bad input naming it", async () => {
    const corners = "retryPlan:\n  corners:\n    - { name: cool, ambient: 0 degC }\n    - { name: hot, ambient: 45 degC, busVoltage: 52 V }\n";
    const io = memoryIo({ "p.yaml": PROFILE(SAFE, corners) });
    await runCli(["retries", "p.yaml", "--json"], io);
    const json = JSON.parse(io.stdout.join("")) as Record<string, any>;
    expect(json["corners"]).toEqual(["cool", "hot"]);
    expect(json["forever"].governing.corner).toBe("hot");
    const bad = memoryIo({ "p.yaml": PROFILE(SAFE, "retryPlan:\n  corners:\n    - { name: damp, humidity: 90 }\n") });
    expect(await runCli(["retries", "p.yaml"], bad)).toBe(2);
    expect(bad.stderr.join("")).toContain("retryPlan.corners[0]");
    expect(bad.stderr.join("")).toContain("humidity");
  });

  test("a back-off with no longest interval says so, never \"up to Infinity\"", async () => {
    const io = memoryIo({ "p.yaml": PROFILE("      attempts: 3\n      interval: 2 s\n      backoff: 2\n      lockout: 60 s") });
    await runCli(["retries", "p.yaml"], io);
    const text = io.stdout.join("");
    expect(text.replace(/\s+/g, " ")).toContain("Profile policy: 3 attempts every 2 s (start to start, back-off ×2, no longest interval), then a 60 s lockout.");
    expect(text).not.toContain("Infinity");
    const capped = memoryIo({ "p.yaml": PROFILE("      attempts: 3\n      interval: 2 s\n      backoff: 2\n      maxInterval: 3 s\n      lockout: 60 s") });
    await runCli(["retries", "p.yaml"], capped);
    expect(capped.stdout.join("").replace(/\s+/g, " ")).toContain("(start to start, back-off ×2 up to 3 s)");
  });

  test("--csv writes the lockout map", async () => {
    const io = memoryIo({ "p.yaml": PROFILE(SAFE, "retryPlan:\n  map: { attempts: 5, from: 0.5 s, to: 50 s, points: 4 }\n") });
    await runCli(["retries", "p.yaml", "--csv", "map.csv"], io);
    const rows = io.files["map.csv"]!.trim().split("\n");
    expect(rows[0]).toBe("attempts,interval_s,spacing,worst_peak_C,allowed_C,limit_C,used_fraction,status,governing_corner");
    expect(rows).toHaveLength(1 + 5 * 4);
  });

  test("a back-off with no longest interval says so in words, never Infinity", async () => {
    const io = memoryIo({ "p.yaml": PROFILE("      attempts: 3\n      interval: 2 s\n      backoff: 2\n      lockout: 60 s") });
    await runCli(["retries", "p.yaml"], io);
    const text = io.stdout.join("");
    expect(text).toContain("back-off ×2, no longest interval");
    expect(text).not.toMatch(/Infinity|NaN/);
  });
});
