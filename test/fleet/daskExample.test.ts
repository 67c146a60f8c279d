import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, test } from "vitest";

// The distributed example (examples/fleet-dask): Dask distributed (Debian python3-distributed and
// python3-dask, the outside engine) maps `heatledger fleet` over partitions of the bundled fleet on
// a local cluster of two worker processes and merges them; the result must be the single run's
// summary byte for byte. .ci/run installs the packages; elsewhere the test skips with a message.
const root = fileURLToPath(new URL("../..", import.meta.url));
const PYTHON = "/usr/bin/python3";
const PROFILE = "profiles/irrigation-pump-decade.yaml";
const FLEET = "profiles/logs/fleet-irrigation";

function daskMissing(): string | undefined {
  if (!existsSync(PYTHON)) return `${PYTHON} is absent (apt-get install -y python3-distributed python3-dask)`;
  const probe = spawnSync(PYTHON, ["-c", "import dask.distributed"], { encoding: "utf8" });
  return probe.status === 0 ? undefined : `Dask distributed is absent from ${PYTHON} (apt-get install -y python3-distributed python3-dask)`;
}

const missing = daskMissing();
if (missing !== undefined) console.warn(`test/fleet/daskExample.test.ts skipped: ${missing}`);
const scratch = mkdtempSync(join(tmpdir(), "heatledger-dask-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe.skipIf(missing !== undefined)("the Dask example gives the single-machine summary", () => {
  test("3 partitions on 2 worker processes, merged: the same NDJSON bytes and the same table as one run", () => {
    const single = spawnSync(process.execPath, ["bin/heatledger.js", "fleet", PROFILE, FLEET, "--ndjson", join(scratch, "single.ndjson")], { cwd: root, encoding: "utf8" });
    expect(single.stderr).toBe("");
    expect(single.status).toBe(2); // two of the bundled logs are broken on purpose
    const dask = spawnSync(PYTHON, ["examples/fleet-dask/run_fleet.py", PROFILE, FLEET, "--partitions", "3", "--out", join(scratch, "dask.ndjson")], {
      cwd: root,
      encoding: "utf8",
      env: { ...process.env, HEATLEDGER_NODE: process.execPath },
    });
    expect(dask.status, dask.stderr).toBe(2);
    const expected = readFileSync(join(scratch, "single.ndjson"), "utf8");
    expect(readFileSync(join(scratch, "dask.ndjson"), "utf8")).toBe(expected);
    expect(expected.split("\n").filter((l) => l !== "").length).toBe(13); // the header and 12 units
    // the table before the "written to" lines is the same too
    const table = (text: string): string => text.slice(0, text.indexOf("Partition: "));
    expect(table(dask.stdout)).toBe(table(single.stdout));
  }, 240_000);
});
