import { Command, CommanderError } from "commander";
import { InputError, describeFound, formatInputProblem, inputError } from "../errors/InputError.js";
import { type CliIo, EXIT_INPUT, PIPED_COLUMNS, processIo } from "./CliIo.js";
import { COMMANDS } from "./commands/registry.js";
import { terminalSafeIo } from "./terminalSafeIo.js";

/** Shared state of one CLI run: the io and the exit status a command sets. */
export interface CliRun {
  /** replaced once before a command runs when --width is given (its columns) */
  io: CliIo;
  status: number;
}

/** The narrowest and widest --width accepted [columns]. */
export const WIDTH_RANGE = { min: 60, max: 400 } as const;

/**
 * Build the heatledger command tree (a factory, so tests run it in process). Commander's own
 * errors are turned into exceptions (exitOverride) and its output goes through io. When the
 * first of `argv` names a command, only that command is registered (a run parses only its own
 * flags, and building every command's options and help costs start-up time); else all are, for
 * `--help`, `help CMD` and commander's "did you mean" suggestions.
 */
export function createProgram(run: CliRun, argv: readonly string[] = []): Command {
  const program = new Command("heatledger")
    .description(
      "Thermal history of DC-link pre-charge parts under repeated power-up, fault and retry events:\n" +
        "exact superposition on Foster/Cauer networks, peak temperatures, margins and verdicts.",
    )
    .version("0.1.0", "-V, --version", "print the version")
    .exitOverride()
    .configureOutput({ writeOut: (t) => run.io.out(t), writeErr: (t) => run.io.err(t), outputError: (t, write) => write(t) })
    .showHelpAfterError("(run with --help for usage)")
    .option("--width <columns>", `width of the text reports (default: the terminal's; ${PIPED_COLUMNS} when the output is not a terminal)`)
    .hook("preAction", () => {
      const text = program.opts<{ width?: string }>().width;
      if (text === undefined) return;
      const columns = Number(text);
      if (!Number.isInteger(columns) || columns < WIDTH_RANGE.min || columns > WIDTH_RANGE.max)
        throw inputError("bad-option", "--width", `a whole number of columns from ${WIDTH_RANGE.min} to ${WIDTH_RANGE.max}`, describeFound(text));
      run.io = { ...run.io, columns };
    });
  const named = COMMANDS.filter(([name]) => name === argv[0]);
  for (const [, register] of named.length > 0 ? named : COMMANDS) register(program, run);
  return program;
}

/**
 * Run the CLI with arguments (without "node heatledger") and return the exit status:
 * 0 all limits met, 1 a limit is crossed, 2 bad input. Never throws for bad input and never
 * prints a stack trace for it.
 */
export async function runCli(argv: readonly string[], rawIo: CliIo = processIo()): Promise<number> {
  const io = terminalSafeIo(rawIo);
  const run: CliRun = { io, status: 0 };
  const program = createProgram(run, argv);
  try {
    await program.parseAsync(argv as string[], { from: "user" });
    return run.status;
  } catch (error) {
    if (error instanceof CommanderError) {
      return error.exitCode === 0 || error.code === "commander.helpDisplayed" || error.code === "commander.version" ? 0 : EXIT_INPUT;
    }
    if (error instanceof InputError) {
      // loaded on this path only: it parses YAML, which --help never loads
      const { locateProblems } = await import("./locateProblems.js");
      for (const problem of locateProblems(rawIo, error.problems)) io.err(`heatledger: ${formatInputProblem(problem)}\n`);
      return EXIT_INPUT;
    }
    const message = error instanceof Error ? error.message : String(error);
    io.err(`heatledger: internal error: ${message}\n(this is a bug in heatledger; please report it with the input that caused it)\n`);
    return 3;
  }
}
