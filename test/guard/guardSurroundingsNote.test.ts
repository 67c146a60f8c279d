import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { memoryIo } from "../helpers/memoryIo.js";

// guard plans at the constant ambient that bounds a varying one, as retries and supervise do, and
// says so as they do: the same note in the text, the same `surroundings` key in the JSON.
const ROOT = join(import.meta.dirname, "..", "..", "profiles");

/** Every bundled file, by its path relative to profiles/ (the profile reads its network and traces). */
function bundledFiles(dir = ROOT): Record<string, string> {
  const out: Record<string, string> = {};
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) Object.assign(out, bundledFiles(path));
    else out[relative(ROOT, path)] = readFileSync(path, "utf8");
  }
  return out;
}

async function run(args: string[]): Promise<string> {
  const io = memoryIo(bundledFiles());
  await runCli(args, io);
  return io.stdout.join("");
}

describe("guard on a profile with a varying ambient", () => {
  const profile = "rooftop-inverter-hot-afternoon.yaml";

  test("the text opens with the planners' note on the bounding ambient, word for word as retries prints it", async () => {
    const guard = await run(["guard", profile]);
    const retries = await run(["retries", profile]);
    const note = retries.split("\n\n")[0]!;
    expect(note.replace(/\n/g, " ")).toMatch(/^The ambient varies \(ambient: .*\)\. These answers are for the constant ambient that bounds it/);
    expect(guard.startsWith(`${note}\n\n`)).toBe(true);
  });

  test("--json carries the same surroundings key, with each part's bounding ambient", async () => {
    const guard = JSON.parse(await run(["guard", profile, "--json"])) as { surroundings?: { boundingAmbientC: Record<string, number> } };
    const retries = JSON.parse(await run(["retries", profile, "--json"])) as { surroundings?: unknown };
    expect(guard.surroundings).toBeDefined();
    expect(guard.surroundings).toEqual(retries.surroundings);
    for (const c of Object.values(guard.surroundings!.boundingAmbientC)) expect(c).toBeCloseTo(41 + 175 * 0.22, 9); // as test/profile/surroundings.test.ts
  });

  test("a constant ambient prints no note and no key", async () => {
    const text = await run(["guard", "warehouse-robot-48v.yaml"]);
    expect(text).not.toContain("The ambient varies");
    expect(JSON.parse(await run(["guard", "warehouse-robot-48v.yaml", "--json"]))).not.toHaveProperty("surroundings");
  });
});
