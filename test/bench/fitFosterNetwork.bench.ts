// Speed and accuracy of the Foster fit on the recovery case (40 log-spaced points of a
// 4-stage network with 1 % noise) and on exact data. Figures are printed, never asserted.
import { type FosterNetwork, fitFosterNetwork, fosterToModal, logSpacedTimes, zth } from "../../src/internal.js";
import { seededNormal } from "../helpers/seededNoise.js";

const KNOWN: FosterNetwork = {
  kind: "foster",
  stages: [
    { rKPerW: 0.05, tauS: 1e-4 },
    { rKPerW: 0.15, tauS: 3e-3 },
    { rKPerW: 0.4, tauS: 0.08 },
    { rKPerW: 1.2, tauS: 2.5 },
  ],
};

export async function run(print: (line: string) => void): Promise<void> {
  const model = fosterToModal(KNOWN);
  for (const [count, noise] of [[40, 0], [40, 0.01], [400, 0.01]] as const) {
    const times = logSpacedTimes(1e-5, 20, count);
    const elapsed: number[] = [];
    let worstGap = 0;
    let stages = "";
    for (let seed = 1; seed <= 10; seed++) {
      const normal = seededNormal(seed);
      const points = times.map((t) => ({ timeS: t, zthKPerW: zth(model, t) * (1 + noise * normal()) }));
      const start = performance.now();
      const fit = fitFosterNetwork(points);
      elapsed.push(performance.now() - start);
      const fitted = fosterToModal(fit.network);
      for (const t of logSpacedTimes(1e-5, 20, 400)) worstGap = Math.max(worstGap, Math.abs(zth(fitted, t) / zth(model, t) - 1));
      stages += String(fit.network.stages.length);
    }
    elapsed.sort((a, b) => a - b);
    print(
      `noise ${noise * 100} %: 10 fits of ${count} points, median ${elapsed[5]!.toFixed(0)} ms, max ${elapsed[9]!.toFixed(0)} ms; ` +
        `stages chosen ${stages}; worst Zth gap to the known network ${(worstGap * 100).toPrecision(2)} %`,
    );
  }
}
