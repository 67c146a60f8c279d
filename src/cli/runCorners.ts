import type { CircuitModels } from "../profile/CircuitModels.js";
import { defaultCircuitModels } from "../profile/defaultCircuitModels.js";
import type { ProfileCorner } from "../profile/profileCorners.js";
import type { CliIo } from "./CliIo.js";
import { commandProgress } from "./commandProgress.js";

/**
 * Run a command's work once per corner (`--corners` of simulate, size and replay) with a progress
 * line on stderr (terminal only, after a second) that names the corner being run.
 * @param verb the progress line's word ("corners")
 * @param each the work at one corner, given circuit models that tick the progress line
 * @throws InputError what `each` throws
 */
export function runCorners<T>(io: CliIo, corners: readonly ProfileCorner[], verb: string, each: (corner: ProfileCorner, models: CircuitModels) => T): T[] {
  let at = "";
  const progress = commandProgress(io, verb, () => `, corner ${at}`);
  const models = progress.watch(defaultCircuitModels);
  try {
    const out = corners.map((corner) => {
      at = corner.name;
      progress.tick();
      return each(corner, models);
    });
    progress.finish();
    return out;
  } finally {
    progress.done();
  }
}
