import * as z from "zod";
import { InputError } from "../errors/InputError.js";
import { type InputLimitName, inputLimit, limitWords } from "../format/inputLimits.js";
import { type Dimension, expectedWords } from "../units/dimensions.js";
import { parseQuantity } from "../units/parseQuantity.js";
import { stressKeysSchema } from "../stress/stressKeysSchema.js";
import { profileKeyMeta } from "./profileKeyMeta.js";

/**
 * A quantity field: a number in SI or a unit string, parsed by parseQuantity into SI. A failure
 * becomes a zod issue carrying `expected` and `found`, so every bad field is reported at once.
 */
function quantity(dimension: Dimension, check?: { min?: number; above?: number; max?: number; words?: string }) {
  return z.unknown().transform((value, ctx) => {
    if (value === undefined) {
      ctx.addIssue({ code: "custom", message: "quantity", params: { expected: `${expectedWords(dimension)} (required)`, found: "nothing" } });
      return z.NEVER;
    }
    try {
      const si = parseQuantity(value, dimension, "");
      const bad =
        (check?.min !== undefined && si < check.min) || (check?.above !== undefined && !(si > check.above)) || (check?.max !== undefined && si > check.max);
      if (bad) {
        ctx.addIssue({ code: "custom", message: "range", params: { expected: check?.words ?? "a value in range", found: describe(value) } });
        return z.NEVER;
      }
      return si;
    } catch (error) {
      const problem = error instanceof InputError ? error.problems[0] : undefined;
      ctx.addIssue({ code: "custom", message: "quantity", params: { expected: problem?.expected ?? dimension, found: problem?.found ?? describe(value) } });
      return z.NEVER;
    }
  }).register(profileKeyMeta, { kind: "quantity", dimension, words: check?.words ?? expectedWords(dimension) });
}

function describe(value: unknown): string {
  return typeof value === "string" ? JSON.stringify(value) : value === undefined ? "nothing" : JSON.stringify(value) ?? String(value);
}

/** A whole count ≥ min. */
function count(min: number, words: string, limit?: InputLimitName) {
  return z.unknown().transform((value, ctx) => {
    const max = limit === undefined ? Number.MAX_SAFE_INTEGER : inputLimit(limit);
    if (typeof value !== "number" || !Number.isInteger(value) || value < min || value > max) {
      const expected = limit === undefined ? words : `${words}, at most ${limitWords(limit)}`;
      ctx.addIssue({ code: "custom", message: "count", params: { expected, found: describe(value) } });
      return z.NEVER;
    }
    return value;
  }).register(profileKeyMeta, { kind: "count", words });
}

const positiveTime = (what: string) => quantity("time", { above: 0, words: `${what} > 0 such as "3 s"` });
const nonNegativeTime = (what: string) => quantity("time", { min: 0, words: `${what} ≥ 0 such as "10 s"` });

/** Load on the bus while it charges. Key names are the profile's; the circuit layer gets BusLoad. */
export const loadSchema = z.strictObject({
  kind: z.enum(["none", "short", "resistive", "constant-current", "constant-power"]),
  resistance: quantity("resistance", { above: 0, words: 'a resistance > 0 such as "2 ohm"' }).optional(),
  current: quantity("current", { above: 0, words: 'a current > 0 such as "5 A"' }).optional(),
  power: quantity("power", { above: 0, words: 'a power > 0 such as "300 W"' }).optional(),
  enableAt: quantity("voltage", { min: 0, words: 'a voltage ≥ 0 such as "30 V"' }).optional(),
  disableAt: quantity("voltage", { min: 0, words: 'a voltage ≥ 0 such as "27 V"' }).optional(),
});

/** Fault conditions a power-up can meet. */
export const FAULT_TYPES = ["shorted-output", "overloaded-bus", "converter-early", "trip-after-close"] as const;

const faultSchema = z.strictObject({
  type: z.enum(FAULT_TYPES),
  load: loadSchema.optional(),
  power: quantity("power", { above: 0, words: 'a power > 0 such as "300 W"' }).optional(),
  enableAt: quantity("voltage", { min: 0, words: 'a voltage ≥ 0 such as "30 V"' }).optional(),
  disableAt: quantity("voltage", { min: 0, words: 'a voltage ≥ 0 such as "27 V"' }).optional(),
  after: nonNegativeTime("a time").optional(),
  label: z.string().optional(),
});

