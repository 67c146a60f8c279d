import type { Command } from "commander";
import { MATERIALS } from "../../thermal/materials.js";
import type { CliRun } from "../main.js";
import { type OutputFlags, addOutputFlags } from "./networkBuildFlags.js";

/** The network forms `network lumped` can write. */
export const LUMPED_FORMS = ["cauer", "foster"] as const;
/** Default form: the ladder's nodes are physical, so it can be chained with a heatsink. */
export const LUMPED_DEFAULT_FORM = "cauer";

/** What the flags of `heatledger network lumped` parse to. */
export interface LumpedFlags extends OutputFlags {
  readonly mass?: string;
  readonly material?: string;
  readonly specificHeat?: string;
  readonly rAmbient?: string;
  readonly bodyMass?: string;
  readonly bodyMaterial?: string;
  readonly bodySpecificHeat?: string;
  readonly rBody?: string;
  readonly form: string;
}

/** `heatledger network lumped --mass ... --material ... --r-ambient ...`: flags and help here; the run is loaded from networkLumpedAction.ts when it starts. */
export function registerNetworkLumped(network: Command, run: CliRun): void {
  const command = network
    .command("lumped")
    .description("build a one- or two-stage network from masses, materials and resistances")
    .option("--mass <kg>", "mass of the heated element (required), e.g. \"3 g\"")
    .option("--material <name>", `material preset of the element: ${MATERIALS.map((m) => m.id).join(", ")}`)
    .option("--specific-heat <J/(kg K)>", "specific heat of the element instead of a preset, e.g. \"420 J/(kg K)\"")
    .option("--r-ambient <K/W>", "resistance from the last lump (element, or body) to ambient (required), e.g. \"12 K/W\"")
    .option("--body-mass <kg>", "mass of the body the element sits on (gives a second stage)")
    .option("--body-material <name>", "material preset of the body")
    .option("--body-specific-heat <J/(kg K)>", "specific heat of the body instead of a preset")
    .option("--r-body <K/W>", "resistance from the element to the body (with --body-mass)")
    .option("--form <form>", `network form to write: ${LUMPED_FORMS.join(" or ")}`, LUMPED_DEFAULT_FORM);
  addOutputFlags(command);
  command.addHelpText(
    "after",
    `
One stage: the element's heat capacity C = m*c, its resistance to ambient R; tau = R*C.
Two stages: the element (C1, then R1 to the body) and the body (C2, then R2 to ambient), a Cauer
ladder whose nodes are physical: heat enters the element, the body buffers it.
Each lump is taken as one uniform temperature, which holds when it is small or conducts well
(Biot number h*L/k < 0.1): a resistance wire, a thin film, a small ceramic core; not a long rod
heated at one end. Specific heats are at 300 K; metals store about 5-15 % more when hot.

Material presets (300 K; values recalled from the named handbook tables, verify the last digit):
${MATERIALS.map((m) => `  ${m.id.padEnd(16)} c = ${String(m.specificHeatJPerKgK).padStart(4)} J/(kg K)  ${m.name}`).join("\n")}

Examples:
  heatledger network lumped --mass "3 g" --material nichrome --r-ambient "40 K/W"
  heatledger network lumped --mass "0.5 g" --material nichrome --r-body "2 K/W" \\
      --body-mass "20 g" --body-material alumina --r-ambient "25 K/W" --out resistor.yaml`,
  );
  command.action(async (options: LumpedFlags) => {
    const { networkLumpedAction } = await import("./networkLumpedAction.js");
    networkLumpedAction(run, options);
  });
}
