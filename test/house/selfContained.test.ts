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

// Word boundaries keep a word that merely contains "issue" from matching by accident. The names
// are assembled from pieces so that this file does not itself hold the words it forbids.
const ISSUE = "[Ii]" + "ssue";
const OUTSIDE_REFERENCE = new RegExp(
  [`\\b${ISSUE}[ -#]*\\d+`, "\\bis" + "sue's\\b", "\\bbrief's\\b", "\\bthe brief\\b", "\\bDES" + "IGN(?: ?§|\\.md)", "\\bTOOL" + "CHAIN\\b", "\\bSTY" + "LE\\.md\\b"].join("|"),
);

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
    const caught = ["// Is" + "sue 6, item 4: the rule", "see DES" + "IGN §3", "(is" + "sue 12)", "the bri" + "ef's bound", "the is" + "sue's bound", "TOOL" + "CHAIN.md measured"];
    for (const line of caught) expect(OUTSIDE_REFERENCE.test(line)).toBe(true);
    for (const line of ["// the issues of a long history", "tis" + "sue 3", "a design note in docs/design.md"]) expect(OUTSIDE_REFERENCE.test(line)).toBe(false);
  });
});
