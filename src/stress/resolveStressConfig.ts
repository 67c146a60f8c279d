import { InputError, type InputProblem, describeFound, inputError } from "../errors/InputError.js";
import { type Dimension } from "../units/dimensions.js";
import { parseQuantity } from "../units/parseQuantity.js";
import { type Cips2008Coefficients, CIPS2008_PUBLISHED, cips2008Model } from "./cips2008.js";
import { coffinMansonModel } from "./coffinManson.js";
import { LESIT_PUBLISHED, lesitModel } from "./lesit.js";
import type { CycleQuantity, FittedInterval, FittedRange, LifetimeModel } from "./LifetimeModel.js";
import { NORRIS_LANDZBERG_SNPB, norrisLandzbergModel } from "./norrisLandzberg.js";
import { PULSE_ENERGY_DERATING_DEFAULTS, type PulseEnergyDerating, type PulseEnergyPoint, validatePulseEnergyTable } from "./pulseEnergyRating.js";
import { type SoaDerating, type SoaTable, validateSoaTable } from "./soaTable.js";
import { type StressKeysInput, stressKeysSchema } from "./stressKeysSchema.js";
import { materialPreset } from "../thermal/materials.js";
import { type AdiabaticElement, spreadingTimeS } from "./adiabaticLimit.js";
import { energyPerOhmTable, validateEnergyPerOhmSeries } from "./energyPerOhmRating.js";
import { type PowerDerating, validatePowerDerating } from "./powerDerating.js";
import { pulsePowerToEnergyTable } from "./pulsePowerRating.js";
import { type RepetitivePulseRule, validateRepetitivePulseRule } from "./repetitivePulseRule.js";
import type { VoltageRating } from "./voltageRating.js";
import { DEFAULT_CYCLE_HYSTERESIS_K } from "./turningPoints.js";

/** The forms a single-pulse rating can be given in. */
export type PulseRatingForm = "energy" | "power" | "energy-per-ohm";

/** What kind of part the stress keys belong to: resistors may only use Coffin-Manson. */
export type StressPartKind = "resistor" | "mosfet" | "other";

/** The stress keys of a part, parsed to SI and checked. */
export interface StressConfig {
  /** single-pulse energy rating, rows in increasing duration; undefined: none given */
  readonly pulseEnergy: readonly PulseEnergyPoint[] | undefined;
  /**
   * the form the single-pulse rating was given in, converted to `pulseEnergy`: energy against
   * duration, peak power against duration (E = P·t), or energy per ohm of a series at the part's
   * resistance; undefined with no single-pulse rating
   */
  readonly pulseEnergyForm: PulseRatingForm | undefined;
  /** the part's resistance as its ratings state it [ohm] (`ratings.resistance`); undefined: not given */
  readonly resistanceOhm: number | undefined;
  /** allowed energy per pulse of a train; undefined: none given */
  readonly repetitive: RepetitivePulseRule | undefined;
  /** voltage ratings; undefined: none given */
  readonly voltage: VoltageRating | undefined;
  /** continuous power rating and its derating against ambient; undefined: none given */
  readonly continuousPower: PowerDerating | undefined;
  /** the element's own heat capacity and spreading time for the adiabatic limit; undefined: none given */
  readonly adiabatic: AdiabaticElement | undefined;
  /** temperature the element may reach in the adiabatic limit [°C] (the pulse derating's T_max, else the part's limit); undefined: not known */
  readonly elementMaxC: number | undefined;
  /**
   * how the pulse-energy rating is derated at a hot start; undefined when there is no table, or
   * when no maximum temperature is known (neither `pulseEnergyDerating.maxTemperature` nor the
   * part's limit)
   */
  readonly pulseEnergyDerating: PulseEnergyDerating | undefined;
  /** SOA boundaries (MOSFETs); undefined: none given */
  readonly soa: SoaTable | undefined;
  /** how to derate the SOA for temperature; undefined: not derated */
  readonly soaDerating: SoaDerating | undefined;
  /** the cycling-life model, built and checked; undefined: no cycling model */
  readonly lifetime: LifetimeModel | undefined;
  /** turning-point hysteresis [K] */
  readonly cycleHysteresisK: number;
}

