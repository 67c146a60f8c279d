import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { registerNetworkConvert } from "./networkConvert.js";
import { registerNetworkFit } from "./networkFit.js";
import { registerNetworkFromRating } from "./networkFromRating.js";
import { registerNetworkLumped } from "./networkLumped.js";
import { registerNetworkShow } from "./networkShow.js";

/** Subcommands of `heatledger network`, in help order (definitions only; see registry.ts). Add new ones here. */
const SUBCOMMANDS: readonly ((network: Command, run: CliRun) => void)[] = [registerNetworkShow, registerNetworkConvert, registerNetworkFit, registerNetworkFromRating, registerNetworkLumped];

/** `heatledger network ...`: look at, convert and build thermal networks. */
export function registerNetwork(program: Command, run: CliRun): void {
  const network = program
    .command("network")
    .description("inspect, convert and build thermal networks (Foster, Cauer, graph)")
    .addHelpText(
      "after",
      `
A network file is YAML or JSON; every quantity is a number in SI units or a string with a unit:
  form: foster                  # Foster: parallel RC pairs in series (datasheet Zth fits)
  stages:
    - { r: 0.15 K/W, tau: 0.8 ms }
    - { r: 0.60 K/W, c: 0.9 J/K }   # tau or c
  form: cauer                   # Cauer ladder: physical nodes, C to reference, R to next node
  stages: [{ r: 0.2 K/W, c: 0.004 J/K }, ...]
  form: graph                   # general RC graph: several parts on one heatsink
  nodes: [{ id: die, c: 0.02 J/K }, { id: sink, c: 40 J/K }]
  links: [{ from: die, to: sink, r: 0.9 K/W }, { from: sink, to: ambient, r: 1.5 K/W }]
  sources: [die]
  observed: [die, sink]`,
    );
  for (const register of SUBCOMMANDS) register(network, run);
}
