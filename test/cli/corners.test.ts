import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { ADIABATIC } from "../helpers/adiabaticProfile.js";

// `--corners` of simulate, size and replay against hand calculations. One Foster stage with
// tau = 1e7 s and r = 1e5 K/W (heat capacity tau/r = 100 J/K) takes the whole charging loss of a
// series-resistor pre-charge. Charging C from 0 to f·Vs takes C·Vs·(f·Vs) from the source and
// stores C·(f·Vs)²/2 (capacitor energy C·v²/2: Hayt, Kemmerly & Durbin, Engineering Circuit
// Analysis, 8th ed., §7.1, from memory), so the resistor's loss is E = C·Vs²·(f − f²/2), whatever
// R is; with nothing flowing out the rise is E over the heat capacity (E = C·ΔT: Incropera et al.,
// Fundamentals of Heat and Mass Transfer, 7th ed., §5.3). f = 0.95: f − f²/2 = 0.49875.
//   as written  C = 2 mF,   Vs = 60 V, 25 °C: E = 2e-3·3600·0.49875   = 3.591 J,   rise 0.03591 K
//   cold        the same at −10 °C
//   high bus    Vs = 66 V:                    E = 2e-3·4356·0.49875   = 4.34511 J, rise 0.0434511 K
//   big C       C = 2.4 mF, R = 3 ohm:        E = 2.4e-3·3600·0.49875 = 4.3092 J,  rise 0.043092 K
// What the stage leaks in the ~40 ms charge is about 1e-9 of the rise.
const PROFILE = (limits: string): string =>
  `${ADIABATIC.replace("name: adiabatic limit", "name: corners by hand").replace("limits: { maxTemperature: 100 degC }", `limits: ${limits}`)}retryPlan:
  corners:
    - { name: cold, ambient: -10 degC }
    - { name: high bus, busVoltage: 66 V }
    - { name: big C, capacitance: 2.4 mF, resistance: 3 ohm }
`;
const WIDE = "{ maxTemperature: 60 degC, margin: 5 K }";
/** limit − margin = 25.03 °C: as written warns (25.0359), high bus fails (25.0435 > 25.04), cold passes */
const TIGHT = "{ maxTemperature: 25.04 degC, margin: 0.01 K }";
const F = 0.49875;
const ENERGY_J = { "as written": 2e-3 * 3600 * F, cold: 2e-3 * 3600 * F, "high bus": 2e-3 * 4356 * F, "big C": 2.4e-3 * 3600 * F };
const AMBIENT_C = { "as written": 25, cold: -10, "high bus": 25, "big C": 25 };

interface CornersJson {
  source: string;
  names: string[];
  verdict: string;
  verdicts: Record<string, string>;
  answers: { subject: string; answer: string; unit: string; value: number | null; governing: string; values: Record<string, number | null> }[];
}

async function run(args: readonly string[], limits = WIDE): Promise<{ status: number; out: string }> {
  const io = memoryIo({ "p.yaml": PROFILE(limits), "log.csv": "time,event\n0,power-up\n10,note\n" });
  const status = await runCli([...args], io);
  return { status, out: io.stdout.join("") };
}

