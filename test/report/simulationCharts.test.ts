import { describe, expect, test } from "vitest";
import { processIo } from "../../src/cli/CliIo.js";
import { readProfileFile } from "../../src/cli/readProfileFile.js";
import {
  ChartTrace,
  EventDigest,
  ProfileStress,
  type ReportChart,
  ThermalRun,
  defaultCircuitModels,
  rainflowClasses,
  simulateProfile,
  simulationCharts,
} from "../../src/internal.js";

// The report's charts draw the simulation's own numbers: the temperature chart's peak markers
// and the top of its envelope are each part's reported peak, the zoomed event is the event the
// digest finds closest to a limit, the per-event energies add up to each part's total, the
// rainflow classes hold every counted cycle. The samples that make the curves are exact and
// change no answer.

function simulateWithCharts(file: string, sampling: { ratio?: number; everyS?: number } | undefined) {
  const profile = readProfileFile(processIo(), file);
  const digest = new EventDigest(profile.parts.map((p) => p.limitC));
  const stress = new ProfileStress(profile, { keepCycles: true });
  const trace = new ChartTrace(profile.parts.map((p) => p.limitC));
  const result = simulateProfile(profile, {
    models: defaultCircuitModels,
    wantSamples: stress.wantsSamples,
    onEvent: (event, temperatures) => {
      digest.add(event, temperatures);
      stress.addEvent(event);
      trace.closeEvent(event, temperatures);
    },
    onPoint: (timeS, temperatureC, kind, eventIndex) => {
      stress.addPoint(timeS, temperatureC, kind, eventIndex);
      trace.add(timeS, temperatureC, eventIndex);
    },
    ...(sampling === undefined ? {} : { sampling, onSample: (timeS: number, temperatureC: readonly number[], eventIndex: number) => trace.add(timeS, temperatureC, eventIndex) }),
  });
  const stressResult = stress.finish(result.endTimeS);
  const charts = simulationCharts({ profile, result, events: digest.all, trace, stress: stressResult });
  return { profile, result, digest, trace, stressResult, charts };
}

/** The inline data of a chart's layers (or of the chart itself), by a field the rows carry. */
function rows(chart: ReportChart, field: string): Record<string, number | string>[] {
  const spec = chart.spec as { data?: { values: Record<string, number | string>[] }; layer?: { data?: { values: Record<string, number | string>[] } }[] };
  const all = [spec.data?.values ?? [], ...(spec.layer ?? []).map((l) => l.data?.values ?? [])];
  return all.filter((values) => values.length > 0 && field in values[0]!).flat();
}

const chart = (charts: readonly ReportChart[], id: string): ReportChart => {
  const found = charts.find((c) => c.id === id);
  if (found === undefined) throw new Error(`no chart ${id}`);
  return found;
};

