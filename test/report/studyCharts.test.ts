import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { StudyProfile, computeSensitivities, defaultCircuitModels, monteCarloCharts, sensitivityCharts } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { ADIABATIC } from "../helpers/adiabaticProfile.js";

// The adiabatic limit (one Foster stage, heat capacity 100 J/K, nothing flows out during the
// charge): the rise is the charging loss C·Vs²·(f − f²/2) over the heat capacity (capacitor
// energy C·v²/2: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed., §7.1, from
// memory; E = C·ΔT: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §5.3),
// so the tornado's bars are 2 for Vs, 1 for C and 0 for R.

describe("study charts", () => {
  test("sensitivity: the tornado draws S = 2 for Vs, 1 for C, 0 for R, largest first", () => {
    const study = new StudyProfile(ADIABATIC, "a.yaml");
    const params = ["circuit.resistance", "circuit.capacitance", "circuit.busVoltage"].map((p) => study.parameter(p, "--vary"));
    const [chart] = sensitivityCharts(computeSensitivities(study, params, ["rise"], { models: defaultCircuitModels }), ["rise"]);
    const bars = (chart!.spec.data as { values: { parameter: string; s: number }[] }).values;
    const s = Object.fromEntries(bars.map((b) => [b.parameter, b.s]));
    expect(Math.abs(s["circuit.busVoltage"]! - 2)).toBeLessThan(1e-6);
    expect(Math.abs(s["circuit.capacitance"]! - 1)).toBeLessThan(1e-6);
    expect(Math.abs(s["circuit.resistance"]!)).toBeLessThan(1e-6);
    expect((chart!.spec.encoding as { y: { sort: unknown } }).y.sort).toEqual({ field: "size", order: "descending" });
  });

  test("montecarlo: one histogram per answer holding every sample, the limit drawn on the margin's", async () => {
    const samples = [5, 7, 9].map((margin, index) => ({ index, values: [1], problem: null, answers: { partId: "r", verdict: "pass" as const, values: { margin, peak: 100 - margin } } }));
    const charts = monteCarloCharts(samples, ["peak", "margin"]);
    expect(charts.map((c) => c.id)).toEqual(["montecarlo-peak", "montecarlo-margin"]);
    const layers = charts[1]!.spec.layer as { data: { values: unknown[] }; mark: { type: string } }[];
    expect(layers[0]!.data.values).toEqual([{ value: 5 }, { value: 7 }, { value: 9 }]);
    expect(layers[1]!.mark.type).toBe("rule");
    const io = memoryIo({ "a.yaml": ADIABATIC });
    expect(await runCli(["montecarlo", "a.yaml", "--samples", "20", "--workers", "1", "--vary", "circuit.capacitance=tolerance 10 %", "--report", "mc.html"], io)).toBe(0);
    expect(io.files["mc.html"]).toContain("Spread of peak");
    expect(await runCli(["sensitivity", "a.yaml", "--vary", "circuit.capacitance", "--answer", "rise", "--report", "s.html"], io)).toBe(0);
    expect(io.files["s.html"]).toContain("Normalised sensitivity of rise");
  });
});
