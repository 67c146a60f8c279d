import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import fc from "fast-check";
import { beforeAll, describe, expect, test } from "vitest";
import { fleetHeader, type FleetHeader } from "../../src/fleet/FleetHeader.js";
import type { FleetUnitRow } from "../../src/fleet/FleetUnitRow.js";
import { fleetNdjson } from "../../src/fleet/fleetNdjson.js";
import { fleetSummary } from "../../src/fleet/fleetSummary.js";
import { mergeFleetPartitions } from "../../src/fleet/mergeFleetPartitions.js";
import { parseFleetNdjson } from "../../src/fleet/parseFleetNdjson.js";
import { replayFleetUnit } from "../../src/fleet/replayFleetUnit.js";
import { defaultCircuitModels } from "../../src/profile/defaultCircuitModels.js";
import type { DutyProfile } from "../../src/profile/DutyProfile.js";
import { loadProfile } from "../../src/profile/loadProfile.js";
import { type InjectedFault, fleetUnitLog } from "../helpers/fleetUnitLog.js";

// 200 invented units of the bundled irrigation pump drive, with faults injected at known units:
// restart storms (the resistor goes above its 180 °C limit), shorted outputs (over its
// pulse-energy rating, below its temperature limit) and logs the replay must refuse. The ranking
// must put exactly the storm units first, then the short units, then every ordinary unit, then the
// broken logs, each named with its file and line; and any partitioning of the units, merged in any
// order or grouping, must print the single run's summary bit for bit.
const PROFILE_FILE = fileURLToPath(new URL("../../profiles/irrigation-pump-decade.yaml", import.meta.url));
const UNITS = 200;

function faultOf(i: number): InjectedFault {
  if (i % 20 === 3) return "storm";
  if (i % 20 === 11) return "shorts";
  if (i % 40 === 17) return (["backwards", "unknown-word", "garbage"] as const)[(i >> 3) % 3]!;
  return "none";
}

const unitId = (i: number): string => `unit-${String(i).padStart(3, "0")}`;

let profile: DutyProfile;
let header: FleetHeader;
let rows: FleetUnitRow[];

beforeAll(() => {
  const text = readFileSync(PROFILE_FILE, "utf8");
  profile = loadProfile(text, "irrigation-pump-decade.yaml", () => {
    throw new Error("the profile names no file");
  });
  header = fleetHeader(profile, text, [], undefined);
  rows = Array.from({ length: UNITS }, (_, i) => replayFleetUnit(profile, { unit: unitId(i), file: `${unitId(i)}.csv`, text: fleetUnitLog(i, faultOf(i)).text }, { models: defaultCircuitModels }));
}, 120_000);

describe("a fleet of 200 units with injected faults", () => {
  test("the ranking finds the storms first, then the shorts, then the ordinary units, then the broken logs", () => {
    const summary = fleetSummary(header, rows);
    const indexOf = (row: FleetUnitRow): number => Number(row.unit.slice(5));
    const ranked = summary.rows.map(indexOf);
    const storms = ranked.filter((i) => faultOf(i) === "storm");
    const shorts = ranked.filter((i) => faultOf(i) === "shorts");
    const broken = ranked.filter((i) => ["backwards", "unknown-word", "garbage"].includes(faultOf(i)));
    expect(storms.length).toBe(10);
    expect(shorts.length).toBe(10);
    expect(broken.length).toBe(5);
    expect(ranked.slice(0, 10).sort()).toEqual([...storms].sort());
    expect(ranked.slice(10, 20).sort()).toEqual([...shorts].sort());
    expect(ranked.slice(UNITS - 5).sort()).toEqual([...broken].sort());
    expect(summary.counts).toEqual({ fail: 20, warn: 0, pass: 175, error: 5 });
    for (const row of summary.rows.slice(0, 10)) {
      expect(row.error).toBeNull();
      if (row.error !== null) continue;
      // above the limit during the storm (the second day's morning), on a line of the storm
      const part = row.parts[0]!;
      expect(part.marginK).toBeLessThan(0);
      const log = fleetUnitLog(Number(row.unit.slice(5)), "storm").text.split("\n");
      expect(log[part.firstExceedanceLine! - 1]).toMatch(/^\d+,overload$/);
      expect(part.firstExceedanceS).toBeGreaterThan(Number(log[part.firstExceedanceLine! - 1]!.split(",")[0]));
      expect(row.reason).toContain("passes its temperature limit");
    }
    for (const row of summary.rows.slice(10, 20)) {
      expect(row.verdict).toBe("fail");
      if (row.error !== null) continue;
      expect(row.parts[0]!.marginK).toBeGreaterThan(0);
      expect(row.reason).toBe("an event exceeds a part's rating table");
    }
    for (const row of summary.rows.slice(20, UNITS - 5)) expect(row.verdict).toBe("pass");
  });

  test("each broken log is reported with its file, line and field, and every other unit completes", () => {
    for (const row of rows) {
      const i = Number(row.unit.slice(5));
      const { badLine } = fleetUnitLog(i, faultOf(i));
      if (badLine === undefined) {
        expect(row.error).toBeNull();
        continue;
      }
      expect(row.verdict).toBe("error");
      expect(row.error).toMatchObject({ file: `${unitId(i)}.csv`, line: badLine, field: faultOf(i) === "unknown-word" ? "event" : "time" });
    }
  });

  test("damage and life left: the storm units have used the most life and have the least left", () => {
    const damage = (row: FleetUnitRow): number => (row.error === null ? row.parts[0]!.damageToDate! : Number.NaN);
    const ordinary = rows.filter((r, i) => faultOf(i) === "none");
    const storms = rows.filter((r, i) => faultOf(i) === "storm");
    expect(Math.min(...storms.map(damage))).toBeGreaterThan(Math.max(...ordinary.map(damage)));
    for (const row of rows) {
      if (row.error !== null) continue;
      const p = row.parts[0]!;
      // remaining life = (1 − D) / (D · r), r = one log per span: a year over the log's span
      const perYear = (365.25 * 86400) / row.spanS;
      expect(p.remainingLifeYears).toBeCloseTo((1 - p.damageToDate!) / (p.damageToDate! * perYear), 9);
    }
  });

  test("a unit's row does not depend on the units replayed before it in the same thread", () => {
    const some = [150, 3, 11, 0, 43, 63, 1].map((i) => replayFleetUnit(profile, { unit: unitId(i), file: `${unitId(i)}.csv`, text: fleetUnitLog(i, faultOf(i)).text }, { models: defaultCircuitModels }));
    for (const row of some) expect(JSON.stringify(row)).toBe(JSON.stringify(rows[Number(row.unit.slice(5))]));
  });
});

