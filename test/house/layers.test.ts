import { readdirSync, readFileSync, statSync } from "node:fs";
import { dirname, join, relative, sep } from "node:path";
import { describe, expect, test } from "vitest";

// The rooms of src/ form layers: a folder may import from its own folder and from folders below
// it, never from one above, so the core can be read (and tested) from the bottom up and no two
// folders depend on each other. The order is the one DEVELOPERS.md documents in its "Layout"
// block (lowest first); this test reads it from there, so the guide and the code cannot drift.

const ROOT = join(import.meta.dirname, "..", "..");
const SRC = join(ROOT, "src");

/** The folder order of DEVELOPERS.md's layout block: lines "  name/  ..." inside the first code block. */
function documentedLayers(guide: string): string[] {
  const block = /## Layout[\s\S]*?```\n([\s\S]*?)```/.exec(guide)?.[1] ?? "";
  return [...block.matchAll(/^ {2}([a-z]+)\/ /gm)].map((m) => m[1]!);
}

function tsFilesBelow(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? tsFilesBelow(path) : name.endsWith(".ts") ? [path] : [];
  });
}

/** The top folder of src/ a file lies in ("" for src/index.ts). */
function roomOf(file: string): string {
  const parts = relative(SRC, file).split(sep);
  return parts.length > 1 ? parts[0]! : "";
}

describe("layers of src/", () => {
  const layers = documentedLayers(readFileSync(join(ROOT, "DEVELOPERS.md"), "utf8"));

  test("DEVELOPERS.md lists every folder of src/ once", () => {
    const folders = readdirSync(SRC).filter((name) => statSync(join(SRC, name)).isDirectory());
    expect([...layers].sort()).toEqual([...folders].sort());
  });

  test("no file under src/ imports from a folder above its own", () => {
    const problems: string[] = [];
    for (const file of tsFilesBelow(SRC)) {
      const room = roomOf(file);
      if (room === "") continue; // src/index.ts is the public API above every room
      const own = layers.indexOf(room);
      for (const m of readFileSync(file, "utf8").matchAll(/(?:from|import)\s*\(?\s*"(\.{1,2}\/[^"]+)"/g)) {
        const target = roomOf(join(dirname(file), m[1]!));
        if (target === "") problems.push(`${relative(ROOT, file)} imports the public index (${m[1]})`);
        else if (layers.indexOf(target) > own) problems.push(`${relative(ROOT, file)} (${room}) imports ${m[1]} (${target}, a higher layer)`);
      }
    }
    expect(problems).toEqual([]);
  });

  test("the layout block is read as an ordered list of folders", () => {
    expect(documentedLayers("## Layout\n\n```\nsrc/\n  errors/  a\n  units/   b\n```\n")).toEqual(["errors", "units"]);
  });
});
