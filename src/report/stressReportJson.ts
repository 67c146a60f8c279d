import type { StressReport } from "../stress/assessStress.js";
import { limitMargin } from "../stress/LimitCheck.js";

/** JSON-safe number: Infinity and NaN become null (JSON has neither). */
function safe(x: number | undefined): number | null {
  return x === undefined || !Number.isFinite(x) ? null : x;
}

/** The plain object `simulate --json` carries per part under `stress`. */
export interface StressJson {
  readonly ratingStatus: string;
  readonly ratingChecks: readonly {
    index: number;
    startS: number;
    /** the part's temperature at the event start [°C], the ratings were derated at; null when not known */
    startTemperatureC: number | null;
    status: string;
    pulseEnergy: {
      status: string;
      energyJ: number;
      equivalentDurationS: number;
      /** the table's energy at the equivalent duration, from its reference temperature */
      ratedEnergyJ: number | null;
      /** factor for the start temperature, (T_max − T_start)/(T_max − T_ref) in [0, 1] */
      deratingFactor: number;
      /** the derated allowance, ratedEnergyJ·deratingFactor */
      allowedEnergyJ: number | null;
      /** energy / allowance; null outside the table or when nothing is allowed */
      utilisation: number | null;
    } | null;
    soa: {
      status: string;
      durationS: number;
      pointsChecked: number;
      pointsOutside: number;
      pointsNotCovered: number;
      deratingFactor: number;
      worst: { timeS: number; vdsV: number; idA: number; allowedA: number; utilisation: number | null } | null;
    } | null;
  }[];
  readonly cycles: {
    mode: string;
    hysteresisK: number;
    turningPoints: number;
    fullCycles: number;
    halfCycles: number;
    largestRangeK: number;
    highestC: number | null;
    lowestC: number | null;
  };
  readonly damage: {
    model: string;
    perRepetition: number;
    repetitionsToEndOfLife: number | null;
    yearsToEndOfLife: number | null;
    cyclesCounted: number;
    topCycles: { rangeK: number; meanC: number; minC: number; maxC: number; count: number; heatingTimeS: number; cyclesToFailure: number | null; damage: number; share: number }[];
    /** per cycle quantity, the cycles outside the model's validity range (their damage is extrapolated) */
    extrapolated: {
      quantity: string;
      unit: string;
      range: [number, number];
      origin: string;
      found: [number | null, number | null];
      cycles: number;
      damageShare: number;
    }[];
    warnings: readonly string[];
  } | null;
  /** the limits beside temperature, one entry each (voltage, continuous-power, adiabatic, repetitive-pulse) */
  readonly limits: readonly {
    limit: string;
    status: string;
    /** worst value found, in `unit` */
    found: number;
    /** allowed there, in `unit`; null where the rule does not cover the case */
    allowed: number | null;
    unit: string;
    /** allowed − found in `unit`; null without an allowance */
    margin: number | null;
    /** margin / allowed; null without a positive allowance */
    marginShare: number | null;
    eventIndex: number | null;
    eventStartS: number | null;
    basis: string;
    checked: number;
    crossed: number;
  }[];
  readonly notes: readonly string[];
}

/**
 * The stress report as a plain JSON-safe object (`damage`, `cycles` summary, rating checks per
 * event): unlimited lives and missing values are null, never Infinity or NaN. Cost O(events + top cycles).
 * @example
 * const config = resolveStressConfig({ lifetime: { model: "coffin-manson", referenceCycles: 1e5, referenceRange: "50 K", exponent: 5 } });
 * const history = [25, 125, 25, 125, 25].map((temperatureC, timeS) => ({ timeS, temperatureC }));
 * stressReportJson(assessStress(config, [], history)).damage.repetitionsToEndOfLife // => 1562.5
 */
export function stressReportJson(report: StressReport): StressJson {
  const d = report.damage;
  return {
    ratingStatus: report.ratingStatus,
    ratingChecks: report.events.map((e) => ({
      index: e.index,
      startS: e.startS,
      startTemperatureC: safe(e.startTemperatureC),
      status: e.status,
      pulseEnergy:
        e.pulseEnergy === undefined
          ? null
          : {
              status: e.pulseEnergy.status,
              energyJ: e.pulseEnergy.energyJ,
              equivalentDurationS: e.pulseEnergy.equivalentDurationS,
              ratedEnergyJ: safe(e.pulseEnergy.ratedEnergyJ),
              deratingFactor: e.pulseEnergy.deratingFactor,
              allowedEnergyJ: safe(e.pulseEnergy.allowedEnergyJ),
              utilisation: safe(e.pulseEnergy.utilisation),
            },
      soa:
        e.soa === undefined
          ? null
          : {
              status: e.soa.status,
              durationS: e.soa.durationS,
              pointsChecked: e.soa.pointsChecked,
              pointsOutside: e.soa.pointsOutside,
              pointsNotCovered: e.soa.pointsNotCovered,
              deratingFactor: e.soa.deratingFactor,
              worst: e.soa.worst === undefined ? null : { ...e.soa.worst, utilisation: safe(e.soa.worst.utilisation) },
            },
    })),
    cycles: {
      ...report.cycleSummary,
      highestC: safe(report.cycleSummary.highestC),
      lowestC: safe(report.cycleSummary.lowestC),
    },
    damage:
      d === undefined
        ? null
        : {
            model: d.model,
            perRepetition: d.damagePerRepetition,
            repetitionsToEndOfLife: safe(d.repetitionsToEndOfLife),
            yearsToEndOfLife: safe(d.yearsToEndOfLife),
            cyclesCounted: d.cyclesCounted,
            topCycles: d.topCycles.map((t) => ({
              rangeK: t.cycle.rangeK,
              meanC: t.cycle.meanC,
              minC: t.cycle.minC,
              maxC: t.cycle.maxC,
              count: t.cycle.count,
              heatingTimeS: t.cycle.heatingTimeS,
              cyclesToFailure: safe(t.cyclesToFailure),
              damage: t.damage,
              share: t.share,
            })),
            extrapolated: d.extrapolated.map((x) => ({
              quantity: x.quantity,
              unit: x.unit,
              range: [x.range[0], x.range[1]],
              origin: x.origin,
              found: [safe(x.found[0]), safe(x.found[1])],
              cycles: x.cycles,
              damageShare: x.damageShare,
            })),
            warnings: d.warnings,
          },
    limits: report.limits.map((l) => {
      const { margin, share } = limitMargin(l);
      return {
        limit: l.limit,
        status: l.status,
        found: safe(l.found) ?? 0,
        allowed: safe(l.allowed),
        unit: l.unit,
        margin: safe(margin),
        marginShare: safe(share),
        eventIndex: l.eventIndex ?? null,
        eventStartS: safe(l.eventStartS),
        basis: l.basis,
        checked: l.checked,
        crossed: l.crossed,
      };
    }),
    notes: report.notes,
  };
}
