// The project's root folder, found from this file whether the bench runs from its TypeScript
// source or from the compiled copy in .bench-build/ (see package.json "bench").
import { existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

function findRoot(): string {
  let folder = dirname(fileURLToPath(import.meta.url));
  while (!existsSync(join(folder, "package.json"))) {
    const up = dirname(folder);
    if (up === folder) throw new Error("heatledger bench: package.json not found above " + fileURLToPath(import.meta.url));
    folder = up;
  }
  return folder;
}

/** Absolute path of the project root (the folder holding package.json and profiles/). */
export const projectRoot = findRoot();