describe("partitions merge into the single run's summary, bit for bit", () => {
  /** The NDJSON of a partition of some rows, as `fleet --ndjson` writes it, read back. */
  const partition = (part: readonly FleetUnitRow[], name: string) => parseFleetNdjson(fleetNdjson(fleetSummary(header, part)), name);

  test("three partitions in any order", () => {
    const single = fleetNdjson(fleetSummary(header, rows));
    const parts = [0, 1, 2].map((k) => partition(rows.filter((_, i) => i % 3 === k), `part-${k}.ndjson`));
    expect(fleetNdjson(mergeFleetPartitions(parts))).toBe(single);
    expect(fleetNdjson(mergeFleetPartitions([parts[2]!, parts[0]!, parts[1]!]))).toBe(single);
    // a merge output is itself a partition: merge(merge(a, b), c) = merge(a, b, c)
    const ab = parseFleetNdjson(fleetNdjson(mergeFleetPartitions([parts[0]!, parts[1]!])), "ab.ndjson");
    expect(fleetNdjson(mergeFleetPartitions([parts[2]!, ab]))).toBe(single);
  });

  test("property: any assignment of units to partitions, merged in any order and grouping", () => {
    const single = fleetNdjson(fleetSummary(header, rows));
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 6 }), { minLength: UNITS, maxLength: UNITS }),
        fc.array(fc.nat(), { minLength: 7, maxLength: 7 }),
        fc.boolean(),
        (assignment, shuffle, nested) => {
          const groups = [0, 1, 2, 3, 4, 5, 6].map((k) => rows.filter((_, i) => assignment[i] === k)).filter((g) => g.length > 0);
          let parts = groups.map((g, k) => partition(g, `part-${k}.ndjson`));
          parts = parts.map((p, k) => [shuffle[k]!, p] as const).sort((a, b) => a[0] - b[0]).map(([, p]) => p);
          if (nested && parts.length > 2) parts = [parseFleetNdjson(fleetNdjson(mergeFleetPartitions(parts.slice(0, 2))), "first-two.ndjson"), ...parts.slice(2)];
          return fleetNdjson(mergeFleetPartitions(parts)) === single;
        },
      ),
      { numRuns: 60, seed: 20260601 },
    );
  });

  test("a unit in two partitions is refused, naming both lines", () => {
    const a = partition(rows.slice(0, 10), "a.ndjson");
    const b = partition(rows.slice(5, 15), "b.ndjson");
    expect(() => mergeFleetPartitions([a, b])).toThrow(/^b\.ndjson:\d+: unit: expected each unit once in a fleet \(unit "unit-00\d" is already a\.ndjson line \d+\)/);
  });

  test("partitions of another profile or rate are refused, naming the field", () => {
    const a = partition(rows.slice(0, 10), "a.ndjson");
    const other = parseFleetNdjson(fleetNdjson(fleetSummary({ ...header, logsPerYear: 52 }, rows.slice(10, 20))), "b.ndjson");
    expect(() => mergeFleetPartitions([a, other])).toThrow(/^b\.ndjson:1: logsPerYear: expected the same logsPerYear as a\.ndjson .*: null, found 52$/);
  });

  test("a partition file that is not one: file, line and field named", () => {
    const good = fleetNdjson(fleetSummary(header, rows.slice(0, 3))).split("\n");
    expect(() => parseFleetNdjson(`${good[0]}\n${good[1]}\nnot json\n`, "p.ndjson")).toThrow(/^p\.ndjson:3: expected one JSON object per line/);
    expect(() => parseFleetNdjson(`${good[1]}\n`, "p.ndjson")).toThrow(/^p\.ndjson:1: kind: expected the header line of a fleet partition/);
    expect(() => parseFleetNdjson(`${good[0]}\n${good[1]!.replace('"peakC":', '"peakC":"hot","x":')}\n`, "p.ndjson")).toThrow(/^p\.ndjson:2: parts\[0\]\.peakC: expected a number, found "hot"$/);
    expect(() => parseFleetNdjson("\n\n", "p.ndjson")).toThrow(/^p\.ndjson: expected a fleet partition: a header line, then one line per unit, found an empty file$/);
  });
});
