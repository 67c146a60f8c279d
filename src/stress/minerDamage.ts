import { describeFound, inputError } from "../errors/InputError.js";
import { CYCLE_QUANTITY_UNITS, type CycleQuantity, type FittedInterval, type LifetimeModel, cycleQuantity } from "./LifetimeModel.js";
import type { RainflowCycle } from "./rainflowCounter.js";

/** Number of most damaging cycles a damage result lists, unless the caller asks otherwise. */
export const DEFAULT_TOP_CYCLES = 5;

/** A cycle with the damage it does. */
export interface DamagingCycle {
  readonly cycle: RainflowCycle;
  /** N_f of this cycle under the model */
  readonly cyclesToFailure: number;
  /** count / N_f */
  readonly damage: number;
  /** share of the total damage per repetition, 0..1 */
  readonly share: number;
}

/**
 * Cycles whose value of one quantity lies outside the lifetime model's validity range (the
 * range its parameters were fitted on): their damage is an extrapolation of the model.
 */
export interface ExtrapolatedQuantity {
  readonly quantity: CycleQuantity;
  /** unit of `range` and `found` ("K", "°C", "s", "Hz") */
  readonly unit: string;
  /** the validity range [lowest, highest] */
  readonly range: readonly [number, number];
  /** where the range comes from ("Bayerer et al. 2008, from memory", "given in the profile") */
  readonly origin: string;
  /** lowest and highest value found outside the range */
  readonly found: readonly [number, number];
  /** counted cycles outside (full cycles count 1, half cycles 0.5) */
  readonly cycles: number;
  /** their share of the damage per repetition, 0..1 */
  readonly damageShare: number;
}

/** Miner's-rule damage of one repetition of a history, and what it projects to. */
export interface MinerDamage {
  readonly model: string;
  /** D = Σ count_i / N_f,i for one repetition of the history */
  readonly damagePerRepetition: number;
  /** 1/D: repetitions until D reaches 1 (Infinity for D = 0) */
  readonly repetitionsToEndOfLife: number;
  /** repetitions to end of life / repetitions per year; undefined without a rate */
  readonly yearsToEndOfLife: number | undefined;
  /** Σ counts (full cycles count 1, half cycles 0.5) */
  readonly cyclesCounted: number;
  /** the most damaging cycles, worst first */
  readonly topCycles: readonly DamagingCycle[];
  /** per quantity, the cycles outside the model's validity range (none: every cycle inside it) */
  readonly extrapolated: readonly ExtrapolatedQuantity[];
  /** cautions about the model's parameters, and a model with no validity range to check against */
  readonly warnings: readonly string[];
}

/** Seconds in a Julian year (365.25 d), for converting a rate per year. Source: IAU definition of the Julian year. */
export const SECONDS_PER_YEAR = 365.25 * 86400;

interface OutsideTally {
  count: number;
  damage: number;
  low: number;
  high: number;
}

/**
 * Miner's rule over a stream of counted cycles: each cycle of count c_i (1 or 0.5) whose
 * lifetime model gives N_f,i cycles to failure uses the fraction c_i/N_f,i of the life, and the
 * fractions add:
 *   D = Σ c_i / N_f,i;  end of life at D = 1, so 1/D repetitions of the history.
 * Every cycle is checked against the model's validity range (`fitted`, by quantity); cycles
 * outside are still evaluated and reported in `extrapolated`, per quantity, with the values
 * found, their count and their share of the damage. A model with no validity range at all
 * (Coffin-Manson or Norris-Landzberg without `fittedRange`) gets a warning that its cycles
 * could not be checked. The sum is
 * compensated (Neumaier), so millions of tiny contributions do not lose precision.
 *
 * Source: Miner, "Cumulative damage in fatigue", J. Appl. Mech. 12 (1945) A159-A164 (linear
 * damage rule); Palmgren (1924).
 * Cost O(top) per cycle; memory O(top + quantities).
 * @example
 * const miner = new MinerAccumulator(coffinMansonModel({ referenceCycles: 1e5, referenceRangeK: 50, exponent: 5 }));
 * miner.add({ rangeK: 100, meanC: 75, minC: 25, maxC: 125, count: 1, heatingTimeS: 1 }) // => 0.00032
 * miner.result().repetitionsToEndOfLife // => 3125
 */
