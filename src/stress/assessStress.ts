import { describeFound, inputError } from "../errors/InputError.js";
import type { LimitCheck } from "./LimitCheck.js";
import { DEFAULT_TOP_CYCLES, MinerAccumulator, type MinerDamage } from "./minerDamage.js";
import { type PulseEnergyCheck, type PulseEnergyDerating, type RatingStatus, checkPulseEnergy, pulseEnergyDeratingFactor } from "./pulseEnergyRating.js";
import { type RainflowCycle, RainflowCounter, type RainflowMode } from "./rainflowCounter.js";
import type { StressConfig, StressPartKind } from "./resolveStressConfig.js";
import { type OperatingPoint, type SoaCheck, checkSoa, soaDeratingFactor } from "./soaTable.js";
import { LINEAR_MOSFET_CAUTION } from "../text/cautions.js";
import { LIFETIME_CAUTION } from "../text/stressCautions.js";
import { TurningPointFilter } from "./turningPoints.js";

/** What the profile layer knows of one event of a part. */
export interface StressEvent {
  /** index of the event in the timeline */
  readonly index: number;
  /** start time [s] */
  readonly startS: number;
  /** conduction time of the event [s] */
  readonly durationS: number;
  /** energy dissipated in the part [J] */
  readonly energyJ: number;
  /** highest instantaneous power in the part [W] */
  readonly peakPowerW: number;
  /** MOSFET operating points (time, Vds, Id) during the event; needed for the SOA check */
  readonly operatingPoints?: readonly OperatingPoint[];
  /** the part's temperature at the event start [°C]; derates the pulse-energy rating and the SOA (when the config says how) */
  readonly startTemperatureC?: number;
}

/** One point of the part's temperature history: time [s], temperature [°C]. */
export interface TemperaturePoint {
  readonly timeS: number;
  readonly temperatureC: number;
}

/** Options of {@link assessStress}; every field has a default. */
export interface StressOptions {
  /** kind of part (default "other") */
  readonly partKind?: StressPartKind;
  /** a MOSFET run in linear mode: the report carries the thermal-instability caution (default false) */
  readonly linearMode?: boolean;
  /** "repeating" (default): the history is one repetition of a profile, closed on itself (§5.4.5); "open" for a one-off record (§5.4.4) */
  readonly mode?: RainflowMode;
  /** period of one repetition [s] (default: last − first history time) */
  readonly periodS?: number;
  /** how often the history occurs per year, for the calendar life (optional) */
  readonly repetitionsPerYear?: number;
  /** keep every counted cycle in the report (for `--cycles FILE`; default true) */
  readonly keepCycles?: boolean;
  /** how many of the most damaging cycles to list (default {@link DEFAULT_TOP_CYCLES}) */
  readonly topCycles?: number;
}

/** Rating checks of one event. */
export interface EventRatingCheck {
  readonly index: number;
  readonly startS: number;
  /** the part's temperature at the event start [°C], the ratings were derated at; undefined when not known */
  readonly startTemperatureC: number | undefined;
  /** present when the part has a pulse-energy table */
  readonly pulseEnergy: PulseEnergyCheck | undefined;
  /** present when the part has an SOA table and the event has operating points */
  readonly soa: SoaCheck | undefined;
  /** worst of the two ("pass" when neither applies) */
  readonly status: RatingStatus;
}

/** Summary of the counted cycles. */
export interface CycleSummary {
  readonly mode: RainflowMode;
  readonly hysteresisK: number;
  readonly turningPoints: number;
  readonly fullCycles: number;
  readonly halfCycles: number;
  /** largest range [K]; 0 with no cycle */
  readonly largestRangeK: number;
  /** highest cycle maximum [°C]; undefined with no cycle */
  readonly highestC: number | undefined;
  /** lowest cycle minimum [°C]; undefined with no cycle */
  readonly lowestC: number | undefined;
}

/** Everything the stress layer says about one part. */
export interface StressReport {
  /** worst rating status over all events ("pass" when the part has no rating table) */
  readonly ratingStatus: RatingStatus;
  readonly events: readonly EventRatingCheck[];
  readonly cycleSummary: CycleSummary;
  /** every counted cycle (empty when keepCycles is false) */
  readonly cycles: readonly RainflowCycle[];
  /** damage of each kept cycle, same order as `cycles` */
  readonly cycleDamage: readonly number[];
  /** Miner damage; undefined when the part has no cycling model */
  readonly damage: MinerDamage | undefined;
  /** the limits beside temperature, one entry per limit the part's ratings give (empty when judged by no caller) */
  readonly limits: readonly LimitCheck[];
  /** conventions used and what was not checked, in words */
  readonly notes: readonly string[];
  /** stress-specific cautions for human-readable reports (lifetime estimate, linear-mode MOSFET); the
   *  general caution closes the whole report (src/text/cautions.ts) */
  readonly cautions: readonly string[];
}

