import type { ProfileStressResult } from "../profile/ProfileStress.js";
import { formatCyclesCsv } from "../report/formatCyclesCsv.js";
import type { CliIo } from "./CliIo.js";
import { writeOutputFile } from "./readInputFile.js";

/**
 * The `--cycles <file>` flag of simulate and replay (CYCLES_OPTION): write the rainflow cycles of every part (formatCyclesCsv: range, mean, count, damage per cycle
 * class) to the `--cycles` file and return the line the text report prints about it ("" without
 * the flag). The stress run must have kept its cycles (ProfileStress keepCycles).
 * Cost O(cycles).
 * @throws InputError when the file exists without --force or cannot be written
 */
export function writeCyclesFile(io: CliIo, path: string | undefined, stress: ProfileStressResult, force: boolean): string {
  if (path === undefined) return "";
  const parts = stress.parts.map((p) => ({ id: p.id, cycles: p.report.cycles, damage: p.report.damage === undefined ? undefined : p.report.cycleDamage }));
  writeOutputFile(io, path, formatCyclesCsv(parts), force, "--cycles");
  return `Cycles: ${parts.reduce((n, p) => n + p.cycles.length, 0)} rows written to ${path}\n`;
}
