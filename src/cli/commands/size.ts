import type { Command } from "commander";
import { SIZE_DEFAULTS, SIZE_SCALE_SCOPES } from "../../size/sizeDefaults.js";
import { MATERIALS } from "../../thermal/materials.js";
import type { CliRun } from "../main.js";
import { CHART_FORCE_OPTION, REPORT_OPTION, SVG_OPTION } from "./chartOptions.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";
import { CORNERS_OPTION } from "./simulate.js";

/** Options of `heatledger size`: one table drives the flags and their help. */
export const SIZE_OPTIONS = [
  { flags: "--json", help: "print one JSON object (verdict, parts, circuit) instead of the text report" },
  { flags: "--part <id>", help: "size only this part (repeat the flag for several; default every part)" },
  {
    flags: "--scale <what>",
    help: `what the capacity answer scales: ${SIZE_SCALE_SCOPES.join(" or ")} (default ${SIZE_DEFAULTS.scale}); whole: every heat capacity of the part's network (a larger part of the same build), element: only its element capacity C1, the rest as it is`,
  },
  { flags: "--material <preset>", help: `give the adiabatic and element capacities as masses of a material preset: ${MATERIALS.map((m) => m.id).join(", ")}` },
  { flags: "--margin <K>", help: "size to this margin below each limit (default: each part's own margin from the profile)" },
  REPORT_OPTION,
  SVG_OPTION,
  CHART_FORCE_OPTION,
  CORNERS_OPTION,
  STRICT_OPTION,
] as const;

/** What the flags of `heatledger size` parse to. */
export interface SizeFlags {
  readonly json?: boolean;
  readonly part?: string[];
  readonly material?: string;
  readonly scale?: string;
  readonly margin?: string;
  readonly report?: string;
  readonly svg?: string;
  readonly force?: boolean;
  readonly corners?: boolean;
  readonly strict?: boolean;
}

/** `heatledger size PROFILE`: flags and help here; the run is loaded from sizeAction.ts when it starts. */
export function registerSize(program: Command, run: CliRun): void {
  const command = program
    .command("size")
    .argument("<profile>", "duty profile (YAML or JSON), or - for standard input")
    .description("smallest heat capacity (or mass) per part, and the slowest charging element that still completes in time")
    .addHelpText(
      "after",
      `
Heat capacity: the adiabatic bound C = E/ΔT of the worst event, then the whole profile inverted
for the smallest k at fixed thermal resistances, bracketed by factors of ${SIZE_DEFAULTS.bracketFactor} and bisected until the
peak is within ${SIZE_DEFAULTS.temperatureToleranceK} K under the limit less the margin. --scale whole (the default) multiplies every
heat capacity of the part's network by k (Foster: tau -> k·tau): the whole body grows, and C1 at k
is only the element's share of it. --scale element multiplies only the element capacity C1 (first
capacity of a Cauer ladder, the part's source node of a graph; a Foster network is turned into its
exact Cauer ladder first) and gives it as C1 and, with --material, as the element's mass C1/c.
--json includes the sized network as a network file holds it. Charging element: the largest
series (or source) resistance, or the smallest charging current or power, that completes a
healthy power-up from 0 V within the profile's timeout.
${verdictHelp("Here the verdict judges the answers: fail when a part or the charging element has no feasible size (the report says why); warn when a part sized to a smaller --margin than its profile wants peaks inside that margin; else pass.")}
Corners (--corners): each part is sized, and the charging element chosen, for the profile as
written and at every corner of its retryPlan.corners; the report adds a table of each answer at
every corner and names the governing corner (largest capacity; smallest resistance, or largest
current or power), whose value holds at every corner. The verdict and exit status are the worst
over the corners. Without the flag a profile with a corner set gets a note.
Example: heatledger size profiles/heat-pump-trip-retries.yaml --corners
See README, "Sizing a pre-charge part" and "Verdicts and exit status".`,
    );
  for (const option of SIZE_OPTIONS) {
    if (option.flags === "--part <id>") command.option(option.flags, option.help, (value: string, previous: string[] | undefined) => [...(previous ?? []), value]);
    else command.option(option.flags, option.help);
  }
  command.action(async (file: string, options: SizeFlags) => {
    const { sizeAction } = await import("./sizeAction.js");
    await sizeAction(run, file, options);
  });
}
