import { checkAdiabatic } from "./adiabaticLimit.js";
import type { LimitCheck, LimitKind } from "./LimitCheck.js";
import { allowedContinuousPowerW } from "./powerDerating.js";
import { type RatingStatus } from "./pulseEnergyRating.js";
import { checkRepetitivePulse } from "./repetitivePulseRule.js";
import type { StressConfig } from "./resolveStressConfig.js";
import { peakVoltageAcrossV, pulseVoltageLimit, voltageStatus } from "./voltageRating.js";
import { maxWindowEnergyJ } from "./windowEnergy.js";
import type { PowerTrace } from "../thermal/powerTrace.js";

/** What the limit checks need of one event of a part. */
export interface LimitEvent {
  readonly index: number;
  readonly startS: number;
  /** energy in the part [J] */
  readonly energyJ: number;
  /** highest instantaneous power in the part [W] */
  readonly peakPowerW: number;
  /** the part's temperature at the event start [°C] */
  readonly startTemperatureC: number;
  /** factor of the pulse ratings for that start temperature (pulseEnergyDeratingFactor; 1: not derated) */
  readonly deratingFactor: number;
  /** the part's power trace in the event (for the adiabatic window) */
  readonly trace: PowerTrace;
}

/** The part-level facts the limits need beside the config. */
export interface PartLimitContext {
  /** the part's resistance [ohm] (its ratings' `resistance`, else the circuit's value for its role); undefined: unknown */
  readonly resistanceOhm: number | undefined;
  /** where that resistance comes from, in words */
  readonly resistanceFrom: string;
  /** the ambient the continuous rating is derated at [°C] */
  readonly ambientC: number;
}

interface Worst {
  status: RatingStatus;
  /** found/allowed, the order of "closer to the limit" */
  use: number;
  found: number;
  allowed: number | undefined;
  eventIndex: number;
  eventStartS: number;
  checked: number;
  crossed: number;
}

const ORDER: Record<RatingStatus, number> = { pass: 0, "outside-table": 1, fail: 2 };

/**
 * The limits beside temperature for one part, fed event by event (in time order) and closed
 * with the run's length: the peak voltage across the part, V = √(P_peak·R), against its pulse (or
 * limiting-element) voltage; the energy within the element's spreading time against its own
 * heat capacity from the event's start temperature (the adiabatic limit); each pulse's energy
 * against the repetitive-pulse rule at the time since the previous pulse started (derated like
 * the single-pulse rating); and, for the run, the mean power (energy over the run's length)
 * against the continuous rating derated at the part's ambient. Each limit keeps its worst case:
 * a failing one before an uncovered one before a passing one, then the highest found/allowed.
 * A limit the config does not give is not judged; `notes` says what could not be checked.
 * Source: the rules of each check (voltageRating.ts, adiabaticLimit.ts, repetitivePulseRule.ts,
 * powerDerating.ts); the worst-case bookkeeping is our own.
 * Cost O(events × trace segments · log segments); memory O(limits).
 */
export class PartLimits {
  private readonly config: StressConfig;
  private readonly context: PartLimitContext;
  private readonly worst = new Map<LimitKind, Worst>();
  private previousStartS: number | undefined;
  private totalEnergyJ = 0;
  /** what could not be checked, in words */
  readonly notes: string[] = [];

  constructor(config: StressConfig, context: PartLimitContext) {
    this.config = config;
    this.context = context;
    if (config.voltage !== undefined && context.resistanceOhm === undefined)
      this.notes.push("Voltage limit not checked: the part's resistance is not known (give ratings.resistance).");
    if (config.adiabatic !== undefined && config.elementMaxC === undefined)
      this.notes.push("Adiabatic limit not checked: no maximum element temperature is known (give ratings.pulseEnergyDerating.maxTemperature).");
  }

  /** Whether any limit is judged per event (so the caller must hand events in). */
  get wantsEvents(): boolean {
    return this.config.voltage !== undefined || this.config.adiabatic !== undefined || this.config.repetitive !== undefined || this.config.continuousPower !== undefined;
  }

  private record(kind: LimitKind, status: RatingStatus, found: number, allowed: number | undefined, e: LimitEvent): void {
    const use = allowed === undefined ? 0 : allowed > 0 ? found / allowed : Number.POSITIVE_INFINITY;
    const w = this.worst.get(kind);
    if (w === undefined) {
      this.worst.set(kind, { status, use, found, allowed, eventIndex: e.index, eventStartS: e.startS, checked: 1, crossed: status === "fail" ? 1 : 0 });
      return;
    }
    w.checked++;
    if (status === "fail") w.crossed++;
    if (ORDER[status] > ORDER[w.status] || (ORDER[status] === ORDER[w.status] && use > w.use))
      Object.assign(w, { status, use, found, allowed, eventIndex: e.index, eventStartS: e.startS });
  }

