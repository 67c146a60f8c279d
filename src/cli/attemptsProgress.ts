import { AttemptCursor } from "../retry/AttemptCursor.js";
import type { CliIo } from "./CliIo.js";
import { type CommandProgress, commandProgress } from "./commandProgress.js";

/**
 * commandProgress for the planners (`retries`, `supervise`): each line also counts the attempts
 * integrated since the command started (AttemptCursor.trialCount).
 */
export function attemptsProgress(io: CliIo, verb: string): CommandProgress {
  const from = AttemptCursor.trialCount;
  return commandProgress(io, verb, () => `, ${(AttemptCursor.trialCount - from).toLocaleString("en")} attempts simulated`);
}
