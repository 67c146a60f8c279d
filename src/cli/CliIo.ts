import { existsSync } from "node:fs";
import { outputPathProblem, readBoundedTextFile, writeFileAtomically } from "./fileSystemIo.js";

/** Everything the CLI does to the outside world, so commands can be tested in process. */
export interface CliIo {
  /** write to standard output (text is written as given; add your own newline) */
  readonly out: (text: string) => void;
  /** write to standard error */
  readonly err: (text: string) => void;
  /** read a UTF-8 text file (the process's: bounded in size, regular files only, strict UTF-8) */
  readonly readFile: (path: string) => string;
  /** write a UTF-8 text file (the process's: atomically, through a temporary file renamed over it) */
  readonly writeFile: (path: string, text: string) => void;
  /** whether a path exists (commands refuse to overwrite without --force) */
  readonly exists: (path: string) => boolean;
  /** why an output path cannot be written (a folder, a missing or read-only folder), checked before a run; absent: no check */
  readonly outputProblem?: (path: string) => string | undefined;
  /** terminal width in columns, for charts and tables */
  readonly columns: number;
  /** raw writes for a progress line on an interactive terminal (stderr); absent when stderr is not one */
  readonly progress?: (text: string) => void;
}

/**
 * Exit status: bad input (file, field or flag). A run's other exit statuses follow its verdict
 * (src/stress/Verdict.ts, verdictExitStatus: 0 for pass and warn, 1 for fail and, under --strict,
 * for warn).
 */
export const EXIT_INPUT = 2;

let pipesGuarded = false;

/**
 * When the reader of stdout or stderr goes away early (`heatledger ... | head`), writes fail with
 * EPIPE: stop quietly with the exit status set so far, as command-line tools do (common practice),
 * instead of Node's unhandled-error stack trace. Other stream errors are rethrown. Installed once.
 */
function guardClosedPipes(): void {
  if (pipesGuarded) return;
  pipesGuarded = true;
  for (const stream of [process.stdout, process.stderr])
    stream.on("error", (error: NodeJS.ErrnoException) => {
      if (error.code !== "EPIPE") throw error;
      process.exit(typeof process.exitCode === "number" ? process.exitCode : 0);
    });
}

/** The real process: stdout, stderr, the file system, the terminal width and, when stderr is a terminal, progress. */
export function processIo(): CliIo {
  guardClosedPipes();
  return {
    out: (text) => process.stdout.write(text),
    err: (text) => process.stderr.write(text),
    readFile: readBoundedTextFile,
    writeFile: writeFileAtomically,
    exists: (path) => existsSync(path),
    outputProblem: outputPathProblem,
    columns: process.stdout.columns ?? 100,
    ...(process.stderr.isTTY ? { progress: (text: string) => void process.stderr.write(text) } : {}),
  };
}
