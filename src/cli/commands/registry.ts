import type { Command } from "commander";
import { registerGuard } from "./guard.js";
import { registerInit } from "./init.js";
import { registerNetwork } from "./network.js";
import { registerReplay } from "./replay.js";
import { registerRetries } from "./retries.js";
import { registerSimulate } from "./simulate.js";
import { registerSize } from "./size.js";
import { registerSupervise } from "./supervise.js";
import { registerSweep } from "./sweep.js";
import { registerSensitivity } from "./sensitivity.js";
import { registerMonteCarlo } from "./montecarlo.js";
import { registerCompare } from "./compare.js";
import { registerFleet } from "./fleet.js";
import { registerStudy } from "./study.js";
import type { CliRun } from "../main.js";

/**
 * A command module registers its flags, help and action on the program. The definition module
 * (`<name>.ts`) imports only commander and the constants its help prints; its action imports the
 * implementation (`<name>Action.ts`, which imports the library modules it needs) with
 * `await import(...)`, so `--help` and the other commands never load it.
 */
export type RegisterCommand = (program: Command, run: CliRun) => void;

/**
 * Every command of the CLI by its name (the word `register` gives commander), in the order
 * `--help` lists them. A run whose first argument names a command registers only that one
 * (`createProgram`): the others' options and help texts are not built.
 */
export const COMMANDS: readonly (readonly [name: string, register: RegisterCommand])[] = [
  ["simulate", registerSimulate], ["replay", registerReplay], ["fleet", registerFleet], ["retries", registerRetries], ["supervise", registerSupervise],
  ["size", registerSize], ["guard", registerGuard], ["network", registerNetwork], ["sweep", registerSweep], ["sensitivity", registerSensitivity],
  ["montecarlo", registerMonteCarlo], ["compare", registerCompare], ["study", registerStudy], ["init", registerInit],
];
