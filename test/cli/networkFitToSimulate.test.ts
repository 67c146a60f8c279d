import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";

const root = fileURLToPath(new URL("../..", import.meta.url));
const EXAMPLE = readFileSync(`${root}profiles/networks/example-zth.csv`, "utf8");

// An invented pulse: 200 W for 20 ms into a MOSFET (as a power trace, so no circuit model is
// involved); its network is either a file fitted from the example Zth points or, inline, the
// network those points were generated from (see profiles/networks/example-zth.csv).
const profile = (network: string): string => `name: fitted network end to end
ambient: 25 degC
parts:
  - id: fet
    network: ${network}
    limits: { maxTemperature: 150 degC }
events:
  - power-trace: { part: fet, points: [[0, 200 W], [20 ms, 200 W], [21 ms, 0 W], [2 s, 0 W]] }
`;
const GENERATING = "{ form: foster, stages: [{ r: 0.02 K/W, tau: 50 us }, { r: 0.08 K/W, tau: 1 ms }, { r: 0.15 K/W, tau: 12 ms }, { r: 0.25 K/W, tau: 150 ms }] }";

describe("from Zth points to a simulation", () => {
  test("a network fitted from CSV points and written with --out runs in simulate and gives the generating network's peak", async () => {
    const io = memoryIo({ "zth.csv": EXAMPLE, "fitted.yaml": profile("nets/part.yaml"), "inline.yaml": profile(GENERATING) });
    expect(await runCli(["network", "fit", "zth.csv", "--out", "nets/part.yaml"], io)).toBe(0);
    const peak = async (file: string): Promise<number> => {
      io.stdout.length = 0;
      expect(await runCli(["simulate", file, "--json"], io)).toBe(0);
      return (JSON.parse(io.stdout.join("")) as { parts: { peakTemperatureC: number }[] }).parts[0]!.peakTemperatureC;
    };
    const fitted = await peak("fitted.yaml");
    const inline = await peak("inline.yaml");
    // The fit matches the generating Zth within the points' 3-digit read-off error (0.5 %); the
    // peak rise over 25 °C inherits that bound.
    expectClose(fitted - 25, inline - 25, { rel: 0.005 });
    expect(inline).toBeGreaterThan(25);
  });

  test("the built bin fits the bundled example and prints JSON", () => {
    const out = execFileSync(process.execPath, ["bin/heatledger.js", "network", "fit", "profiles/networks/example-zth.csv", "--json"], { cwd: root, encoding: "utf8" });
    const json = JSON.parse(out) as { pointCount: number; network: { form: string; stages: unknown[] } };
    expect(json.pointCount).toBe(26);
    expect(json.network.form).toBe("foster");
    expect(json.network.stages.length).toBe(4);
  });
});
