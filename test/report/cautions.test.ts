import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { GENERAL_CAUTION } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { shortedBusProfile, shortedRetry } from "../helpers/shortedBusProfile.js";

// Every JSON report carries its cautions under one key, `cautions`, a list of strings (before,
// some reports had a `caution` string and `retries`, `size`, `network show` and `network convert`
// had none).
const PROFILE = shortedBusProfile(
  shortedRetry("      attempts: 3\n      interval: 2 s\n      lockout: 60 s"),
  "supervision:\n  corners:\n    capacitance: [0.9 mF, 1.1 mF]\n",
);
const bundled = (name: string): string => readFileSync(join(import.meta.dirname, "../../profiles/networks", name), "utf8");
const FILES = {
  "p.yaml": PROFILE,
  "n.yaml": "form: foster\nstages: [{ r: 1 K/W, tau: 1 s }, { r: 2 K/W, tau: 20 s }]\n",
  "zth.csv": bundled("example-zth.csv"),
  "rating.csv": bundled("example-pulse-rating.csv"),
};

describe("cautions in every JSON report", () => {
  test.each([
    [["simulate", "p.yaml"]],
    [["retries", "p.yaml"]],
    [["supervise", "p.yaml"]],
    [["size", "p.yaml"]],
    [["network", "show", "n.yaml"]],
    [["network", "convert", "n.yaml", "--to", "cauer"]],
    [["network", "fit", "zth.csv"]],
    [["network", "from-rating", "rating.csv", "--start-temperature", "25 degC", "--max-temperature", "350 degC"]],
    [["network", "lumped", "--mass", "0.5 g", "--material", "nichrome", "--r-ambient", "25 K/W"]],
  ])("%j --json: cautions is a list holding the general caution; no caution key", async (args) => {
    const io = memoryIo({ ...FILES });
    expect(await runCli([...args, "--json"], io)).toBe(0);
    const json = JSON.parse(io.stdout.join("")) as Record<string, unknown>;
    expect(json).not.toHaveProperty("caution");
    expect(Array.isArray(json["cautions"])).toBe(true);
    expect(json["cautions"]).toContain(GENERAL_CAUTION);
    for (const c of json["cautions"] as unknown[]) expect(typeof c).toBe("string");
  });
});
