import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { memoryIo } from "../helpers/memoryIo.js";

// Every command that reads a profile reads the files it names relative to the profile's folder
// (src/cli/readProfileFile.ts), and its messages name such a file by that resolved path.
const PROFILE = `name: named files
ambient: 25 degC
parts:
  - id: r
    network: net.yaml
    limits: { maxTemperature: 100 degC, margin: 10 K }
events:
  - power-trace: { part: r, file: pulse.csv }
`;

describe("readProfileFile, through each command that reads a profile", () => {
  test.each([["simulate"], ["size"], ["retries"], ["supervise"]])("%s: a profile dir/p.yaml naming a missing net.yaml gets a message naming dir/net.yaml", async (command) => {
    const io = memoryIo({ "dir/p.yaml": PROFILE, "dir/pulse.csv": "time_s,power_W\n0,10\n1,10\n" });
    expect(await runCli([command, "dir/p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toBe("heatledger: dir/p.yaml:5: parts[0].network: expected a readable network file, found \"net.yaml\" (no such file: dir/net.yaml)\n");
  });

  test("replay: the files its --profile names are named relative to that profile", async () => {
    const io = memoryIo({ "dir/p.yaml": PROFILE, "dir/pulse.csv": "time_s,power_W\n0,10\n1,10\n", "log.csv": "time,event,note\n0,power-up,\n" });
    expect(await runCli(["replay", "log.csv", "--profile", "dir/p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toBe("heatledger: dir/p.yaml:5: parts[0].network: expected a readable network file, found \"net.yaml\" (no such file: dir/net.yaml)\n");
  });
});
