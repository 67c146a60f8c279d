// Helper for the shared-heatsink test (not a test file): Zth superposition with two sources.
import { type ModalModel, graphToModal } from "../../src/internal.js";

export { graphToModal };

/** Transfer impedance from source s to observed node 0 after t [K/W]. */
function zthTransfer(model: ModalModel, t: number, s: number): number {
  const gains = model.gainKPerW[0]![s]!;
  let sum = 0;
  for (let m = 0; m < gains.length; m++) sum += gains[m]! * -Math.expm1(-t / model.tauS[m]!);
  return sum;
}

/** Rise of observed node 0 at the end of the n-th of n pulses of length onS every periodS, one power per source. */
export function superposedRiseGraph(model: ModalModel, n: number, periodS: number, onS: number, powersW: readonly number[]): number {
  const t = (n - 1) * periodS + onS;
  let rise = 0;
  for (let k = 0; k < n; k++) {
    const start = k * periodS;
    powersW.forEach((p, s) => {
      rise += p * (zthTransfer(model, t - start, s) - (t - start - onS > 0 ? zthTransfer(model, t - start - onS, s) : 0));
    });
  }
  return rise;
}
