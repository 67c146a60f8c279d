// Helpers of the closed-loop tests (not a test file). A planner's answer is written back into a
// bundled profile as YAML text: the profile's own parts, networks, limits and circuit, with the
// answer's events (and a corner's or the answer's circuit values) substituted, and the result is
// run through loadProfile and simulateProfile, the path `heatledger simulate` takes. The planners
// are called only by planOf, once per bundled profile.
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { isMap, isSeq, parseDocument } from "yaml";
import { type DutyProfile, type RetryPlanReport, defaultCircuitModels, loadProfile, planRetries, simulateProfile } from "../../src/internal.js";

const PROFILES = join(dirname(fileURLToPath(import.meta.url)), "..", "..", "profiles");

/**
 * How far a simulated peak may lie above limit − margin and still count as "inside" [K]. The
 * planners and simulate both sum the same exact modal responses (closed form, no time step) and
 * differ only in the order of the floating-point work (AttemptCursor attempt by attempt,
 * ThermalRun over the merged timeline): on the fastest schedules here simulate's peak equals the
 * planner's to the last bit, and at every answer simulate stayed below limit − margin (the
 * planners' bisections stop on the safe side, 5e-10 K to 2e-6 K below it). 1e-6 K covers that
 * rounding and is some 100,000 times smaller than what a 2 % move of an answer changes here
 * (0.2 K to 2 K), so it cannot hide a defect.
 */
export const PEAK_TOLERANCE_K = 1e-6;

/** The move toward danger each answer is tested with: 2 % of the answer (shorter interval, wait or lockout; longer timeout). */
export const DANGER_STEP = 0.02;

/** A bundled profile's text. */
export function bundledText(name: string): string {
  return readFileSync(join(PROFILES, name), "utf8");
}

/** Load profile text as if it were the bundled file `name` (networks it names are read from profiles/). */
export function loadAs(text: string, name: string): DutyProfile {
  return loadProfile(text, join("profiles", name), (path) => readFileSync(join(PROFILES, path), "utf8"));
}

const plans = new Map<string, RetryPlanReport>();

/** The retry plan of a bundled profile, as `heatledger retries` computes it (once per file). */
export function planOf(name: string): RetryPlanReport {
  let plan = plans.get(name);
  if (plan === undefined) {
    plan = planRetries(loadAs(bundledText(name), name), defaultCircuitModels);
    plans.set(name, plan);
  }
  return plan;
}

/** A value of the profile document at a path, as plain data (undefined when absent). */
export function readPath(text: string, path: readonly (string | number)[]): unknown {
  const node = parseDocument(text).getIn(path, true) as unknown;
  return node !== null && typeof node === "object" && "toJSON" in node ? (node as { toJSON(): unknown }).toJSON() : node;
}

/** The profile text with one value replaced (or added). */
export function withValue(text: string, path: readonly (string | number)[], value: unknown): string {
  const doc = parseDocument(text);
  doc.setIn(path, value);
  return doc.toString({ lineWidth: 0 });
}

/** The profile text with its events replaced by `events` (plain data, one key per event). */
export function withEvents(text: string, events: readonly unknown[]): string {
  return withValue(text, ["events"], events);
}

/** Index of the first top-level retry block in the profile's event list. */
export function retryIndexOf(text: string): number {
  const events = parseDocument(text).get("events");
  const index = isSeq(events) ? events.items.findIndex((e) => isMap(e) && e.has("retry")) : -1;
  if (index < 0) throw new Error("the profile has no top-level retry block");
  return index;
}

/** The first top-level retry block of the profile, as written. */
export function retryBlockOf(text: string): Record<string, unknown> {
  return readPath(text, ["events", retryIndexOf(text), "retry"]) as Record<string, unknown>;
}

/** The profile text with keys of its first top-level retry block replaced. */
export function withRetryKeys(text: string, keys: Readonly<Record<string, unknown>>): string {
  const index = retryIndexOf(text);
  let out = text;
  for (const [key, value] of Object.entries(keys)) out = withValue(out, ["events", index, "retry", key], value);
  return out;
}

