import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import {
  StudyProfile,
  defaultCircuitModels,
  loadProfile,
  parseStudyDistribution,
  runMonteCarloSamples,
  simulateProfile,
  summarizeMonteCarlo,
  wilsonInterval,
} from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// One RC stage (Foster, R = 2 K/W, tau = 1 s) heated by P = 10 W for t = 1 s: the rise at the end
// of the pulse is y = P·R·(1 − e^(−t/tau)) (lumped capacitance heated from rest: Incropera et al.,
// Fundamentals of Heat and Mass Transfer, 7th ed., §5.3).
const RC = `name: one RC stage
ambient: 25 degC
parts:
  - id: r
    network: { form: foster, stages: [{ r: 2 K/W, tau: 1 s }] }
    limits: { maxTemperature: 37 degC, margin: 2 K }
events:
  - power-trace: { part: r, points: [[0, 10], [1 s, 10], [1.000001 s, 0]] }
  - wait: 4 s
`;

describe("Monte Carlo", () => {
  test("one RC stage: the JCGM 101 Monte Carlo estimate agrees with the JCGM 100 law of propagation within its confidence interval", () => {
    const study = new StudyProfile(RC, "rc.yaml");
    const vary = ["parts[0].network.stages[0].r=normal 2 %", "parts[0].network.stages[0].tau=normal 5 %"];
    const distributions = vary.map((v) => parseStudyDistribution(study, v, "--vary"));
    const n = 1000;
    const samples = runMonteCarloSamples(study, distributions, ["rise", "margin"], { models: defaultCircuitModels }, 11, 0, n);
    const rise = summarizeMonteCarlo(samples, ["rise", "margin"]).distributions[0]!;
    expect(rise.count).toBe(n);
    // JCGM 100:2008 §5.1.2 eq. (10): u_c² = Σ (∂y/∂x_i)² u²(x_i) for uncorrelated inputs, with
    // ∂y/∂R = P(1 − e^(−t/tau)) and ∂y/∂tau = −P·R·e^(−t/tau)·t/tau²; the mean moves by the
    // second-order term ½·∂²y/∂tau²·u²(tau) = ½·P·R·e^(−1)·u²(tau) at t = tau (§5.1.2, note).
    const [P, R, tau, t] = [10, 2, 1, 1];
    const uR = 0.02 * R;
    const uTau = 0.05 * tau;
    const e = Math.exp(-t / tau);
    const y0 = P * R * (1 - e);
    const uc = Math.hypot(P * (1 - e) * uR, P * R * e * (t / tau ** 2) * uTau);
    const mean = y0 + 0.5 * P * R * e * uTau ** 2;
    // JCGM 101:2008 §7: the estimate is the sample mean, its standard uncertainty the sample
    // standard deviation; three standard errors of each (the standard deviation's standard error
    // is about s/√(2(n − 1)) for a near-normal output)
    expect(Math.abs(rise.mean - mean)).toBeLessThan((3 * uc) / Math.sqrt(n));
    expect(Math.abs(rise.standardDeviation / uc - 1)).toBeLessThan(3 / Math.sqrt(2 * (n - 1)));
  });

  test("the same seed gives the same numbers on 1 and 2 workers; another seed does not", async () => {
    const args = (workers: string, seed: string) => ["montecarlo", "rc.yaml", "--json", "--samples", "48", "--seed", seed, "--workers", workers, "--vary", "parts[0].network.stages[0].r=tolerance 10 %", "--vary", "parts[0].network.stages[0].tau=normal 5 % within 12 %"];
    const run = async (workers: string, seed: string) => {
      const io = memoryIo({ "rc.yaml": RC });
      expect(await runCli(args(workers, seed), io)).toBe(0);
      const json = JSON.parse(io.stdout.join("")) as Record<string, unknown>;
      expect(json.workers).toBe(Number(workers));
      return { ...json, workers: undefined };
    };
    const one = await run("1", "5");
    expect(await run("2", "5")).toEqual(one);
    expect(await run("1", "6")).not.toEqual(one);
  });

  test("the crossing probability counts margins below zero and the worst sample, written out, reproduces itself under simulate", async () => {
    const io = memoryIo({ "rc.yaml": RC });
    const args = ["montecarlo", "rc.yaml", "--json", "--samples", "200", "--workers", "1", "--vary", "parts[0].network.stages[0].r=normal 5 %", "--worst", "worst.yaml"];
    expect(await runCli(args, io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as { crossing: { count: number; of: number; low: number; high: number }; worst: { answers: { peak: number; margin: number } }; answers: { name: string; min: number }[] };
    // limit 37 °C, nominal peak 25 + 12.64 = 37.64 °C: about 2/3 of the units cross (margin < 0)
    expect(json.crossing.of).toBe(200);
    expect(json.crossing.count).toBeGreaterThan(100);
    expect(json.crossing.low).toBeLessThan(json.crossing.count / 200);
    expect(json.worst.answers.margin).toBe(json.answers.find((a) => a.name === "margin")!.min);
    const worst = loadProfile(io.files["worst.yaml"]!, "worst.yaml");
    expect(simulateProfile(worst, { models: defaultCircuitModels }).parts[0]!.peakTemperatureC).toBe(json.worst.answers.peak);
    // a second run refuses to overwrite it without --force
    const again = memoryIo(io.files);
    expect(await runCli(args, again)).toBe(2);
    expect(await runCli([...args, "--force"], memoryIo(io.files))).toBe(0);
  });

  test("Wilson score interval against published worked values", () => {
    // Newcombe, "Two-sided confidence intervals for the single proportion", Stat. Med. 17 (1998),
    // Table I, method 3 (score interval without continuity correction), values from memory:
    // 81/263 → 0.2553 to 0.3662; 0/20 → 0 to 0.1611
    const a = wilsonInterval(81, 263, 1.959963984540054);
    expect(a.low).toBeCloseTo(0.2553, 4);
    expect(a.high).toBeCloseTo(0.3662, 4);
    const b = wilsonInterval(0, 20, 1.959963984540054);
    expect(b.low).toBe(0);
    expect(b.high).toBeCloseTo(0.1611, 4);
  });
});
