import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION } from "../../src/text/cautions.js";
import { CART_24V_HEAD } from "../helpers/cartParts.js";
import { memoryIo } from "../helpers/memoryIo.js";

// In-process runs of `heatledger fleet` (one thread: the logs are read through the memory io) on
// an invented 24 V cart and three invented logs, one of them missing.
const PROFILE = `${CART_24V_HEAD}events:
  - power-up: {}
`;
const QUIET = "time,event\n0,power-up\n3600,power-down\n3700,power-up\n3760,note\n";
const SHORTS = `time,event\n0,short\n${Array.from({ length: 30 }, (_, i) => `${2 * (i + 1)},short`).join("\n")}\n200,power-down\n`;

function files(): Record<string, string> {
  return { "cart.yaml": PROFILE, "logs/a.csv": QUIET, "logs/b.csv": SHORTS, "fleet.list": "log,unit\n# the cart fleet\nlogs/a.csv,cart-7\nlogs/b.csv,cart-9\nlogs/c.csv,cart-3\n" };
}

describe("heatledger fleet in process", () => {
  test("a list file names the units; the missing log is reported, the others ranked", async () => {
    const io = memoryIo(files());
    const status = await runCli(["fleet", "cart.yaml", "--list", "fleet.list", "--json"], io);
    expect(io.stderr).toEqual([]);
    expect(status).toBe(2);
    const json = JSON.parse(io.stdout.join("")) as { units: { unit: string; file: string; verdict: string; error: { file: string; expected: string; found: string } | null }[]; cautions: string[] };
    expect(json.units.map((u) => [u.unit, u.file, u.verdict])).toEqual([
      ["cart-9", "logs/b.csv", "fail"],
      ["cart-7", "logs/a.csv", "pass"],
      ["cart-3", "logs/c.csv", "error"],
    ]);
    expect(json.units[2]!.error).toMatchObject({ file: "logs/c.csv", expected: "a readable event log", found: "no such file" });
    expect(json.cautions[0]).toBe(GENERAL_CAUTION);
  });

  test("the text table and the NDJSON on standard output", async () => {
    const io = memoryIo(files());
    expect(await runCli(["fleet", "cart.yaml", "logs/a.csv", "logs/b.csv"], io)).toBe(1);
    const text = io.stdout.join("");
    expect(text).toMatch(/^heatledger fleet: invented 24 V cart\n2 units: 1 fail, 0 warn, 1 pass\n/);
    expect(text).toMatch(/\n {3}1 {2}b +fail /);
    expect(text).toContain("life left [yr]");
    const nd = memoryIo(files());
    await runCli(["fleet", "cart.yaml", "logs/b.csv", "logs/a.csv", "--ndjson"], nd);
    const lines = nd.stdout.join("").trimEnd().split("\n");
    expect(lines).toHaveLength(3);
    expect(JSON.parse(lines[0]!)).toMatchObject({ kind: "fleet-header", format: "heatledger-fleet/1", profile: "invented 24 V cart", logsPerYear: null });
    expect(JSON.parse(lines[1]!)).toMatchObject({ kind: "unit", unit: "b", verdict: "fail" });
  });

  test("--logs-per-year states the rate of life left: (1 − D) / (D · r)", async () => {
    const io = memoryIo(files());
    await runCli(["fleet", "cart.yaml", "logs/b.csv", "--logs-per-year", "12", "--json"], io);
    const part = (JSON.parse(io.stdout.join("")) as { units: { parts: { damageToDate: number | null; remainingLifeYears: number | null }[] }[] }).units[0]!.parts[0]!;
    if (part.damageToDate === null) expect(part.remainingLifeYears).toBeNull();
    else expect(part.remainingLifeYears).toBeCloseTo((1 - part.damageToDate) / (part.damageToDate * 12), 12);
  });

  test("bad options and lists name the flag, file and line", async () => {
    const cases: [string[], Record<string, string>, string][] = [
      [["fleet", "cart.yaml", "logs/a.csv", "--top", "-1"], {}, "heatledger: --top: expected a whole number of table rows ≥ 0, found \"-1\"\n"],
      [["fleet", "cart.yaml", "logs/a.csv", "--json", "--ndjson"], {}, "heatledger: --ndjson: expected a file when --json prints to standard output (--ndjson FILE), found --ndjson without a file\n"],
      [["fleet", "cart.yaml", "logs/a.csv", "--logs-per-year", "0"], {}, 'heatledger: --logs-per-year: expected a number of logs per year > 0 such as 52, found "0"\n'],
      [["fleet", "cart.yaml", "--list", "bad.list"], { "bad.list": "logs/a.csv\nlogs/b.csv,u,extra\n" }, 'heatledger: bad.list:2: expected PATH or PATH,UNIT (a log\'s path and, optionally, its unit id), found "logs/b.csv,u,extra"\n'],
      [["fleet", "merge", "p.ndjson", "--workers", "2"], { "p.ndjson": "" }, 'heatledger: --workers: expected only output flags after fleet merge (the partitions keep the options they were replayed with), found "2"\n'],
    ];
    for (const [args, extra, message] of cases) {
      const io = memoryIo({ ...files(), ...extra });
      expect(await runCli(args, io)).toBe(2);
      expect(io.stderr.join("")).toBe(message);
    }
  });
});
