import { describeFound, inputError } from "../errors/InputError.js";
import type { GuardEstimator } from "./GuardEstimator.js";
import type { ThermalGuard } from "./thermalGuard.js";
import { GUARD_DEFAULTS } from "./guardDefaults.js";
import { COOLDOWN_DOUBLINGS, greedyCooldown } from "./greedyCooldown.js";

/** Bits of the decay factors (unsigned, below 1: UQ0.32). */
export const DECAY_BITS = 32;
/** Bits of the span decay factors (unsigned, up to 1: UQ1.31). */
export const SPAN_BITS = 31;
/** Relative widening of every rounded constant, far above the error of the doubles it comes from (a few 1e-16). */
const WIDEN = 1e-12;
const INT32_MAX = 2147483647n;
const INT32_MIN = -2147483648n;

/** The guard's constants as 32-bit integers: what the fixed-point C source holds. */
export interface FixedPointGuard {
  /** fractional bits of rises, states and headrooms (K) */
  readonly fractionBits: number;
  /** fractional bits of the energy inputs (J) */
  readonly energyFractionBits: number;
  /** fractional bits of the input gains (K/J) */
  readonly gainFractionBits: number;
  /** modes per part (parts with fewer modes are padded with zero gains) */
  readonly modes: number;
  /** decay per tick rounded up, and rounded down (for negative states), UQ0.32, [part][mode] */
  readonly decayUp: readonly (readonly number[])[];
  readonly decayDown: readonly (readonly number[])[];
  /** input gains rounded up, [part][input][mode] */
  readonly gain: readonly (readonly (readonly number[])[])[];
  /** span decays rounded up, UQ1.31, [part][span][mode] */
  readonly spanDecay: readonly (readonly (readonly number[])[])[];
  /** headrooms rounded down, [part][span] */
  readonly headroom: readonly (readonly number[])[];
  /** decay over 2^k ticks rounded up, UQ0.32, [part][k][mode] */
  readonly cooldownDecay: readonly (readonly (readonly number[])[])[];
}

/**
 * Round the guard to 32-bit fixed point, every constant toward the safe side: the decay up (down
 * for a negative state), the input gains up, the span decays up, the headrooms down; the C source
 * rounds every product up (ceilShift), so the fixed-point state never falls below the
 * floating-point one and the may-start answer is never more permissive. The gains take the most
 * fractional bits that fit 32 bits. The fraction bits are the user's Q format (Q(31 − F).F).
 * Source: interval rounding, each operation rounded toward the bound it must keep (common
 * practice); integer arithmetic as ISO/IEC 9899:1999 (C99) defines it.
 * Cost O(parts × (inputs + spans + doublings) × modes).
 * @throws InputError `out-of-range` for fraction bits outside 1..30, or a Q range too small for
 *   GUARD_DEFAULTS.rangeFactor times the largest rise tracked, or for the heaviest tick's energy
 */
export function fixedPointGuard(guard: ThermalGuard, fractionBits: number = GUARD_DEFAULTS.fractionBits, energyFractionBits: number = GUARD_DEFAULTS.energyFractionBits): FixedPointGuard {
  for (const [bits, field] of [
    [fractionBits, "--q"],
    [energyFractionBits, "--energy-q"],
  ] as const) {
    if (!Number.isInteger(bits) || bits < 1 || bits > 30) throw inputError("out-of-range", field, "fractional bits, a whole number from 1 to 30", describeFound(bits));
  }
  const modes = Math.max(...guard.channels.map((c) => c.modes.tauS.length));
  const biggestRise = Math.max(...guard.channels.flatMap((c) => [...c.allowedRiseK, ...c.responseK.flat()]));
  const rangeK = 2 ** (31 - fractionBits);
  if (GUARD_DEFAULTS.rangeFactor * biggestRise >= rangeK)
    throw inputError("out-of-range", "--q", `fewer fractional bits: Q${31 - fractionBits}.${fractionBits} holds rises up to ${rangeK} K, the guard needs ${GUARD_DEFAULTS.rangeFactor} × ${biggestRise.toFixed(1)} K`, `${fractionBits}`);
  const heaviest = Math.max(...guard.channels.flatMap((c) => c.heaviestTickJ));
  if (GUARD_DEFAULTS.rangeFactor * heaviest >= 2 ** (31 - energyFractionBits))
    throw inputError("out-of-range", "--energy-q", `fewer fractional bits: the heaviest tick carries ${heaviest.toPrecision(3)} J`, `${energyFractionBits}`);
  const biggestGain = Math.max(...guard.channels.flatMap((c) => c.modes.boundGainKPerJ.flat().map(Math.abs)), 1e-300);
  // the most bits with |gain|·2^bits below 2^31 (kept ≤ 62 − energy bits + fraction bits so the shift stays in range)
  let gainFractionBits = Math.floor(Math.log2((2 ** 31 - 2) / (biggestGain * (1 + 1e-9))));
  gainFractionBits = Math.min(gainFractionBits, 60 + fractionBits - energyFractionBits);
  if (gainFractionBits + energyFractionBits - fractionBits < 0) throw inputError("out-of-range", "--energy-q", `at least ${fractionBits - gainFractionBits} fractional bits for gains up to ${biggestGain.toPrecision(3)} K/J`, `${energyFractionBits}`);
  const up = (x: number, bits: number): number => Math.ceil(x * 2 ** bits * (x >= 0 ? 1 + WIDEN : 1 - WIDEN));
  const down = (x: number, bits: number): number => Math.floor(x * 2 ** bits * (x >= 0 ? 1 - WIDEN : 1 + WIDEN));
  const pad = <T>(list: readonly T[], fill: T): T[] => [...list, ...new Array<T>(modes - list.length).fill(fill)];
  return {
    fractionBits,
    energyFractionBits,
    gainFractionBits,
    modes,
    decayUp: guard.channels.map((c) => pad(c.modes.decay.map((a) => Math.min(up(a, DECAY_BITS), 2 ** DECAY_BITS - 1)), 0)),
    decayDown: guard.channels.map((c) => pad(c.modes.decay.map((a) => down(a, DECAY_BITS)), 0)),
    gain: guard.channels.map((c) =>
      guard.inputs.map((_, i) => {
        const s = c.inputOfSource.indexOf(i);
        return pad(s < 0 ? c.modes.tauS.map(() => 0) : c.modes.boundGainKPerJ[s]!.map((b) => up(b, gainFractionBits)), 0);
      }),
    ),
    spanDecay: guard.channels.map((c) => c.spanDecay.map((row) => pad(row.map((d) => Math.min(up(d, SPAN_BITS), 2 ** SPAN_BITS)), 0))),
    headroom: guard.channels.map((c) => c.headroomK.map((h) => Math.max(-(2 ** 31), down(h - 1e-9 * Math.max(1, Math.abs(h)), fractionBits)))),
    cooldownDecay: guard.channels.map((c) =>
      Array.from({ length: COOLDOWN_DOUBLINGS }, (_, k) => pad(c.modes.tauS.map((tau) => Math.min(up(Math.exp((-c.modes.tickS * 2 ** k) / tau), DECAY_BITS), 2 ** DECAY_BITS - 1)), 0)),
    ),
  };
}