const FITTED_DIMENSION: Record<CycleQuantity, Dimension> = {
  range: "temperatureDifference",
  mean: "temperature",
  min: "temperature",
  max: "temperature",
  heatingTime: "time",
  frequency: "frequency",
};

function at(prefix: string, path: string): string {
  return prefix === "" ? path : `${prefix}.${path}`;
}

function valueAt(raw: unknown, path: readonly PropertyKey[]): unknown {
  let v: unknown = raw;
  for (const key of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<PropertyKey, unknown>)[key];
  }
  return v;
}

function pathText(path: readonly PropertyKey[]): string {
  return path.reduce<string>((s, k) => (typeof k === "number" ? `${s}[${k}]` : s === "" ? String(k) : `${s}.${String(k)}`), "");
}

function fitted(raw: StressKeysInput["lifetime"], field: string): FittedRange | undefined {
  const ranges = raw?.fittedRange;
  if (ranges === undefined) return undefined;
  const out: Partial<Record<CycleQuantity, FittedInterval>> = {};
  for (const [key, pair] of Object.entries(ranges) as [CycleQuantity, [unknown, unknown] | undefined][]) {
    if (pair === undefined) continue;
    const f = `${field}.fittedRange.${key}`;
    const min = parseQuantity(pair[0], FITTED_DIMENSION[key], `${f}[0]`);
    const max = parseQuantity(pair[1], FITTED_DIMENSION[key], `${f}[1]`);
    if (!(max >= min)) throw inputError("out-of-range", `${f}[1]`, `a highest value ≥ the lowest (${min})`, describeFound(pair[1]));
    out[key] = { min, max, origin: "given in the profile" };
  }
  return out;
}

function buildLifetime(raw: NonNullable<StressKeysInput["lifetime"]>, field: string): LifetimeModel {
  switch (raw.model) {
    case "coffin-manson": {
      const fit = fitted(raw, field);
      return coffinMansonModel(
        {
          referenceCycles: raw.referenceCycles,
          referenceRangeK: parseQuantity(raw.referenceRange, "temperatureDifference", `${field}.referenceRange`),
          exponent: raw.exponent,
          ...(fit === undefined ? {} : { fitted: fit }),
        },
        field,
      );
    }
    case "norris-landzberg": {
      const fit = fitted(raw, field);
      return norrisLandzbergModel(
        {
          referenceCycles: raw.referenceCycles,
          referenceRangeK: parseQuantity(raw.referenceRange, "temperatureDifference", `${field}.referenceRange`),
          referenceFrequencyHz: parseQuantity(raw.referenceFrequency, "frequency", `${field}.referenceFrequency`),
          referenceMaxC: parseQuantity(raw.referenceMaxTemperature, "temperature", `${field}.referenceMaxTemperature`),
          exponent: raw.exponent ?? NORRIS_LANDZBERG_SNPB.exponent,
          frequencyExponent: raw.frequencyExponent ?? NORRIS_LANDZBERG_SNPB.frequencyExponent,
          activationTemperatureK:
            raw.activationTemperature === undefined
              ? NORRIS_LANDZBERG_SNPB.activationTemperatureK
              : parseQuantity(raw.activationTemperature, "temperatureDifference", `${field}.activationTemperature`),
          ...(fit === undefined ? {} : { fitted: fit }),
        },
        field,
      );
    }
    case "lesit": {
      const fit = fitted(raw, field);
      return lesitModel(
        {
          coefficient: raw.coefficient ?? LESIT_PUBLISHED.coefficient,
          rangeExponent: raw.rangeExponent ?? LESIT_PUBLISHED.rangeExponent,
          activationEnergyJPerMol: raw.activationEnergy ?? LESIT_PUBLISHED.activationEnergyJPerMol,
          ...(fit === undefined ? {} : { fitted: fit }),
        },
        field,
      );
    }
    case "cips2008": {
      const fit = fitted(raw, field);
      const coefficients: Cips2008Coefficients = {
        k: raw.k ?? CIPS2008_PUBLISHED.k,
        beta1: raw.beta1 ?? CIPS2008_PUBLISHED.beta1,
        beta2: raw.beta2 ?? CIPS2008_PUBLISHED.beta2,
        beta3: raw.beta3 ?? CIPS2008_PUBLISHED.beta3,
        beta4: raw.beta4 ?? CIPS2008_PUBLISHED.beta4,
        beta5: raw.beta5 ?? CIPS2008_PUBLISHED.beta5,
        beta6: raw.beta6 ?? CIPS2008_PUBLISHED.beta6,
      };
      return cips2008Model(
        {
          currentPerWireA: parseQuantity(raw.currentPerWire, "current", `${field}.currentPerWire`),
          voltageClassV: parseQuantity(raw.voltageClass, "voltage", `${field}.voltageClass`),
          wireDiameterM: parseQuantity(raw.wireDiameter, "length", `${field}.wireDiameter`),
          coefficients,
          ...(fit === undefined ? {} : { fitted: fit }),
        },
        field,
      );
    }
  }
}

