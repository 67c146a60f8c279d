import { InputError } from "../../src/errors/InputError.js";

/**
 * Run something that must throw an InputError and return its problems as
 * "field: expected X, found Y" joined by "; ". Any other error is rethrown; no error at all fails.
 */
export function inputErrorMessage(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    if (error instanceof InputError) return error.problems.map((p) => `${p.field}: expected ${p.expected}, found ${p.found}`).join("; ");
    throw error;
  }
  throw new Error("no InputError");
}
