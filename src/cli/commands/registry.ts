import type { Command } from "commander";
import { registerNetwork } from "./network.js";
import { registerRetries } from "./retries.js";
import { registerSimulate } from "./simulate.js";
import { registerSize } from "./size.js";
import { registerSupervise } from "./supervise.js";
import type { CliRun } from "../main.js";

/** A command module registers its flags, help and action on the program. */
export type RegisterCommand = (program: Command, run: CliRun) => void;

/** Every command of the CLI, in the order `--help` lists them. */
export const COMMANDS: readonly RegisterCommand[] = [registerSimulate, registerRetries, registerSupervise, registerSize, registerNetwork];
