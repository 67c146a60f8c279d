import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { VERDICTS } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// Every judging command states the one verdict rule and takes --strict; the paragraph is built
// from VERDICTS, so the words and exit statuses cannot drift apart between commands.
describe("--help of every judging command", () => {
  test.each([["simulate"], ["replay"], ["retries"], ["supervise"], ["size"], ["fleet"]])("%s: the verdict words, their exit statuses and --strict", async (command) => {
    const io = memoryIo({});
    expect(await runCli([command, "--help"], io)).toBe(0);
    const help = io.stdout.join("");
    expect(help).toContain("--strict");
    expect(help).toContain("exit with status 1 on a warn verdict too (for CI gating)");
    expect(help).toContain("Verdict and exit status (one rule for every command that judges a part");
    expect(help).toContain(`  pass   ${VERDICTS.pass.meaning}: exit status 0`);
    expect(help.replace(/\s+/g, " ")).toContain(`warn ${VERDICTS.warn.meaning}: exit status 0, or 1 with --strict`);
    expect(help).toContain(`  fail   ${VERDICTS.fail.meaning}: exit status 1`);
    expect(help).toContain("  bad input (a file, field or flag): exit status 2");
    expect(help).toContain("Here ");
    for (const line of help.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
  });
});