const powerUpSchema = z
  .strictObject({ load: loadSchema.optional(), label: z.string().optional() })
  .nullable()
  .transform((v) => v ?? {});

const retrySchema = z.strictObject({
  attempts: count(1, "a whole number of attempts ≥ 1", "maxPlanAttempts"),
  interval: positiveTime("a start-to-start interval"),
  backoff: quantity("dimensionless", { min: 1, words: "a back-off factor ≥ 1 such as 2" }).optional(),
  maxInterval: positiveTime("a longest interval").optional(),
  fault: faultSchema.optional(),
  faultyAttempts: count(0, "a whole number of attempts ≥ 0").optional(),
  lockout: nonNegativeTime("a lockout time"),
  label: z.string().optional(),
});

const powerDownSchema = z
  .strictObject({ off: nonNegativeTime("an off time").optional(), label: z.string().optional() })
  .nullable()
  .transform((v) => v ?? {});

const pointSchema = z.tuple([quantity("time", { min: 0, words: 'a time ≥ 0 such as "0.5 s"' }), quantity("power", { min: 0, words: 'a power ≥ 0 such as "20 W"' })]);

const powerTraceSchema = z.strictObject({
  part: z.string().min(1),
  file: z.string().min(1).optional(),
  points: z.array(pointSchema).optional(),
  scale: quantity("dimensionless", { min: 0, words: "a scale factor ≥ 0 such as 1" }).optional(),
  label: z.string().optional(),
});

/** Names of the event kinds a profile's `events` list may hold (one key per list item). */
export const EVENT_KEYS = ["power-up", "fault", "run", "wait", "power-down", "lockout", "retry", "repeat", "power-trace"] as const;

/** One item of an `events` list: an object with exactly one of {@link EVENT_KEYS}. */
export type EventInput =
  | { "power-up": z.output<typeof powerUpSchema> }
  | { fault: z.output<typeof faultSchema> }
  | { run: number }
  | { wait: number }
  | { "power-down": z.output<typeof powerDownSchema> }
  | { lockout: number }
  | { retry: z.output<typeof retrySchema> }
  | { repeat: { count: number; period?: number | undefined; events: EventInput[] } }
  | { "power-trace": z.output<typeof powerTraceSchema> };

const eventSchema: z.ZodType<EventInput> = z.lazy(() =>
  z
    .strictObject({
      "power-up": powerUpSchema.optional(),
      fault: faultSchema.optional(),
      run: nonNegativeTime("a run time").optional(),
      wait: nonNegativeTime("a waiting time").optional(),
      "power-down": powerDownSchema.optional(),
      lockout: nonNegativeTime("a lockout time").optional(),
      retry: retrySchema.optional(),
      repeat: z
        .strictObject({
          count: count(1, "a whole number of repetitions ≥ 1"),
          period: positiveTime("a start-to-start period").optional(),
          events: z.array(eventSchema).min(1),
        })
        .optional(),
      "power-trace": powerTraceSchema.optional(),
    })
    .superRefine((value, ctx) => {
      const present = Object.keys(value);
      if (present.length !== 1) {
        ctx.addIssue({
          code: "custom",
          message: "one-key",
          params: { expected: `exactly one event key (${EVENT_KEYS.join(", ")})`, found: present.length === 0 ? "none" : present.join(", ") },
        });
      }
    }),
) as unknown as z.ZodType<EventInput>;

/** The circuit roles a part can play, as written in a profile, and as the circuit models name them. */
export const ROLE_NAMES = { resistor: "resistor", mosfet: "mosfet", "source-resistor": "sourceResistor", switch: "switch" } as const;

/** A part's limits: the primary verdict compares the peak with maxTemperature and maxTemperature − margin. */
const limitsSchema = z.strictObject({
  maxTemperature: quantity("temperature", { above: -273.15, words: 'a temperature such as "155 degC"' }),
  margin: quantity("temperatureDifference", { min: 0, words: 'a temperature difference ≥ 0 such as "15 K"' }).optional(),
});

/**
 * One part. Kept as its own exported object so other domains (ratings, lifetime) can extend it
 * with `partSchema.extend({...})` when they are wired in.
 */
