import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { type CliIo, processIo } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/main.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { shortedBusProfile } from "../helpers/shortedBusProfile.js";

// Hostile and enormous input files, in process: the real file system reader and writer
// (processIo) with the output collected, and memoryIo for the text-only cases. Every case exits 2
// with one line naming the file and the reason, before any computation.

const folder = mkdtempSync(join(tmpdir(), "heatledger-hostile-"));
const PROFILE = join(folder, "p.yaml");
writeFileSync(PROFILE, shortedBusProfile("  - power-up: {}"));

function fsIo(): CliIo & { stdout: string[]; stderr: string[] } {
  const stdout: string[] = [];
  const stderr: string[] = [];
  return { ...processIo(), out: (t) => void stdout.push(t), err: (t) => void stderr.push(t), progress: undefined, stdout, stderr };
}

async function run(argv: string[], io = fsIo()): Promise<{ status: number; out: string; err: string }> {
  const status = await runCli(argv, io);
  return { status, out: io.stdout.join(""), err: io.stderr.join("") };
}

describe("input files that are not profiles", () => {
  test("a device such as /dev/zero is refused before it is read", async () => {
    expect(await run(["simulate", "/dev/zero"])).toEqual({ status: 2, out: "", err: "heatledger: /dev/zero: expected a readable duty profile, found a device\n" });
  });

  test("a folder is refused", async () => {
    expect((await run(["simulate", folder])).err).toBe(`heatledger: ${folder}: expected a readable duty profile, found a folder\n`);
  });

  test("a file above the size limit is refused by its size, naming the limit and how to raise it", async () => {
    const big = join(folder, "big.yaml");
    writeFileSync(big, Buffer.alloc(8 * 1024 * 1024 + 1, 0x20));
    expect((await run(["simulate", big])).err).toBe(
      `heatledger: ${big}: expected a readable duty profile, found a file of 8.0 MiB, above the limit of 8 MiB (set HEATLEDGER_MAX_INPUT_MB to raise it)\n`,
    );
  });

  test("bytes that are not UTF-8 are refused with their line, not replaced", async () => {
    const bad = join(folder, "latin1.yaml");
    writeFileSync(bad, Buffer.concat([Buffer.from("name: caf"), Buffer.from([0xe9]), Buffer.from("\nambient: 25 degC\n")]));
    expect((await run(["simulate", bad])).err).toBe(`heatledger: ${bad}: expected a readable duty profile, found bytes that are not UTF-8 on line 1\n`);
  });

  test("CR-only line ends (old Mac text) read like newlines, so line numbers stay right", async () => {
    const text = shortedBusProfile("  - power-up: {}").replace("resistance: 48 ohm", "resistance: 48 ohms?").replace(/\n/g, "\r");
    const io = memoryIo({ "p.yaml": text });
    expect(await runCli(["simulate", "p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toBe('heatledger: p.yaml:12: circuit.resistance: expected a resistance such as "47 ohm" (or a number in ohm), found "48 ohms?"\n');
  });
});

describe("output destinations are checked before the run and written atomically", () => {
  test("a missing folder", async () => {
    const out = join(folder, "none", "t.csv");
    expect(await run(["simulate", PROFILE, "--csv", out])).toEqual({
      status: 2,
      out: "",
      err: `heatledger: ${out}: --csv: expected a file that can be written, found the folder ${join(folder, "none")} does not exist\n`,
    });
  });

  test("a folder as the output", async () => {
    expect((await run(["simulate", PROFILE, "--cycles", folder])).err).toBe(`heatledger: ${folder}: --cycles: expected a file that can be written, found a folder\n`);
  });

  test("a file as the output's folder", async () => {
    const out = join(PROFILE, "t.csv");
    expect((await run(["simulate", PROFILE, "--csv", out])).err).toBe(`heatledger: ${out}: --csv: expected a file that can be written, found ${PROFILE} is not a folder\n`);
  });

  test("the same path for --csv and --cycles is refused before anything is written", async () => {
    const out = join(folder, "same.csv");
    const result = await run(["simulate", PROFILE, "--csv", out, "--cycles", `${folder}/./same.csv`]);
    expect(result.err).toBe(`heatledger: ${folder}/./same.csv: --cycles: expected a path other than the one given to --csv, found the same path\n`);
    expect(readdirSync(folder)).not.toContain("same.csv");
  });

  test("a full device at write time is exit 2 naming the path and the reason (ENOSPC), not an internal error", async () => {
    const result = await run(["simulate", PROFILE, "--csv", "/dev/full", "--force"]);
    expect(result.status).toBe(2);
    expect(result.err).toBe("heatledger: /dev/full: --csv: expected a file that can be written, found no space left on the device (ENOSPC)\n");
  });

  test("a write goes through a temporary file that is renamed: no temporary file is left", async () => {
    const out = join(folder, "series.csv");
    expect((await run(["simulate", PROFILE, "--csv", out])).status).toBe(0);
    expect(readFileSync(out, "utf8").split("\n")[0]).toMatch(/^time_s,/);
    expect(readdirSync(folder).filter((f) => f.endsWith(".tmp"))).toEqual([]);
  });

  test("a write that fails in process (memoryIo) is exit 2 with the system reason", async () => {
    const io = memoryIo({ "p.yaml": shortedBusProfile("  - power-up: {}") });
    const failing = { ...io, writeFile: () => { throw Object.assign(new Error("EACCES: permission denied"), { code: "EACCES" }); } };
    expect(await runCli(["simulate", "p.yaml", "--csv", "out.csv"], failing)).toBe(2);
    expect(io.stderr.join("")).toBe("heatledger: out.csv: --csv: expected a file that can be written, found permission denied (EACCES)\n");
  });
});
