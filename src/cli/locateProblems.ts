import type { InputProblem } from "../errors/InputError.js";
import { parseStructuredText } from "../format/parseStructuredText.js";
import type { CliIo } from "./CliIo.js";

/**
 * Give a line to the problems that name a YAML/JSON file and a field but no line: those raised
 * while a loaded profile runs (a repeat's period overrun, a run past the longest profile, a circuit
 * model's refusal), when the profile's text is no longer at hand. The file is read and parsed
 * again, only on this error path, and each field is looked up (`lineOf`); a file that cannot be
 * read or parsed leaves its problems as they were.
 * Cost: one parse per file named, on error only.
 */
export function locateProblems(io: CliIo, problems: readonly InputProblem[]): InputProblem[] {
  const lineOf = new Map<string, ((field: string) => number) | undefined>();
  const lookup = (file: string): ((field: string) => number) | undefined => {
    if (!lineOf.has(file)) {
      try {
        lineOf.set(file, parseStructuredText(io.readFile(file), file).lineOf);
      } catch {
        lineOf.set(file, undefined);
      }
    }
    return lineOf.get(file);
  };
  return problems.map((p) => {
    if (p.line > 0 || p.field === "" || p.field.startsWith("-") || !/\.(ya?ml|json)$/i.test(p.file)) return p;
    const line = lookup(p.file)?.(p.field) ?? 0;
    return line > 0 ? { ...p, line } : p;
  });
}
