import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { parseDocument } from "yaml";
import { type DutyProfile, SIZE_SCALE_SCOPES, type ThermalNetwork, defaultCircuitModels, formatNetworkFile, loadProfile, simulateProfile, sizeProfile, sizeScaledNetwork } from "../../src/index.js";

// Closed loop over every bundled profile: each capacity answer of `heatledger size`, for both
// scopes, is written back as a design (the sized network through the project's own network-file
// writer, the profile text pointing its part(s) at that file), loaded and simulated again. The
// sized design must keep the part, and the part that governs the answer, at or under the limit
// less the margin (+ 0.01 K: SIZE_DEFAULTS.temperatureToleranceK, plus the 1e-9 relative Zth change
// of the file's 10 significant digits); the answer moved 2 % toward danger (k × 0.98, capacity
// smaller) must take the governing part over it. 2 % is twenty times the sizing bracket's width
// (SIZE_DEFAULTS.capacityRelativeWidth = 1e-3), so it crosses wherever the peak falls with capacity.
const folder = join(import.meta.dirname, "../../profiles");
const files = readdirSync(folder).filter((f) => /\.ya?ml$/.test(f)).sort();
const SIZED_FILE = "sized-design-network.yaml";
const models = defaultCircuitModels;

/** The profile text with every part on the sized network pointing at SIZED_FILE, loaded with that file's text. */
function designWith(text: string, file: string, profile: DutyProfile, partIndex: number, network: ThermalNetwork): DutyProfile {
  const doc = parseDocument(text);
  const key = profile.parts[partIndex]!.networkKey;
  profile.parts.forEach((p, j) => {
    if (p.networkKey === key) doc.setIn(["parts", j, "network"], SIZED_FILE);
  });
  const networkText = formatNetworkFile(network);
  return loadProfile(String(doc), file, (path) => (path === SIZED_FILE ? networkText : readFileSync(join(folder, path), "utf8")));
}

test("the bundled profiles are found", () => {
  expect(files.length).toBeGreaterThanOrEqual(5);
});

describe.each(files)("closed loop: %s", (name) => {
  const text = readFileSync(join(folder, name), "utf8");
  const profile = loadProfile(text, name, (path) => readFileSync(join(folder, path), "utf8"));

  test.each([...SIZE_SCALE_SCOPES])("--scale %s: the sized design passes with its margin, 2 % less capacity does not", (scope) => {
    const report = sizeProfile(profile, { models, scope });
    expect(report.parts.length).toBe(profile.parts.length);
    const sized = report.parts.filter((p) => p.inversion.status === "sized");
    // whole-body scaling always has an answer here (every bundled part heats and has a target above ambient)
    if (scope === "whole") expect(sized.length).toBe(profile.parts.length);
    for (const answer of report.parts.filter((p) => p.inversion.status !== "sized")) expect(answer.inversion.status).toBe("any");
    for (const answer of sized) {
      const i = answer.partIndex;
      const part = profile.parts[i]!;
      const targetOf = (id: string): number => {
        const p = profile.parts.find((q) => q.id === id)!;
        return p.limitC - p.marginK;
      };
      const governing = profile.parts.findIndex((q) => q.id === answer.governingPartId);
      const at = simulateProfile(designWith(text, name, profile, i, answer.inversion.sizedNetwork!), { models }).parts;
      expect(at[i]!.peakTemperatureC).toBeLessThanOrEqual(answer.targetC + 0.01);
      expect(at[governing]!.peakTemperatureC).toBeLessThanOrEqual(targetOf(answer.governingPartId) + 0.01);
      // and the design is the one the report states: its element capacity and peak
      expect(sizeScaledNetwork(answer.inversion.sizedNetwork!, part.model.sources[part.sourceIndex]!, "whole", 1).elementCapacityJPerK).toBeCloseTo(answer.inversion.capacityJPerK, 12);
      expect(Math.abs(at[i]!.peakTemperatureC - answer.inversion.peakTemperatureC)).toBeLessThan(1e-6); // 10-digit file values
      const smaller = sizeScaledNetwork(part.network!, part.model.sources[part.sourceIndex]!, scope, 0.98 * answer.inversion.scale).network;
      const over = simulateProfile(designWith(text, name, profile, i, smaller), { models }).parts;
      expect(over[governing]!.peakTemperatureC).toBeGreaterThan(targetOf(answer.governingPartId));
    }
  });
});
