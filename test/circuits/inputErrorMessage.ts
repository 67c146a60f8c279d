import { InputError } from "../../src/internal.js";

/**
 * The message of the InputError a call throws, for exact comparison ("no error" when it returns,
 * the error's name and message when it throws something else).
 */
export function inputErrorMessage(call: () => unknown): string {
  try {
    call();
  } catch (e) {
    return e instanceof InputError ? e.message : `${(e as Error).name}: ${(e as Error).message}`;
  }
  return "no error";
}
