import { dirname, isAbsolute, join } from "node:path";
import type { Command } from "commander";
import { MATERIALS, SIZE_DEFAULTS, defaultCircuitModels, formatSizingText, loadProfile, materialPreset, parseQuantity, sizeProfile, sizingJson } from "../../index.js";
import { EXIT_LIMIT, EXIT_OK } from "../CliIo.js";
import type { CliRun } from "../main.js";
import { readTextFile } from "../readInputFile.js";

/** Options of `heatledger size`: one table drives the flags and their help. */
export const SIZE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (verdict, parts, circuit) instead of the text report" },
  { flags: "--part <id>", help: "size only this part (repeat the flag for several; default every part)" },
  { flags: "--material <preset>", help: `give capacities as masses of a material preset: ${MATERIALS.map((m) => m.id).join(", ")}` },
  { flags: "--margin <K>", help: "size to this margin below each limit (default: each part's own margin from the profile)" },
] as const;

/** `heatledger size PROFILE`. */
export function registerSize(program: Command, run: CliRun): void {
  const command = program
    .command("size")
    .argument("<profile>", "duty profile (YAML or JSON)")
    .description("smallest heat capacity (or mass) per part, and the slowest charging element that still completes in time")
    .addHelpText(
      "after",
      `
Heat capacity: the adiabatic bound C = E/ΔT of the worst event, then the whole profile inverted:
every heat capacity of the part's network is scaled by k at fixed thermal resistances (Foster:
tau -> k·tau), k bracketed by factors of ${SIZE_DEFAULTS.bracketFactor} and bisected until the peak is within
${SIZE_DEFAULTS.temperatureToleranceK} K under the limit less the margin. Charging element: the largest series (or source)
resistance, or the smallest charging current or power, that completes a healthy power-up from
0 V within the profile's timeout. Exit status: 0 a feasible size exists, 1 none (the report says
why), 2 bad input. See README, "Sizing a pre-charge part".`,
    );
  for (const option of SIZE_OPTIONS) {
    if (option.flags === "--part <id>") command.option(option.flags, option.help, (value: string, previous: string[] | undefined) => [...(previous ?? []), value]);
    else command.option(option.flags, option.help);
  }
  command.action((file: string, options: { json?: boolean; part?: string[]; material?: string; margin?: string }) => {
    const material = options.material === undefined ? undefined : materialPreset(options.material, "--material");
    const marginK = options.margin === undefined ? undefined : parseQuantity(/^\s*[-+]?[\d.]+(e[-+]?\d+)?\s*$/i.test(options.margin) ? Number(options.margin) : options.margin, "temperatureDifference", "--margin");
    const folder = dirname(file);
    const readNamed = (path: string): string => readTextFile(run.io, isAbsolute(path) ? path : join(folder, path), "file named in the profile");
    const profile = loadProfile(readTextFile(run.io, file, "duty profile"), file, readNamed);
    const report = sizeProfile(profile, {
      models: defaultCircuitModels,
      ...(material === undefined ? {} : { material }),
      ...(marginK === undefined ? {} : { marginK }),
      ...(options.part === undefined ? {} : { partIds: options.part }),
    });
    if (options.json) run.io.out(`${JSON.stringify(sizingJson(report), null, 2)}\n`);
    else run.io.out(formatSizingText(report, Math.min(run.io.columns, 120)));
    run.status = report.verdict === "feasible" ? EXIT_OK : EXIT_LIMIT;
  });
}
