/**
 * The physical dimensions heatledger accepts, each with the SI unit its numbers are stored in and
 * an example a user can copy. Absolute temperatures are the exception: they are held in degrees
 * Celsius (the unit engineers read), rises and differences in kelvin.
 */
export const DIMENSIONS = {
  time: { si: "s", words: "a time", example: "350 ms" },
  frequency: { si: "Hz", words: "a frequency", example: "50 Hz" },
  capacitance: { si: "F", words: "a capacitance", example: "4.7 mF" },
  resistance: { si: "ohm", words: "a resistance", example: "47 ohm" },
  voltage: { si: "V", words: "a voltage", example: "48 V" },
  current: { si: "A", words: "a current", example: "2.5 A" },
  power: { si: "W", words: "a power", example: "150 W" },
  energy: { si: "J", words: "an energy", example: "12 J" },
  mass: { si: "kg", words: "a mass", example: "8 g" },
  length: { si: "m", words: "a length", example: "300 um" },
  temperature: { si: "degC", words: "a temperature", example: "40 degC" },
  temperatureDifference: { si: "K", words: "a temperature difference", example: "10 K" },
  thermalResistance: { si: "K/W", words: "a thermal resistance", example: "2.5 K/W" },
  heatCapacity: { si: "J/K", words: "a heat capacity", example: "12 J/K" },
  specificHeat: { si: "J/(kg K)", words: "a specific heat", example: "900 J/(kg K)" },
  voltagePerKelvin: { si: "V/K", words: "a voltage temperature coefficient", example: "-5 mV/K" },
  transconductanceParameter: { si: "A/V^2", words: "a transconductance parameter (square law K)", example: "12 A/V^2" },
  inductance: { si: "H", words: "an inductance", example: "2 uH" },
  voltageRate: { si: "V/s", words: "a voltage rise rate", example: "200 V/s" },
  currentSquaredTime: { si: "A^2 s", words: "a current-squared time (I²t)", example: "5 A^2 s" },
  energyPerResistance: { si: "J/ohm", words: "an energy per ohm", example: "0.5 J/ohm" },
  dimensionless: { si: "", words: "a plain number", example: "0.95" },
} as const;

/** Name of a physical dimension heatledger parses. */
export type Dimension = keyof typeof DIMENSIONS;

/** "a capacitance such as 4.7 mF": the expectation sentence used in error messages. */
export function expectedWords(dimension: Dimension): string {
  const d = DIMENSIONS[dimension];
  return dimension === "dimensionless" ? `${d.words} such as ${d.example}` : `${d.words} such as "${d.example}" (or a number in ${d.si})`;
}
