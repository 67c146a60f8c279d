import type { GuardReport } from "./planGuard.js";

/**
 * The test vectors of a guard report as plain data: per corner, the lines the exported guard ran
 * (ticks with the same energy, the energy per input as fed, then the state, the rise estimate, the
 * exact rise at that tick instant, the may-start answer and, on idle lines, the cool-down answer in
 * ticks, −1 for never) and the attempts it admitted. Fixed-point values are the Q integers.
 * Cost O(lines × parts × modes).
 * @example
 * const report = planGuard(profile("warehouse-robot-48v.yaml"), defaultCircuitModels);
 * guardVectorsJson(report, "robot.yaml").kind // => "heatledger-guard-vectors"
 */
export function guardVectorsJson(report: GuardReport, profile: string): Record<string, unknown> {
  const num = (v: number | bigint): number => Number(v);
  return {
    kind: "heatledger-guard-vectors",
    version: 1,
    profile,
    numeric: report.numeric,
    tickS: report.guard.tickS,
    fractionBits: report.fixed?.fractionBits ?? null,
    energyFractionBits: report.fixed?.energyFractionBits ?? null,
    inputs: report.guard.inputs.map((i) => i.name),
    parts: report.guard.channels.map((c) => c.part),
    corners: report.bursts.map((b) => ({
      corner: b.corner,
      attempts: b.attempts.map((a) => ({ attempt: a.attempt, startTick: a.startTick, durationS: a.durationS, peakC: a.peakC })),
      lines: b.steps.map((s) => ({
        ticks: s.ticks,
        energy: s.energy.map(num),
        state: s.state.map((row) => row.map(num)),
        riseK: s.riseK,
        exactRiseK: s.exactRiseK,
        mayStart: s.mayStart,
        ...(s.cooldownTicks === undefined ? {} : { cooldownTicks: s.cooldownTicks ?? -1 }),
      })),
    })),
  };
}