/**
 * Validate a part's stress keys (see {@link stressKeysSchema}) and resolve them: every quantity
 * parsed to SI by parseQuantity ("dc" accepted as an SOA duration), tables checked for order and
 * monotonicity, the lifetime model built with published defaults filled in where the source is
 * named (LESIT, CIPS 2008 coefficients, Norris-Landzberg exponents). Resistors may only use
 * Coffin-Manson with the user's parameters: no cycling model is published for them.
 * A pulse-energy table is always derated for the part's temperature at each event start
 * (`pulseEnergyDerating`): from `reference` (default {@link PULSE_ENERGY_DERATING_DEFAULTS})
 * to nothing at `maxTemperature` (default: the part's limit, `options.limitC`).
 * The single-pulse rating may be given in one of three forms, each converted to that table:
 * `pulseEnergy`, `pulsePower` (E = P·t per row) or `energyPerOhm` of a series read log-log at the
 * part's `resistance`; two forms at once are refused. `repetitive` (by period or by duty cycle),
 * `voltage`, `continuousPower` and `adiabatic` (capacity from a mass and a material preset or as
 * given, spreading time d²/α or as given) are resolved for the limits beside temperature
 * (PartLimits). A `series` key left in is refused: the profile loader reads a family file and
 * replaces it with the series' keys.
 * Cost O(table sizes).
 * @param raw the part object (or just its stress keys) as read from the profile
 * @param options field prefix for messages (such as `parts[1]`), the part's kind and its
 *   temperature limit [°C] (where the pulse-energy allowance reaches zero unless the rating says)
 * @throws InputError with the field path, what was expected and what was found, for every
 *   schema problem (all at once) or the first value problem
 * @example
 * const raw = { lifetime: { model: "coffin-manson", referenceCycles: 1e5, referenceRange: "50 K", exponent: 5 } };
 * resolveStressConfig(raw).lifetime.name // => "Coffin-Manson"
 */
