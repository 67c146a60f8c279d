import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { EventDigest, PeakEnvelope, type TimelineEvent } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// The report pieces behind `simulate`: the CSV holds every local peak, the chart envelope never
// drops a maximum however many points it folds, and the event digest keeps the hottest events.

describe("simulate --csv", () => {
  test("every local peak is a row, and the hottest row is the reported peak", async () => {
    // A ramp from 100 W down to 0 over 1 s on two Foster stages: the fast stage turns inside the
    // step, so the maximum is an interior peak, not a step end (invented values).
    const io = memoryIo({
      "p.yaml": `name: ramp
ambient: 20 degC
parts:
  - id: r
    network: { form: foster, stages: [{ r: 0.5 K/W, tau: 50 ms }, { r: 2 K/W, tau: 20 s }] }
    limits: { maxTemperature: 200 degC }
events:
  - repeat:
      count: 3
      period: 10 s
      events:
        - power-trace: { part: r, points: [[0, 100], [1 s, 0]] }
`,
    });
    expect(await runCli(["simulate", "p.yaml", "--json", "--csv", "out.csv"], io)).toBe(0);
    const peak = (JSON.parse(io.stdout.join("")) as { parts: { peakTemperatureC: number }[] }).parts[0]!.peakTemperatureC;
    const rows = io.files["out.csv"]!.trim().split("\n").slice(1).map((l) => l.split(","));
    const peaks = rows.filter((r) => r[2] === "peak");
    expect(peaks.length).toBe(3); // one interior maximum per ramp
    expect(peaks.map((r) => Number(r[1]))).toEqual([0, 1, 2]); // each in its own event's window
    const hottest = Math.max(...rows.map((r) => Number(r[3])));
    // the CSV rounds to 1e-6 °C
    expect(Math.abs(hottest - peak)).toBeLessThan(1e-6);
    expect(peaks.some((r) => Math.abs(Number(r[3]) - peak) < 1e-6)).toBe(true);
  });
});

describe("PeakEnvelope", () => {
  test("folding a million points into 64 bins keeps every bin's maximum", () => {
    const envelope = new PeakEnvelope(1, 64, 1e-3);
    let max = -Infinity;
    let spikeAt = 0;
    for (let i = 0; i < 1_000_000; i++) {
      const t = i * 0.37;
      const v = i === 777_777 ? 1000 : Math.sin(i / 1000);
      if (v > max) {
        max = v;
        spikeAt = t;
      }
      envelope.add(t, [v]);
    }
    const points = envelope.points(0);
    expect(points.length).toBeLessThanOrEqual(64);
    expect(Math.max(...points.map((p) => p.y))).toBe(1000);
    const spike = points.find((p) => p.y === 1000)!;
    const width = points[1]!.x - points[0]!.x;
    expect(Math.abs(spike.x - spikeAt)).toBeLessThanOrEqual(width);
  });
});

describe("EventDigest", () => {
  const event = (index: number): TimelineEvent => ({
    type: "event",
    index,
    kind: "power-up",
    label: "",
    field: "",
    startS: index,
    durationS: 1,
    outcome: "completed",
    busStalled: false,
    reason: "",
    startVoltageV: 0,
    endVoltageV: 48,
    traces: [undefined],
    energyJ: [1],
  });

  test("keeps all events up to its cap and always the hottest few", () => {
    const digest = new EventDigest([100], 5, 3);
    const temps = [50, 99, 20, 101, 60, 30, 98, 10];
    temps.forEach((t, i) => digest.add(event(i), { peakTemperatureC: [t], peakTimeS: [i] }));
    expect(digest.count).toBe(8);
    expect(digest.all.map((e) => e.index)).toEqual([0, 1, 2, 3, 4]);
    expect(digest.hottest.map((e) => e.peakTemperatureC[0])).toEqual([101, 99, 98]);
  });
});
