import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, test } from "vitest";

// The project explains itself: no source, test or document may send its reader to a text that is
// not in the repository (an issue tracker entry, an outside design note). Reasons are written
// where they apply, or in docs/design.md. This scan reads every text file of src/, test/, docs/
// and the two guides and lists each offending line, so a failure says exactly what to rewrite.

const ROOT = join(import.meta.dirname, "..", "..");

/** Every file below a folder (the folders scanned hold only source and text). */
function filesBelow(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesBelow(path) : [path];
  });
}

// Word boundaries keep "tissue 3" or "issues 200" of generated data from matching by accident.
const OUTSIDE_REFERENCE = /\b[Ii]ssue[ -#]*\d+|\bissue's\b|\bbrief's\b|\bthe brief\b|\bDESIGN(?: ?§|\.md)|\bTOOLCHAIN\b|\bSTYLE\.md\b/;

describe("self-contained sources", () => {
  test("no comment, test or doc refers to an issue number or a design document outside the repository", () => {
    const files = [...filesBelow(join(ROOT, "src")), ...filesBelow(join(ROOT, "test")), ...filesBelow(join(ROOT, "docs")), join(ROOT, "README.md"), join(ROOT, "DEVELOPERS.md")]
      .filter((f) => /\.(ts|md|yaml|csv|c|h|py)$/.test(f) && !f.endsWith("selfContained.test.ts"));
    const hits: string[] = [];
    for (const file of files) {
      readFileSync(file, "utf8")
        .split("\n")
        .forEach((line, i) => {
          if (OUTSIDE_REFERENCE.test(line)) hits.push(`${relative(ROOT, file)}:${i + 1}: ${line.trim()}`);
        });
    }
    expect(hits).toEqual([]);
  });

  test("the scan's pattern catches the forms it is meant to catch", () => {
    for (const line of ["// Issue 6, item 4: the rule", "see DESIGN §3", "(issue 12)", "the brief's bound", "TOOLCHAIN.md measured"]) expect(OUTSIDE_REFERENCE.test(line)).toBe(true);
    for (const line of ["// the issues of a long history", "tissue", "a design note in docs/design.md"]) expect(OUTSIDE_REFERENCE.test(line)).toBe(false);
  });
});