/** The note that says how (or that not) a part's pulse-energy table was derated for a hot start. */
function pulseEnergyDeratingNote(d: PulseEnergyDerating | undefined): string {
  if (d === undefined)
    return "Pulse-energy rating not derated for temperature: no maximum temperature is known (give ratings.pulseEnergyDerating.maxTemperature, or check through a profile, whose part limit is used).";
  const ref = `${d.referenceC} °C${d.referenceFrom === "default" ? " (the default; ratings.pulseEnergyDerating.reference)" : ""}`;
  const max = `${d.maxTemperatureC} °C${d.maxTemperatureFrom === "part limit" ? " (the part's limit; ratings.pulseEnergyDerating.maxTemperature)" : ""}`;
  return (
    `Pulse-energy rating derated at each event's start temperature: E_allowed = E_rated·(T_max − T_start)/(T_max − T_ref), ` +
    `at most E_rated, with T_ref = ${ref} and T_max = ${max}. Common practice for resistor pulse ratings.`
  );
}

const STATUS_ORDER: Record<RatingStatus, number> = { pass: 0, "outside-table": 1, fail: 2 };

/** The worse of two rating statuses: fail > outside-table > pass. */
export function worseStatus(a: RatingStatus, b: RatingStatus): RatingStatus {
  return STATUS_ORDER[a] >= STATUS_ORDER[b] ? a : b;
}

/**
 * Push-style stress assessment of one part, for a caller that produces the temperature history
 * point by point (the thermal visitor): `addTemperature` for each point in time order, then
 * `finish(events)`. Points pass through the turning-point filter (hysteresis from the config)
 * into the rainflow counter, and every cycle goes straight into Miner's sum: memory is bounded
 * by the residue stack (plus the cycles, if kept).
 * Cost O(points + cycles·top + events·rating work).
 * @throws InputError for points out of order or not finite, and for bad options
 * @example
 * const stress = new StressAssessment(resolveStressConfig({}));
 * [25, 125, 25, 125, 25].forEach((temperatureC, timeS) => stress.addTemperature(timeS, temperatureC));
 * stress.finish([]).cycles.map((c) => c.rangeK) // => [100, 100]
 */
export class StressAssessment {
  private readonly config: StressConfig;
  private readonly options: StressOptions;
  private readonly counter: RainflowCounter;
  private readonly filter: TurningPointFilter;
  private readonly miner: MinerAccumulator | undefined;
  private readonly cycles: RainflowCycle[] = [];
  private readonly cycleDamage: number[] = [];
  private turningPoints = 0;
  private full = 0;
  private half = 0;
  private largestRangeK = 0;
  private highestC = Number.NEGATIVE_INFINITY;
  private lowestC = Number.POSITIVE_INFINITY;
  private firstTimeS = Number.NaN;
  private lastTimeS = Number.NaN;

  constructor(config: StressConfig, options: StressOptions = {}) {
    this.config = config;
    this.options = options;
    if (options.periodS !== undefined && !(options.periodS > 0 && Number.isFinite(options.periodS)))
      throw inputError("out-of-range", "periodS", "a period > 0 s", describeFound(options.periodS));
    this.miner = config.lifetime === undefined ? undefined : new MinerAccumulator(config.lifetime, options.topCycles ?? DEFAULT_TOP_CYCLES);
    const keep = options.keepCycles ?? true;
    this.counter = new RainflowCounter(
      (cycle) => {
        const damage = this.miner?.add(cycle) ?? 0;
        if (keep) {
          this.cycles.push(cycle);
          this.cycleDamage.push(damage);
        }
        if (cycle.count === 1) this.full++;
        else this.half++;
        if (cycle.rangeK > this.largestRangeK) this.largestRangeK = cycle.rangeK;
        if (cycle.maxC > this.highestC) this.highestC = cycle.maxC;
        if (cycle.minC < this.lowestC) this.lowestC = cycle.minC;
      },
      { mode: options.mode ?? "repeating", levelBandK: config.cycleHysteresisK },
    );
    this.filter = new TurningPointFilter((timeS, value, leaveS) => {
      this.turningPoints++;
      this.counter.push(timeS, value, leaveS);
    }, config.cycleHysteresisK);
  }

  /** Next point of the part's temperature history (time [s], temperature [°C]). */
  addTemperature(timeS: number, temperatureC: number): void {
    if (Number.isNaN(this.firstTimeS)) this.firstTimeS = timeS;
    this.lastTimeS = timeS;
    this.filter.push(timeS, temperatureC);
  }

