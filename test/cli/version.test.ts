import { readFileSync } from "node:fs";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { memoryIo } from "../helpers/memoryIo.js";

// `-V` and `--version` print the package's version (package.json) and exit 0, as command-line
// tools commonly do (common practice).
const { version } = JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8")) as { version: string };

describe("the version flags", () => {
  test.each([["-V"], ["--version"]])("%s prints the package version and exits 0", async (flag) => {
    const io = memoryIo();
    expect(await runCli([flag], io)).toBe(0);
    expect(io.stdout.join("")).toBe(`${version}\n`);
    expect(io.stderr).toEqual([]);
  });
});