export const partSchema = z.strictObject({
  id: z.string().min(1),
  role: z.enum(Object.keys(ROLE_NAMES) as [keyof typeof ROLE_NAMES, ...(keyof typeof ROLE_NAMES)[]]).optional(),
  network: z.union([z.string().min(1), z.record(z.string(), z.unknown())]),
  source: z.string().optional(),
  observe: z.string().optional(),
  ambient: quantity("temperature", { above: -273.15, words: 'a temperature such as "40 degC"' }).optional(),
  limits: limitsSchema,
  // ratings, lifetime, cycleHysteresis: the stress layer's keys (src/stress/stressKeysSchema.ts)
  ...stressKeysSchema.shape,
});

const mosfetSchema = z.strictObject({
  gateVoltage: quantity("voltage", { above: 0, words: 'a gate voltage > 0 such as "10 V"' }),
  thresholdVoltage: quantity("voltage", { above: 0, words: 'a threshold voltage > 0 such as "4 V"' }),
  sourceResistor: quantity("resistance", { above: 0, words: 'a resistance > 0 such as "1 ohm"' }).optional(),
  saturationCurrent: quantity("current", { above: 0, words: 'a current > 0 such as "8 A"' }).optional(),
  rdsOn: quantity("resistance", { above: 0, words: 'a resistance > 0 such as "10 mohm"' }),
  thresholdTempco: quantity("voltagePerKelvin", { words: 'a coefficient such as "-5 mV/K"' }).optional(),
  transconductance: quantity("transconductanceParameter", { above: 0, words: 'a square-law K > 0 such as "12 A/V^2"' }).optional(),
  transconductanceExponent: quantity("dimensionless", { min: 0, max: 10, words: "a mobility exponent in [0, 10] such as 1.5" }).optional(),
  loopGainWarning: quantity("dimensionless", { above: 0, words: "a loop gain > 0 such as 0.5" }).optional(),
});

const converterSchema = z.strictObject({
  mode: z.enum(["constant-current", "constant-power"]),
  current: quantity("current", { above: 0, words: 'a current > 0 such as "2 A"' }).optional(),
  power: quantity("power", { above: 0, words: 'a power > 0 such as "200 W"' }).optional(),
  efficiency: quantity("dimensionless", { above: 0, max: 1, words: "an efficiency in (0, 1] such as 0.9" }),
  currentLimit: quantity("current", { above: 0, words: 'a current > 0 such as "5 A"' }).optional(),
});

const completionSchema = z.strictObject({
  fraction: quantity("dimensionless", { above: 0, max: 0.999999, words: "a fraction in (0, 1) such as 0.95" }).optional(),
  within: quantity("voltage", { above: 0, words: 'a voltage > 0 such as "2 V"' }).optional(),
  dwell: positiveTime("a dwell").optional(),
  timeout: positiveTime("a timeout"),
});

const dischargeSchema = z.strictObject({
  kind: z.enum(["none", "bleeder", "constant-current", "active"]),
  resistance: quantity("resistance", { above: 0, words: 'a resistance > 0 such as "10 kohm"' }).optional(),
  current: quantity("current", { above: 0, words: 'a current > 0 such as "10 mA"' }).optional(),
  until: quantity("voltage", { min: 0, words: 'a voltage ≥ 0 such as "5 V"' }).optional(),
  bleeder: quantity("resistance", { above: 0, words: 'a resistance > 0 such as "47 kohm"' }).optional(),
});

/** How a series pre-charge resistor's resistance follows its temperature (resolveResistanceCurve.ts). */
const resistorTemperatureSchema = z.strictObject({
  kind: z.enum(["linear", "ntc-beta", "steinhart-hart", "table"]),
  ppmPerK: quantity("dimensionless", { words: "a temperature coefficient in ppm/K such as 3900" }).optional(),
  beta: quantity("temperatureDifference", { above: 0, words: 'a B value > 0 such as "3000 K"' }).optional(),
  reference: quantity("temperature", { above: -273.15, words: 'a temperature such as "25 degC"' }).optional(),
  a: quantity("dimensionless", { words: "a Steinhart-Hart coefficient in 1/K such as 1.009e-3" }).optional(),
  b: quantity("dimensionless", { words: "a Steinhart-Hart coefficient in 1/K such as 2.378e-4" }).optional(),
  c: quantity("dimensionless", { words: "a Steinhart-Hart coefficient in 1/K such as 2.019e-7" }).optional(),
  points: z
    .array(z.tuple([quantity("temperature", { above: -273.15, words: 'a temperature such as "120 degC"' }), quantity("resistance", { above: 0, words: 'a resistance > 0 such as "20 ohm"' })]))
    .min(2)
    .optional(),
});

