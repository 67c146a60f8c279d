import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import * as z from "zod";
import { DIMENSIONS, type Dimension, PROFILE_KEY_NOTES, PROFILE_REFERENCE_COMMAND, parseQuantity, profileKeyExample, profileKeyNote, profileKeyRows, profileReferenceMarkdown, profileSchema } from "../../src/internal.js";

// The profile reference (docs/profile-reference.md) is generated from the schema: these checks
// fail when a key is added, renamed or removed without the page and its notes following.

const ROOT = join(import.meta.dirname, "..", "..");
const rows = profileKeyRows();

describe("profile reference page", () => {
  test("docs/profile-reference.md is what the schema and the notes generate", () => {
    const page = readFileSync(join(ROOT, "docs", "profile-reference.md"), "utf8");
    expect(page === profileReferenceMarkdown(), `docs/profile-reference.md is stale: run ${PROFILE_REFERENCE_COMMAND}`).toBe(true);
  });

  test("every key of the schema has a note, and every note names a key", () => {
    const missing = rows.filter((r) => profileKeyNote(r.path) === undefined).map((r) => r.path);
    expect(missing, "keys with no entry in src/report/profileKeyNotes.ts").toEqual([]);
    const starred = new Set(rows.map((r) => r.path.replace(/\[[a-z0-9-]+\]/g, "[*]")));
    const paths = new Set(rows.map((r) => r.path));
    const orphans = Object.keys(PROFILE_KEY_NOTES).filter((k) => !paths.has(k) && !starred.has(k));
    expect(orphans, "notes for keys the schema does not have").toEqual([]);
  });

  test("the walk finds the keys a profile is made of, with their units and whether they are required", () => {
    const byPath = new Map(rows.map((r) => [r.path, r]));
    expect(byPath.get("circuit.capacitance")).toMatchObject({ type: "quantity", unit: "F", required: true });
    expect(byPath.get("parts[].limits.margin")).toMatchObject({ unit: "K", required: false });
    expect(byPath.get("events[].retry.attempts")).toMatchObject({ type: "whole number", required: true });
    expect(byPath.get("events[].repeat.events")?.type).toBe("list of sections, as `events`");
    expect(byPath.get("supervision.corners.capacitance")?.type).toBe("quantity, or a [low, high] pair");
    expect(byPath.get("parts[].lifetime[lesit].activationEnergy")?.required).toBe(false);
    // every key of the schema's own top-level object is listed
    for (const key of Object.keys(profileSchema.shape)) expect(byPath.has(key), key).toBe(true);
  });

  test("every example is accepted by its key's own schema (and raw stress quantities by their unit)", () => {
    const bad: string[] = [];
    for (const row of rows) {
      const note = profileKeyNote(row.path);
      const example = profileKeyExample(row, note);
      if (example === "") continue;
      const value: unknown = parse(`v: ${example}`).v;
      const result = (row.schema as z.ZodType).safeParse(value);
      if (!result.success) bad.push(`${row.path}: ${example}`);
      const dimension = Object.entries(DIMENSIONS).find(([, d]) => d.si === note?.unit)?.[0] as Dimension | undefined;
      if (dimension !== undefined && result.success && !/^(dc|\[)/.test(String(value))) {
        try {
          parseQuantity(value, dimension, row.path);
        } catch {
          bad.push(`${row.path}: ${example} is not ${dimension}`);
        }
      }
    }
    expect(bad).toEqual([]);
  });

  test("every optional key states its default in words", () => {
    const undocumented = rows.filter((r) => !r.required && profileKeyNote(r.path)?.default === undefined).map((r) => r.path);
    // sections that switch a feature on, and list items, need none; plain values do
    const values = undocumented.filter((p) => !rows.find((r) => r.path === p)!.type.startsWith("section") && !rows.find((r) => r.path === p)!.type.startsWith("list") && !rows.find((r) => r.path === p)!.type.startsWith("as "));
    expect(values).toEqual([]);
  });
});
