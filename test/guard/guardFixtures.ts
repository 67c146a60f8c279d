// Helpers of the guard tests (not a test file): the guard of a bundled profile, the exported C
// compiled with gcc together with a small driver that replays test vectors, and the guard's
// schedule written back into the profile as events for simulate.
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { type GuardNumeric, type GuardReport, defaultCircuitModels, guardCSource, planGuard, profileRetrySetup } from "../../src/internal.js";
import { bundledText, loadAs, readPath } from "../helpers/closedLoopFixtures.js";
import { requireGccRan } from "../helpers/requireGcc.js";

/** The compile line the exported C must pass (C99, every warning an error). */
export const GCC_FLAGS = ["-std=c99", "-Wall", "-Wextra", "-Werror", "-O2"];

const reports = new Map<string, GuardReport>();

/** The guard report of a bundled profile, with vectors (once per profile and number type). */
export function guardOf(name: string, numeric: GuardNumeric): GuardReport {
  const key = `${name}|${numeric}`;
  let r = reports.get(key);
  if (r === undefined) {
    r = planGuard(loadAs(bundledText(name), name), defaultCircuitModels, { numeric, vectors: true });
    reports.set(key, r);
  }
  return r;
}

/** The retry setup of a bundled profile (the planner's corners). */
export function setupOf(name: string): ReturnType<typeof profileRetrySetup> {
  return profileRetrySetup(loadAs(bundledText(name), name), defaultCircuitModels);
}

/**
 * A driver for the exported guard: reads lines "ticks e0 e1 ..." from stdin, runs that many ticks
 * with those energies, and prints "state... | rise... | may_start cooldown" after each line.
 */
function driver(numeric: GuardNumeric): string {
  const fixed = numeric === "fixed";
  const scalar = fixed ? "int32_t" : "double";
  return `#include <stdio.h>
#include <inttypes.h>
#include "guard.h"

int main(void)
{
    hl_guard_state s;
    long ticks;
    int i, p, m;
    ${scalar} energy[HL_GUARD_INPUTS];
    hl_guard_init(&s);
    while (scanf("%ld", &ticks) == 1) {
        for (i = 0; i < HL_GUARD_INPUTS; i++) {
            ${fixed ? 'long v; if (scanf("%ld", &v) != 1) return 2; energy[i] = (int32_t)v;' : 'if (scanf("%lf", &energy[i]) != 1) return 2;'}
        }
        for (; ticks > 0; ticks--) hl_guard_tick(&s, energy);
        for (p = 0; p < HL_GUARD_PARTS; p++)
            for (m = 0; m < HL_GUARD_MODES; m++) printf(${fixed ? '"%" PRId32 " ", s.z[p][m]' : '"%.17g ", s.z[p][m]'});
        printf("|");
        for (p = 0; p < HL_GUARD_PARTS; p++) printf(${fixed ? '" %" PRId32, hl_guard_rise(&s, p)' : '" %.17g", hl_guard_rise(&s, p)'});
        printf(" | %d %" PRIu32 "\\n", hl_guard_may_start(&s), hl_guard_cooldown_ticks(&s));
    }
    return 0;
}
`;
}

/** What the compiled guard printed after one line of input. */
export interface DriverLine {
  readonly state: number[];
  readonly rise: number[];
  readonly mayStart: boolean;
  /** null for never (HL_GUARD_NEVER) */
  readonly cooldownTicks: number | null;
}

/** Compile the exported guard of a report with gcc (GCC_FLAGS) and replay one corner's vectors through it. */
export function runExportedC(report: GuardReport, corner: number): DriverLine[] {
  const dir = mkdtempSync(join(tmpdir(), "heatledger-guard-"));
  const files = guardCSource(report.guard, report.fixed !== null ? { kind: "fixed", q: report.fixed } : { kind: "float", f: report.float }, { profile: "test", name: "hl_guard", headerFile: "guard.h" });
  writeFileSync(join(dir, "guard.h"), files.header);
  writeFileSync(join(dir, "guard.c"), files.source);
  writeFileSync(join(dir, "driver.c"), driver(report.numeric));
  const exe = join(dir, "driver");
  requireGccRan(spawnSync("gcc", [...GCC_FLAGS, "-o", exe, "guard.c", "driver.c"], { cwd: dir, encoding: "utf8" }));
  const input = report.bursts[corner]!.steps.map((s) => `${s.ticks} ${s.energy.map((e) => (typeof e === "bigint" ? e.toString() : e.toPrecision(17))).join(" ")}`).join("\n");
  const run = spawnSync(exe, [], { input: `${input}\n`, encoding: "utf8", maxBuffer: 1 << 28 });
  if (run.status !== 0) throw new Error(`the driver failed (status ${run.status}): ${run.stderr}`);
  return run.stdout
    .split("\n")
    .filter((line) => line.trim() !== "")
    .map((line) => {
      const [state, rise, tail] = line.split("|") as [string, string, string];
      const [may, cool] = tail.trim().split(" ") as [string, string];
      const words = (t: string): number[] => t.trim().split(/\s+/).filter((w) => w !== "").map(Number);
      return { state: words(state), rise: words(rise), mayStart: may === "1", cooldownTicks: cool === "4294967295" ? null : Number(cool) };
    });
}

/**
 * The guard's schedule in one corner as profile events: attempts into the fault with the waits
 * the guard kept, then free cooling up to `untilS` from the first attempt's start (none when the
 * last attempt ends there).
 */
export function scheduleEvents(fault: unknown, attempts: readonly { startS: number; durationS: number }[], untilS: number): unknown[] {
  const events: unknown[] = [];
  let end = 0;
  attempts.forEach((a, i) => {
    if (i > 0 && a.startS - end > 0) events.push({ wait: a.startS - end });
    events.push({ fault });
    end = a.startS + a.durationS;
  });
  if (untilS - end > 1e-12) events.push({ wait: untilS - end });
  return events;
}

/** The fault of the profile's first retry block with a fault, as written (depth first, as the planner finds it). */
export function faultAsWritten(text: string): unknown {
  const search = (events: unknown): unknown => {
    if (!Array.isArray(events)) return undefined;
    for (const e of events as Record<string, unknown>[]) {
      const retry = e["retry"] as Record<string, unknown> | undefined;
      if (retry?.["fault"] !== undefined) return retry["fault"];
      for (const inner of [retry?.["events"], (e["repeat"] as Record<string, unknown> | undefined)?.["events"]]) {
        const found = search(inner);
        if (found !== undefined) return found;
      }
    }
    return undefined;
  };
  return search(readPath(text, ["events"]));
}
