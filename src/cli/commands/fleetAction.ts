import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { describeFound, inputError } from "../../errors/InputError.js";
import { fleetHeader } from "../../fleet/FleetHeader.js";
import type { FleetUnitRow } from "../../fleet/FleetUnitRow.js";
import { FLEET_DEFAULTS } from "../../fleet/fleetDefaults.js";
import { fleetSummary } from "../../fleet/fleetSummary.js";
import { commandProgress } from "../commandProgress.js";
import { type FleetLogRef, collectFleetLogs } from "../collectFleetLogs.js";
import { type FleetTask, replayFleetLogs } from "../fleetWorker.js";
import type { CliRun } from "../main.js";
import { readProfileFile } from "../readProfileFile.js";
import { checkFleetOutputs, writeFleetSummary } from "../writeFleetSummary.js";
import type { FleetFlags } from "./fleet.js";

/** A positive number option, or undefined when not given. */
function positiveOption(text: string | undefined, option: string, words: string): number | undefined {
  if (text === undefined) return undefined;
  const n = Number(text);
  if (!(Number.isFinite(n) && n > 0)) throw inputError("bad-option", option, words, describeFound(text));
  return n;
}

/**
 * The run of `heatledger fleet PROFILE LOGS...` (flags and help in fleet.ts): collect the logs,
 * read the profile (and record the texts it reads, for the worker threads and the header's
 * digest), replay every unit (in this thread with one worker, else over a pool of worker threads
 * running the compiled dist/cli/fleetWorker.js), rank the rows and write the outputs.
 * @throws InputError for a bad profile, option, list file or glob, a unit id given twice, or an
 *   output file that exists without --force (a bad log is a broken row, not an error)
 */
export async function fleetAction(run: CliRun, profileFile: string, args: readonly string[], options: FleetFlags): Promise<void> {
  const top = checkFleetOutputs(run, options);
  const logsPerYear = positiveOption(options.logsPerYear, "--logs-per-year", "a number of logs per year > 0 such as 52");
  const logs = collectFleetLogs(run.io, args, options.list ?? []);
  const fallback = Math.max(1, Math.min(availableParallelism(), Math.floor(logs.length / FLEET_DEFAULTS.unitsPerWorker)));
  const asked = positiveOption(options.workers, "--workers", "a whole number of worker threads ≥ 1");
  if (asked !== undefined && !Number.isSafeInteger(asked)) throw inputError("bad-option", "--workers", "a whole number of worker threads ≥ 1", describeFound(options.workers));
  const workers = Math.min(asked ?? fallback, logs.length);
  const texts = new Map<string, string>();
  const recording = { ...run.io, readFile: (path: string) => {
    const text = run.io.readFile(path);
    texts.set(path, text);
    return text;
  } };
  const profile = readProfileFile(recording, profileFile);
  const profileText = texts.get(profileFile)!;
  const header = fleetHeader(profile, profileText, [...texts].filter(([path]) => path !== profileFile).map(([, text]) => text), logsPerYear);
  let done = 0;
  const progress = commandProgress(run.io, "fleet", () => `, ${done} of ${logs.length} units`);
  let rows: FleetUnitRow[];
  try {
    if (workers === 1) rows = replayFleetLogs(run.io, profile, logs, logsPerYear, () => ((done += 1), progress.tick()));
    else {
      const task = (batch: readonly FleetLogRef[]): FleetTask => ({ profileFile, profileTexts: [...texts], logsPerYear, logs: batch });
      rows = await runInPool(task, logs, workers, (n) => ((done += n), progress.tick()));
    }
    progress.finish();
  } finally {
    progress.done();
  }
  await writeFleetSummary(run, fleetSummary(header, rows), options, top);
}

/** The compiled worker module: beside this one in dist/, or dist/ of the package when running from src/. */
function workerFile(): string {
  const here = fileURLToPath(new URL("../fleetWorker.js", import.meta.url));
  return existsSync(here) ? here : join(dirname(here), "..", "..", "dist", "cli", "fleetWorker.js");
}

/** The units in small batches over a pool of worker threads (piscina); rows come back in any order (the summary ranks them). */
async function runInPool(task: (batch: readonly FleetLogRef[]) => FleetTask, logs: readonly FleetLogRef[], workers: number, onBatch: (n: number) => void): Promise<FleetUnitRow[]> {
  const { Piscina } = await import("piscina");
  const pool = new Piscina({ filename: workerFile(), minThreads: workers, maxThreads: workers, idleTimeout: 100 });
  try {
    const jobs: Promise<FleetUnitRow[]>[] = [];
    for (let from = 0; from < logs.length; from += FLEET_DEFAULTS.unitsPerTask) {
      const batch = logs.slice(from, from + FLEET_DEFAULTS.unitsPerTask);
      jobs.push(
        (pool.run(task(batch)) as Promise<FleetUnitRow[]>).then((r) => {
          onBatch(r.length);
          return r;
        }),
      );
    }
    return (await Promise.all(jobs)).flat();
  } finally {
    await pool.destroy();
  }
}