/** A retry plan corner as written in the profile: each key changes only what it names. */
export interface CornerSpec {
  readonly name: string;
  readonly ambient?: string | number;
  readonly busVoltage?: string | number;
  readonly capacitance?: string | number;
  readonly resistance?: string | number;
}

/** The profile's retryPlan corners, or the profile itself as the one corner "nominal". */
export function cornersOf(text: string): CornerSpec[] {
  const corners = readPath(text, ["retryPlan", "corners"]) as CornerSpec[] | undefined;
  return corners ?? [{ name: "nominal" }];
}

/**
 * The profile as one corner: the corner's ambient for the profile and every part that sets its
 * own, and its bus voltage, capacitance and series resistance in the circuit (the same values the
 * retry planner changes for that corner).
 */
export function atCorner(text: string, corner: CornerSpec): string {
  const doc = parseDocument(text);
  if (corner.ambient !== undefined) {
    doc.setIn(["ambient"], corner.ambient);
    const parts = doc.get("parts");
    if (isSeq(parts)) parts.items.forEach((p, i) => isMap(p) && p.has("ambient") && doc.setIn(["parts", i, "ambient"], corner.ambient));
  }
  if (corner.busVoltage !== undefined) doc.setIn(["circuit", "busVoltage"], corner.busVoltage);
  if (corner.capacitance !== undefined) doc.setIn(["circuit", "capacitance"], corner.capacitance);
  if (corner.resistance !== undefined) doc.setIn(["circuit", "resistance"], corner.resistance);
  return doc.toString({ lineWidth: 0 });
}

/** What simulate found for one part of one profile text. */
export interface SimulatedPeak {
  readonly label: string;
  readonly part: string;
  readonly peakC: number;
  /** limit − margin [°C] */
  readonly allowedC: number;
  /** allowed − peak [K]; negative past limit − margin */
  readonly headroomK: number;
}

/** Simulate a profile text (loaded as the bundled file `name`): every part's peak against limit − margin. */
export function simulatedPeaks(text: string, name: string, label = name): SimulatedPeak[] {
  const profile = loadAs(text, name);
  const result = simulateProfile(profile, { models: defaultCircuitModels });
  return result.parts.map((r, i) => {
    const allowedC = r.limitC - profile.parts[i]!.marginK;
    return { label, part: r.id, peakC: r.peakTemperatureC, allowedC, headroomK: allowedC - r.peakTemperatureC };
  });
}

/** The least headroom over several simulated texts and their parts (the governing one). */
export function worst(peaks: readonly SimulatedPeak[]): SimulatedPeak {
  return peaks.reduce((a, b) => (b.headroomK < a.headroomK ? b : a));
}

/** One simulate run per corner of the profile, with the corner's values and the given events. */
export function simulateCorners(text: string, name: string, events: readonly unknown[]): SimulatedPeak {
  return worst(cornersOf(text).flatMap((c) => simulatedPeaks(withEvents(atCorner(text, c), events), name, c.name)));
}

/**
 * Attempts into `fault`, the k-th wait (seconds, from the end of attempt k to the start of attempt
 * k + 1, as a firmware timer started at the end or trip) between them, then `tailS` of free
 * cooling so that the last attempt's window covers any late peak. A wait of 0 puts the attempts
 * back to back.
 */
export function attemptsWithWaits(fault: unknown, waitsS: readonly number[], tailS = 60): unknown[] {
  const events: unknown[] = [{ fault }];
  for (const w of waitsS) {
    if (w > 0) events.push({ wait: w });
    events.push({ fault });
  }
  events.push({ wait: tailS });
  return events;
}

/** `count` attempts into `fault` every `waitS` seconds from the end of each (end-to-start), then a cooling tail. */
export function endToStartTrain(fault: unknown, count: number, waitS: number, tailS = 60): unknown[] {
  const body: unknown[] = [{ fault }];
  if (waitS > 0) body.push({ wait: waitS });
  return [{ repeat: { count, events: body } }, { wait: tailS }];
}

/** A retry block (start-to-start interval, no back-off) into `fault`, then a cooling tail. */
export function uniformRetry(fault: unknown, attempts: number, intervalS: number, lockoutS: number, tailS = 60): unknown[] {
  return [{ retry: { attempts, interval: intervalS, fault, lockout: lockoutS } }, { wait: tailS }];
}
