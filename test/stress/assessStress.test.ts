import { parse } from "csv-parse/sync";
import { describe, expect, test } from "vitest";
import {
  CYCLES_CSV_COLUMNS,
  LINEAR_MOSFET_CAUTION,
  StressAssessment,
  assessStress,
  coffinMansonCycles,
  constantPowerSegment,
  formatCyclesCsv,
  formatStressSection,
  fosterToModal,
  resolveStressConfig,
  runThermalHistory,
  stressReportJson,
  traceSteps,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Invented scenario: a resistor on one RC stage (R = 0.5 K/W, tau = 0.5 s) at 40 °C ambient takes
// ten 200 W, 50 ms pulses, one every 2 s.
const R = 0.5;
const tau = 0.5;
const P = 200;
const tp = 0.05;
const period = 2;
const pulses = 10;
const ambientC = 40;
const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });
const trace = Array.from({ length: pulses }, (_, k) => constantPowerSegment(k * period, tp, P));

function history(): { timeS: number; temperatureC: number }[] {
  const points = [{ timeS: 0, temperatureC: ambientC }];
  runThermalHistory(model, traceSteps([trace], 0, pulses * period), {
    onPoint: (p) => points.push({ timeS: p.timeS, temperatureC: ambientC + p.riseK[0]! }),
  });
  return points;
}

const events = trace.map((s, index) => ({ index, startS: s.startS, durationS: tp, energyJ: P * tp, peakPowerW: P }));
const cm = { referenceCycles: 1e5, referenceRange: "50 K", exponent: 3 };

