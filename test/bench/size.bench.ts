// Sizing speed figures: the whole-profile capacity inversion and the charging-element search on the
// bundled example profiles (simulations per answer and wall time). Printed, never asserted.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { projectRoot } from "./projectRoot.js";
import { defaultCircuitModels, loadProfile, sizeProfile } from "../../src/internal.js";

export async function run(print: (line: string) => void): Promise<void> {
  const folder = join(projectRoot, "profiles");
  for (const name of ["heat-pump-trip-retries.yaml", "warehouse-robot-48v.yaml", "home-storage-400v.yaml", "irrigation-pump-decade.yaml"]) {
    const file = join(folder, name);
    const profile = loadProfile(readFileSync(file, "utf8"), file, (p) => readFileSync(join(folder, p), "utf8"));
    const t0 = performance.now();
    const report = sizeProfile(profile, { models: defaultCircuitModels });
    const ms = performance.now() - t0;
    const sims = report.parts.map((p) => `${p.partId} ${p.inversion.simulations} simulations`).join(", ");
    print(`${name}: ${(ms / 1000).toFixed(2)} s (${sims}; circuit ${report.circuit?.runs ?? 0} model runs)`);
  }
}