describe("--corners", () => {
  test("simulate: energy and peak at every corner match the hand calculation; the governing corner is named", async () => {
    const { status, out } = await run(["simulate", "p.yaml", "--corners", "--json"]);
    expect(status).toBe(0);
    const corners = (JSON.parse(out) as { corners: CornersJson }).corners;
    expect(corners.source).toBe("retryPlan.corners");
    expect(corners.names).toEqual(["as written", "cold", "high bus", "big C"]);
    const answer = (name: string): CornersJson["answers"][number] => corners.answers.find((a) => a.answer === name)!;
    for (const [corner, e] of Object.entries(ENERGY_J)) {
      expect(answer("energy").values[corner]! / e - 1).toBeLessThan(1e-6);
      expect(Math.abs(answer("peak").values[corner]! - (AMBIENT_C[corner as keyof typeof AMBIENT_C] + e / 100))).toBeLessThan(1e-7);
    }
    // 4.34511 J (high bus) beats 4.3092 J (big C): it governs peak, margin and energy
    expect(answer("peak").governing).toBe("high bus");
    expect(answer("margin").governing).toBe("high bus");
    expect(answer("energy").governing).toBe("high bus");
    expect(Math.abs(answer("margin").value! - (60 - 25 - ENERGY_J["high bus"] / 100))).toBeLessThan(1e-7);
  });

  test("simulate: the verdict and exit status are the worst over the corners; the text names the governing corner within 100 columns", async () => {
    const plain = await run(["simulate", "p.yaml"], TIGHT);
    expect(plain.status).toBe(0); // as written only: warn
    expect(plain.out).toContain("Note: the profile has 3 corners in retryPlan.corners");
    const { status, out } = await run(["simulate", "p.yaml", "--corners"], TIGHT);
    expect(status).toBe(1);
    expect(out).toContain("Verdict over the corners: fail (set by corner high bus).");
    expect(out).toMatch(/peak: 25\.04 °C, governing corner high bus/);
    expect(out).toMatch(/\ncold +pass +-9\.964 /);
    for (const line of out.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
    expect(out).toContain("Caution:");
  });

  test("a profile without corners keeps its report; --corners then runs it alone and says so", async () => {
    const bare = (await run(["simulate", "p.yaml"])).out;
    const io = memoryIo({ "p.yaml": PROFILE(WIDE).split("retryPlan:")[0]! });
    expect(await runCli(["simulate", "p.yaml"], io)).toBe(0);
    const without = io.stdout.join("");
    expect(without).not.toContain("retryPlan.corners");
    expect(bare.replace(/\nNote: the profile has 3 corners[^]*$/, "")).toBe(without.replace(/\n$/, ""));
    const io2 = memoryIo({ "p.yaml": PROFILE(WIDE).split("retryPlan:")[0]! });
    expect(await runCli(["simulate", "p.yaml", "--corners"], io2)).toBe(0);
    expect(io2.stdout.join("")).toContain("The profile has no corner set (retryPlan.corners)");
  });

  test("size: the capacity is E over the allowed rise at the governing corner; the resistance t = R·C·ln 20 ≤ 1 s at the largest C", async () => {
    const { status, out } = await run(["size", "p.yaml", "--corners", "--json"]);
    expect(status).toBe(0);
    const corners = (JSON.parse(out) as { corners: CornersJson }).corners;
    const capacity = corners.answers.find((a) => a.answer === "capacity")!;
    // adiabatic: C = E / (limit − margin − ambient) = E / 30 K (as written), E / 65 K (cold)
    for (const [corner, e] of Object.entries(ENERGY_J)) {
      const allowedK = 55 - AMBIENT_C[corner as keyof typeof AMBIENT_C];
      expect(Math.abs(capacity.values[corner]! / (e / allowedK) - 1)).toBeLessThan(2e-3);
    }
    expect(capacity.governing).toBe("high bus");
    // the RC charge reaches 0.95·Vs at t = R·C·ln(1/0.05) (driven RC circuit: Hayt, Kemmerly &
    // Durbin, Engineering Circuit Analysis, 8th ed., §8.8, from memory): R = 1 s / (C·ln 20)
    const element = corners.answers.find((a) => a.subject === "charging element")!;
    expect(element.governing).toBe("big C");
    expect(Math.abs(element.value! / (1 / (2.4e-3 * Math.log(20))) - 1)).toBeLessThan(1e-5);
    expect(Math.abs(element.values["as written"]! / (1 / (2e-3 * Math.log(20))) - 1)).toBeLessThan(1e-5);
  });

  test("replay: the log's one power-up gives the same corner answers as the profile's", async () => {
    const { status, out } = await run(["replay", "log.csv", "--profile", "p.yaml", "--corners", "--json"], TIGHT);
    expect(status).toBe(1);
    const corners = (JSON.parse(out) as { corners: CornersJson }).corners;
    expect(corners.verdicts).toEqual({ "as written": "warn", cold: "pass", "high bus": "fail", "big C": "fail" });
    const energy = corners.answers.find((a) => a.answer === "energy")!;
    for (const [corner, e] of Object.entries(ENERGY_J)) expect(Math.abs(energy.values[corner]! / e - 1)).toBeLessThan(1e-6);
  });
});
