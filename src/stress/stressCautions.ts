/**
 * Cautions every human-readable stress report carries (DESIGN §8): results depend on the thermal
 * data supplied; margins must cover tolerances and ageing; the part maker's ratings, local codes
 * and licensed practice govern; lifetime figures are model estimates.
 */
export const STRESS_CAUTIONS: readonly string[] = [
  "Results depend on the thermal network, ratings and lifetime parameters supplied; they are only as good as that data.",
  "Margins must cover part tolerances, ageing, ambient extremes and model error.",
  "The part maker's ratings, local codes and licensed engineering practice govern over these figures.",
  "Damage and life figures are estimates from a fitted model under Miner's linear rule, not a guarantee of life.",
];

/**
 * Caution for linear-mode MOSFETs (DESIGN §8): at high drain-source voltage a MOSFET in linear
 * mode can go thermally unstable (current crowds into hot cells) and fail inside its thermal
 * rating; only an SOA drawn for linear operation at that voltage covers it.
 */
export const LINEAR_MOSFET_CAUTION =
  "Linear-mode MOSFET: at high drain-source voltage, thermal instability (current crowding into hot cells) can fail the part inside its thermal rating and its Zth-based temperature limit; rely on an SOA rated for linear (DC-like) operation at the actual Vds, and derate it for case temperature.";
