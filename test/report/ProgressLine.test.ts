import { describe, expect, test } from "vitest";
import { type CircuitModels, PROGRESS_EVENTS, loadProfile, simulateProfile } from "../../src/internal.js";
import { PROGRESS_DEFAULTS, ProgressLine } from "../../src/report/ProgressLine.js";


// The progress line of long CLI runs: silent for the first second, then at most one rewrite per
// quarter second, erased at the end only if it was shown; driven here by a fake clock.
describe("ProgressLine", () => {
  function fixture(): { clock: { t: number }; written: string[]; line: ProgressLine } {
    const clock = { t: 100 };
    const written: string[] = [];
    return { clock, written, line: new ProgressLine((s) => written.push(s), () => clock.t) };
  }

  test("a short run shows nothing and erases nothing", () => {
    const { clock, written, line } = fixture();
    for (let i = 0; i < 10; i++) {
      clock.t += 0.09;
      line.update(() => `step ${i}`);
    }
    line.done();
    expect(written).toEqual([]);
  });

  test("after the first second, one rewrite per quarter second, then erased", () => {
    const { clock, written, line } = fixture();
    clock.t += PROGRESS_DEFAULTS.firstAfterS;
    line.update(() => "a");
    clock.t += 0.1;
    line.update(() => "b"); // too soon after "a"
    clock.t += PROGRESS_DEFAULTS.everyS;
    line.update(() => "c");
    line.done();
    expect(written).toEqual(["\ra\u001b[K", "\rc\u001b[K", "\r\u001b[K"]);
  });

  test("finish leaves a closing line with the time taken after a run of a second or more, even with no update shown", () => {
    const { clock, written, line } = fixture();
    clock.t += 1.25;
    line.finish((s) => `done in ${s} s`);
    expect(written).toEqual(["\rdone in 1.25 s\u001b[K\n"]);
    const quick = fixture();
    quick.clock.t += 0.5;
    quick.line.finish((s) => `done in ${s} s`);
    expect(quick.written).toEqual([]);
  });

  test("the text is only built when it is shown", () => {
    const { clock, line } = fixture();
    let built = 0;
    line.update(() => `${++built}`);
    clock.t += 2;
    line.update(() => `${++built}`);
    expect(built).toBe(1);
  });
});

describe("simulateProfile reports progress every PROGRESS_EVENTS events", () => {
  test("a profile of 140,000 one-second waits: calls at 65,536 and 131,072 events, with their start times", () => {
    const noCircuit: CircuitModels = {
      charge: () => {
        throw new Error("no circuit");
      },
      discharge: (_p, _c, v) => v,
    };
    const profile = loadProfile(
      `name: waits
ambient: 25 degC
parts:
  - id: r
    network: { form: foster, stages: [{ r: 1 K/W, tau: 1 s }] }
    limits: { maxTemperature: 100 degC }
events:
  - repeat: { count: 140000, events: [{ wait: 1 s }] }
`,
      "waits.yaml",
    );
    const calls: [number, number][] = [];
    const result = simulateProfile(profile, { models: noCircuit, onProgress: (events, timeS) => calls.push([events, timeS]) });
    expect(result.eventCount).toBe(140_000);
    expect(calls).toEqual([
      [PROGRESS_EVENTS, PROGRESS_EVENTS - 1],
      [2 * PROGRESS_EVENTS, 2 * PROGRESS_EVENTS - 1],
    ]);
  });
});