describe("simulationCharts draw the simulation's numbers", () => {
  const run = simulateWithCharts("profiles/home-storage-400v.yaml", { ratio: 2 });

  test("the charts of a profile with cycles and damage: temperature, zoom, two per event, rainflow, damage, Zth", () => {
    expect(run.charts.map((c) => c.id)).toEqual(["temperature", "worst-event", "event-energy", "event-peak", "rainflow", "damage", "zth"]);
  });

  test("the peak markers and the top of the envelope are each part's reported peak", () => {
    const temperature = chart(run.charts, "temperature");
    const peaks = rows(temperature, "peakC");
    const bands = rows(temperature, "highC");
    const unit = run.result.endTimeS / (bands.reduce((m, r) => Math.max(m, r.t as number), 0) || 1);
    expect(unit).toBeGreaterThan(0);
    run.result.parts.forEach((p) => {
      const marker = peaks.find((r) => r.part === p.id)!;
      expect(marker.peakC).toBe(p.peakTemperatureC);
      const top = Math.max(...bands.filter((r) => r.part === p.id).map((r) => r.highC as number));
      // the same maximum, the envelope's from the point handed out (all parts advanced to its time)
      expect(top).toBeCloseTo(p.peakTemperatureC, 9);
      const bottom = Math.min(...bands.filter((r) => r.part === p.id).map((r) => r.lowC as number));
      expect(bottom).toBeGreaterThanOrEqual(p.peakTemperatureC - 200);
      expect(bottom).toBeLessThanOrEqual(top);
    });
  });

  test("the zoomed event is the one closest to a limit, and its curve reaches that event's peak", () => {
    const limits = run.profile.parts.map((p) => p.limitC);
    const closeness = (peaks: readonly number[]) => Math.max(...peaks.map((t, i) => t - limits[i]!));
    const best = run.digest.all.reduce((b, e) => (closeness(e.peakTemperatureC) > closeness(b.peakTemperatureC) ? e : b));
    expect(run.trace.worst!.index).toBe(best.index);
    const zoom = chart(run.charts, "worst-event");
    const points = rows(zoom, "temperatureC");
    const hottest = run.profile.parts.findIndex((_, i) => best.peakTemperatureC[i]! - limits[i]! === closeness(best.peakTemperatureC));
    const id = run.profile.parts[hottest]!.id;
    expect(Math.max(...points.filter((r) => r.part === id).map((r) => r.temperatureC as number))).toBeCloseTo(best.peakTemperatureC[hottest]!, 9);
  });

  test("the energies per event add up to each part's total energy", () => {
    const energy = rows(chart(run.charts, "event-energy"), "energyJ");
    run.result.parts.forEach((p) => {
      const sum = energy.filter((r) => r.part === p.id).reduce((s, r) => s + (r.energyJ as number), 0);
      expect(sum).toBeCloseTo(p.energyJ, 6);
    });
  });

  test("the rainflow classes hold every counted cycle and the whole damage", () => {
    const classes = rainflowClasses(run.stressResult);
    for (const part of run.stressResult.parts) {
      const mine = classes.filter((c) => c.part === part.id);
      const summary = part.report.cycleSummary;
      expect(mine.reduce((s, c) => s + c.cycles, 0)).toBeCloseTo(summary.fullCycles + 0.5 * summary.halfCycles, 9);
      if (part.report.cycleDamage.some((d) => d > 0)) expect(mine.reduce((s, c) => s + c.damageShare, 0)).toBeCloseTo(1, 9);
    }
  });

  test("the Zth curve levels off at the sum of the network's gains (its steady-state resistance)", () => {
    const zth = rows(chart(run.charts, "zth"), "zthKPerW");
    run.profile.parts.forEach((p) => {
      const mine = zth.filter((r) => r.part === p.id);
      const steady = p.model.gainKPerW[p.observedIndex]![p.sourceIndex]!.reduce((a, b) => a + b, 0);
      // ten slowest time constants in: 1 − e^(−10) of the steady value (Incropera et al., 7th ed., §5.3)
      expect((mine[mine.length - 1]!.zthKPerW as number) / steady).toBeCloseTo(1 - Math.exp(-10), 3);
    });
  });

  test("samples change no answer: the same result with and without them", () => {
    const plain = simulateWithCharts("profiles/home-storage-400v.yaml", undefined);
    expect(run.result).toEqual(plain.result);
    expect(run.stressResult).toEqual(plain.stressResult);
  });
});

describe("ThermalRun samples are the exact curve", () => {
  // One lumped RC stage: heated at P for t1 from ambient, rise P·R·(1 − e^(−t/τ)); then cooling,
  // rise(t1)·e^(−(t − t1)/τ) (Incropera, DeWitt, Bergman & Lavine, 7th ed. (2011), §5.1 eq. 5.6
  // and §5.3).
  const R = 2.5; // K/W
  const tau = 0.8; // s
  const P = 12; // W
  const t1 = 0.3; // s
  const model = { tauS: [tau], sources: ["r"], observed: ["r"], gainKPerW: [[[R]]] };
  const exact = (t: number): number => (t <= t1 ? P * R * -Math.expm1(-t / tau) : P * R * -Math.expm1(-t1 / tau) * Math.exp(-(t - t1) / tau));

  test("geometric samples from a quarter of τ, doubling, and even ones every 0.5 s, in time order with the step ends", () => {
    const seen: { timeS: number; kind: string; riseK: number }[] = [];
    const run = new ThermalRun(model, {
      onPoint: (p) => seen.push({ timeS: p.timeS, kind: p.kind, riseK: p.riseK[0]! }),
      onSample: (timeS, riseK) => seen.push({ timeS, kind: "sample", riseK: riseK[0]! }),
      sampling: { ratio: 2, everyS: 0.5 },
    });
    run.push({ startS: 0, durationS: t1, powers: [[{ a: P, b: 0, lambda: 0 }]] });
    run.push({ startS: t1, durationS: 20 * tau, powers: [] });
    const samples = seen.filter((s) => s.kind === "sample");
    // heating step: 0.2 s (τ/4); cooling step (16 s long): t1 + 0.2·2^k for k = 0..6, and every 0.5 s from 0.5 to 16.0 s
    const geometric = [0.2, ...Array.from({ length: 7 }, (_, k) => t1 + 0.2 * 2 ** k)];
    const even = Array.from({ length: 32 }, (_, k) => 0.5 * (k + 1)).filter((t) => t < t1 + 20 * tau);
    expect(samples.map((s) => s.timeS)).toEqual([...new Set([...geometric, ...even])].sort((a, b) => a - b).map((t) => expect.closeTo(t, 12)));
    for (let i = 1; i < seen.length; i++) expect(seen[i]!.timeS).toBeGreaterThanOrEqual(seen[i - 1]!.timeS);
    for (const s of seen) expect(s.riseK).toBeCloseTo(exact(s.timeS), 10);
  });
});