  /** Close the history, check every event against the ratings, and report. */
  finish(events: readonly StressEvent[]): StressReport {
    this.filter.finish();
    const span = this.lastTimeS - this.firstTimeS;
    const periodS = this.options.periodS ?? (span > 0 ? span : undefined);
    this.counter.finish(periodS);
    const { pulseEnergy, pulseEnergyDerating, soa, soaDerating } = this.config;
    const kind = this.options.partKind ?? "other";
    const checks: EventRatingCheck[] = events.map((e, i) => {
      const field = `events[${i}]`;
      const energy =
        pulseEnergy === undefined
          ? undefined
          : checkPulseEnergy(pulseEnergy, e.energyJ, e.peakPowerW, field, pulseEnergyDerating === undefined || e.startTemperatureC === undefined ? 1 : pulseEnergyDeratingFactor(pulseEnergyDerating, e.startTemperatureC));
      const soaCheck =
        soa === undefined || e.operatingPoints === undefined || e.operatingPoints.length === 0 || !(e.durationS > 0)
          ? undefined
          : checkSoa(
              soa,
              e.operatingPoints,
              e.durationS,
              field,
              soaDerating === undefined || e.startTemperatureC === undefined ? 1 : soaDeratingFactor(soaDerating, e.startTemperatureC),
            );
      const status = worseStatus(energy?.status ?? "pass", soaCheck?.status ?? "pass");
      return { index: e.index, startS: e.startS, startTemperatureC: e.startTemperatureC, pulseEnergy: energy, soa: soaCheck, status };
    });
    const notes: string[] = [];
    if (pulseEnergy !== undefined) {
      notes.push("Pulse-energy check: each event is read at its equivalent rectangular duration E/P_peak (same energy, same peak power; common practice).");
      notes.push(pulseEnergyDeratingNote(pulseEnergyDerating));
      const form = this.config.pulseEnergyForm;
      const rows = pulseEnergy.map((r) => `${Number(r.energyJ.toPrecision(4))} J at ${Number(r.durationS.toPrecision(4))} s`).join(", ");
      if (form === "power") notes.push(`Pulse rating given as peak power against duration, converted row by row to E = P·t: ${rows}.`);
      else if (form === "energy-per-ohm")
        notes.push(`Pulse rating given as energy per ohm of a series, interpolated log-log to ${this.config.resistanceOhm} ohm and multiplied by it: ${rows}.`);
    } else notes.push("No pulse-energy rating table given: events are not checked against a single-pulse rating.");
    if (soa !== undefined)
      notes.push("SOA check: every operating point is held to the boundary for the whole event duration (conservative; common practice).");
    else if (kind === "mosfet") notes.push("No SOA table given: operating points are not checked against a safe operating area.");
    if (soa !== undefined && soaDerating === undefined)
      notes.push("SOA not derated for temperature: the boundaries hold as drawn; give ratings.soaDerating to scale them for a hot part.");
    else if (soa !== undefined && soaDerating !== undefined)
      notes.push(
        `SOA derated linearly from ${soaDerating.referenceC} °C to zero at ${soaDerating.maxJunctionC} °C, at the part's temperature at each event start (common practice).`,
      );
    if (soa !== undefined && events.some((e) => e.operatingPoints === undefined || e.operatingPoints.length === 0))
      notes.push("Some events carry no operating points: they were not checked against the SOA.");
    if (this.config.lifetime === undefined)
      notes.push(
        kind === "resistor"
          ? "No cycling model for this resistor (none is published; give Coffin-Manson parameters of your own): temperature and energy checks only."
          : "No lifetime model given: cycles are counted but no damage is computed.",
      );
    const cautions: string[] = this.config.lifetime === undefined ? [] : [LIFETIME_CAUTION];
    if (kind === "mosfet" && this.options.linearMode === true) cautions.push(LINEAR_MOSFET_CAUTION);
    return {
      ratingStatus: checks.reduce<RatingStatus>((s, c) => worseStatus(s, c.status), "pass"),
      events: checks,
      cycleSummary: {
        mode: this.options.mode ?? "repeating",
        hysteresisK: this.config.cycleHysteresisK,
        turningPoints: this.turningPoints,
        fullCycles: this.full,
        halfCycles: this.half,
        largestRangeK: this.largestRangeK,
        highestC: Number.isFinite(this.highestC) ? this.highestC : undefined,
        lowestC: Number.isFinite(this.lowestC) ? this.lowestC : undefined,
      },
      cycles: this.cycles,
      cycleDamage: this.cycleDamage,
      damage: this.miner?.result(this.options.repetitionsPerYear),
      limits: [],
      notes,
      cautions,
    };
  }
}

/**
 * Assess one part's stress: rating checks per event (single-pulse energy at E/P_peak, SOA at
 * every operating point), rainflow cycles of its temperature history and Miner damage per
 * repetition under its lifetime model. The profile layer calls this once per part; the Zth-based
 * temperature verdict stays the profile layer's and is primary, these checks are reported beside
 * it. See {@link StressAssessment} for the streaming form.
 * Cost O(history points + cycles + events × rating work); memory O(residue + kept cycles).
 * @throws InputError for bad points, events or options, naming the field
 * @example
 * const config = resolveStressConfig({ lifetime: { model: "coffin-manson", referenceCycles: 1e5, referenceRange: "50 K", exponent: 5 } });
 * const history = [25, 125, 25, 125, 25].map((temperatureC, timeS) => ({ timeS, temperatureC }));
 * assessStress(config, [], history).damage.damagePerRepetition // => 0.00064
 */
export function assessStress(
  config: StressConfig,
  events: readonly StressEvent[],
  history: Iterable<TemperaturePoint>,
  options: StressOptions = {},
): StressReport {
  const assessment = new StressAssessment(config, options);
  for (const p of history) assessment.addTemperature(p.timeS, p.temperatureC);
  return assessment.finish(events);
}