export function resolveStressConfig(raw: unknown, options: { field?: string; partKind?: StressPartKind; limitC?: number } = {}): StressConfig {
  const prefix = options.field ?? "";
  // jitless: as in loadProfile, compiling zod's fast path costs more than a few parses save
  const parsed = stressKeysSchema.safeParse(raw, { jitless: true });
  if (!parsed.success) {
    const problems: InputProblem[] = parsed.error.issues.map((issue) => {
      const found = valueAt(raw, issue.path);
      let expected = issue.message;
      let foundText = describeFound(found);
      if (issue.code === "unrecognized_keys") {
        expected = "only the keys this object knows";
        foundText = issue.keys.map((k) => `"${k}"`).join(", ");
      } else if (expected.startsWith("Invalid input")) {
        expected = issue.code === "invalid_type" ? `a value of type ${issue.expected}` : expected.replace(/^Invalid input: /, "");
      }
      return { code: "bad-profile", file: "", line: 0, field: at(prefix, pathText(issue.path)), expected, found: foundText };
    });
    throw new InputError(problems);
  }
  const keys = parsed.data;
  let pulseEnergy: PulseEnergyPoint[] | undefined;
  let soa: SoaTable | undefined;
  const ratingsField = at(prefix, "ratings");
  if (keys.ratings?.pulseEnergy !== undefined) {
    const f = `${ratingsField}.pulseEnergy`;
    pulseEnergy = keys.ratings.pulseEnergy.map((row, i) => ({
      durationS: parseQuantity(row.duration, "time", `${f}[${i}].duration`),
      energyJ: parseQuantity(row.energy, "energy", `${f}[${i}].energy`),
    }));
    validatePulseEnergyTable(pulseEnergy, f);
  }
  const ratings = keys.ratings;
  const forms = (["pulseEnergy", "pulsePower", "energyPerOhm"] as const).filter((k) => ratings?.[k] !== undefined);
  if (forms.length > 1)
    throw inputError("bad-profile", `${ratingsField}.${forms[1]}`, `one single-pulse rating form per part (this part already has ${forms[0]})`, `both ${forms.join(" and ")}`);
  if (ratings?.series !== undefined)
    throw inputError("bad-profile", `${ratingsField}.series`, "a series read in by the profile loader (give the series' tables inline when there is no profile)", describeFound(ratings.series.file));
  const resistanceOhm = ratings?.resistance === undefined ? undefined : parseQuantity(ratings.resistance, "resistance", `${ratingsField}.resistance`);
  if (resistanceOhm !== undefined && !(resistanceOhm > 0)) throw inputError("out-of-range", `${ratingsField}.resistance`, "a resistance > 0 ohm", describeFound(ratings?.resistance));
  let pulseEnergyForm: PulseRatingForm | undefined = pulseEnergy === undefined ? undefined : "energy";
  if (ratings?.pulsePower !== undefined) {
    const f = `${ratingsField}.pulsePower`;
    pulseEnergy = pulsePowerToEnergyTable(
      ratings.pulsePower.map((row, i) => ({ durationS: parseQuantity(row.duration, "time", `${f}[${i}].duration`), powerW: parseQuantity(row.power, "power", `${f}[${i}].power`) })),
      f,
    );
    validatePulseEnergyTable(pulseEnergy, f);
    pulseEnergyForm = "power";
  }
  if (ratings?.energyPerOhm !== undefined) {
    const f = `${ratingsField}.energyPerOhm`;
    const series = {
      durationsS: ratings.energyPerOhm.durations.map((d, j) => parseQuantity(d, "time", `${f}.durations[${j}]`)),
      rows: ratings.energyPerOhm.rows.map((row, i) => ({
        resistanceOhm: parseQuantity(row.resistance, "resistance", `${f}.rows[${i}].resistance`),
        energyPerOhmJPerOhm: row.energyPerOhm.map((e, j) => parseQuantity(e, "energyPerResistance", `${f}.rows[${i}].energyPerOhm[${j}]`)),
      })),
    };
    validateEnergyPerOhmSeries(series, f);
    if (resistanceOhm === undefined) throw inputError("bad-profile", `${ratingsField}.resistance`, "the part's resistance value, to read the energy-per-ohm table at", "nothing");
    pulseEnergy = energyPerOhmTable(series, resistanceOhm, `${ratingsField}.resistance`);
    validatePulseEnergyTable(pulseEnergy, f);
    pulseEnergyForm = "energy-per-ohm";
  }
  let repetitive: RepetitivePulseRule | undefined;
  if (ratings?.repetitive !== undefined) {
    const f = `${ratingsField}.repetitive`;
    const byPeriod = ratings.repetitive[0]?.period !== undefined;
    repetitive = {
      by: byPeriod ? "period" : "duty-cycle",
      rows: ratings.repetitive.map((row, i) => {
        const given = byPeriod ? row.period : row.dutyCycle;
        const other = byPeriod ? row.dutyCycle : row.period;
        if (given === undefined || other !== undefined)
          throw inputError(
            "bad-profile",
            `${f}[${i}]`,
            `${byPeriod ? "a period" : "a dutyCycle"} like the first row (one kind of row per rule)`,
            other !== undefined ? `${byPeriod ? "dutyCycle" : "period"}` : "neither period nor dutyCycle",
          );
        return { at: byPeriod ? parseQuantity(given, "time", `${f}[${i}].period`) : (given as number), energyJ: parseQuantity(row.energy, "energy", `${f}[${i}].energy`) };
      }),
    };
    validateRepetitivePulseRule(repetitive, f);
  }
  let voltage: VoltageRating | undefined;
  if (ratings?.voltage !== undefined) {
    const f = `${ratingsField}.voltage`;
    const v = ratings.voltage;
    const read = (raw: unknown, key: string): number | undefined => {
      if (raw === undefined) return undefined;
      const x = parseQuantity(raw, "voltage", `${f}.${key}`);
      if (!(x > 0)) throw inputError("out-of-range", `${f}.${key}`, "a voltage > 0 V", describeFound(raw));
      return x;
    };
    voltage = { limitingElementV: read(v.limitingElement, "limitingElement"), pulseV: read(v.pulse, "pulse") };
    if (voltage.limitingElementV === undefined && voltage.pulseV === undefined) throw inputError("bad-profile", f, "a limitingElement voltage, a pulse voltage, or both", "neither");
  }
  let continuousPower: PowerDerating | undefined;
  if (ratings?.continuousPower !== undefined) {
    const f = `${ratingsField}.continuousPower`;
    const c = ratings.continuousPower;
    continuousPower = {
      ratedPowerW: parseQuantity(c.rated, "power", `${f}.rated`),
      fullPowerUpToC: parseQuantity(c.fullPowerUpTo, "temperature", `${f}.fullPowerUpTo`),
      zeroPowerAtC: parseQuantity(c.zeroPowerAt, "temperature", `${f}.zeroPowerAt`),
    };
    validatePowerDerating(continuousPower, f);
  }
  const adiabatic = ratings?.adiabatic === undefined ? undefined : resolveAdiabatic(ratings.adiabatic, `${ratingsField}.adiabatic`);
  const pulseEnergyDerating =
    pulseEnergy === undefined && repetitive === undefined ? undefined : resolvePulseEnergyDerating(keys, `${ratingsField}.pulseEnergyDerating`, options.limitC);
  const elementMaxC = pulseEnergyDerating?.maxTemperatureC ?? options.limitC;
  if (keys.ratings?.soa !== undefined) {
    const f = `${ratingsField}.soa`;
    soa = keys.ratings.soa.map((curve, k) => ({
      durationS:
        typeof curve.duration === "string" && curve.duration.trim().toLowerCase() === "dc"
          ? Number.POSITIVE_INFINITY
          : parseQuantity(curve.duration, "time", `${f}[${k}].duration`),
      points: curve.points.map((p, i) => ({
        vdsV: parseQuantity(p.vds, "voltage", `${f}[${k}].points[${i}].vds`),
        idA: parseQuantity(p.id, "current", `${f}[${k}].points[${i}].id`),
      })),
    }));
    validateSoaTable(soa, f);
  }
  let soaDerating: SoaDerating | undefined;
  if (keys.ratings?.soaDerating !== undefined) {
    const f = `${ratingsField}.soaDerating`;
    const referenceC = parseQuantity(keys.ratings.soaDerating.reference, "temperature", `${f}.reference`);
    const maxJunctionC = parseQuantity(keys.ratings.soaDerating.maxJunction, "temperature", `${f}.maxJunction`);
    if (!(maxJunctionC > referenceC))
      throw inputError("out-of-range", `${f}.maxJunction`, `a temperature above the reference ${referenceC} °C`, describeFound(keys.ratings.soaDerating.maxJunction));
    soaDerating = { referenceC, maxJunctionC };
  }
  const lifetimeField = at(prefix, "lifetime");
  if (options.partKind === "resistor" && keys.lifetime !== undefined && keys.lifetime.model !== "coffin-manson")
    throw inputError(
      "bad-profile",
      `${lifetimeField}.model`,
      '"coffin-manson" with your own parameters, or no lifetime key (no cycling model is published for resistors)',
      describeFound(keys.lifetime.model),
    );
  const lifetime = keys.lifetime === undefined ? undefined : buildLifetime(keys.lifetime, lifetimeField);
  const cycleHysteresisK =
    keys.cycleHysteresis === undefined
      ? DEFAULT_CYCLE_HYSTERESIS_K
      : parseQuantity(keys.cycleHysteresis, "temperatureDifference", at(prefix, "cycleHysteresis"));
  if (!(cycleHysteresisK >= 0))
    throw inputError("out-of-range", at(prefix, "cycleHysteresis"), "a temperature difference ≥ 0 K", describeFound(keys.cycleHysteresis));
  return {
    pulseEnergy,
    pulseEnergyForm,
    resistanceOhm,
    repetitive,
    voltage,
    continuousPower,
    adiabatic,
    elementMaxC,
    pulseEnergyDerating,
    soa,
    soaDerating,
    lifetime,
    cycleHysteresisK,
  };
}