export class MinerAccumulator {
  private readonly model: LifetimeModel;
  private readonly top: number;
  private sum = 0;
  private compensation = 0;
  private counted = 0;
  private readonly worst: DamagingCycle[] = [];
  private readonly outside = new Map<CycleQuantity, OutsideTally>();
  private readonly checks: readonly { quantity: CycleQuantity; min: number; max: number }[];

  /**
   * @param model the lifetime model
   * @param topCycles how many of the most damaging cycles to keep (default {@link DEFAULT_TOP_CYCLES})
   */
  constructor(model: LifetimeModel, topCycles: number = DEFAULT_TOP_CYCLES) {
    if (!(Number.isInteger(topCycles) && topCycles >= 0)) throw inputError("out-of-range", "topCycles", "a whole number ≥ 0", describeFound(topCycles));
    this.model = model;
    this.top = topCycles;
    this.checks = (Object.entries(model.fitted) as [CycleQuantity, FittedInterval][]).map(([quantity, i]) => ({ quantity, min: i.min, max: i.max }));
  }

  /** Add one counted cycle; returns its damage c/N_f. */
  add(cycle: RainflowCycle): number {
    const cyclesToFailure = this.model.cyclesToFailure(cycle);
    const damage = cyclesToFailure === Number.POSITIVE_INFINITY ? 0 : cycle.count / cyclesToFailure;
    const t = this.sum + damage;
    this.compensation += Math.abs(this.sum) >= Math.abs(damage) ? this.sum - t + damage : damage - t + this.sum;
    this.sum = t;
    this.counted += cycle.count;
    for (const { quantity, min, max } of this.checks) {
      const value = cycleQuantity(cycle, quantity);
      if (value >= min && value <= max) continue;
      const tally = this.outside.get(quantity) ?? { count: 0, damage: 0, low: value, high: value };
      tally.count += cycle.count;
      tally.damage += damage;
      tally.low = Math.min(tally.low, value);
      tally.high = Math.max(tally.high, value);
      this.outside.set(quantity, tally);
    }
    if (this.top > 0 && damage > 0) {
      const last = this.worst[this.worst.length - 1];
      if (this.worst.length < this.top || (last !== undefined && damage > last.damage)) {
        let i = this.worst.length;
        while (i > 0 && this.worst[i - 1]!.damage < damage) i--;
        this.worst.splice(i, 0, { cycle, cyclesToFailure, damage, share: 0 });
        if (this.worst.length > this.top) this.worst.pop();
      }
    }
    return damage;
  }

  /** Damage so far, D = Σ c/N_f. */
  get damage(): number {
    return this.sum + this.compensation;
  }

  /**
   * The damage per repetition and its projections.
   * @param repetitionsPerYear how many times a year the history occurs (optional, > 0)
   * @throws InputError `out-of-range` for a rate ≤ 0
   */
  result(repetitionsPerYear?: number): MinerDamage {
    if (repetitionsPerYear !== undefined && !(repetitionsPerYear > 0 && Number.isFinite(repetitionsPerYear)))
      throw inputError("out-of-range", "repetitionsPerYear", "a rate > 0 per year", describeFound(repetitionsPerYear));
    const d = this.damage;
    const repetitionsToEndOfLife = d > 0 ? 1 / d : Number.POSITIVE_INFINITY;
    const warnings = [...this.model.parameterWarnings];
    if (this.checks.length === 0)
      warnings.push(`${this.model.name}: no validity range, published or given (lifetime.fittedRange), so the cycles cannot be checked against one`);
    const extrapolated: ExtrapolatedQuantity[] = [];
    for (const { quantity } of this.checks) {
      const tally = this.outside.get(quantity);
      if (tally === undefined) continue;
      const interval: FittedInterval = this.model.fitted[quantity]!;
      extrapolated.push({
        quantity,
        unit: CYCLE_QUANTITY_UNITS[quantity],
        range: [interval.min, interval.max],
        origin: interval.origin,
        found: [tally.low, tally.high],
        cycles: tally.count,
        damageShare: d > 0 ? tally.damage / d : 0,
      });
    }
    return {
      model: this.model.name,
      damagePerRepetition: d,
      repetitionsToEndOfLife,
      yearsToEndOfLife: repetitionsPerYear === undefined ? undefined : repetitionsToEndOfLife / repetitionsPerYear,
      cyclesCounted: this.counted,
      topCycles: this.worst.map((w) => ({ ...w, share: d > 0 ? w.damage / d : 0 })),
      extrapolated,
      warnings,
    };
  }
}
