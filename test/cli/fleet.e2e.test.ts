import { spawnSync } from "node:child_process";
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, truncateSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, test } from "vitest";
import { fleetUnitLog } from "../helpers/fleetUnitLog.js";

// End to end: the built bin on the bundled fleet (twelve invented irrigation units, two of whose
// logs are broken on purpose) and on generated units, with worker threads.
const root = fileURLToPath(new URL("../..", import.meta.url));
const PROFILE = "profiles/irrigation-pump-decade.yaml";
const FLEET = "profiles/logs/fleet-irrigation";
const scratch = mkdtempSync(join(tmpdir(), "heatledger-fleet-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

function heatledger(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ["bin/heatledger.js", ...args], { cwd: root, encoding: "utf8", maxBuffer: 1 << 30, env: { ...process.env, NO_COLOR: "1" } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe("heatledger fleet, the built bin", () => {
  test("the bundled fleet: ranked table within 100 columns, the broken logs with file and line, exit 2", () => {
    const run = heatledger("fleet", PROFILE, FLEET);
    expect(run.stderr).toBe("");
    expect(run.status).toBe(2);
    const lines = run.stdout.split("\n");
    expect(lines[0]).toBe("heatledger fleet: 80 V irrigation pump drive, ten years of daily cycles with occasional faults");
    expect(lines[1]).toBe("12 units: 4 fail, 0 warn, 6 pass, 2 could not be replayed");
    for (const line of lines) expect([...line].length).toBeLessThanOrEqual(100);
    // the two restart storms rank first (above the limit), then the storm stopped at 30 attempts and the shorts (over the rating)
    const ranked = lines.filter((l) => /^ +\d+ {2}unit-\d\d /.test(l)).map((l) => l.trim().split(/ +/)[1]);
    expect(ranked.slice(0, 4)).toEqual(["unit-09", "unit-03", "unit-07", "unit-06"]);
    expect(ranked).toHaveLength(10);
    expect(run.stdout).toMatch(/unit-11: profiles\/logs\/fleet-irrigation\/unit-11\.csv:26: time: expected a time at or after the\s+previous line's/);
    expect(run.stdout).toMatch(/unit-12: profiles\/logs\/fleet-irrigation\/unit-12\.csv:18: event: expected one of the event words[\s\S]*found "powerup"/);
    expect(run.stdout).toContain("unit-07: an event exceeds a part's rating table");
    expect(run.stdout.trimEnd()).toMatch(/not a guarantee of\s+life\.$/);
    expect(run.stdout).not.toMatch(/NaN|Infinity/);
  });

  test("two worker threads give the one-thread NDJSON bit for bit; partitions run apart and merged give it too", () => {
    const logs = join(scratch, "gen");
    mkdirSync(logs);
    const faults = ["none", "storm", "none", "shorts", "none", "backwards", "none", "none"] as const;
    for (let i = 0; i < 40; i++) writeFileSync(join(logs, `g${String(i).padStart(2, "0")}.csv`), fleetUnitLog(i, faults[i % faults.length]!).text);
    // a 2 GB file of zero bytes (sparse): streamed, it is refused at its first line, which runs past
    // the longest line a log may have, without reading the rest; the other units unaffected
    writeFileSync(join(logs, "huge.csv"), "");
    truncateSync(join(logs, "huge.csv"), 2 * 1024 ** 3);
    const one = join(scratch, "one.ndjson");
    const two = join(scratch, "two.ndjson");
    expect(heatledger("fleet", PROFILE, logs, "--ndjson", one, "--workers", "1").status).toBe(2);
    const pooled = heatledger("fleet", PROFILE, logs, "--ndjson", two, "--workers", "2");
    expect(pooled.stderr).toBe("");
    const expected = readFileSync(one, "utf8");
    expect(readFileSync(two, "utf8")).toBe(expected);
    expect(expected).toMatch(/"unit":"huge","file":"[^"]*huge\.csv","verdict":"error","error":\{"code":"bad-file","file":"[^"]*huge\.csv","line":1,"field":"","expected":"lines of at most 1048576 characters \(a CSV text file\)","found":"a longer line"\}\}/);
    expect(expected.split("\n").filter((l) => l.includes('"verdict":"pass"')).length).toBe(25);
    // partitions by glob (the pattern given quoted, expanded by the command) and by a list file
    const a = join(scratch, "a.ndjson");
    const b = join(scratch, "b.ndjson");
    expect(heatledger("fleet", PROFILE, `${logs}/g[0-1]*.csv`, join(logs, "huge.csv"), "--ndjson", a).status).toBe(2);
    const list = join(scratch, "rest.list");
    writeFileSync(list, `# the rest\n${Array.from({ length: 20 }, (_, i) => join(logs, `g${20 + i}.csv`)).join("\n")}\n`);
    expect(heatledger("fleet", PROFILE, "--list", list, "--ndjson", b).status).toBe(2);
    const merged = join(scratch, "merged.ndjson");
    expect(heatledger("fleet", "merge", b, a, "--ndjson", merged).status).toBe(2);
    expect(readFileSync(merged, "utf8")).toBe(expected);
    // the JSON of the merge and of the single run agree too
    expect(heatledger("fleet", "merge", a, b, "--json").stdout).toBe(heatledger("fleet", PROFILE, logs, "--json", "--workers", "2").stdout);
  }, 300_000);

  test("--csv, --json and --report", () => {
    const csv = join(scratch, "fleet.csv");
    const report = join(scratch, "fleet.html");
    const run = heatledger("fleet", PROFILE, FLEET, "--csv", csv, "--report", report, "--top", "3");
    expect(run.status).toBe(2);
    expect(run.stdout).toContain("... and 7 more units (every unit is in --csv, --ndjson and --json)");
    const rows = readFileSync(csv, "utf8").trimEnd().split("\n");
    expect(rows[0]).toBe(
      "rank,unit,log,verdict,reason,log lines,span [s],start (timestamp),precharge-resistor peak [°C],precharge-resistor margin [K],precharge-resistor first over limit [s]," +
        "precharge-resistor first over limit (timestamp),precharge-resistor first over limit (log line),precharge-resistor damage to date,precharge-resistor life left [yr],problem",
    );
    expect(rows).toHaveLength(13);
    expect(rows[1]).toMatch(/^1,unit-09,profiles\/logs\/fleet-irrigation\/unit-09\.csv,fail,/);
    const html = readFileSync(report, "utf8");
    expect(html).toContain("<title>heatledger fleet: 80 V irrigation pump drive");
    expect(html).toContain("Least margin to a limit, the 10 units most at risk");
    expect((html.match(/<svg/g) ?? []).length).toBe(2);
    const json = JSON.parse(heatledger("fleet", PROFILE, FLEET, "--json").stdout) as { verdict: string; counts: object; units: { rank: number; unit: string; verdict: string }[]; cautions: string[] };
    expect(json.verdict).toBe("fail");
    expect(json.counts).toEqual({ fail: 4, warn: 0, pass: 6, error: 2 });
    expect(json.units.map((u) => u.rank)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(json.units.slice(10).map((u) => u.verdict)).toEqual(["error", "error"]);
    expect(json.cautions).toHaveLength(2);
  });

  test("bad input: a unit id twice, a pattern matching nothing, a merge of a file that is not a partition", () => {
    const twin = join(scratch, "twin");
    mkdirSync(twin);
    copyFileSync(join(root, FLEET, "unit-01.csv"), join(twin, "unit-01.csv"));
    const dup = heatledger("fleet", PROFILE, FLEET, twin);
    expect(dup.status).toBe(2);
    expect(dup.stderr).toMatch(/^heatledger: .*twin\/unit-01\.csv: unit: expected one log per unit \(unit "unit-01" is already profiles\/logs\/fleet-irrigation\/unit-01\.csv;/);
    const none = heatledger("fleet", PROFILE, `${FLEET}/nothing-*.csv`);
    expect(none.stderr).toBe(`heatledger: ${FLEET}/nothing-*.csv: logs: expected event logs (.csv files), found a pattern that matches no file\n`);
    const notPart = heatledger("fleet", "merge", join(root, FLEET, "unit-01.csv"));
    expect(notPart.status).toBe(2);
    expect(notPart.stderr).toMatch(/unit-01\.csv:1: expected one JSON object per line/);
  });
});