/** The relay (or contactor) that starts and ends each pre-charge attempt: its switching times. */
const relaySchema = z.strictObject({
  operate: quantity("time", { min: 0, words: 'an operate time ≥ 0 such as "15 ms"' }).optional(),
  release: quantity("time", { min: 0, words: 'a release time ≥ 0 such as "8 ms"' }).optional(),
});

/** Protection that ends a pre-charge attempt before its timeout (src/circuits/AttemptProtection.ts). */
export const protectionSchema = z.strictObject({
  busChecks: z
    .array(
      z.strictObject({
        at: nonNegativeTime("a check time"),
        below: quantity("voltage", { above: 0, words: 'a voltage > 0 such as "45 V"' }).optional(),
        above: quantity("voltage", { above: 0, words: 'a voltage > 0 such as "60 V"' }).optional(),
      }),
    )
    .optional(),
  riseChecks: z
    .array(z.strictObject({ from: nonNegativeTime("a start time"), to: positiveTime("an end time"), atLeast: quantity("voltageRate", { above: 0, words: 'a rise rate > 0 such as "200 V/s"' }) }))
    .optional(),
  overCurrent: z.strictObject({ above: quantity("current", { above: 0, words: 'a trip current > 0 such as "3 A"' }), for: nonNegativeTime("a delay") }).optional(),
  fuse: z.strictObject({ i2t: quantity("currentSquaredTime", { above: 0, words: 'a melting I²t > 0 such as "5 A^2 s"' }) }).optional(),
  firmwareI2t: quantity("currentSquaredTime", { above: 0, words: 'an I²t limit > 0 such as "2 A^2 s"' }).optional(),
  maxOnTime: positiveTime("a maximum on-time").optional(),
});

/** The main contactor that closes across the pre-charge element: its making-current rating and the loop it closes. */
export const contactorSchema = z.strictObject({
  makingCurrent: quantity("current", { above: 0, words: 'a making-current rating > 0 such as "150 A"' }),
  loopResistance: quantity("resistance", { above: 0, words: 'a loop resistance > 0 such as "30 mohm"' }),
  loopInductance: quantity("inductance", { min: 0, words: 'a loop inductance ≥ 0 such as "2 uH"' }).optional(),
  operate: quantity("time", { min: 0, words: 'an operate time ≥ 0 such as "30 ms"' }).optional(),
  release: quantity("time", { min: 0, words: 'a release time ≥ 0 such as "15 ms"' }).optional(),
});

/** The pre-charge circuit: topology, bus, capacitor, load, completion rule, discharge path and relay. */
export const circuitSchema = z.strictObject({
  topology: z.enum(["series-resistor", "linear-mosfet", "converter"]),
  busVoltage: quantity("voltage", { above: 0, words: 'a bus voltage > 0 such as "48 V"' }),
  capacitance: quantity("capacitance", { above: 0, words: 'a capacitance > 0 such as "4.7 mF"' }),
  resistance: quantity("resistance", { above: 0, words: 'a resistance > 0 such as "10 ohm"' }).optional(),
  sourceResistance: quantity("resistance", { min: 0, words: 'a resistance ≥ 0 such as "20 mohm"' }).optional(),
  resistorTemperature: resistorTemperatureSchema.optional(),
  peakCurrentRating: quantity("current", { above: 0, words: 'a current > 0 such as "60 A"' }).optional(),
  mosfet: mosfetSchema.optional(),
  converter: converterSchema.optional(),
  load: loadSchema.optional(),
  completion: completionSchema,
  discharge: dischargeSchema,
  relay: relaySchema.optional(),
  protection: protectionSchema.optional(),
  contactor: contactorSchema.optional(),
});

/** The firmware that runs the pre-charge: the resolution of the timer it times waits with. */
const firmwareSchema = z.strictObject({
  timerResolution: quantity("time", { min: 0, words: 'a timer resolution ≥ 0 such as "1 ms" (0: no rounding)' }).optional(),
});

