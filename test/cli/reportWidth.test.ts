import { existsSync, readFileSync, readdirSync } from "node:fs";
import { describe, expect, test } from "vitest";
import { type CliIo, PIPED_COLUMNS, reportColumns } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/main.js";
import { fitTable } from "../../src/internal.js";

// Text reports fit their width: 100 columns when the output is not a terminal (a pipe, a file),
// the terminal's otherwise, or --width N. Every command's text report on every bundled profile is
// checked line by line at the piped width, and every report that judges a part also at 80.

/** Real files in, output collected, at the width a pipe gets. */
function pipedIo(columns = reportColumns(undefined, undefined)): CliIo & { stdout: string[] } {
  const stdout: string[] = [];
  return {
    stdout,
    out: (t) => stdout.push(t),
    err: () => {},
    readFile: (p) => readFileSync(p, "utf8"),
    writeFile: () => {
      throw new Error("the width runs write no file");
    },
    exists: (p) => existsSync(p),
    columns,
  };
}

/** Lines longer than `width` code points (what a terminal shows), with their length. */
function overlong(text: string, width: number): string[] {
  return text
    .split("\n")
    .filter((l) => [...l].length > width)
    .map((l) => `${[...l].length}: ${l}`);
}

async function report(args: string[]): Promise<string> {
  const io = pipedIo();
  const status = await runCli(args, io);
  expect([0, 1]).toContain(status);
  return io.stdout.join("");
}

const bundled = readdirSync("profiles").filter((f) => f.endsWith(".yaml"));
const supervised = bundled.filter((f) => /^\s*supervision:/m.test(readFileSync(`profiles/${f}`, "utf8")));
// the retry planner needs a retry block with a fault
const retried = bundled.filter((f) => /^\s*fault:/m.test(readFileSync(`profiles/${f}`, "utf8")));
const networks = readdirSync("profiles/networks").filter((f) => f.endsWith(".yaml"));

describe("every text report fits 100 columns when piped", () => {
  test("a pipe gets 100 columns; COLUMNS narrows it, never widens it; a terminal gets its own width", () => {
    expect(PIPED_COLUMNS).toBe(100);
    expect(reportColumns(undefined, undefined)).toBe(100);
    expect(reportColumns(undefined, "80")).toBe(80);
    expect(reportColumns(undefined, "250")).toBe(100);
    expect(reportColumns(undefined, "junk")).toBe(100);
    expect(reportColumns(160, "80")).toBe(160);
  });

  const runs: [string, string[]][] = [
    ...bundled.flatMap((f): [string, string[]][] => [
      [`simulate ${f}`, ["simulate", `profiles/${f}`]],
      [`size ${f}`, ["size", `profiles/${f}`]],
    ]),
    ...retried.map((f): [string, string[]] => [`retries ${f}`, ["retries", `profiles/${f}`]]),
    ...supervised.map((f): [string, string[]] => [`supervise ${f}`, ["supervise", `profiles/${f}`]]),
    ["replay irrigation log", ["replay", "profiles/logs/irrigation-pump-returned-unit.csv", "--profile", "profiles/irrigation-pump-decade.yaml"]],
    ...networks.map((f): [string, string[]] => [`network show ${f}`, ["network", "show", `profiles/networks/${f}`]]),
    ["network fit example-zth.csv", ["network", "fit", "profiles/networks/example-zth.csv"]],
  ];
  test.each(runs)("%s", { timeout: 120_000 }, async (_, args) => {
    expect(overlong(await report(args), 100)).toEqual([]);
  });

  const narrow: [string, string[]][] = [
    ...bundled.map((f): [string, string[]] => [`simulate ${f}`, ["simulate", `profiles/${f}`]]),
    ...supervised.map((f): [string, string[]] => [`supervise ${f}`, ["supervise", `profiles/${f}`]]),
    ...retried.map((f): [string, string[]] => [`retries ${f}`, ["retries", `profiles/${f}`]]),
    ...bundled.map((f): [string, string[]] => [`size ${f}`, ["size", `profiles/${f}`]]),
    ["network fit example-zth.csv", ["network", "fit", "profiles/networks/example-zth.csv"]],
    ["replay irrigation log", ["replay", "profiles/logs/irrigation-pump-returned-unit.csv", "--profile", "profiles/irrigation-pump-decade.yaml"]],
  ];
  test.each(narrow)("%s --width 80", { timeout: 120_000 }, async (_, args) => {
    expect(overlong(await report([...args, "--width", "80"]), 80)).toEqual([]);
  });

  test("--width outside 60-400 columns is bad input", async () => {
    const io = pipedIo();
    expect(await runCli(["simulate", "profiles/warehouse-robot-48v.yaml", "--width", "12"], io)).toBe(2);
  });
});

describe("fitTable", () => {
  const columns = [{ heading: "#", align: "right" as const }, { heading: "event" }, ...Array.from({ length: 6 }, (_, i) => ({ heading: `part-${i} [°C]`, align: "right" as const }))];
  const rows = Array.from({ length: 5 }, (_, r) => [String(r), `a rather long event name number ${r} with words`, ...Array.from({ length: 6 }, (_, i) => (100 + r + i / 10).toFixed(1))]);

  test("splits a wide table into parts that repeat the key column, every cell kept", () => {
    const fitted = fitTable(columns, rows, { width: 60, keyColumns: 1, cutColumn: 1, cutMin: 20 });
    expect(overlong(fitted.text, 60)).toEqual([]);
    for (const row of rows) for (const cell of row.slice(2)) expect(fitted.text).toContain(cell);
    expect(fitted.text.split("\n").filter((l) => l.startsWith("#")).length).toBeGreaterThan(1);
  });

  test("cuts the free-text column with an ellipsis when that alone makes it fit, and counts the cuts", () => {
    const fitted = fitTable(columns.slice(0, 3), rows.map((r) => r.slice(0, 3)), { width: 40, keyColumns: 1, cutColumn: 1, cutMin: 20 });
    expect(overlong(fitted.text, 40)).toEqual([]);
    expect(fitted.cutCells).toBe(5);
    expect(fitted.text).toContain("…");
  });
});