describe("assessStress on a pulse train", () => {
  test("counts one cycle per pulse, closed at the largest peak, and sums Miner damage against closed forms", () => {
    const config = resolveStressConfig(
      { ratings: { pulseEnergy: [{ duration: "10 ms", energy: "6 J" }, { duration: "1 s", energy: "60 J" }] }, lifetime: { model: "coffin-manson", ...cm } },
      { partKind: "resistor" },
    );
    const report = assessStress(config, events, history(), { partKind: "resistor", repetitionsPerYear: 365 });
    // Lumped single stage (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011),
    // §5.1 and §5.3):
    // peak after a pulse p = v·e^(−tp/τ) + P·R·(1 − e^(−tp/τ)), next valley v' = p·e^(−(T−tp)/τ).
    const peaks: number[] = [];
    const valleys: number[] = [0];
    for (let k = 0; k < pulses; k++) {
      peaks.push(valleys[k]! * Math.exp(-tp / tau) + P * R * -Math.expm1(-tp / tau));
      valleys.push(peaks[k]! * Math.exp(-(period - tp) / tau));
    }
    // A rising staircase closed on itself (ASTM E1049 §5.4.5): pulse k < 10 closes (p_k, v_k),
    // the last peak pairs with the ambient start: ranges p_k − v_k and p_10 − 0.
    const expected = [...peaks.slice(0, -1).map((p, k) => p - valleys[k + 1]!), peaks[pulses - 1]!].sort((a, b) => a - b);
    const ranges = report.cycles.map((c) => c.rangeK).sort((a, b) => a - b);
    expect(report.cycleSummary.fullCycles).toBe(pulses);
    expect(report.cycleSummary.halfCycles).toBe(0);
    // exact integration vs closed form: 1e-9 K covers the history's rounding (peaks ~10 K).
    ranges.forEach((r, i) => expectClose(r, expected[i]!, { abs: 1e-9 }));
    const damage = expected.reduce((s, r) => s + 1 / coffinMansonCycles({ referenceCycles: 1e5, referenceRangeK: 50, exponent: 3 }, r), 0);
    expectClose(report.damage!.damagePerRepetition, damage, { rel: 1e-9 }); // ΔT^3 triples the 1e-10 relative range error
    expectClose(report.damage!.yearsToEndOfLife!, 1 / damage / 365, { rel: 1e-9 });
    // every event: E = 10 J at t_eq = E/P_peak = 50 ms; rated 6·10^(log10(5)/2) = 13.42 J -> 74.5 %.
    const rated = 6 * 10 ** (Math.log10(5) / 2);
    expect(report.ratingStatus).toBe("pass");
    expectClose(report.events[0]!.pulseEnergy!.ratedEnergyJ!, rated, { rel: 1e-13 });
  });

  test("a resistor without a cycling model says so and still checks energy", () => {
    const config = resolveStressConfig({ ratings: { pulseEnergy: [{ duration: "10 ms", energy: "2 J" }, { duration: "1 s", energy: "20 J" }] } });
    const report = assessStress(config, events, history(), { partKind: "resistor" });
    expect(report.damage).toBeUndefined();
    expect(report.ratingStatus).toBe("fail");
    expect(report.notes.some((n) => n.includes("No cycling model for this resistor") && n.includes("temperature and energy checks only"))).toBe(true);
    const text = formatStressSection("R1", report);
    expect(text).toContain("ratings: FAIL (0 of 10 events within ratings)");
    expect(text).toContain("temperature and energy checks only");
  });

  test("a linear-mode MOSFET report carries the thermal-instability caution and its SOA check", () => {
    const config = resolveStressConfig(
      {
        ratings: { soa: [{ duration: "10 ms", points: [{ vds: "10 V", id: "50 A" }, { vds: "100 V", id: "5 A" }] }, { duration: "dc", points: [{ vds: "10 V", id: "10 A" }, { vds: "100 V", id: "1 A" }] }] },
        lifetime: { model: "lesit" },
      },
      { partKind: "mosfet" },
    );
    const withPoints = events.map((e) => ({ ...e, operatingPoints: [{ timeS: e.startS, vdsV: 48, idA: 4 }, { timeS: e.startS + tp, vdsV: 5, idA: 4 }] }));
    const report = assessStress(config, withPoints, history(), { partKind: "mosfet", linearMode: true });
    expect(report.cautions).toContain(LINEAR_MOSFET_CAUTION);
    const text = formatStressSection("Q1", report);
    expect(text).toContain("linear-mode MOSFET");
    expect(text.replace(/\s+/g, " ")).toContain("event 1 at 2 s: SOA FAIL: 1 of 2 points past the boundary, 0 not covered; worst 4 A at 48 V (allowed 2.08 A for 0.05 s)");
    for (const line of text.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
    // allowed at 48 V on the 10 ms line: 50·0.1^(log10 4.8) = 7.3 A ≥ 4 A; 50 ms lies past the last
    // finite line, so the DC line holds: 10·0.1^(log10 4.8) = 1.46 A < 4 A -> fail.
    expect(report.ratingStatus).toBe("fail");
    expectClose(report.events[0]!.soa!.worst!.allowedA, 10 * 0.1 ** Math.log10(4.8), { rel: 1e-13 });
    // LESIT cycles of ~10 K lie outside its fitted 30-80 K: reported as extrapolated, not silence.
    const outside = report.damage!.extrapolated.find((x) => x.quantity === "range")!;
    expect(outside).toMatchObject({ range: [30, 80], unit: "K", cycles: pulses });
    expectClose(outside.damageShare, 1, { rel: 1e-12 }); // every cycle outside: the same ten terms summed twice, rounding only
    expect(formatStressSection("Q1", report)).toMatch(/extrapolated: 10 of 10 counted cycles have a range of [0-9.]+-[0-9.]+ K, outside the model's validity\s+range 30-80 K/);
  });
});

describe("heating time of a short pulse after hours at ambient (CIPS 2008)", () => {
  // Invented history: one RC stage (R = 1 K/W, tau = 0.1 s) at 40 °C, a 100 W pulse of 0.3 s every
  // 3 h, the first one 3 h after the start, four in all, then 3 h of cooling. Between pulses the
  // part is back at ambient exactly (e^(−108000) underflows), so every pulse starts from a flat
  // stretch at 40 °C that began hours earlier. Lumped single stage (Incropera et al.,
  // Fundamentals of Heat and Mass Transfer, 7th ed., §5.2): peak rise at the pulse end
  // ΔT = P·R·(1 − e^(−0.3/0.1)) = 100·(1 − e^(−3)) = 95.02129 K, reached 0.3 s after the pulse starts.
  const stage = fosterToModal({ kind: "foster", stages: [{ rKPerW: 1, tauS: 0.1 }] });
  const hours3 = 3 * 3600;
  const pulsesAfterHours = [1, 2, 3, 4].map((k) => constantPowerSegment(k * hours3, 0.3, 100));
  function idleHistory(): { timeS: number; temperatureC: number }[] {
    const points = [{ timeS: 0, temperatureC: 40 }];
    runThermalHistory(stage, traceSteps([pulsesAfterHours], 0, 5 * hours3), {
      onPoint: (p) => points.push({ timeS: p.timeS, temperatureC: 40 + p.riseK[0]! }),
    });
    return points;
  }
  const cips = { model: "cips2008", currentPerWire: "10 A", voltageClass: "600 V", wireDiameter: "300 um" } as const;

  // The leave time is the step end at the pulse start, the peak the step end 0.3 s later: one
  // subtraction of times near 4e4 s, about 1e-11 s of rounding.
  test("repeating history: each of the four cycles heats for 0.3 s, not for the hours before it", () => {
    const report = assessStress(resolveStressConfig({ lifetime: cips }), [], idleHistory(), { mode: "repeating" });
    expect(report.cycles.map((c) => c.count)).toEqual([1, 1, 1, 1]);
    for (const c of report.cycles) expectClose(c.heatingTimeS, 0.3, { abs: 1e-10 });
  });

  test("open history: the four rising half cycles heat for 0.3 s", () => {
    // Equal ranges give half cycles only (ASTM E1049 §5.4.4): four rises and four falls, whose
    // one-way travel is the 3 h of cooling to the next pulse.
    const report = assessStress(resolveStressConfig({ lifetime: cips }), [], idleHistory(), { mode: "open" });
    const heating = report.cycles.map((c) => c.heatingTimeS).sort((a, b) => a - b);
    expect(report.cycles.map((c) => c.count)).toEqual(Array(8).fill(0.5));
    for (const t of heating.slice(0, 4)) expectClose(t, 0.3, { abs: 1e-10 });
    for (const t of heating.slice(4)) expect(t).toBeGreaterThan(3600);
  });

  test("its CIPS 2008 life matches the published equation by hand", () => {
    // N_f = K·ΔT^β1·exp(β2/(T_min + 273))·t_on^β3·I^β4·(V/100)^β5·D^β6, Bayerer et al. 2008, eq. (1),
    // coefficients K = 9.30e14, β1 = −4.416, β2 = 1285, β3 = −0.463, β4 = −0.716, β5 = −0.761,
    // β6 = −0.5 (recalled, from memory). Cycle: ΔT = 95.02129 K, T_min = 40 °C, t_on = 0.3 s;
    // part: I = 10 A per wire, V = 600 V, D = 300 µm.
    //   95.02129^−4.416 = 1.844772e−9;  exp(1285/313) = 60.66891;  0.3^−0.463 = 1.746195
    //   10^−0.716 = 0.1923092;  6^−0.761 = 0.2557566;  300^−0.5 = 0.05773503
    //   N_f = 9.3e14 · 1.844772e−9 · 60.66891 · 1.746195 · 0.1923092 · 0.2557566 · 0.05773503
    //       = 5.161202e5 cycles
    // (With the hours at ambient counted as heating, t_on = 10 800.3 s, N_f would be 4.0e3: 129
    // times shorter.) 1e-6 relative: seven-digit factors.
    const report = assessStress(resolveStressConfig({ lifetime: cips }), [], idleHistory(), { mode: "repeating" });
    const worst = report.damage!.topCycles[0]!;
    expectClose(worst.cycle.rangeK, 95.02129, { rel: 1e-6 });
    expectClose(worst.cyclesToFailure, 5.161202e5, { rel: 1e-6 });
    expectClose(report.damage!.damagePerRepetition, 4 / 5.161202e5, { rel: 1e-6 });
    // t_on = 0.3 s lies below the 1-15 s the model was fitted on: the report says so
    const short = report.damage!.extrapolated.find((x) => x.quantity === "heatingTime")!;
    expect([short.range, short.unit, short.cycles]).toEqual([[1, 15], "s", 4]);
    expectClose(short.found[1], 0.3, { abs: 1e-10 });
    expectClose(short.damageShare, 1, { rel: 1e-12 }); // all four cycles, the same terms summed twice
  });
});

describe("stress formatters", () => {
  const config = resolveStressConfig({ lifetime: { model: "coffin-manson", ...cm } });
  const report = assessStress(config, events, history());

  test("stressReportJson is plain JSON: no Infinity, no NaN, the keys the report promises", () => {
    const json = stressReportJson(report);
    const text = JSON.stringify(json);
    expect(text).not.toMatch(/Infinity|NaN/);
    expect(Object.keys(json)).toEqual(["ratingStatus", "ratingChecks", "cycles", "damage", "limits", "notes"]);
    expect(json.damage!.yearsToEndOfLife).toBeNull(); // no rate given
    expect(json.cycles.fullCycles).toBe(pulses);
  });

  test("formatCyclesCsv writes a header and one row per cycle that csv-parse reads back", () => {
    const csv = formatCyclesCsv([{ id: "R1", cycles: report.cycles, damage: report.cycleDamage }]);
    const rows = parse(csv, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toEqual([...CYCLES_CSV_COLUMNS]);
    expect(rows).toHaveLength(report.cycles.length);
    expect(Number(rows[0]!.range_K)).toBe(report.cycles[0]!.rangeK); // full precision survives
    expect(Number(rows[0]!.damage)).toBe(report.cycleDamage[0]);
  });

  test("the terminal section names the model, the damage and the life", () => {
    const text = formatStressSection("R1", report);
    expect(text).toMatch(/damage \(Coffin-Manson, Miner's rule\): [0-9.e-]+ per repetition of the profile/);
    expect(text).toContain("10 full, 0 half");
    expect(text).toContain("Caution (lifetime)");
    expect(text).not.toMatch(/NaN|Infinity|undefined/);
  });
});

describe("StressAssessment (push-style)", () => {
  test("gives the same report as assessStress over the same points", () => {
    const config = resolveStressConfig({ lifetime: { model: "coffin-manson", ...cm }, cycleHysteresis: "0.5 K" });
    const a = new StressAssessment(config, { mode: "open" });
    for (const p of history()) a.addTemperature(p.timeS, p.temperatureC);
    const pushed = a.finish(events);
    const batch = assessStress(config, events, history(), { mode: "open" });
    expect(pushed.cycles).toEqual(batch.cycles);
    expect(pushed.damage!.damagePerRepetition).toBe(batch.damage!.damagePerRepetition);
    expect(pushed.cycleSummary.halfCycles).toBeGreaterThan(0); // an open record keeps its residue
  });
});

describe("edge cases never reach a report as NaN", () => {
  test("no history and no events", () => {
    const report = assessStress(resolveStressConfig({ lifetime: { model: "lesit" } }), [], []);
    const text = formatStressSection("X", report);
    expect(text).toContain("ratings: no rating table applies");
    expect(text).toMatch(/0 full, 0 half from 0 turning\s+points/);
    expect(text).not.toMatch(/NaN|undefined/);
    expect(JSON.stringify(stressReportJson(report))).not.toMatch(/NaN|Infinity/);
    expect(report.damage!.repetitionsToEndOfLife).toBe(Number.POSITIVE_INFINITY);
    expect(text).toContain("end of life after unlimited repetitions");
  });
});
