import { describe, expect, test } from "vitest";
import { COMMANDS } from "../../src/cli/commands/registry.js";
import { createProgram, runCli } from "../../src/cli/main.js";
import { memoryIo } from "../helpers/memoryIo.js";

// A run whose first argument names a command registers only that command (start-up time); the
// name in the registry must be the word the command registers, and the command must be the same
// (flags, arguments, help) as when every command is registered.
describe("the command registry", () => {
  const fullProgram = createProgram({ io: memoryIo(), status: 0 });

  test("every command is in the registry once, under the name it registers", () => {
    expect(fullProgram.commands.map((c) => c.name())).toEqual(COMMANDS.map(([name]) => name));
  });

  test.each(COMMANDS.map(([name]) => [name]))("%s alone: one command, the same help as among all", (name) => {
    const alone = createProgram({ io: memoryIo(), status: 0 }, [name, "--help"]);
    expect(alone.commands.map((c) => c.name())).toEqual([name]);
    const full = fullProgram.commands.find((c) => c.name() === name)!;
    expect(alone.commands[0]!.helpInformation()).toBe(full.helpInformation());
    expect(alone.commands[0]!.commands.map((c) => c.helpInformation())).toEqual(full.commands.map((c) => c.helpInformation()));
  });

  test("a first argument that names no command registers them all: the suggestion still comes", async () => {
    const io = memoryIo();
    expect(await runCli(["simulat", "x.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toContain("(Did you mean simulate?)");
  });
});
