import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { type DutyProfile, SIZE_SCALE_SCOPES, type ThermalNetwork, defaultCircuitModels, formatNetworkFile, loadProfile, simulateProfile, sizeProfile, sizeScaledNetwork } from "../../src/internal.js";
import { DANGER_STEP, PEAK_TOLERANCE_K, bundledText, loadAs, withValue } from "../helpers/closedLoopFixtures.js";

// Closed loop for `heatledger size`, over every bundled profile and both --scale choices: each
// capacity answer is written back as a design, the sized network through the project's own
// network-file writer (formatNetworkFile) and the profile text naming that file for the part (for
// every part on the network, when several share it), loaded and simulated again. The part, and
// the part that governs the answer, must stay at or below limit − margin; the answer moved 2 %
// toward danger (k × 0.98: less capacity) must take the governing part past it.
// Tolerance: the sizing stops on the safe side of the target (its peak at most 0.01 K under it,
// SIZE_DEFAULTS.temperatureToleranceK) and the file keeps 10 significant digits (Zth changes by
// under 1e-9 relative, some 2e-7 K on these rises), so PEAK_TOLERANCE_K (1e-6 K) covers the
// write-back. Measured on the bundled profiles: the sized peaks lie 1.8e-3 K to 8e-3 K under
// limit − margin, and a 2 % move (twenty times the bisection's 1e-3 bracket,
// SIZE_DEFAULTS.capacityRelativeWidth) raises the governing peak by 0.37 K to 2.0 K.
const PROFILES = join(import.meta.dirname, "..", "..", "profiles");
const files = readdirSync(PROFILES).filter((f) => /\.ya?ml$/.test(f)).sort();
const SIZED_FILE = "sized-design-network.yaml";
const models = defaultCircuitModels;

/** The bundled profile with every part on the sized part's network pointing at SIZED_FILE, which holds `network`. */
function designWith(name: string, profile: DutyProfile, partIndex: number, network: ThermalNetwork): DutyProfile {
  const key = profile.parts[partIndex]!.networkKey;
  let text = bundledText(name);
  profile.parts.forEach((p, j) => {
    if (p.networkKey === key) text = withValue(text, ["parts", j, "network"], SIZED_FILE);
  });
  const networkText = formatNetworkFile(network);
  return loadProfile(text, join("profiles", name), (path) => (path === SIZED_FILE ? networkText : readFileSync(join(PROFILES, path), "utf8")));
}

/** limit − margin of a part of the profile [°C]. */
const allowedC = (profile: DutyProfile, index: number): number => profile.parts[index]!.limitC - profile.parts[index]!.marginK;

test("the bundled profiles are found", () => {
  expect(files.length).toBeGreaterThanOrEqual(5);
});

describe.each(files)("size, closed loop: %s", (name) => {
  const profile = loadAs(bundledText(name), name);

  test.each([...SIZE_SCALE_SCOPES])("--scale %s: the sized design holds limit − margin, 2 % less capacity crosses it", (scope) => {
    const report = sizeProfile(profile, { models, scope });
    expect(report.parts.length).toBe(profile.parts.length);
    const sized = report.parts.filter((p) => p.inversion.status === "sized");
    // every bundled part heats and has a target above ambient, so the whole body always has an answer;
    // the element may not matter ("any": the rest of the network sets the peak), never "none"
    if (scope === "whole") expect(sized.length).toBe(profile.parts.length);
    for (const answer of report.parts.filter((p) => p.inversion.status !== "sized")) expect(answer.inversion.status).toBe("any");
    for (const answer of sized) {
      const i = answer.partIndex;
      const part = profile.parts[i]!;
      const governing = profile.parts.findIndex((q) => q.id === answer.governingPartId);
      const network = answer.inversion.sizedNetwork!;
      const at = simulateProfile(designWith(name, profile, i, network), { models }).parts;
      expect(at[i]!.peakTemperatureC).toBeLessThanOrEqual(allowedC(profile, i) + PEAK_TOLERANCE_K);
      expect(at[governing]!.peakTemperatureC).toBeLessThanOrEqual(allowedC(profile, governing) + PEAK_TOLERANCE_K);
      // the design is the one the report states: its element capacity and its peak
      const source = part.model.sources[part.sourceIndex]!;
      expect(sizeScaledNetwork(network, source, "whole", 1).elementCapacityJPerK).toBeCloseTo(answer.inversion.capacityJPerK, 12);
      expect(Math.abs(at[i]!.peakTemperatureC - answer.inversion.peakTemperatureC)).toBeLessThan(PEAK_TOLERANCE_K);
      const smaller = sizeScaledNetwork(part.network!, source, scope, (1 - DANGER_STEP) * answer.inversion.scale).network;
      const over = simulateProfile(designWith(name, profile, i, smaller), { models }).parts;
      expect(over[governing]!.peakTemperatureC).toBeGreaterThan(allowedC(profile, governing) + PEAK_TOLERANCE_K);
    }
  });
});