/** ⌈p / 2^s⌉ for a 64-bit product: what the C source's hl_ceil_shift computes. */
function ceilShift(p: bigint, s: bigint): bigint {
  return p >= 0n ? (p + (1n << s) - 1n) >> s : -(-p >> s);
}

function clamp32(x: bigint): bigint {
  return x > INT32_MAX ? INT32_MAX : x < INT32_MIN ? INT32_MIN : x;
}

/**
 * The fixed-point guard as the exported C source runs it, in BigInt so that every 64-bit product
 * is exact: bit for bit the C answers (the test vectors hold its results). Energies in joules are
 * rounded up to the energy Q format before use.
 */
export class FixedPointEstimator implements GuardEstimator {
  private readonly z: bigint[][];
  private readonly q: FixedPointGuard;
  private readonly gainShift: bigint;

  constructor(q: FixedPointGuard) {
    this.q = q;
    this.z = q.decayUp.map(() => new Array<bigint>(q.modes).fill(0n));
    this.gainShift = BigInt(q.gainFractionBits + q.energyFractionBits - q.fractionBits);
  }

  quantiseEnergy(energyJ: readonly number[]): bigint[] {
    return energyJ.map((e) => BigInt(Math.min(2 ** 31 - 1, Math.max(0, Math.ceil(e * 2 ** this.q.energyFractionBits * (1 + WIDEN))))));
  }

  tick(energyJ: readonly number[]): void {
    this.tickQ(this.quantiseEnergy(energyJ));
  }

  /** One tick with energies already in the energy Q format. */
  tickQ(energy: readonly bigint[]): void {
    const q = this.q;
    this.z.forEach((row, c) => {
      for (let m = 0; m < q.modes; m++) {
        const z = row[m]!;
        let next = ceilShift(BigInt(z >= 0n ? q.decayUp[c]![m]! : q.decayDown[c]![m]!) * z, BigInt(DECAY_BITS));
        energy.forEach((e, i) => (next += ceilShift(BigInt(q.gain[c]![i]![m]!) * (e > 0n ? e : 0n), this.gainShift)));
        row[m] = clamp32(next);
      }
    });
  }

  /** The rises in the Q format, as the C source's rise function returns them. */
  riseQ(): bigint[] {
    return this.z.map((row) => clamp32(row.reduce((a, b) => a + b, 0n)));
  }

  riseK(): number[] {
    return this.riseQ().map((r) => Number(r) / 2 ** this.q.fractionBits);
  }

  mayStart(): boolean {
    return this.allowed(this.z.map((row) => row.map((z) => (z > 0n ? z : 0n))));
  }

  cooldownTicks(): number | null {
    const q = this.q;
    return greedyCooldown(
      this.z.map((row) => row.map((v) => (v > 0n ? v : 0n))),
      (z) => this.allowed(z),
      (z, k) => z.map((row, c) => row.map((v, m) => ceilShift(v * BigInt(q.cooldownDecay[c]![k]![m]!), BigInt(DECAY_BITS)))),
    );
  }

  state(): bigint[][] {
    return this.z.map((row) => [...row]);
  }

  /** The may-start test on non-negative states: every span's decayed sum at or below its headroom. */
  private allowed(positive: readonly (readonly bigint[])[]): boolean {
    const q = this.q;
    return positive.every((row, c) =>
      q.headroom[c]!.every((h, j) => {
        let sum = 0n;
        row.forEach((z, m) => (sum += ceilShift(z * BigInt(q.spanDecay[c]![j]![m]!), BigInt(SPAN_BITS))));
        return sum <= BigInt(h);
      }),
    );
  }
}