// ---- retry plan (read by src/retry for `heatledger retries`; nothing else uses it) ----

/** One corner of the retry plan's corner set: the circuit and ambient values it changes. */
const retryCornerSchema = z.strictObject({
  name: z.string().min(1),
  busVoltage: quantity("voltage", { above: 0, words: 'a bus voltage > 0 such as "58 V"' }).optional(),
  ambient: quantity("temperature", { above: -273.15, words: 'a temperature such as "55 degC"' }).optional(),
  capacitance: quantity("capacitance", { above: 0, words: 'a capacitance > 0 such as "5.2 mF"' }).optional(),
  resistance: quantity("resistance", { above: 0, words: 'a resistance > 0 such as "9 ohm"' }).optional(),
});

/** The retry plan: which questions to answer for the profile's fault and over which corners. */
export const retryPlanSchema = z.strictObject({
  attempts: count(1, "a whole number of attempts ≥ 1", "maxPlanAttempts").optional(),
  interval: positiveTime("a retry interval").optional(),
  spacing: z.enum(["start-to-start", "end-to-start"]).optional(),
  nearAmbient: quantity("temperatureDifference", { above: 0, words: 'a temperature difference > 0 such as "2 K"' }).optional(),
  map: z
    .strictObject({
      attempts: count(1, "a whole number of attempts ≥ 1", "maxMapSide").optional(),
      from: positiveTime("a shortest interval").optional(),
      to: positiveTime("a longest interval").optional(),
      points: count(2, "a whole number of intervals ≥ 2", "maxMapSide").optional(),
    })
    .optional(),
  corners: z.array(retryCornerSchema).min(1).optional(),
});

/** The retry plan as validated (SI numbers). */
export type RetryPlanInput = z.output<typeof retryPlanSchema>;

// ---- end of retry plan ----
// ---------------------------------------------------------------------------------------------
// supervision (read by `heatledger supervise`; resolved by resolveSupervision.ts)

/**
 * A range of a quantity: one value, or a [low, high] pair; parsed to { low, high } in SI.
 * Each item is checked by the same rules as a single quantity.
 */
function quantityRange(dimension: Dimension, check?: { min?: number; above?: number; max?: number; below?: number; words?: string }) {
  const one = quantity(dimension, check);
  return z.unknown().transform((value, ctx) => {
    const items = Array.isArray(value) ? value : [value];
    if (items.length < 1 || items.length > 2) {
      ctx.addIssue({ code: "custom", message: "range", params: { expected: `one value or a [low, high] pair (${check?.words ?? expectedWords(dimension)})`, found: describe(value) } });
      return z.NEVER;
    }
    const out: number[] = [];
    for (const [i, item] of items.entries()) {
      const parsed = one.safeParse(item);
      if (!parsed.success) {
        for (const issue of parsed.error.issues) {
          const params = (issue as { params?: { expected?: string; found?: string } }).params;
          ctx.addIssue({ code: "custom", message: issue.message, params: params ?? {}, path: Array.isArray(value) ? [i] : [] });
        }
        return z.NEVER;
      }
      if (check?.below !== undefined && !(parsed.data < check.below)) {
        ctx.addIssue({ code: "custom", message: "range", params: { expected: check.words ?? "a value in range", found: describe(item) }, path: Array.isArray(value) ? [i] : [] });
        return z.NEVER;
      }
      out.push(parsed.data);
    }
    const low = out[0]!;
    const high = out[out.length - 1]!;
    if (low > high) {
      ctx.addIssue({ code: "custom", message: "range", params: { expected: "a [low, high] pair with low ≤ high", found: describe(value) } });
      return z.NEVER;
    }
    return { low, high };
  }).register(profileKeyMeta, { kind: "range", dimension, words: check?.words ?? expectedWords(dimension) });
}

/** The healthy systems a supervisor must let through: ranges of what varies between units and over life. */
const supervisionCornersSchema = z.strictObject({
  capacitance: quantityRange("capacitance", { above: 0, words: 'a capacitance > 0 such as "4.7 mF"' }),
  busVoltage: quantityRange("voltage", { above: 0, words: 'a bus voltage > 0 such as "48 V"' }).optional(),
  completionFraction: quantityRange("dimensionless", { above: 0, below: 1, words: "a completion fraction of the bus voltage, above 0 and below 1, such as 0.95" }).optional(),
  loads: z.array(loadSchema).min(1).optional(),
});