/** The pulse-energy derating of a part with a table: profile keys over the defaults; undefined with no maximum temperature known. */
function resolvePulseEnergyDerating(keys: StressKeysInput, f: string, limitC: number | undefined): PulseEnergyDerating | undefined {
  const given = keys.ratings?.pulseEnergyDerating;
  const referenceC = given?.reference === undefined ? PULSE_ENERGY_DERATING_DEFAULTS.referenceC : parseQuantity(given.reference, "temperature", `${f}.reference`);
  const maxTemperatureC = given?.maxTemperature === undefined ? limitC : parseQuantity(given.maxTemperature, "temperature", `${f}.maxTemperature`);
  if (maxTemperatureC === undefined) return undefined;
  if (!(maxTemperatureC > referenceC)) {
    if (given?.maxTemperature !== undefined)
      throw inputError("out-of-range", `${f}.maxTemperature`, `a temperature above the reference ${referenceC} °C`, describeFound(given.maxTemperature));
    throw inputError(
      "out-of-range",
      `${f}.reference`,
      `a temperature below the part's limit ${maxTemperatureC} °C, where the allowance reaches zero (or a maxTemperature of the rating above it)`,
      `${referenceC} °C${given?.reference === undefined ? " (the default)" : ""}`,
    );
  }
  return {
    referenceC,
    maxTemperatureC,
    referenceFrom: given?.reference === undefined ? "default" : "profile",
    maxTemperatureFrom: given?.maxTemperature === undefined ? "part limit" : "profile",
  };
}

