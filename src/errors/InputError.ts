import { tidyNumbers } from "./tidyNumbers.js";
/**
 * Stable codes for every kind of bad input heatledger can report. The CLI maps each of them to
 * exit status 2 and prints one line per problem.
 */
export type InputErrorCode =
  | "bad-quantity"
  | "wrong-dimension"
  | "unknown-unit"
  | "not-finite"
  | "out-of-range"
  | "bad-network"
  | "bad-trace"
  | "bad-file"
  | "bad-profile"
  | "bad-option";

/** One problem with one field of the user's input. */
export interface InputProblem {
  readonly code: InputErrorCode;
  /** Where the value came from: a file path, or "" for a value given directly. */
  readonly file: string;
  /** 1-based line in the file when known, else 0. */
  readonly line: number;
  /** Dotted field path, for example `parts[0].network.stages[2].r`. */
  readonly field: string;
  /** What a correct value looks like, in words ("a capacitance such as 4.7 mF"). */
  readonly expected: string;
  /** What was found, quoted as the user wrote it. */
  readonly found: string;
}

/**
 * Bad input: one or more problems, each naming the file, field, what was expected and what was
 * found. Thrown by the core; the CLI prints {@link formatInputProblem} for each problem and exits
 * with status 2. Never carries a stack trace to the user.
 * @example
 * const problem = { code: "bad-unit", file: "p.yaml", line: 7, field: "circuit.resistance", expected: "a resistance", found: '"22 V"' };
 * new InputError(problem).message // => 'p.yaml:7: circuit.resistance: expected a resistance, found "22 V"'
 */
export class InputError extends Error {
  readonly problems: readonly InputProblem[];

  constructor(problems: InputProblem | readonly InputProblem[]) {
    const list = Array.isArray(problems) ? (problems as readonly InputProblem[]) : [problems as InputProblem];
    super(list.map(formatInputProblem).join("\n"));
    this.name = "InputError";
    this.problems = list;
  }

  /** The code of the first problem, for callers that branch on a single kind. */
  get code(): InputErrorCode {
    return this.problems[0]?.code ?? "bad-profile";
  }
}

/**
 * Build an {@link InputError} for one field, with file and line left for an outer layer to fill in.
 * @param code stable error code
 * @param field dotted field path
 * @param expected what a correct value looks like
 * @param found what was found (quoted as written)
 */
export function inputError(code: InputErrorCode, field: string, expected: string, found: string): InputError {
  return new InputError({ code, file: "", line: 0, field, expected, found });
}

/**
 * One line per problem: `file:line: field: expected X, found Y`, with floating-point noise taken
 * out of the numbers (tidyNumbers).
 * Example: `profiles/a.yaml:12: circuit.capacitance: expected a capacitance such as 4.7 mF, found "4.7 mV" (a voltage)`
 * @example
 * const problem = { code: "bad-unit", file: "p.yaml", line: 7, field: "circuit.resistance", expected: "a resistance", found: '"22 V"' };
 * formatInputProblem(problem) // => 'p.yaml:7: circuit.resistance: expected a resistance, found "22 V"'
 */
export function formatInputProblem(problem: InputProblem): string {
  const where = problem.file === "" ? "" : problem.line > 0 ? `${problem.file}:${problem.line}: ` : `${problem.file}: `;
  const field = problem.field === "" ? "" : `${problem.field}: `;
  return `${where}${field}expected ${tidyNumbers(problem.expected)}, found ${tidyNumbers(problem.found)}`;
}

/**
 * Re-home the problems of an error raised deep in the core onto a file and a field prefix.
 * @param error the error to re-home
 * @param file the file the values came from
 * @param prefix field path prefix to prepend (for example `parts[1]`)
 * @param lineOf optional lookup from a full field path to a line number
 */
export function withLocation(
  error: InputError,
  file: string,
  prefix = "",
  lineOf: (field: string) => number = () => 0,
): InputError {
  return new InputError(
    error.problems.map((p) => {
      const field = prefix === "" ? p.field : p.field === "" ? prefix : p.field.startsWith("[") ? `${prefix}${p.field}` : `${prefix}.${p.field}`;
      return { ...p, file: p.file === "" ? file : p.file, field, line: p.line > 0 ? p.line : lineOf(field) };
    }),
  );
}

/** Quote a found value for a message: strings in double quotes, everything else as JSON. */
export function describeFound(value: unknown): string {
  if (value === undefined) return "nothing";
  if (typeof value === "string") return JSON.stringify(value);
  if (typeof value === "number") return Number.isNaN(value) ? "NaN" : String(value);
  try {
    const text = JSON.stringify(value);
    return text.length > 60 ? `${text.slice(0, 57)}...` : text;
  } catch {
    return String(value);
  }
}