/** The supervision section: corner set, check times and margins for the timeout window and early-abort checks. */
export const supervisionSchema = z.strictObject({
  corners: supervisionCornersSchema,
  startVoltage: quantity("voltage", { min: 0, words: 'a capacitor voltage ≥ 0 such as "0 V"' }).optional(),
  checkTimes: z.array(positiveTime("a check time")).min(1).optional(),
  riseCheckTimes: z.array(positiveTime("a check time")).min(1).optional(),
  checkMargin: quantity("dimensionless", { min: 0, max: 0.9, words: "a margin as a fraction of the voltage, from 0 to 0.9, such as 0.2" }).optional(),
  minCheckVoltage: quantity("voltage", { above: 0, words: 'a voltage > 0 such as "2 V"' }).optional(),
});

/** A validated supervision section (SI numbers). */
export type SupervisionInput = z.output<typeof supervisionSchema>;

const temperatureKey = (example: string) => quantity("temperature", { above: -273.15, words: `a temperature such as "${example}"` });
const timeOfDay = (what: string) => quantity("time", { min: 0, max: 86_400, words: `${what} from 0 to 24 h, such as "15 h"` });

/** `ambientProfile`: the ambient as a time series (a daily cosine, a daily table, or a CSV trace); see docs/profile-format.md. */
export const ambientProfileSchema = z.strictObject({
  daily: z.strictObject({ min: temperatureKey("18 degC"), max: temperatureKey("34 degC"), maxAt: timeOfDay("the time of day of the maximum") }).optional(),
  table: z.array(z.tuple([timeOfDay("a time of day"), temperatureKey("25 degC")])).min(1).optional(),
  file: z.string().min(1).optional(),
  startAt: timeOfDay("the time of day at the profile's start").optional(),
});

/** One `heatSources` item: extra heat on a node of a part's graph or Cauer network, constant or a CSV power trace. */
export const heatSourceSchema = z.strictObject({
  part: z.string().min(1),
  node: z.string().min(1),
  power: quantity("power", { min: 0, words: 'a power ≥ 0 such as "150 W"' }).optional(),
  file: z.string().min(1).optional(),
  scale: quantity("dimensionless", { min: 0, words: "a scale factor ≥ 0 such as 1" }).optional(),
  label: z.string().optional(),
});

/**
 * The duty-profile file, validated and with every quantity converted to SI (temperatures in °C).
 * Networks and trace files are still references here; loadProfile resolves them.
 * Source: keys of our own (see docs/profile-format.md).
 */
export const profileSchema = z.strictObject({
  name: z.string().min(1),
  description: z.string().optional(),
  ambient: quantity("temperature", { above: -273.15, words: 'a temperature such as "40 degC"' }).optional(),
  ambientProfile: ambientProfileSchema.optional(),
  heatSources: z.array(heatSourceSchema).min(1).optional(),
  parts: z.array(partSchema).min(1),
  circuit: circuitSchema.optional(),
  events: z.array(eventSchema).min(1),
  retryPlan: retryPlanSchema.optional(),
  supervision: supervisionSchema.optional(),
  firmware: firmwareSchema.optional(),
  /** how many times a year the whole profile happens, for calendar life (stress layer) */
  occursPerYear: quantity("dimensionless", { above: 0, words: "a number of times per year > 0 such as 52" }).optional(),
});

/** The profile as validated by {@link profileSchema}, before networks and files are resolved. */
export type ProfileInput = z.output<typeof profileSchema>;
/** A validated load specification. */
export type LoadInput = z.output<typeof loadSchema>;
/** A validated fault specification. */
export type FaultInput = z.output<typeof faultSchema>;
/** A validated circuit. */
export type CircuitInput = z.output<typeof circuitSchema>;
/** A validated part. */
export type PartInput = z.output<typeof partSchema>;
/** A validated `circuit.protection` section. */
export type ProtectionInput = z.output<typeof protectionSchema>;
/** A validated `circuit.contactor` section. */
export type ContactorInput = z.output<typeof contactorSchema>;