/**
 * The element of the adiabatic limit: its heat capacity (given, or its mass times the material's
 * specific heat) and its spreading time (given, or thickness²/α with α = k/(ρ·c) of the material).
 */
function resolveAdiabatic(raw: NonNullable<NonNullable<StressKeysInput["ratings"]>["adiabatic"]>, f: string): AdiabaticElement {
  const material = raw.material === undefined ? undefined : materialPreset(raw.material, `${f}.material`);
  let heatCapacityJPerK: number;
  let capacityWords: string;
  if (raw.heatCapacity !== undefined) {
    heatCapacityJPerK = parseQuantity(raw.heatCapacity, "heatCapacity", `${f}.heatCapacity`);
    capacityWords = `element heat capacity ${heatCapacityJPerK} J/K`;
  } else if (raw.mass !== undefined && material !== undefined) {
    const massKg = parseQuantity(raw.mass, "mass", `${f}.mass`);
    heatCapacityJPerK = massKg * material.specificHeatJPerKgK;
    capacityWords = `element of ${Number((massKg * 1000).toPrecision(4))} g of ${material.id} (c ${material.specificHeatJPerKgK} J/(kg K), ${material.provenance})`;
  } else throw inputError("bad-profile", f, "heatCapacity, or mass with a material preset", raw.mass === undefined ? "neither" : "a mass without a material");
  if (!(heatCapacityJPerK > 0)) throw inputError("out-of-range", `${f}.${raw.heatCapacity === undefined ? "mass" : "heatCapacity"}`, "a value > 0", describeFound(raw.heatCapacity ?? raw.mass));
  let spreading: number;
  let spreadingWords: string;
  if (raw.spreadingTime !== undefined) {
    spreading = parseQuantity(raw.spreadingTime, "time", `${f}.spreadingTime`);
    if (!(spreading > 0)) throw inputError("out-of-range", `${f}.spreadingTime`, "a time > 0 s", describeFound(raw.spreadingTime));
    spreadingWords = `spreading time ${spreading} s as given`;
  } else if (raw.thickness !== undefined && material !== undefined) {
    const thicknessM = parseQuantity(raw.thickness, "length", `${f}.thickness`);
    const alpha = material.conductivityWPerMK / (material.densityKgPerM3 * material.specificHeatJPerKgK);
    spreading = spreadingTimeS(thicknessM, alpha, f);
    spreadingWords = `spreading time d²/α = ${Number(spreading.toPrecision(3))} s (d ${Number((thicknessM * 1e6).toPrecision(4))} um of ${material.id})`;
  } else throw inputError("bad-profile", f, "spreadingTime, or thickness with a material preset", raw.thickness === undefined ? "neither" : "a thickness without a material");
  return { spreadingTimeS: spreading, heatCapacityJPerK, basis: `${capacityWords}; ${spreadingWords}` };
}
