import { existsSync } from "node:fs";
import type { TextSource } from "../replay/EventLogScanner.js";
import { outputPathProblem, readBoundedStdin, readBoundedTextFile, writeFileAtomically } from "./fileSystemIo.js";
import { fileTextSource } from "./fileTextSource.js";

/** Everything the CLI does to the outside world, so commands can be tested in process. */
export interface CliIo {
  /** write to standard output (text is written as given; add your own newline) */
  readonly out: (text: string) => void;
  /** write to standard error */
  readonly err: (text: string) => void;
  /** read a UTF-8 text file (the process's: bounded in size, regular files only, strict UTF-8) */
  readonly readFile: (path: string) => string;
  /** read standard input to its end as UTF-8 text (the process's: bounded as a file; a terminal is refused); absent: no standard input */
  readonly readStdin?: () => string;
  /** open a text file to be read piece by piece (a long log); absent (in-process tests): readFile serves it whole */
  readonly openText?: (path: string, what: string) => TextSource & { readonly close: () => void };
  /** write a UTF-8 text file (the process's: atomically, through a temporary file renamed over it) */
  readonly writeFile: (path: string, text: string) => void;
  /** whether a path exists (commands refuse to overwrite without --force) */
  readonly exists: (path: string) => boolean;
  /** why an output path cannot be written (a folder, a missing or read-only folder), checked before a run; absent: no check */
  readonly outputProblem?: (path: string) => string | undefined;
  /** width of the text reports in columns: the terminal's, else COLUMNS up to PIPED_COLUMNS, else PIPED_COLUMNS; --width sets it */
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

/** The width of the text reports when standard output is not a terminal (a pipe or a file) [columns]. */
export const PIPED_COLUMNS = 100;

/**
 * The report width: the terminal's when standard output is one; otherwise the COLUMNS variable
 * when it holds a whole number from 40 up, never more than PIPED_COLUMNS; else PIPED_COLUMNS.
 */
export function reportColumns(stdoutColumns: number | undefined, columnsVariable: string | undefined): number {
  if (stdoutColumns !== undefined && stdoutColumns > 0) return stdoutColumns;
  const fromVariable = Number(columnsVariable);
  if (Number.isInteger(fromVariable) && fromVariable >= 40) return Math.min(fromVariable, PIPED_COLUMNS);
  return PIPED_COLUMNS;
}

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
    readStdin: readBoundedStdin,
    openText: fileTextSource,
    writeFile: writeFileAtomically,
    exists: (path) => existsSync(path),
    outputProblem: outputPathProblem,
    columns: reportColumns(process.stdout.isTTY ? process.stdout.columns : undefined, process.env.COLUMNS),
    ...(process.stderr.isTTY ? { progress: (text: string) => void process.stderr.write(text) } : {}),
  };
}
