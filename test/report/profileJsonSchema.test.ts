import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { Ajv } from "ajv";
import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { shortedBusProfile } from "../helpers/shortedBusProfile.js";
import { PROFILE_REFERENCE_COMMAND, profileJsonSchemaText, profileSchema } from "../../src/internal.js";

// docs/profile.schema.json is generated from the zod profile schema. Its checks are made with an
// outside, general-purpose JSON Schema validator (ajv, draft-07), not with our own code: it must
// accept every bundled duty profile and reject broken ones that zod rejects too. Units and
// numeric ranges are refinements no JSON Schema keyword can follow (a unit string is parsed);
// the schema leaves them to loadProfile, so no broken profile below relies on them.

const ROOT = join(import.meta.dirname, "..", "..");
const SCHEMA_LINE = "# yaml-language-server: $schema=../docs/profile.schema.json";
const committed = readFileSync(join(ROOT, "docs", "profile.schema.json"), "utf8");
const validate = new Ajv({ allErrors: true, strict: true, allowUnionTypes: true }).compile(JSON.parse(committed) as object);

/** Bundled duty profiles: profiles/*.yaml (studies/, parts/ and networks/ hold other formats). */
const dutyProfiles = readdirSync(join(ROOT, "profiles")).filter((name) => name.endsWith(".yaml"));

// shortedBusProfile's invented profile, with a bare `power-up:` (null in YAML) and a nested repeat
const BASE = shortedBusProfile("  - power-up:\n  - run: 10 s\n  - repeat: { count: 3, events: [{ wait: 5 s }, { power-up: {} }] }");
const PARTS = "parts:\n  - id: r\n    role: resistor\n    network: { form: foster, stages: [{ r: 2 K/W, tau: 5 s }] }\n    limits: { maxTemperature: 100 degC, margin: 10 K }\n";

const edit = (from: string, to: string): unknown => {
  if (!BASE.includes(from)) throw new Error(`test setup: "${from}" not in the base profile`);
  return parse(BASE.replace(from, to)) as unknown;
};

describe("docs/profile.schema.json", () => {
  test("is what the generator makes from the profile schema", () => {
    expect(committed === profileJsonSchemaText(), `docs/profile.schema.json is stale: run ${PROFILE_REFERENCE_COMMAND}`).toBe(true);
  });

  test("the base profile of these checks is valid for zod and for ajv", () => {
    const data = parse(BASE) as unknown;
    expect(profileSchema.safeParse(data).success).toBe(true);
    expect(validate(data), JSON.stringify(validate.errors)).toBe(true);
  });

  test.each(dutyProfiles)("ajv accepts the bundled duty profile %s, which names the schema on its first line", (name) => {
    const text = readFileSync(join(ROOT, "profiles", name), "utf8");
    expect(text.split("\n")[0]).toBe(SCHEMA_LINE);
    const data = parse(text) as unknown;
    // the line is a YAML comment: the parsed profile is the same without it
    expect(parse(text.slice(SCHEMA_LINE.length + 1)) as unknown).toEqual(data);
    expect(profileSchema.safeParse(data).success).toBe(true);
    expect(validate(data), JSON.stringify(validate.errors)).toBe(true);
  });

  test.each([
    ["a misspelt top-level key", edit("ambient: 25 degC", "ambeint: 25 degC"), "additionalProperties"],
    ["a misspelt circuit key", edit("resistance: 48 ohm", "resistence: 48 ohm"), "additionalProperties"],
    ["a missing parts list", edit(PARTS, ""), "required"],
    ["an empty parts list", edit(PARTS, "parts: []\n"), "minItems"],
    ["a list where a section belongs", edit("completion: { fraction: 0.95, timeout: 500 ms }", "completion: [0.95, 500 ms]"), "type"],
    ["a section where a quantity belongs", edit("busVoltage: 48 V", "busVoltage: { value: 48 }"), "type"],
    ["a fractional repeat count", edit("count: 3", "count: 2.5"), "type"],
    ["an unknown topology", edit("topology: series-resistor", "topology: series-resistr"), "enum"],
    ["an event with two keys", edit("  - run: 10 s", "  - { run: 10 s, wait: 2 s }"), "maxProperties"],
    ["an event with no key", edit("  - run: 10 s", "  - {}"), "minProperties"],
  ])("zod and ajv both reject %s", (_what, data, keyword) => {
    expect(profileSchema.safeParse(data).success).toBe(false);
    expect(validate(data)).toBe(false);
    expect(validate.errors?.map((e) => e.keyword)).toContain(keyword);
  });
});
