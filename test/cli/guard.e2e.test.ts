import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { requireGccRan } from "../helpers/requireGcc.js";

// End to end: the built bin exports the bundled robot's guard (the README's example) and the
// system C compiler (Debian gcc) builds it with every warning an error.
const root = fileURLToPath(new URL("../..", import.meta.url));

describe("heatledger guard, the built bin", () => {
  test("profiles/warehouse-robot-48v.yaml --c: the files compile with gcc -std=c99 -Wall -Wextra -Werror", () => {
    const dir = mkdtempSync(join(tmpdir(), "heatledger-guard-e2e-"));
    const run = spawnSync(process.execPath, ["bin/heatledger.js", "guard", "profiles/warehouse-robot-48v.yaml", "--c", join(dir, "robot_guard")], { cwd: root, encoding: "utf8", env: { ...process.env, NO_COLOR: "1" } });
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    expect(run.stdout).toContain("Verdict: pass (every attempt the guard admitted stays at or below limit − margin).");
    expect(readFileSync(join(dir, "robot_guard.h"), "utf8")).toContain("#define HL_GUARD_Q_FRACTION_BITS 16");
    requireGccRan(spawnSync("gcc", ["-std=c99", "-Wall", "-Wextra", "-Werror", "-O2", "-c", "robot_guard.c", "-o", "robot_guard.o"], { cwd: dir, encoding: "utf8" }));
  });
});
