import type { Command } from "commander";
import { PULSE_RATING_ASSUMPTIONS } from "../../thermal/zthFromPulseRating.js";
import type { CliRun } from "../main.js";
import { type OutputFlags, addFitFlags, addOutputFlags } from "./networkBuildFlags.js";

/** What the flags of `heatledger network from-rating` parse to (the fit flags are read by readFitFlags). */
export type NetworkFromRatingFlags = Record<string, unknown> &
  OutputFlags & {
    readonly startTemperature?: string;
    readonly maxTemperature?: string;
    readonly durationUnit?: string;
    readonly energyUnit?: string;
    readonly powerUnit?: string;
    readonly form?: string;
    readonly series?: string;
    readonly resistance?: string;
  };

/** `heatledger network from-rating TABLE.csv`: flags and help here; the run is loaded from networkFromRatingAction.ts when it starts. */
export function registerNetworkFromRating(network: Command, run: CliRun): void {
  const command = network
    .command("from-rating")
    .argument("<table>", "CSV file of a pulse rating (duration, energy or power), or a resistor family file (.yaml)")
    .description("turn a pulse rating table into Zth points and fit a Foster network")
    .option("--form <form>", "what the CSV's second column is: energy (default; single-pulse energy) or power (peak pulse power)")
    .option("--series <id>", "with a family file: the series to read")
    .option("--resistance <ohm>", "with a family file whose series is rated in energy per ohm: the part's value, e.g. \"68 ohm\"")
    .option("--start-temperature <degC>", "element temperature the rating starts from (required for a CSV), e.g. \"25 degC\"")
    .option("--max-temperature <degC>", "element temperature the rated pulse reaches (required for a CSV), e.g. \"350 degC\"")
    .option("--duration-unit <unit>", "unit of the duration column when the header has none (s, ms)")
    .option("--energy-unit <unit>", "unit of the energy column when the header has none (J, mJ)")
    .option("--power-unit <unit>", "unit of the power column (--form power) when the header has none (W, kW)");
  addFitFlags(command);
  addOutputFlags(command);
  command.addHelpText(
    "after",
    `
A pulse rating says how much energy one rectangular pulse of a given length may put into the part
when it starts at one temperature and may reach another. The table is a CSV file:
  # my resistor, single-pulse rating at 25 degC, element limit 350 degC
  duration [ms], energy [J]
  1,    12
  10,   40
  100,  150
  ...
Each row becomes a Zth point, Zth(t_p) = (T_max - T_start) * t_p / E_max(t_p), and the points are
fitted exactly as \`network fit\` does. The conversion assumes:
${PULSE_RATING_ASSUMPTIONS.map((a) => `  - ${a}`).join("\n")}
A table where a longer pulse is rated for less energy, or for more power, is rejected as misread.
With --form power the CSV gives the peak power of one rectangular pulse against its duration
(header "duration [ms], power [W]"); each row becomes E = P * t. A resistor family file (the one
profiles name in ratings.series) gives a series' rating in any form, energy per ohm against the
resistance value included (read log-log at --resistance); its pulse derating's reference and
maximum temperature are the defaults of --start-temperature and --max-temperature.

Examples:
  heatledger network from-rating rating.csv --start-temperature "25 degC" --max-temperature "350 degC" --out part.yaml
  heatledger network from-rating profiles/parts/resistor-families.yaml --series ww-housed-100w --resistance "68 ohm"`,
  );
  command.action(async (file: string, options: NetworkFromRatingFlags) => {
    const { networkFromRatingAction } = await import("./networkFromRatingAction.js");
    networkFromRatingAction(run, file, options);
  });
}
