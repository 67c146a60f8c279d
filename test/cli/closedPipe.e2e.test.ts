import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";

// A user piping a report into `head` closes the pipe before heatledger has written everything:
// the CLI must stop quietly (no "write EPIPE" stack trace), as command-line tools do (common
// practice). The JSON of the ten-year bundled profile is megabytes, far more than a pipe holds,
// so its writes are bound to meet the closed pipe. The profile passes, so the status is 0, as unpiped.
const root = fileURLToPath(new URL("../..", import.meta.url));

describe("the built bin when its output pipe closes early", () => {
  test("simulate --json into a reader that stops at once: no stack trace, exit 0", { timeout: 120_000 }, async () => {
    const child = spawn(process.execPath, ["bin/heatledger.js", "simulate", "profiles/irrigation-pump-decade.yaml", "--json"], { cwd: root });
    let stderr = "";
    child.stderr.setEncoding("utf8").on("data", (t: string) => (stderr += t));
    // read the first chunk, then close our end, as `head -1` does
    child.stdout.once("data", () => child.stdout.destroy());
    const status = await new Promise<number | null>((resolve) => child.on("close", (code) => resolve(code)));
    expect(stderr).not.toMatch(/EPIPE|at .*\(|node:internal/);
    expect(status).toBe(0);
  });
});
