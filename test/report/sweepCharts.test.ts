import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { StudyProfile, defaultCircuitModels, parseSweepAxis, runSweep, sweepCharts } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { splitProfile } from "../helpers/adiabaticProfile.js";

// A sweep of the series resistance R with a source resistance Rs = 2 ohm: each charge from 0 to
// f·Vs loses C·Vs²·(f − f²/2) whatever the resistances (the source gives C·Vs·f·Vs, the
// capacitor keeps C·(f·Vs)²/2: capacitor energy, Hayt, Kemmerly & Durbin, Engineering Circuit
// Analysis, 8th ed., §7.1, from memory), split as R/(R + Rs) by the one current through both
// (Joule heating i²R: the same book, §2.4, from memory). C = 2 mF, Vs = 60 V, f = 0.95:
// E = 2e-3·3600·0.49875 = 3.591 J; R = 2, 6, 18 ohm: 0.5·E, 0.75·E, 0.9·E.
const SPLIT = splitProfile(200);
const E = 2e-3 * 3600 * 0.49875;

describe("sweep charts", () => {
  test("1-D: the line chart draws the resistor's share R/(R + Rs) of the charging loss at each R", () => {
    const study = new StudyProfile(SPLIT, "s.yaml");
    const axis = parseSweepAxis(study, "circuit.resistance=2 ohm,6 ohm,18 ohm", "--vary");
    const charts = sweepCharts(runSweep(study, [axis], ["energy", "peak"], { models: defaultCircuitModels }));
    expect(charts.map((c) => c.id)).toEqual(["sweep-energy", "sweep-peak"]);
    const drawn = (charts[0]!.spec.data as { values: { x: number; value: number }[] }).values;
    expect(drawn.map((d) => d.x)).toEqual([2, 6, 18]);
    for (const [i, share] of [0.5, 0.75, 0.9].entries()) expect(Math.abs(drawn[i]!.value / (share * E) - 1)).toBeLessThan(1e-6);
    expect(charts[0]!.spec.mark).toEqual({ type: "line", point: true });
  });

  test("2-D: the heat map has one cell per grid point, each the energy C·Vs²·(f − f²/2)·R/(R + Rs)", () => {
    const study = new StudyProfile(SPLIT, "s.yaml");
    const axes = [parseSweepAxis(study, "circuit.resistance=2 ohm,18 ohm", "--vary"), parseSweepAxis(study, "circuit.capacitance=1 mF,2 mF,4 mF", "--vary")];
    const [chart] = sweepCharts(runSweep(study, axes, ["energy"], { models: defaultCircuitModels }));
    const cells = (chart!.spec.data as { values: { x: number; y: number; value: number; label: string }[] }).values;
    expect(cells).toHaveLength(6);
    for (const c of cells) expect(Math.abs(c.value / (c.y * 3600 * 0.49875 * (c.x / (c.x + 2))) - 1)).toBeLessThan(1e-6);
    expect((chart!.spec.layer as { mark: { type: string } }[]).map((l) => l.mark.type)).toEqual(["rect", "text"]);
  });

  test("sweep --report and study --report write the page with a chart per answer", async () => {
    const io = memoryIo({ "s.yaml": SPLIT, "st.yaml": "study: sweep\nprofile: s.yaml\nanswers: [energy]\nvary:\n  - { path: circuit.resistance, from: 2 ohm, to: 18 ohm, points: 3, scale: log }\n" });
    expect(await runCli(["sweep", "s.yaml", "--vary", "circuit.resistance=2 ohm,18 ohm", "--answer", "energy,peak", "--report", "out.html"], io)).toBe(0);
    expect(io.stdout.join("")).toContain("Report: 2 charts written to out.html");
    expect(io.files["out.html"]).toContain("<svg");
    expect(io.files["out.html"]).toContain("Caution:");
    expect(await runCli(["study", "st.yaml", "--report", "study.html"], io)).toBe(0);
    expect(io.files["study.html"]).toContain("energy put into the part over the profile against circuit.resistance");
    expect(await runCli(["sweep", "s.yaml", "--vary", "circuit.resistance=2 ohm", "--report", "out.html"], io)).toBe(2);
  });
});
