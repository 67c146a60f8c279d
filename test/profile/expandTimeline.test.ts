import { describe, expect, test } from "vitest";
import { type TimelineEvent, expandTimeline, loadProfile } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { FAKE_COMPLETE_S, fakeModels } from "./fakeCircuit.js";

// Expansion logic is checked against schedules counted by hand from the profile's own rules
// (retry intervals start to start, k-th interval = min(interval·backoff^(k−1), maxInterval),
// repeats start to start every period). Times are sums of a few doubles: 1e-9 s absolute covers
// their rounding.
const HEAD = `
name: expansion test
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 1 K/W, tau: 1 s }] }
    limits: { maxTemperature: 150 degC }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 2 mF
  resistance: 10 ohm
  completion: { fraction: 0.95, timeout: 1 s }
  discharge: { kind: bleeder, resistance: 5 kohm }
`;

function events(yamlEvents: string, log?: { initialV: number[] }): TimelineEvent[] {
  const profile = loadProfile(`${HEAD}events:\n${yamlEvents}`, "t.yaml");
  return [...expandTimeline(profile, fakeModels(log))].filter((e): e is TimelineEvent => e.type === "event");
}

describe("expandTimeline", () => {
  test("retry into a permanent short: every attempt, back-off capped, then the lockout", () => {
    const list = events(`  - retry: { attempts: 5, interval: 2 s, backoff: 2, maxInterval: 5 s, fault: { type: shorted-output }, lockout: 60 s }\n`);
    expect(list.map((e) => e.kind)).toEqual(["shorted-output", "shorted-output", "shorted-output", "shorted-output", "shorted-output", "lockout"]);
    // intervals 2, 4, 5 (capped), 5 s: starts 0, 2, 6, 11, 16; last attempt ends at 17 s (1 s timeout)
    [0, 2, 6, 11, 16, 17].forEach((t, i) => expectClose(list[i]!.startS, t, { abs: 1e-9 }));
    expect(list.slice(0, 5).every((e) => e.outcome === "timed-out")).toBe(true);
    expectClose(list[5]!.durationS, 60, { abs: 1e-9 });
  });

  test("retry stops at the first completed attempt and no lockout follows", () => {
    const list = events(`  - retry: { attempts: 6, interval: 3 s, fault: { type: shorted-output }, faultyAttempts: 2, lockout: 60 s }\n  - run: 10 s\n`);
    expect(list.map((e) => `${e.kind}:${e.outcome}`)).toEqual(["shorted-output:timed-out", "shorted-output:timed-out", "power-up:completed", "run:none"]);
    [0, 3, 6, 6 + FAKE_COMPLETE_S].forEach((t, i) => expectClose(list[i]!.startS, t, { abs: 1e-9 }));
  });

  test.each([
    [2, 3, 6],
    [3, 1, 3],
    [4, 5, 20],
  ])("nested repeats %i × %i give %i power-ups at period starts", (outer, inner, total) => {
    const list = events(`  - repeat:\n      count: ${outer}\n      period: 100 s\n      events:\n        - repeat:\n            count: ${inner}\n            period: 10 s\n            events:\n              - power-up: {}\n              - run: 1 s\n              - power-down: {}\n`);
    const ups = list.filter((e) => e.kind === "power-up");
    expect(ups.length).toBe(total);
    ups.forEach((e, k) => expectClose(e.startS, Math.floor(k / inner) * 100 + (k % inner) * 10, { abs: 1e-9 }));
    expect(list.length).toBe(total * 3);
    expect(list.map((e) => e.index)).toEqual(list.map((_, i) => i));
  });

  test("the capacitor voltage is carried: a retry starts from what the bleeder left", () => {
    const log = { initialV: [] as number[] };
    // power-up completes (48 V), power-down, 5 s off on the fake 10 s bleed, then power up again
    events(`  - power-up: {}\n  - power-down: { off: 5 s }\n  - power-up: {}\n`, log);
    expect(log.initialV[0]).toBe(0);
    // fake discharge: 48·e^(−5/10), computed the same way: exact to rounding
    expectClose(log.initialV[1]!, 48 * Math.exp(-0.5), { rel: 1e-14 });
  });

  test("a trip after closing leaves the bus off and the retry goes on", () => {
    const list = events(`  - retry: { attempts: 3, interval: 2 s, fault: { type: trip-after-close, after: 0.5 s }, faultyAttempts: 1, lockout: 1 min }\n`);
    expect(list.map((e) => e.kind)).toEqual(["trip-after-close", "power-up"]);
    expectClose(list[0]!.durationS, FAKE_COMPLETE_S + 0.5, { abs: 1e-9 });
    expect(list[0]!.reason).toMatch(/tripped 0.5 s after/);
  });

  test.each([
    ["0 s", 0],
    ["1 ns", 1e-9],
    ["1 ms", 1e-3],
  ])("a trip %s after closing disconnects the bus: the next attempt starts from what the drain left", (after, afterS) => {
    const log = { initialV: [] as number[] };
    const list = events(`  - retry: { attempts: 2, interval: 2 s, fault: { type: trip-after-close, after: ${after} }, lockout: 1 min }\n`, log);
    expect(list.map((e) => e.kind)).toEqual(["trip-after-close", "trip-after-close", "lockout"]);
    expectClose(list[0]!.durationS, FAKE_COMPLETE_S + afterS, { abs: 1e-12 });
    // the fake drain (10 s time constant) runs from the trip to the next start 2 s after the first:
    // 48·e^(−(2 − 0.2 − after)/10), computed the same way, so exact to rounding; a trip at 0 s
    // read as "no trip" would leave the bus on at 48 V
    expectClose(log.initialV[1]!, 48 * Math.exp(-(2 - FAKE_COMPLETE_S - afterS) / 10), { rel: 1e-12 });
    expect(list[0]!.reason).toMatch(new RegExp(`tripped ${afterS} s after`));
  });

  test("a repetition longer than its period is refused, naming the field", () => {
    expect(() => events(`  - repeat: { count: 2, period: 1 s, events: [{ run: 2 s }] }\n`)).toThrow(
      "events[0].repeat.period: expected a period at least as long as one repetition (repetition 1 took 2 s), found 1 s",
    );
  });

  test("expansion is lazy: a million-event profile yields its first event at once", () => {
    const profile = loadProfile(`${HEAD}events:\n  - repeat: { count: 1000000, period: 1 h, events: [{ power-up: {} }, { power-down: {} }] }\n`, "t.yaml");
    const it = expandTimeline(profile, fakeModels());
    const first = it.next().value as TimelineEvent;
    expect(first.kind).toBe("power-up");
    it.return(undefined);
  });
});
