import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import * as api from "../src/index.js";

// The public API is pinned: adding or removing an export is a deliberate change of
// test/fixtures/public-api.txt (regenerate with the command in its header and review the diff).
describe("src/index.ts", () => {
  test("exports exactly the pinned list of runtime names", () => {
    const pinned = readFileSync(new URL("fixtures/public-api.txt", import.meta.url), "utf8")
      .split("\n")
      .filter((line) => line !== "" && !line.startsWith("#"));
    expect(Object.keys(api).sort()).toEqual(pinned);
  });

  test("importing the built library does not load mathjs (start-up stays fast)", () => {
    // a fresh process: import dist/index.js, then look for mathjs in Node's module cache
    const script = [
      'import "./dist/index.js";',
      'import { createRequire } from "node:module";',
      "const cache = createRequire(import.meta.url).cache;",
      'console.log(Object.keys(cache).some((p) => p.includes("node_modules/mathjs/")));',
    ].join("\n");
    const output = execFileSync(process.execPath, ["--input-type=module", "-e", script], { cwd: fileURLToPath(new URL("..", import.meta.url)), encoding: "utf8" });
    expect(output.trim()).toBe("false");
  });
});
