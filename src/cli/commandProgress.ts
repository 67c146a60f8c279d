import type { CircuitModels } from "../profile/CircuitModels.js";
import { ProgressLine } from "../report/ProgressLine.js";
import { formatDuration } from "../text/formatTable.js";
import type { CliIo } from "./CliIo.js";

/** The progress of one CLI command (see commandProgress). */
export interface CommandProgress {
  /** offer an update; `detail` (", 1,234 attempts"; default the command's own count) is built only when the line is rewritten */
  tick(detail?: () => string): void;
  /** circuit models that tick on every charge and discharge they compute, then do the work of `models` */
  watch(models: CircuitModels): CircuitModels;
  /** the run succeeded: erase the line and, after a run of a second or more, say how long it took */
  finish(): void;
  /** erase the line (call in a `finally`; after finish it does nothing) */
  done(): void;
}

/**
 * Progress of a long command for the CLI: on an interactive terminal (CliIo.progress), a line on
 * stderr, `heatledger: VERB: working, 3.2 s` plus what the command counts, rewritten at most four
 * times a second from the first second on (ProgressLine), and on success a closing line
 * `heatledger: VERB: done in 4.1 s` when the run took a second or more; elsewhere (a pipe, a file,
 * the tests' memory io) nothing at all. The library reports nothing by itself: the command ticks
 * from the callbacks it already passes (the circuit models every planner and simulation calls,
 * `watch`, or a library hook); `counted` adds what the command counts to every line; `now` is the
 * clock in seconds (default the process's monotonic clock; tests pass their own).
 * Cost O(1) per tick.
 */
export function commandProgress(io: CliIo, verb: string, counted?: () => string, now?: () => number): CommandProgress {
  if (io.progress === undefined) return { tick: () => {}, watch: (models) => models, finish: () => {}, done: () => {} };
  const line = new ProgressLine(io.progress, now);
  let finished = false;
  const tick = (detail: (() => string) | undefined = counted): void =>
    line.update(() => `heatledger: ${verb}: working, ${formatDuration(line.elapsedS())}${detail === undefined ? "" : detail()}`);
  return {
    tick,
    watch: (models) => ({
      charge: (circuit, load, conditions) => {
        tick(counted);
        return models.charge(circuit, load, conditions);
      },
      discharge: (path, capacitanceF, initialVoltageV, durationS) => {
        tick(counted);
        return models.discharge(path, capacitanceF, initialVoltageV, durationS);
      },
    }),
    finish: () => {
      finished = true;
      line.finish((elapsedS) => `heatledger: ${verb}: done in ${formatDuration(elapsedS)}`);
    },
    done: () => {
      if (!finished) line.done();
    },
  };
}
