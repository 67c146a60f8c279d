import type * as z from "zod";
import { type InputProblem, describeFound } from "../errors/InputError.js";
import { unknownKeyExpectation } from "../errors/nearestKey.js";
import { join } from "../format/FieldReader.js";
import { profileSchema } from "./profileSchema.js";

/*
 * Schema problems in words: zod's issues on a profile turned into InputProblems with the file,
 * line, field path, what was expected (the valid keys, the nearest one to a typo) and what was found.
 * Part of loading a profile (loadProfile.ts orchestrates).
 */
export function issueToProblems(issue: z.core.$ZodIssue, file: string, lineOf: (field: string) => number): InputProblem[] {
  const field = issue.path.reduce<string>((f, key) => join(f, typeof key === "number" ? key : String(key)), "");
  const input = (issue as { input?: unknown }).input;
  const at = (f: string, expected: string, found: string, code: InputProblem["code"] = "bad-profile"): InputProblem => ({ code, file, line: lineOf(f), field: f, expected, found });
  switch (issue.code) {
    case "unrecognized_keys": {
      const valid = keysAt(issue.path);
      return issue.keys.map((key) => at(join(field, key), unknownKeyExpectation(key, valid), "an unknown key"));
    }
    case "custom": {
      const params = issue.params as { expected?: string; found?: string } | undefined;
      const code = issue.message === "quantity" ? "bad-quantity" : issue.message === "range" ? "out-of-range" : "bad-profile";
      return [at(field, params?.expected ?? issue.message, params?.found ?? describeFound(input), code)];
    }
    case "invalid_type":
      if (input === undefined) return [at(field, `${typeWords(issue.expected)} (required)`, "nothing")];
      return [at(field, typeWords(issue.expected), describeFound(input))];
    case "invalid_value": {
      const values = issue.values.map(String);
      const guess = typeof input === "string" ? unknownKeyExpectation(input, values).replace(/^one of the keys /, "one of ") : `one of ${values.join(", ")}`;
      return [at(field, guess, describeFound(input))];
    }
    case "too_small":
      return [at(field, issue.origin === "array" ? `at least ${String(issue.minimum)} item${issue.minimum === 1 ? "" : "s"}` : "a non-empty text", describeFound(input))];
    case "invalid_union": {
      // a union that names what it wants (the stress keys' quantities and lifetime models do) says so
      const named = issue.message !== "" && !issue.message.startsWith("Invalid input") ? issue.message : "a valid value";
      return [at(field, field.endsWith("network") ? "a network mapping (form: foster | cauer | graph) or a network file path" : named, describeFound(input))];
    }
    default:
      return [at(field, "a valid value", describeFound(input))];
  }
}

function typeWords(type: string): string {
  switch (type) {
    case "string":
      return "text";
    case "number":
      return "a number";
    case "array":
      return "a list";
    case "object":
      return "a mapping";
    case "tuple":
      return "a [time, power] pair";
    default:
      return type;
  }
}

/** The valid keys of the object schema at a path of the profile schema. */
function keysAt(path: readonly PropertyKey[]): string[] {
  let schema: unknown = profileSchema;
  const unwrap = (s: unknown): unknown => {
    for (;;) {
      const def = (s as { _zod: { def: Record<string, unknown> } })._zod.def;
      if (def.type === "optional" || def.type === "nullable") s = def.innerType;
      else if (def.type === "lazy") s = (def.getter as () => unknown)();
      else if (def.type === "pipe") s = def.in;
      else return s;
    }
  };
  for (const key of path) {
    const def = (unwrap(schema) as { _zod: { def: Record<string, unknown> } })._zod.def;
    if (def.type === "object") schema = (def.shape as Record<string, unknown>)[String(key)];
    else if (def.type === "array") schema = def.element;
    else if (def.type === "tuple") schema = (def.items as unknown[])[Number(key)];
    else return [];
    if (schema === undefined) return [];
  }
  const def = (unwrap(schema) as { _zod: { def: Record<string, unknown> } })._zod.def;
  return def.type === "object" ? Object.keys(def.shape as Record<string, unknown>) : [];
}
