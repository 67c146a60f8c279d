import { formatDuration } from "../text/formatTable.js";
import type { CliIo } from "./CliIo.js";
import { commandProgress } from "./commandProgress.js";

/**
 * Progress of a long simulation for the CLI (commandProgress): on an interactive terminal
 * (CliIo.progress), a line on stderr with the time so far, the events simulated and the profile
 * time reached, after the first second; elsewhere nothing. Call `finish` when the run succeeds
 * (after a run of a second or more it leaves a closing line saying how long it took) and `done`
 * when it ends, also on an error, so what follows starts on a clean line.
 */
export function simulationProgress(io: CliIo, verb: string): { onProgress?: (events: number, timeS: number) => void; finish: () => void; done: () => void } {
  if (io.progress === undefined) return { finish: () => {}, done: () => {} };
  const progress = commandProgress(io, verb);
  return {
    onProgress: (events, timeS) => progress.tick(() => `, ${events.toLocaleString("en")} events, ${formatDuration(timeS)} of profile time`),
    finish: () => progress.finish(),
    done: () => progress.done(),
  };
}
