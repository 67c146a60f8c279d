import { reportCautions } from "../text/cautions.js";
import { GUARD_CAUTION } from "../text/guardCaution.js";
import type { FixedPointGuard } from "./fixedPointGuard.js";
import { DECAY_BITS, SPAN_BITS } from "./fixedPointGuard.js";
import { COOLDOWN_DOUBLINGS } from "./greedyCooldown.js";
import type { FloatGuard } from "./floatGuard.js";
import type { ThermalGuard } from "./thermalGuard.js";

/**
 * The exported guard as plain data, for firmware in other languages: the exact figures (time
 * constants, decays, zero-order-hold and guard gains, span starts and headrooms), the
 * double-precision tables of the floating-point export and, when made, the integer tables of the
 * fixed-point export, with the arithmetic each needs written out in `arithmetic`. The same
 * numbers the C source holds. Cost O(size of the tables).
 * @example
 * const report = planGuard(profile("warehouse-robot-48v.yaml"), defaultCircuitModels);
 * guardModelJson(report.guard, report.float, report.fixed, "robot.yaml").kind // => "heatledger-thermal-guard"
 */
export function guardModelJson(guard: ThermalGuard, float: FloatGuard, fixed: FixedPointGuard | null, profile: string): Record<string, unknown> {
  return {
    kind: "heatledger-thermal-guard",
    version: 1,
    profile,
    tickS: guard.tickS,
    corners: guard.corners,
    inputs: guard.inputs.map((i) => i.name),
    arithmetic:
      "per tick: z[p][m] = decay[p][m]·z[p][m] + Σ_i gain[p][i][m]·energy[i]; rise[p] = Σ_m z[p][m]; may start when for every part p and span j, " +
      "Σ_m max(z[p][m], 0)·spanDecay[p][j][m] ≤ headroom[p][j]. Fixed point: decays UQ0." +
      `${DECAY_BITS} (up for z ≥ 0, down for z < 0), span decays UQ1.${SPAN_BITS}, every product rounded up (ceil of p / 2^bits), states clamped to int32; ` +
      `cool-down: greedy descent over the decays of 2^k ticks, k = ${COOLDOWN_DOUBLINGS - 1} .. 0.`,
    parts: guard.channels.map((c) => ({
      part: c.part,
      tauS: c.modes.tauS,
      decay: c.modes.decay,
      zohGainKPerJ: c.modes.zohGainKPerJ,
      boundGainKPerJ: c.modes.boundGainKPerJ,
      inputOfSource: c.inputOfSource,
      spanStartS: c.spanStartS,
      headroomK: c.headroomK,
      governingCorner: c.governing,
      allowedRiseK: Object.fromEntries(guard.corners.map((name, i) => [name, c.allowedRiseK[i]])),
    })),
    float: { decay: float.decay, gainKPerJ: float.gain, spanDecay: float.spanDecay, headroomK: float.headroomK, cooldownDecay: float.cooldownDecay, allowanceK: float.allowanceK },
    fixed:
      fixed === null
        ? null
        : {
            fractionBits: fixed.fractionBits,
            energyFractionBits: fixed.energyFractionBits,
            gainFractionBits: fixed.gainFractionBits,
            decayBits: DECAY_BITS,
            spanDecayBits: SPAN_BITS,
            decayUp: fixed.decayUp,
            decayDown: fixed.decayDown,
            gain: fixed.gain,
            spanDecay: fixed.spanDecay,
            headroom: fixed.headroom,
            cooldownDecay: fixed.cooldownDecay,
          },
    cautions: [GUARD_CAUTION, ...reportCautions(false)],
  };
}
