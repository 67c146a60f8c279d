import { describeFound, inputError } from "../errors/InputError.js";

/**
 * Check a circuit parameter is a finite number > 0 (or ≥ 0 with `allowZero`).
 * Cost O(1).
 * @throws InputError `not-finite` or `out-of-range` naming `field`, with `expected` in words
 */
export function requirePositive(value: number | undefined, field: string, expected: string, allowZero = false): asserts value is number {
  if (typeof value !== "number" || Number.isNaN(value) || !Number.isFinite(value))
    throw inputError("not-finite", field, expected, describeFound(value));
  if (allowZero ? value < 0 : !(value > 0)) throw inputError("out-of-range", field, expected, describeFound(value));
}
