// a namespace import, as in profileSchema.ts: the bundler keeps only the parts of zod in use
// (`import { z }` keeps all of zod, every message locale with it)
import * as z from "zod";

/** A quantity as written in a profile: a number in SI units or a string with a unit. */
const quantity = z.union([z.number(), z.string()], { error: 'a number in SI units or a string with a unit (such as "10 ms")' });
const count = z.number({ error: "a plain number" });
const interval = z.tuple([quantity, quantity], { error: 'a pair [lowest, highest] (such as ["30 K", "80 K"])' });

/** Fitted range overrides by cycle quantity: [lowest, highest]. */
const fittedRange = z
  .object({
    range: interval.optional(),
    mean: interval.optional(),
    min: interval.optional(),
    max: interval.optional(),
    heatingTime: interval.optional(),
    frequency: interval.optional(),
  })
  .strict();

const coffinManson = z
  .object({
    model: z.literal("coffin-manson"),
    referenceCycles: count,
    referenceRange: quantity,
    exponent: count,
    fittedRange: fittedRange.optional(),
  })
  .strict();

const norrisLandzberg = z
  .object({
    model: z.literal("norris-landzberg"),
    referenceCycles: count,
    referenceRange: quantity,
    referenceFrequency: quantity,
    referenceMaxTemperature: quantity,
    exponent: count.optional(),
    frequencyExponent: count.optional(),
    activationTemperature: quantity.optional(),
    fittedRange: fittedRange.optional(),
  })
  .strict();

const lesit = z
  .object({
    model: z.literal("lesit"),
    coefficient: count.optional(),
    rangeExponent: count.optional(),
    /** J/mol */
    activationEnergy: count.optional(),
    fittedRange: fittedRange.optional(),
  })
  .strict();

const cips2008 = z
  .object({
    model: z.literal("cips2008"),
    currentPerWire: quantity,
    voltageClass: quantity,
    wireDiameter: quantity,
    k: count.optional(),
    beta1: count.optional(),
    beta2: count.optional(),
    beta3: count.optional(),
    beta4: count.optional(),
    beta5: count.optional(),
    beta6: count.optional(),
    fittedRange: fittedRange.optional(),
  })
  .strict();

/** Names of the lifetime models a profile can choose. */
export const LIFETIME_MODEL_NAMES = ["coffin-manson", "norris-landzberg", "lesit", "cips2008"] as const;

/**
 * zod 4 schema of the part keys the stress layer owns, to be merged into the profile's part
 * schema (`partSchema.extend(stressKeysSchema.shape)`): `ratings` (a single-pulse rating in one
 * of three forms: `pulseEnergy`, `pulsePower` or `energyPerOhm` of a series with the part's
 * `resistance`, or a `series` entry of a family file the profile loader reads in; a
 * `repetitive` rule; SOA tables; how each is derated for a hot part; the limits beside
 * temperature: `voltage`, `continuousPower`, `adiabatic`),
 * `lifetime` (a cycling model and its parameters) and `cycleHysteresis`. Quantities stay raw
 * here (number in SI or string with a unit); {@link resolveStressConfig} parses them with
 * parseQuantity and checks the tables, with field paths in every error.
 */
export const stressKeysSchema = z.object({
  ratings: z
    .object({
      pulseEnergy: z.array(z.object({ duration: quantity, energy: quantity }).strict()).optional(),
      soa: z
        .array(
          z
            .object({
              duration: quantity,
              points: z.array(z.object({ vds: quantity, id: quantity }).strict()),
            })
            .strict(),
        )
        .optional(),
      soaDerating: z.object({ reference: quantity, maxJunction: quantity }).strict().optional(),
      pulseEnergyDerating: z.object({ reference: quantity.optional(), maxTemperature: quantity.optional() }).strict().optional(),
      // the other forms of a single-pulse rating, each turned into a pulse-energy table
      pulsePower: z.array(z.object({ duration: quantity, power: quantity }).strict()).optional(),
      energyPerOhm: z
        .object({
          durations: z.array(quantity),
          rows: z.array(z.object({ resistance: quantity, energyPerOhm: z.array(quantity) }).strict()),
        })
        .strict()
        .optional(),
      resistance: quantity.optional(),
      series: z.object({ file: z.string(), id: z.string() }).strict().optional(),
      repetitive: z.array(z.object({ period: quantity.optional(), dutyCycle: count.optional(), energy: quantity }).strict()).optional(),
      // limits beside temperature
      voltage: z.object({ limitingElement: quantity.optional(), pulse: quantity.optional() }).strict().optional(),
      continuousPower: z.object({ rated: quantity, fullPowerUpTo: quantity, zeroPowerAt: quantity }).strict().optional(),
      adiabatic: z
        .object({
          spreadingTime: quantity.optional(),
          thickness: quantity.optional(),
          material: z.string().optional(),
          heatCapacity: quantity.optional(),
          mass: quantity.optional(),
        })
        .strict()
        .optional(),
    })
    .strict()
    .optional(),
  lifetime: z
    .discriminatedUnion("model", [coffinManson, norrisLandzberg, lesit, cips2008], {
      error: `a lifetime model: one of ${LIFETIME_MODEL_NAMES.map((n) => `"${n}"`).join(", ")} with its parameters`,
    })
    .optional(),
  cycleHysteresis: quantity.optional(),
});

/** The stress keys of a part as zod accepts them (quantities still raw). */
export type StressKeysInput = z.infer<typeof stressKeysSchema>;
