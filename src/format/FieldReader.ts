import { InputError, type InputProblem, describeFound } from "../errors/InputError.js";
import { unknownKeyExpectation } from "../errors/nearestKey.js";
import type { Dimension } from "../units/dimensions.js";
import { parseQuantity } from "../units/parseQuantity.js";

/**
 * Reads plain data (from YAML or JSON) field by field, collecting every problem instead of
 * stopping at the first, so a user sees all bad fields of a file at once. Call {@link done} at the
 * end: it throws one InputError with every problem, or returns.
 */
export class FieldReader {
  private readonly problems: InputProblem[] = [];

  /** Record a problem at a field. */
  fail(code: InputProblem["code"], field: string, expected: string, found: string): void {
    this.problems.push({ code, file: "", line: 0, field, expected, found });
  }

  /** Record every problem of an InputError raised by a nested parser. */
  absorb(error: unknown): void {
    if (error instanceof InputError) this.problems.push(...error.problems);
    else throw error;
  }

  /** Whether any problem has been recorded. */
  get failed(): boolean {
    return this.problems.length > 0;
  }

  /** Throw all recorded problems as one InputError, if any. */
  done(): void {
    if (this.problems.length > 0) throw new InputError(this.problems);
  }

  /**
   * A mapping with only the allowed keys; unknown keys are reported with the nearest valid key.
   * @returns the record, or undefined (problem recorded) when raw is not a mapping
   */
  record(raw: unknown, field: string, allowed: readonly string[], required: readonly string[] = []): Record<string, unknown> | undefined {
    if (raw === null || typeof raw !== "object" || Array.isArray(raw)) {
      this.fail("bad-profile", field, `a mapping with keys ${allowed.join(", ")}`, describeFound(raw));
      return undefined;
    }
    const record = raw as Record<string, unknown>;
    for (const key of Object.keys(record)) {
      if (!allowed.includes(key)) this.fail("bad-profile", join(field, key), unknownKeyExpectation(key, allowed), "an unknown key");
    }
    for (const key of required) {
      if (record[key] === undefined) this.fail("bad-profile", join(field, key), "this key (required)", "nothing");
    }
    return record;
  }

  /** A list; undefined (problem recorded) otherwise. */
  list(raw: unknown, field: string, what: string, minLength = 0): unknown[] | undefined {
    if (!Array.isArray(raw)) {
      this.fail("bad-profile", field, `a list of ${what}`, describeFound(raw));
      return undefined;
    }
    if (raw.length < minLength) {
      this.fail("bad-profile", field, `at least ${minLength} ${what}`, `${raw.length}`);
      return undefined;
    }
    return raw;
  }

  /** A quantity in SI (see parseQuantity); NaN (problem recorded) when bad. */
  quantity(raw: unknown, dimension: Dimension, field: string, check?: { min?: number; exclusiveMin?: number; max?: number }): number {
    try {
      const value = parseQuantity(raw, dimension, field);
      if (check?.exclusiveMin !== undefined && !(value > check.exclusiveMin)) {
        this.fail("out-of-range", field, `a value > ${check.exclusiveMin}`, describeFound(raw));
        return Number.NaN;
      }
      if (check?.min !== undefined && !(value >= check.min)) {
        this.fail("out-of-range", field, `a value ≥ ${check.min}`, describeFound(raw));
        return Number.NaN;
      }
      if (check?.max !== undefined && !(value <= check.max)) {
        this.fail("out-of-range", field, `a value ≤ ${check.max}`, describeFound(raw));
        return Number.NaN;
      }
      return value;
    } catch (error) {
      this.absorb(error);
      return Number.NaN;
    }
  }

  /** A non-empty string; "" (problem recorded) otherwise. */
  text(raw: unknown, field: string, what = "a name"): string {
    if (typeof raw !== "string" || raw.trim() === "") {
      this.fail("bad-profile", field, what, describeFound(raw));
      return "";
    }
    return raw;
  }

  /** One of a set of words; undefined (problem recorded) otherwise. */
  choice<T extends string>(raw: unknown, field: string, options: readonly T[]): T | undefined {
    if (typeof raw === "string" && (options as readonly string[]).includes(raw)) return raw as T;
    this.fail("bad-profile", field, `one of ${options.join(", ")}`, describeFound(raw));
    return undefined;
  }
}

/** `a.b` or `a[3]`: join a field path and a key or index. */
export function join(field: string, key: string | number): string {
  if (typeof key === "number") return `${field}[${key}]`;
  return field === "" ? key : `${field}.${key}`;
}
