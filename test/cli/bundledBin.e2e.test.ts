import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { afterAll, describe, expect, test } from "vitest";

// The bin runs the bundled CLI (dist/bundle/, scripts/bundle-cli.mjs; built with dist/ by
// vitest's global setup). The bundle must be the same program as the unbundled dist/cli/main.js:
// the same output bytes and exit status for the same arguments, and the worker scripts it starts
// must be found where the bundled actions look for them.
const root = fileURLToPath(new URL("../..", import.meta.url));
const temp = mkdtempSync(join(tmpdir(), "heatledger-bundle-"));
afterAll(() => rmSync(temp, { recursive: true, force: true }));
// the bin's two lines, on the unbundled dist/cli/main.js
const unbundledBin = join(temp, "unbundled.mjs");
writeFileSync(unbundledBin, `const { runCli } = await import(${JSON.stringify(pathToFileURL(join(root, "dist/cli/main.js")).href)});\nprocess.exitCode = await runCli(process.argv.slice(2));\n`);

function run(bundled: boolean, args: readonly string[]): { status: number | null; stdout: string; stderr: string } {
  const argv = [bundled ? "bin/heatledger.js" : unbundledBin, ...args];
  const child = spawnSync(process.execPath, argv, { cwd: root, encoding: "utf8", maxBuffer: 1 << 28, env: { ...process.env, NO_COLOR: "1" } });
  return { status: child.status, stdout: child.stdout, stderr: child.stderr };
}

describe("the bundled bin and the unbundled CLI are the same program", () => {
  test("the bundle was built beside dist/", () => {
    expect(existsSync(`${root}dist/bundle/cli/main.js`)).toBe(true);
    expect(existsSync(`${root}dist/bundle/cli/monteCarloWorker.js`)).toBe(true);
  });

  test("zod is tree-shaken: only its English messages are in the bundle, no other locale", () => {
    // `import { z } from "zod"` (a namespace re-exported as a value) keeps all of zod, its 60-odd
    // message locales with it, some 550 KB more for simulate to compile; `import * as z` does not
    const folder = `${root}dist/bundle/cli/commands`;
    const text = readdirSync(folder).map((file) => readFileSync(join(folder, file), "utf8")).join("\n");
    const locales = [...new Set(text.match(/zod\/v4\/locales\/[\w-]+\.js/g) ?? [])];
    expect(locales).toEqual(["zod/v4/locales/en.js"]);
  });

  test.each([
    [["simulate", "profiles/warehouse-robot-48v.yaml"]],
    [["simulate", "profiles/home-storage-400v.yaml", "--json"]],
    [["retries", "profiles/warehouse-robot-48v.yaml", "--json"]],
    [["simulate", "profiles/no-such-profile.yaml"]],
    [["--help"]],
  ])("%j: same stdout, stderr and exit status", { timeout: 120_000 }, (args) => {
    const unbundled = run(false, args);
    const bundled = run(true, args);
    expect(bundled).toEqual(unbundled);
    expect(bundled.stdout.length + bundled.stderr.length).toBeGreaterThan(0);
  });

  test("montecarlo on two worker threads finds the bundled worker script", { timeout: 120_000 }, () => {
    const args = ["montecarlo", "profiles/warehouse-robot-48v.yaml", "--vary", "circuit.resistance=tolerance 5%", "--samples", "40", "--seed", "7", "--workers", "2", "--json"];
    const bundled = run(true, args);
    expect(bundled.stderr).toBe("");
    expect([0, 1]).toContain(bundled.status);
    // 16 samples per worker at least: 40 samples on two workers ran in the pool
    expect((JSON.parse(bundled.stdout) as { workers: number }).workers).toBe(2);
    expect(bundled).toEqual(run(false, args));
  });
});
