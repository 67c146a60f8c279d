import { describe, expect, test } from "vitest";
import { commandProgress } from "../../src/cli/commandProgress.js";
import type { CircuitModels } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// The progress line of the long commands (retries, supervise, size, the fits): silent on a
// non-terminal, ticking from the circuit models the command passes to the library, and a closing
// line with the time taken after a run of a second or more. Driven by a fake clock: nothing waits.
describe("commandProgress", () => {
  function terminal(): { clock: { t: number }; written: string[]; io: ReturnType<typeof memoryIo> } {
    const clock = { t: 50 };
    const written: string[] = [];
    return { clock, written, io: { ...memoryIo(), progress: (s: string) => written.push(s) } };
  }
  const models: CircuitModels = {
    charge: () => {
      throw new Error("not called in this test");
    },
    discharge: (_path, _c, v, w) => v * Math.exp(-w),
  };

  test("a long run ticks from the circuit models it watches, then leaves a closing line", () => {
    const { clock, written, io } = terminal();
    let counted = 0;
    const progress = commandProgress(io, "retries", () => `, ${counted} attempts simulated`, () => clock.t);
    const watched = progress.watch(models);
    clock.t += 0.5;
    expect(watched.discharge({ kind: "none" } as never, 1e-3, 10, 0)).toBe(10);
    clock.t += 1;
    counted = 1234;
    watched.discharge({ kind: "none" } as never, 1e-3, 10, 0);
    clock.t += 2;
    progress.finish();
    progress.done();
    expect(written).toEqual(["\rheatledger: retries: working, 1.50 s, 1234 attempts simulated\u001b[K", "\rheatledger: retries: done in 3.50 s\u001b[K\n"]);
  });

  test("a run shorter than a second writes nothing, and an error only erases what was shown", () => {
    const quick = terminal();
    const progress = commandProgress(quick.io, "size", undefined, () => quick.clock.t);
    progress.tick();
    quick.clock.t += 0.4;
    progress.finish();
    expect(quick.written).toEqual([]);
    const failing = terminal();
    const broken = commandProgress(failing.io, "size", undefined, () => failing.clock.t);
    failing.clock.t += 1.2;
    broken.tick(() => ", trying 3 stages");
    broken.done();
    expect(failing.written).toEqual(["\rheatledger: size: working, 1.20 s, trying 3 stages\u001b[K", "\r\u001b[K"]);
  });

  test("without a terminal nothing is written and the models are passed through untouched", () => {
    const io = memoryIo();
    const progress = commandProgress(io, "supervise");
    expect(progress.watch(models)).toBe(models);
    progress.tick();
    progress.finish();
    expect(io.stderr).toEqual([]);
  });
});