  /** One event with power in the part. */
  addEvent(e: LimitEvent): void {
    const { voltage, adiabatic, repetitive, elementMaxC } = this.config;
    this.totalEnergyJ += e.energyJ;
    if (voltage !== undefined && this.context.resistanceOhm !== undefined) {
      const peakV = peakVoltageAcrossV(e.peakPowerW, this.context.resistanceOhm);
      const allowed = pulseVoltageLimit(voltage).voltageV;
      this.record("voltage", voltageStatus(peakV, allowed), peakV, allowed, e);
    }
    if (adiabatic !== undefined && elementMaxC !== undefined) {
      const check = checkAdiabatic(adiabatic, maxWindowEnergyJ(e.trace, adiabatic.spreadingTimeS), e.startTemperatureC, elementMaxC);
      this.record("adiabatic", check.status, check.riseK, check.allowedRiseK, e);
    }
    if (repetitive !== undefined && this.previousStartS !== undefined && e.peakPowerW > 0) {
      const check = checkRepetitivePulse(repetitive, e.energyJ, e.startS - this.previousStartS, e.energyJ / e.peakPowerW, e.deratingFactor);
      this.record("repetitive-pulse", check.status, e.energyJ, check.allowedEnergyJ, e);
    }
    this.previousStartS = e.startS;
  }

  /** The verdict of every limit the config gives, after a run `durationS` long. */
  finish(durationS: number): LimitCheck[] {
    const out: LimitCheck[] = [];
    const { voltage, adiabatic, repetitive, continuousPower, elementMaxC } = this.config;
    const fromWorst = (kind: LimitKind, unit: string, basis: string): void => {
      const w = this.worst.get(kind);
      if (w === undefined) return;
      out.push({ limit: kind, status: w.status, found: w.found, allowed: w.allowed, unit, eventIndex: w.eventIndex, eventStartS: w.eventStartS, basis, checked: w.checked, crossed: w.crossed });
    };
    if (voltage !== undefined && this.context.resistanceOhm !== undefined)
      fromWorst("voltage", "V", `${pulseVoltageLimit(voltage).basis}; V = √(P_peak·R) with R ${this.context.resistanceOhm} ohm (${this.context.resistanceFrom})`);
    if (adiabatic !== undefined && elementMaxC !== undefined)
      fromWorst("adiabatic", "K", `energy within the spreading time over the element's own heat capacity, up to ${elementMaxC} °C; ${adiabatic.basis}`);
    if (repetitive !== undefined) {
      const w = this.worst.get("repetitive-pulse");
      const by = repetitive.by === "period" ? "the time since the previous pulse started" : "the duty cycle t_eq/period";
      if (w === undefined)
        out.push({ limit: "repetitive-pulse", status: "pass", found: 0, allowed: undefined, unit: "J", eventIndex: undefined, eventStartS: undefined, basis: "no pulse followed another: the single-pulse rating governs", checked: 0, crossed: 0 });
      else
        fromWorst(
          "repetitive-pulse",
          "J",
          w.allowed === undefined
            ? w.status === "pass"
              ? `every pulse further apart than the rule covers (read at ${by}): the single-pulse rating governs`
              : `pulses closer together than the rule covers (read at ${by})`
            : `allowed energy per pulse at ${by}, derated at the start temperature`,
        );
    }
    if (continuousPower !== undefined) {
      const meanW = durationS > 0 ? this.totalEnergyJ / durationS : 0;
      const allowed = allowedContinuousPowerW(continuousPower, this.context.ambientC);
      out.push({
        limit: "continuous-power",
        status: meanW > allowed ? "fail" : "pass",
        found: meanW,
        allowed,
        unit: "W",
        eventIndex: undefined,
        eventStartS: undefined,
        basis:
          `mean power over the run against ${continuousPower.ratedPowerW} W derated linearly from ${continuousPower.fullPowerUpToC} °C to zero at ` +
          `${continuousPower.zeroPowerAtC} °C, at the part's ambient ${this.context.ambientC} °C`,
        checked: 1,
        crossed: meanW > allowed ? 1 : 0,
      });
    }
    return out;
  }
}

