import { ProgressLine } from "../report/ProgressLine.js";
import { formatDuration } from "../text/formatTable.js";
import type { CliIo } from "./CliIo.js";

/**
 * Progress of a long simulation for the CLI: on an interactive terminal (CliIo.progress), a line
 * on stderr with the events simulated so far and the profile time reached, after the first second
 * (ProgressLine); elsewhere nothing. Call `done` when the run ends, also on an error, so what
 * follows starts on a clean line.
 */
export function simulationProgress(io: CliIo, verb: string): { onProgress?: (events: number, timeS: number) => void; done: () => void } {
  if (io.progress === undefined) return { done: () => {} };
  const line = new ProgressLine(io.progress);
  return {
    onProgress: (events, timeS) => line.update(() => `heatledger: ${verb}: ${events.toLocaleString("en")} events, ${formatDuration(timeS)} of profile time`),
    done: () => line.done(),
  };
}
