import type { GuardEstimator } from "./GuardEstimator.js";
import type { ThermalGuard } from "./thermalGuard.js";
import { GUARD_DEFAULTS } from "./guardDefaults.js";
import { COOLDOWN_DOUBLINGS, greedyCooldown } from "./greedyCooldown.js";

/** Unit roundoff of IEEE 754 double precision, 2^−53. */
const UNIT_ROUNDOFF = 2 ** -53;

/** The guard's constants as doubles, padded for rounding: what the floating-point C source holds. */
export interface FloatGuard {
  readonly modes: number;
  /** decay per tick, [part][mode] */
  readonly decay: readonly (readonly number[])[];
  /** input gains widened by GUARD_DEFAULTS.floatGainPad, [part][input][mode] [K/J] */
  readonly gain: readonly (readonly (readonly number[])[])[];
  /** span decays, [part][span][mode] */
  readonly spanDecay: readonly (readonly (readonly number[])[])[];
  /** headrooms less the rounding allowance, [part][span] [K] */
  readonly headroomK: readonly (readonly number[])[];
  /** decay over 2^k ticks, [part][k][mode] */
  readonly cooldownDecay: readonly (readonly (readonly number[])[])[];
  /** added to every rise estimate and taken off every headroom [K], per part */
  readonly allowanceK: readonly number[];
}

/**
 * The guard for double-precision firmware. Round-to-nearest arithmetic can round a state down by
 * at most u = 2^−53 of it per operation; over the history a mode's error is at most
 * Σ_k a^k·c·u·Z ≤ c·u·Z/(1 − a) for states below Z. The allowance per part is
 * Σ_m 8·u·Z/(1 − a_m) with Z = GUARD_DEFAULTS.floatStateCapFactor × the largest allowed rise
 * (8 covers the few operations per update and the error of the constants themselves); it is
 * added to the rise estimate and taken off every headroom. The gains are also widened by
 * GUARD_DEFAULTS.floatGainPad (relative). Valid while the states stay below Z.
 * Source: the standard model of floating-point arithmetic, fl(x op y) = (x op y)(1 + δ), |δ| ≤ u
 * (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed. (2002), §2.2); the geometric
 * sum of the decaying errors (Boyce & DiPrima, Elementary Differential Equations, 10th ed. (2012),
 * §2.9).
 * Cost O(parts × (inputs + spans + doublings) × modes).
 */
export function floatGuard(guard: ThermalGuard): FloatGuard {
  const modes = Math.max(...guard.channels.map((c) => c.modes.tauS.length));
  const pad = <T>(list: readonly T[], fill: T): T[] => [...list, ...new Array<T>(modes - list.length).fill(fill)];
  const widen = GUARD_DEFAULTS.floatGainPad;
  const allowanceK = guard.channels.map((c) => {
    const cap = GUARD_DEFAULTS.floatStateCapFactor * Math.max(...c.allowedRiseK);
    return c.modes.tauS.reduce((sum, tau) => sum + (8 * UNIT_ROUNDOFF * cap) / -Math.expm1(-c.modes.tickS / tau), 0);
  });
  return {
    modes,
    decay: guard.channels.map((c) => pad(c.modes.decay, 0)),
    gain: guard.channels.map((c) =>
      guard.inputs.map((_, i) => {
        const s = c.inputOfSource.indexOf(i);
        return pad(s < 0 ? c.modes.tauS.map(() => 0) : c.modes.boundGainKPerJ[s]!.map((b) => b * (b >= 0 ? 1 + widen : 1 - widen)), 0);
      }),
    ),
    spanDecay: guard.channels.map((c) => c.spanDecay.map((row) => pad(row.map((d) => d * (1 + widen)), 0))),
    headroomK: guard.channels.map((c, p) => c.headroomK.map((h) => h - allowanceK[p]! - widen * Math.abs(h))),
    cooldownDecay: guard.channels.map((c) => Array.from({ length: COOLDOWN_DOUBLINGS }, (_, k) => pad(c.modes.tauS.map((tau) => Math.exp((-c.modes.tickS * 2 ** k) / tau) * (1 + widen)), 0))),
    allowanceK,
  };
}

/** The floating-point guard as the exported C source runs it: the same operations in the same order. */
export class FloatEstimator implements GuardEstimator {
  private readonly z: number[][];
  private readonly g: FloatGuard;

  constructor(g: FloatGuard) {
    this.g = g;
    this.z = g.decay.map(() => new Array<number>(g.modes).fill(0));
  }

  quantiseEnergy(energyJ: readonly number[]): number[] {
    return [...energyJ];
  }

  tick(energyJ: readonly number[]): void {
    const g = this.g;
    this.z.forEach((row, c) => {
      for (let m = 0; m < g.modes; m++) {
        let next = g.decay[c]![m]! * row[m]!;
        for (let i = 0; i < energyJ.length; i++) next += g.gain[c]![i]![m]! * energyJ[i]!;
        row[m] = next;
      }
    });
  }

  riseK(): number[] {
    return this.z.map((row, c) => {
      let sum = 0;
      for (const z of row) sum += z;
      return sum + this.g.allowanceK[c]!;
    });
  }

  mayStart(): boolean {
    return this.allowed(this.z.map((row) => row.map((z) => (z > 0 ? z : 0))));
  }

  cooldownTicks(): number | null {
    const g = this.g;
    return greedyCooldown(
      this.z.map((row) => row.map((v) => (v > 0 ? v : 0))),
      (z) => this.allowed(z),
      (z, k) => z.map((row, c) => row.map((v, m) => v * g.cooldownDecay[c]![k]![m]!)),
    );
  }

  state(): number[][] {
    return this.z.map((row) => [...row]);
  }

  private allowed(positive: readonly (readonly number[])[]): boolean {
    const g = this.g;
    return positive.every((row, c) =>
      g.headroomK[c]!.every((h, j) => {
        let sum = 0;
        for (let m = 0; m < row.length; m++) sum += row[m]! * g.spanDecay[c]![j]![m]!;
        return sum <= h;
      }),
    );
  }
}
