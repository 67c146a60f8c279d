// Brute-force references for the planner tests (not a test file). They share no code with
// src/retry: rectangular pulse trains are superposed from step responses Zth(t) (the O(N²)
// convolution kept as the reference (docs/design.md, "Exact integration")), and general traces are simulated in one piece
// with runThermalHistory over traceSteps.
import { type ModalModel, type PowerTrace, runThermalHistory, traceSteps, zth } from "../../src/internal.js";

/** A rectangular pulse. */
export interface Pulse {
  readonly startS: number;
  readonly onS: number;
  readonly powerW: number;
}

/** Rise at time t [K]: Σ P·(Zth(t − start) − Zth(t − start − on)), Zth(t < 0) = 0. */
export function superposedRise(model: ModalModel, pulses: readonly Pulse[], t: number): number {
  let sum = 0;
  for (const p of pulses) {
    if (t > p.startS) sum += p.powerW * zth(model, t - p.startS);
    if (t > p.startS + p.onS) sum -= p.powerW * zth(model, t - p.startS - p.onS);
  }
  return sum;
}

/**
 * Highest rise of a pulse train [K], sampled at every pulse end and on `samples` points inside
 * every pulse and inside every gap (and a tail as long as the train after it).
 */
export function superposedPeak(model: ModalModel, pulses: readonly Pulse[], samples = 20): number {
  let peak = 0;
  const times: number[] = [];
  pulses.forEach((p, i) => {
    const next = pulses[i + 1]?.startS ?? p.startS + p.onS + 5 * Math.max(...model.tauS);
    for (let j = 1; j <= samples; j++) times.push(p.startS + (p.onS * j) / samples);
    for (let j = 1; j <= samples; j++) times.push(p.startS + p.onS + ((next - p.startS - p.onS) * j) / samples);
  });
  for (const t of times) peak = Math.max(peak, superposedRise(model, pulses, t));
  return peak;
}

/** A uniform train of n pulses every periodS starting at fromS. */
export function uniformPulses(n: number, periodS: number, onS: number, powerW: number, fromS = 0): Pulse[] {
  return Array.from({ length: n }, (_, k) => ({ startS: fromS + k * periodS, onS, powerW }));
}

/** Peak rise of one absolute trace simulated in one piece [K]. */
export function wholeTracePeak(model: ModalModel, trace: PowerTrace, tailS: number): number {
  const last = trace[trace.length - 1];
  const end = last === undefined ? 0 : last.startS + last.durationS;
  return runThermalHistory(model, traceSteps([trace], 0, end + tailS)).peakRiseK[0]!;
}

/** Smallest value of a grid at which ok() holds, or null. */
export function firstOnGrid(grid: readonly number[], ok: (x: number) => boolean): number | null {
  for (const x of grid) if (ok(x)) return x;
  return null;
}

/** n points evenly spaced from a to b inclusive. */
export function linspace(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));
}
